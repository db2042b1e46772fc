import { defineConfig } from 'drizzle-kit';

// Migrations are generated offline (`npm run db:generate -- --name <what>`) and applied at start-up.
export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'mysql://rackturn@127.0.0.1:3307/rackturn' },
});
