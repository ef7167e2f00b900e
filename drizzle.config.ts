import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema/index.ts',
  out: './drizzle',
  // Only `generate` is used; migrations are applied by scripts/lib/migrate.mjs.
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://localhost/tickover' },
  strict: true,
  verbose: false,
});
