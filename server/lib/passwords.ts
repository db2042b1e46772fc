// Password hashing with bcrypt (bcryptjs: pure JavaScript, nothing to compile on install).
import bcrypt from 'bcryptjs';

const COST = 11;
// Compared against when the e-mail is unknown, so both failures take the same time.
const DUMMY_HASH = bcrypt.hashSync('rackturn-timing-equaliser', COST);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return hash !== null && ok;
}
