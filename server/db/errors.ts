// Recognising the MariaDB errors that mean "the data said no" or "try again" rather than "something broke".

/** Whether a database error (possibly wrapped by drizzle as the `cause`) carries one of these codes. */
export function hasErrorCode(err: unknown, codes: readonly string[]): boolean {
  for (let e = err as { code?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; depth++) {
    if (typeof e.code === 'string' && codes.includes(e.code)) return true;
    e = e.cause as typeof e;
  }
  return false;
}

/** A unique index refused the write. */
export const isDuplicateKey = (err: unknown) => hasErrorCode(err, ['ER_DUP_ENTRY']);

/** A foreign key still points at the row being deleted. */
export const isStillReferenced = (err: unknown) =>
  hasErrorCode(err, ['ER_ROW_IS_REFERENCED_2', 'ER_ROW_IS_REFERENCED']);

/** InnoDB gave up on this transaction because of another one: running it again is safe and usually works. */
export const isLockConflict = (err: unknown) => hasErrorCode(err, ['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);

/** The driver's message (it names the duplicate value), wherever drizzle put it. */
export function driverMessage(err: unknown): string {
  const e = err as { message?: string; cause?: { message?: string } };
  return `${e.cause?.message ?? ''} ${e.message ?? ''}`;
}
