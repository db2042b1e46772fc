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
/** Optimistic-lock counter: every update must name the version it read and bumps it by one. */
export const version = () => int('version', { unsigned: true }).notNull().default(1);
