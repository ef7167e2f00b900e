// Direct access to the test database for fixtures and assertions. Tests create their own
// organisations so that files running in parallel never see each other's rows.
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import * as schema from '../../src/db/schema';
import { dropDatabase } from '../../scripts/lib/postgres.mjs';

let pool: pg.Pool | undefined;

export function testPool() {
  // A Playwright worker runs several spec files in one process, sharing this module: a file that
  // ends the pool in its afterAll must not leave the next file without one.
  if (!pool || pool.ending || pool.ended) pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
  return pool;
}

export function testDb() {
  return drizzle(testPool(), { schema });
}

/** A URL for another database on the test server (same role). */
export function databaseUrlFor(database: string) {
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = `/${database}`;
  return url.toString();
}

/** Creates an empty scratch database and returns its URL and a function that drops it. */
export async function scratchDatabase(prefix: string) {
  const name = `${prefix}_${Date.now().toString(36)}_${Math.random().toString(36).slice(2, 8)}`;
  const admin = new pg.Client({ connectionString: databaseUrlFor('postgres') });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  await admin.end();
  return {
    url: databaseUrlFor(name),
    async drop() {
      const client = new pg.Client({ connectionString: databaseUrlFor('postgres') });
      await client.connect();
      await dropDatabase(client, name);
      await client.end();
    },
  };
}
