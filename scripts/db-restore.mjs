// `npm run db:restore -- <file>`: replace the app database's contents with a backup.
// Stop the app first; sessions in the backup are restored with everything else.
import { setup } from './setup.mjs';
import { restoreDatabase } from './lib/backup.mjs';
import { log } from './lib/run.mjs';

const file = process.argv[2];
if (!file) {
  console.error('Usage: npm run db:restore -- <backup file>');
  process.exit(2);
}
const { databaseUrl } = await setup({ install: false });
restoreDatabase(databaseUrl, file);
log(`restored ${file}`);
