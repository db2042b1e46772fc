// Integration tests get a database migrated from empty, so the committed migrations are tested too.
import type { TestProject } from 'vitest/node';
import mysql from 'mysql2/promise';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

export function testDatabaseUrl(name: string): string {
  const admin = process.env.TEST_DB_ADMIN_URL;
  if (!admin) throw new Error('TEST_DB_ADMIN_URL is not set: run the suites through `npm test`');
  return `${admin.replace(/\/$/, '')}/${name}`;
}

export async function recreateDatabase(name: string): Promise<string> {
  const conn = await mysql.createConnection({ uri: testDatabaseUrl('') });
  await conn.query(`DROP DATABASE IF EXISTS \`${name}\``);
  await conn.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await conn.end();
  const url = testDatabaseUrl(name);
  const database = createDatabase(url);
  await runMigrations(database.db);
  await database.close();
  return url;
}

export default async function setup(project: TestProject) {
  project.provide('databaseUrl', await recreateDatabase('rackturn_test'));
}
