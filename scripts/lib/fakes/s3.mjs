// The local S3-compatible store (s3-server.mjs) as one of our fakes: started detached on
// 127.0.0.1 and reused by later runs (detached.mjs), objects and credentials kept in .data/s3.
// Skipped when S3_ENDPOINT points at a real store.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDetached } from './detached.mjs';

export const DEFAULT_S3_PORT = 4569;
const BUCKET = 'tickover-photos';

/** Made once per checkout; the fake checks every request's signature against them. */
function credentials(base) {
  const file = join(base, 'credentials.json');
  if (!existsSync(file)) {
    const fresh = { accessKeyId: `TK${randomBytes(9).toString('hex').toUpperCase()}`, secretAccessKey: randomBytes(30).toString('base64url') };
    writeFileSync(file, JSON.stringify(fresh, null, 2), { mode: 0o600 });
  }
  return JSON.parse(readFileSync(file, 'utf8'));
}

export async function ensure(root) {
  if (process.env.S3_ENDPOINT) return {};
  const port = Number(process.env.TICKOVER_S3_PORT ?? DEFAULT_S3_PORT);
  const base = join(root, '.data', 's3');
  const objects = join(base, 'objects');
  mkdirSync(join(objects, BUCKET), { recursive: true });
  const keys = credentials(base);
  await ensureDetached(root, {
    name: 's3',
    script: fileURLToPath(new URL('./s3-server.mjs', import.meta.url)),
    port,
    env: { FAKE_S3_DIR: objects, S3_FAKE_ACCESS_KEY_ID: keys.accessKeyId, S3_FAKE_SECRET_ACCESS_KEY: keys.secretAccessKey },
  });
  return {
    S3_ENDPOINT: `http://127.0.0.1:${port}`,
    S3_REGION: 'us-east-1',
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: keys.accessKeyId,
    S3_SECRET_ACCESS_KEY: keys.secretAccessKey,
    S3_FORCE_PATH_STYLE: '1',
  };
}
