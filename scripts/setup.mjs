// Everything both `npm start` and `npm test` need: npm packages, PostgreSQL, local service fakes,
// and the environment the app reads. Run directly (`npm run db:up`) it just brings them up.
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { ensurePackages } from './lib/packages.mjs';
import { ensurePostgres } from './lib/postgres.mjs';
import { ensureLocalServices } from './lib/services.mjs';
import { localSecret } from './lib/secrets.mjs';
import { log } from './lib/run.mjs';

export const root = join(dirname(fileURLToPath(import.meta.url)), '..');

export async function setup({ install = true, appUrl } = {}) {
  if (install) ensurePackages(root);
  const { databaseUrl } = await ensurePostgres(root);
  // The fakes that call the app back (payment webhooks) need the address it will serve on.
  const services = await ensureLocalServices(root, { appUrl: process.env.PUBLIC_BASE_URL ?? appUrl });
  return {
    databaseUrl,
    env: {
      BETTER_AUTH_SECRET: process.env.BETTER_AUTH_SECRET ?? localSecret(root, 'auth-secret'),
      RECORD_LINK_SECRET: process.env.RECORD_LINK_SECRET ?? localSecret(root, 'record-link-secret'),
      ...services,
    },
  };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const { databaseUrl } = await setup({ install: !process.argv.includes('--no-install') });
  const { migrate } = await import('./lib/migrate.mjs');
  await migrate(root, databaseUrl);
  log(`PostgreSQL is up: ${databaseUrl.replace(/:[^:@/]+@/, ':***@')}`);
}
