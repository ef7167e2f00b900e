// The one PostgreSQL pool of a server process. Created on first use so that importing a module
// that mentions the database does not open connections (tests and scripts choose the URL first).
import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];
/** Either the pool-backed database or a transaction inside it. */
export type Executor = Database | Transaction;

let pool: pg.Pool | undefined;
let database: Database | undefined;

export function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) {
    throw new Error('DATABASE_URL is not set. Start the app with `npm start` (it sets up PostgreSQL), or export DATABASE_URL.');
  }
  return url;
}

export function getPool(): pg.Pool {
  if (!pool) {
    pool = new pg.Pool({
      connectionString: databaseUrl(),
      max: Number(process.env.DATABASE_POOL_SIZE ?? 10),
      // A stuck query must not hold a device's push for ever.
      statement_timeout: 30_000,
    });
    // An idle connection dropped by a database restart must not take the server down; the pool
    // discards it and the next request opens a fresh one.
    pool.on('error', (error) => console.error(`[db] an idle connection was lost: ${error.message}`));
  }
  return pool;
}

export function getDb(): Database {
  database ??= drizzle(getPool(), { schema });
  return database;
}

export async function closeDb(): Promise<void> {
  const p = pool;
  pool = undefined;
  database = undefined;
  await p?.end();
}
