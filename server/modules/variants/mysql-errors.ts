// Recognising the MariaDB errors that mean "the data said no" rather than "something broke".
function hasCode(err: unknown, codes: string[]): boolean {
  // drizzle wraps the driver's error as its `cause`.
  for (let e = err as { code?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; depth++) {
    if (typeof e.code === 'string' && codes.includes(e.code)) return true;
    e = e.cause as typeof e;
  }
  return false;
}

/** A unique index refused the write. */
export const isDuplicateKey = (err: unknown) => hasCode(err, ['ER_DUP_ENTRY']);

/** A foreign key still points at the row being deleted. */
export const isStillReferenced = (err: unknown) => hasCode(err, ['ER_ROW_IS_REFERENCED_2', 'ER_ROW_IS_REFERENCED']);

/** The driver's message (it names the duplicate value), wherever drizzle put it. */
export function driverMessage(err: unknown): string {
  const e = err as { message?: string; cause?: { message?: string } };
  return `${e.cause?.message ?? ''} ${e.message ?? ''}`;
}
