// `npm run db:seed`: set up PostgreSQL if needed, migrate, and seed the demo business.
// `npm run demo:reset`: the same on an emptied demo database, so the demo week is laid out again
// around today (the seed lays it out once, around the day it first runs; see src/db/seed).
import { setup, root } from './setup.mjs';
import { migrate } from './lib/migrate.mjs';
import { recreateDatabase } from './lib/postgres.mjs';
import { log, runOrThrow } from './lib/run.mjs';

const reset = process.argv.includes('--reset');
if (reset && process.env.DATABASE_URL) {
  // DATABASE_URL may name a database we did not make: never drop it.
  console.error('[tickover] demo:reset only empties the project\'s own PostgreSQL; unset DATABASE_URL to use it.');
  process.exit(2);
}
let { databaseUrl } = await setup({ install: false });
if (reset) {
  log('emptying the demo database');
  databaseUrl = await recreateDatabase(root, databaseUrl, new URL(databaseUrl).pathname.slice(1));
}
await migrate(root, databaseUrl);
runOrThrow('npx', ['tsx', 'scripts/seed.ts'], { cwd: root, env: { ...process.env, DATABASE_URL: databaseUrl } });
