// What every server benchmark does first, the way `npm test` does it: set-up (packages,
// PostgreSQL, local fakes), a database of its own recreated and migrated, a fresh build (unless
// --no-build), and the built server on a free loopback port. Then it runs the benchmark proper
// (a TypeScript file, with tsx) with BENCH_BASE_URL and DATABASE_URL set, and stops the server.
import { createServer } from 'node:net';
import { setup, root } from '../../scripts/setup.mjs';
import { ensureChromium } from '../../scripts/lib/apt.mjs';
import { migrate } from '../../scripts/lib/migrate.mjs';
import { recreateDatabase } from '../../scripts/lib/postgres.mjs';
import { log, runAsync, runOrThrow } from '../../scripts/lib/run.mjs';
import { startServer, waitForServer } from '../../scripts/lib/server-process.mjs';

export const freePort = () =>
  new Promise((resolve) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address();
      probe.close(() => resolve(port));
    });
  });

/**
 * @param {{ database: string, script: string, browser?: boolean, serverEnv?: Record<string, string> }} options
 * @returns {Promise<number>} the benchmark's exit code
 */
export async function runBench({ database, script, browser = false, serverEnv: extraEnv = {} }) {
  const port = String(await freePort());
  const baseUrl = `http://127.0.0.1:${port}`;
  const { databaseUrl, env } = await setup({ appUrl: baseUrl });
  const benchUrl = await recreateDatabase(root, databaseUrl, database);
  await migrate(root, benchUrl);
  const chromium = browser ? ensureChromium() : undefined;
  if (!process.argv.includes('--no-build')) {
    log('building the app for the benchmark');
    runOrThrow('npx', ['astro', 'build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
  }
  // TRUST_PROXY: each simulated client sends its own X-Forwarded-For, as in `npm test`, so the
  // sign-in rate limit applies per client and not to the whole benchmark.
  const serverEnv = { ...env, DATABASE_URL: benchUrl, HOST: '127.0.0.1', PORT: port, TRUST_PROXY: '1', ...extraEnv };
  const server = startServer(root, serverEnv, { stdio: ['ignore', 'ignore', 'inherit'] });
  try {
    await waitForServer(baseUrl, server);
    return await runAsync('npx', ['tsx', script], {
      cwd: root,
      env: { ...process.env, ...serverEnv, BENCH_BASE_URL: baseUrl, ...(chromium ? { CHROMIUM_PATH: chromium } : {}) },
    });
  } finally {
    server.kill('SIGTERM');
  }
}
