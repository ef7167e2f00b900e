// `npm test`: the same set-up as `npm start`, then every test against real parts: Vitest (unit,
// and integration over HTTP against the built server and PostgreSQL) and Playwright in Debian's
// Chromium. The tests get their own database, recreated on every run.
//
//   npm test                      everything
//   npm test -- --vitest-only     skip Playwright      npm test -- --e2e-only   skip Vitest
//   npm test -- <filters>         passed on to the runner(s) that run
import { setup, root } from './setup.mjs';
import { migrate } from './lib/migrate.mjs';
import { recreateDatabase } from './lib/postgres.mjs';
import { ensureChromium } from './lib/apt.mjs';
import { log, runAsync, runOrThrow } from './lib/run.mjs';
import { startServer, startWorker, waitForServer } from './lib/server-process.mjs';

const args = process.argv.slice(2);
const vitestOnly = args.includes('--vitest-only');
const e2eOnly = args.includes('--e2e-only');
const filters = args.filter((a) => a !== '--vitest-only' && a !== '--e2e-only');

const port = process.env.TEST_PORT ?? '4329';
const baseUrl = `http://127.0.0.1:${port}`;
const { databaseUrl, env } = await setup({ appUrl: baseUrl });
const testDatabase = process.env.TICKOVER_TEST_DB ?? 'tickover_test';
const testDatabaseUrl = await recreateDatabase(root, databaseUrl, testDatabase);
await migrate(root, testDatabaseUrl);
const testEnv = {
  ...env,
  DATABASE_URL: testDatabaseUrl,
  HOST: '127.0.0.1',
  PORT: port,
  // Tests give each simulated client its own X-Forwarded-For so sign-in limits apply per test.
  TRUST_PROXY: '1',
  TEST_BASE_URL: baseUrl,
  TICKOVER_ROOT: root,
  // The job queue polls fast and retries soon in tests, so mail arrives within a second or two.
  JOB_POLL_SECONDS: '0.5',
  MAIL_RETRY_DELAY_SECONDS: '1',
};
const childEnv = { ...process.env, ...testEnv };
runOrThrow('npx', ['tsx', 'scripts/seed.ts'], { cwd: root, env: childEnv });
const chromium = e2eOnly || !vitestOnly ? ensureChromium() : undefined;
log('building the app for the tests');
runOrThrow('npx', ['astro', 'build'], { cwd: root, env: childEnv });

const server = startServer(root, testEnv, { stdio: ['ignore', 'ignore', 'inherit'] });
const worker = startWorker(root, testEnv, { stdio: ['ignore', 'ignore', 'inherit'] });
let failed = false;
try {
  await waitForServer(baseUrl, server);
  if (!e2eOnly) {
    log('Vitest: unit and integration tests');
    failed = (await runAsync('npx', ['vitest', 'run', ...filters], { cwd: root, env: childEnv })) !== 0 || failed;
  }
  if (!vitestOnly) {
    log('Playwright: end-to-end tests in Chromium');
    const code = await runAsync('npx', ['playwright', 'test', ...filters], {
      cwd: root,
      env: { ...childEnv, CHROMIUM_PATH: chromium },
    });
    failed = code !== 0 || failed;
  }
} finally {
  server.kill('SIGTERM');
  worker.kill('SIGTERM');
}
log(failed ? 'some tests failed' : 'all tests passed');
process.exit(failed ? 1 : 0);
