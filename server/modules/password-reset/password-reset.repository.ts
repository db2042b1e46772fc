// SQL for password resets: single-use tokens (only their hash is stored) and the password change itself.
import { and, eq, isNull } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { passwordResets, users } from '../../db/schema';

export async function insertReset(db: Queryable, userId: number, tokenHash: string, expiresAt: Date) {
  await db.insert(passwordResets).values({ userId, tokenHash, expiresAt });
}

export async function findReset(db: Queryable, tokenHash: string, lock = false) {
  const query = db
    .select({
      id: passwordResets.id,
      userId: passwordResets.userId,
      expiresAt: passwordResets.expiresAt,
      usedAt: passwordResets.usedAt,
      email: users.email,
    })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, tokenHash))
    .limit(1);
  const [row] = lock ? await query.for('update') : await query;
  return row ?? null;
}

/** Ends every outstanding reset token of the user (the one just used included). */
export async function useAllResets(db: Queryable, userId: number, now: Date) {
  await db
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

export async function setPassword(db: Queryable, userId: number, passwordHash: string, now: Date) {
  await db.update(users).set({ passwordHash, passwordChangedAt: now }).where(eq(users.id, userId));
}
