// SQL for the provider events already handled (each one exactly once) and the details a receipt needs.
import { and, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athletes, paymentEvents, teams, users } from '../../db/schema';

export async function eventSeen(db: Queryable, eventId: string): Promise<boolean> {
  const [row] = await db
    .select({ id: paymentEvents.id })
    .from(paymentEvents)
    .where(eq(paymentEvents.eventId, eventId))
    .limit(1);
  return Boolean(row);
}

/** Marks the event handled; the unique index refuses a second copy, even one racing this one. */
export async function recordEvent(db: Queryable, eventId: string, type: string): Promise<void> {
  await db.insert(paymentEvents).values({ eventId, type: type.slice(0, 80) });
}

export function isDuplicateKey(err: unknown): boolean {
  // drizzle wraps the driver's error as its `cause`.
  for (let e = err as { code?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; depth++) {
    if (e.code === 'ER_DUP_ENTRY') return true;
    e = e.cause as typeof e;
  }
  return false;
}

export async function receiptDetails(db: Queryable, teamId: number, athleteId: number) {
  const [row] = await db
    .select({ athleteName: athletes.name, email: users.email, teamName: teams.name })
    .from(athletes)
    .innerJoin(teams, eq(teams.id, athletes.teamId))
    .leftJoin(users, eq(users.id, athletes.userId))
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId)))
    .limit(1);
  return row ?? null;
}
