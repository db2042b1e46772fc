// Column helpers shared by every table: ids, foreign ids, timestamps, optimistic-lock versions.
import { bigint, int, timestamp } from 'drizzle-orm/mysql-core';

export const id = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey();
export const ref = (name: string) => bigint(name, { mode: 'number', unsigned: true });
export const createdAt = () => timestamp('created_at', { mode: 'date', fsp: 3 }).notNull().defaultNow();
export const updatedAt = () =>
  timestamp('updated_at', { mode: 'date', fsp: 3 })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date());
/**
 * A MariaDB ENUM's values, taken from the list shared/ defines (a zod enum's options or a constant list), so
 * the database and the contracts name the same values in the same order.
 */
export function enumValues<T extends string>(values: readonly T[]): [T, ...T[]] {
  if (values.length === 0) throw new Error('An ENUM needs at least one value.');
  return [...values] as [T, ...T[]];
}
/** Optimistic-lock counter: every update must name the version it read and bumps it by one. */
export const version = () => int('version', { unsigned: true }).notNull().default(1);
