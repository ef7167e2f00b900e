// The local SMTP fake: every message the app sends lands in .data/mail/ (one .eml file each, and
// a line in index.jsonl), where tests and developers read it. Skipped when SMTP_URL is set.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDetached } from './detached.mjs';

export const DEFAULT_SMTP_PORT = 2525;

export async function ensure(root) {
  if (process.env.SMTP_URL) return {};
  const port = Number(process.env.TICKOVER_SMTP_PORT ?? DEFAULT_SMTP_PORT);
  const mailDir = join(root, '.data', 'mail');
  await ensureDetached(root, {
    name: 'smtp',
    script: fileURLToPath(new URL('./smtp-server.mjs', import.meta.url)),
    port,
    env: { FAKE_MAIL_DIR: mailDir },
  });
  return { SMTP_URL: `smtp://127.0.0.1:${port}`, SMTP_FAKE_DIR: mailDir };
}
