// `npm run db:backup [-- file]`: dump the app database (default: .data/backups/tickover-<time>.dump).
import { join } from 'node:path';
import { setup, root } from './setup.mjs';
import { backupDatabase } from './lib/backup.mjs';
import { log } from './lib/run.mjs';

const { databaseUrl } = await setup({ install: false });
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const file = process.argv[2] ?? join(root, '.data', 'backups', `tickover-${stamp}.dump`);
backupDatabase(databaseUrl, file);
log(`backup written to ${file}`);
