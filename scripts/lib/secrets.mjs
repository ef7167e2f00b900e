// Secrets a fresh checkout needs and nobody should have to invent: made once, kept in .data/.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';

export function localSecret(root, name) {
  const dir = join(root, '.data', 'secrets');
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  const file = join(dir, name);
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}
