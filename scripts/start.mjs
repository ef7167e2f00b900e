// `npm start`: set up everything, seed the demo business, build, and serve it.
import { setup, root } from './setup.mjs';
import { migrate } from './lib/migrate.mjs';
import { log, runOrThrow } from './lib/run.mjs';
import { startServer, startWorker, waitForServer } from './lib/server-process.mjs';
import { DEMO_ACCOUNTS } from './lib/demo-accounts.mjs';

const host = process.env.HOST ?? '127.0.0.1';
const port = process.env.PORT ?? '4321';
const url = `http://${host}:${port}`;

const { databaseUrl, env } = await setup({ appUrl: url });
const appEnv = { ...env, DATABASE_URL: databaseUrl, HOST: host, PORT: port };
await migrate(root, databaseUrl);
runOrThrow('npx', ['tsx', 'scripts/seed.ts'], { cwd: root, env: { ...process.env, ...appEnv } });
log('building the app');
runOrThrow('npx', ['astro', 'build'], { cwd: root, env: { ...process.env, ...appEnv } });

const server = startServer(root, appEnv);
const worker = startWorker(root, appEnv);
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    server.kill(signal);
    worker.kill(signal);
  });
}
server.on('exit', (code) => {
  worker.kill('SIGTERM');
  process.exit(code ?? 0);
});
await waitForServer(url, server);
log(`Tickover is serving the demo business at ${url}`);
log('Demo accounts (password for all: servicing-demo):');
for (const account of DEMO_ACCOUNTS) log(`  ${account.role.padEnd(10)} ${account.email}  (${account.name})`);
log('Stop with Ctrl+C; `npm run db:stop` stops PostgreSQL.');
