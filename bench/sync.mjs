// `npm run bench:sync`: sets up its own database (tickover_bench) and a server of the freshly
// built app, then runs bench/sync-run.ts against them and prints the figures. Options by
// environment: BENCH_DEVICES (8), BENCH_VISITS per device (5), BENCH_ROUNDS (3); --no-build
// reuses dist/ as it is.
import { createServer } from 'node:net';
import { setup, root } from '../scripts/setup.mjs';
import { migrate } from '../scripts/lib/migrate.mjs';
import { recreateDatabase } from '../scripts/lib/postgres.mjs';
import { log, runAsync, runOrThrow } from '../scripts/lib/run.mjs';
import { startServer, waitForServer } from '../scripts/lib/server-process.mjs';

const freePort = () =>
  new Promise((resolve) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address();
      probe.close(() => resolve(port));
    });
  });

const { databaseUrl, env } = await setup();
const benchUrl = await recreateDatabase(root, databaseUrl, 'tickover_bench');
await migrate(root, benchUrl);
if (!process.argv.includes('--no-build')) {
  log('building the app for the benchmark');
  runOrThrow('npx', ['astro', 'build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
}
const port = String(await freePort());
const baseUrl = `http://127.0.0.1:${port}`;
const serverEnv = { ...env, DATABASE_URL: benchUrl, HOST: '127.0.0.1', PORT: port, TRUST_PROXY: '1' };
const server = startServer(root, serverEnv, { stdio: ['ignore', 'ignore', 'inherit'] });
let code = 1;
try {
  await waitForServer(baseUrl, server);
  code = await runAsync('npx', ['tsx', 'bench/sync-run.ts'], { cwd: root, env: { ...process.env, ...serverEnv, BENCH_BASE_URL: baseUrl } });
} finally {
  server.kill('SIGTERM');
}
process.exit(code);
