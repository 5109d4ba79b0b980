import { defineConfig } from 'drizzle-kit';

// Migrations are generated from the schema with `npm run db:generate` and applied at start-up and in tests.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
  dbCredentials: {
    url: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/stillspan',
  },
});
