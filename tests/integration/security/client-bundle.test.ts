// Nothing secret reaches the browser: every file the build serves to clients (dist/client, the
// service worker's precache included) is searched for the values of every secret this checkout
// runs with, for the names of the server's secret settings, and for process.env.
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = process.env.TICKOVER_ROOT ?? join(__dirname, '..', '..', '..');
const client = join(root, 'dist', 'client');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? files(path) : [path];
  });
}

const SECRET_SETTINGS = [
  'BETTER_AUTH_SECRET',
  'RECORD_LINK_SECRET',
  'STRIPE_SECRET_KEY',
  'STRIPE_WEBHOOK_SECRET',
  'S3_SECRET_ACCESS_KEY',
  'S3_ACCESS_KEY_ID',
  'DATABASE_URL',
  'SMTP_URL',
];

/** Every secret value this checkout uses, from the environment the tests run with and from .data/. */
function secretValues(): { where: string; value: string }[] {
  const found: { where: string; value: string }[] = [];
  const add = (where: string, value: string | undefined) => {
    if (value && value.length >= 8) found.push({ where, value });
  };
  for (const name of SECRET_SETTINGS) add(`$${name}`, process.env[name]);
  add('the DATABASE_URL password', process.env.DATABASE_URL ? decodeURIComponent(new URL(process.env.DATABASE_URL).password) : undefined);
  if (process.env.SMTP_URL) add('the SMTP password', decodeURIComponent(new URL(process.env.SMTP_URL).password));
  const secrets = join(root, '.data', 'secrets');
  if (existsSync(secrets)) for (const file of readdirSync(secrets)) add(`.data/secrets/${file}`, readFileSync(join(secrets, file), 'utf8').trim());
  for (const file of ['postgres/credentials.json', 's3/credentials.json']) {
    const path = join(root, '.data', file);
    if (!existsSync(path)) continue;
    for (const [key, value] of Object.entries(JSON.parse(readFileSync(path, 'utf8')) as Record<string, unknown>)) {
      if (typeof value === 'string') add(`.data/${file} ${key}`, value);
    }
  }
  return found;
}

describe('the client bundle', () => {
  const served = files(client).map((path) => ({ path: path.slice(client.length), text: readFileSync(path).toString('latin1') }));

  it('is there to search', () => {
    expect(served.some((f) => f.path === '/sw.js')).toBe(true);
    expect(served.filter((f) => f.path.endsWith('.js')).length).toBeGreaterThan(20);
  });

  it('holds no secret value this checkout runs with', () => {
    const secrets = secretValues();
    // The auth secret, the record-link secret, the database and object-store passwords at least.
    expect(secrets.length).toBeGreaterThanOrEqual(6);
    const leaks = served.flatMap((file) => secrets.filter((s) => file.text.includes(s.value)).map((s) => `${s.where} in ${file.path}`));
    expect(leaks).toEqual([]);
  });

  it('names no secret setting, reads no process.env, and holds no connection string', () => {
    const found = served.flatMap((file) => [
      ...SECRET_SETTINGS.filter((name) => file.text.includes(name)).map((name) => `${name} in ${file.path}`),
      ...(file.text.includes('process.env') ? [`process.env in ${file.path}`] : []),
      ...[...file.text.matchAll(/\b(postgres(?:ql)?|smtps?|rediss?):\/\/[^\s"'`]*/g)].map((m) => `${m[0]} in ${file.path}`),
    ]);
    expect(found).toEqual([]);
  });
});
