// Tokens carried by links in e-mails. Single-use links (invitations, password resets) carry 32 random
// bytes and only their SHA-256 is stored; the unsubscribe link is a signed token naming its purpose.
import { createHash, randomBytes } from 'node:crypto';
import { SignJWT, jwtVerify } from 'jose';

export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Only weekly-plan unsubscribe tokens carry this; sessions and other tokens are refused. */
export const UNSUBSCRIBE_PURPOSE = 'weekly-email-unsubscribe';
const UNSUBSCRIBE_TTL = '400d';

const keyOf = (secret: string) => new TextEncoder().encode(secret);

export function signUnsubscribeToken(secret: string, userId: number): Promise<string> {
  return new SignJWT({ purpose: UNSUBSCRIBE_PURPOSE })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(String(userId))
    .setIssuedAt()
    .setExpirationTime(UNSUBSCRIBE_TTL)
    .sign(keyOf(secret));
}

/** The user id the token was made for, or null when it is forged, expired or made for something else. */
export async function verifyUnsubscribeToken(secret: string, token: string): Promise<number | null> {
  try {
    const { payload } = await jwtVerify(token, keyOf(secret), { algorithms: ['HS256'] });
    if (payload.purpose !== UNSUBSCRIBE_PURPOSE) return null;
    const userId = Number(payload.sub);
    return Number.isSafeInteger(userId) && userId > 0 ? userId : null;
  } catch {
    return null;
  }
}

/** An absolute link into the app. */
export function appLink(origin: string, path: string, query: Record<string, string> = {}): string {
  const url = new URL(path, origin);
  for (const [k, v] of Object.entries(query)) url.searchParams.set(k, v);
  return url.toString();
}
