// Serves an existing build against the already-running database (for working on the app).
import { setup, root } from './setup.mjs';
import { startServer } from './lib/server-process.mjs';

const { databaseUrl, env } = await setup({ install: false });
const server = startServer(root, { ...env, DATABASE_URL: databaseUrl, HOST: process.env.HOST ?? '127.0.0.1', PORT: process.env.PORT ?? '4321' });
server.on('exit', (code) => process.exit(code ?? 0));
