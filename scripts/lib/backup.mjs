// Backup and restore of the Tickover database with PostgreSQL's own tools, in the custom format
// (compressed, restorable table by table). Connection details travel in the environment, not on
// the command line, so the password never shows in `ps`.
import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';

function pgTool(name) {
  // Prefer the server's own major version; /usr/bin wrappers pick it too on Debian.
  const candidates = ['/usr/lib/postgresql/15/bin', '/usr/lib/postgresql/16/bin', '/usr/lib/postgresql/17/bin'];
  for (const dir of candidates) if (existsSync(join(dir, name))) return join(dir, name);
  return name;
}

function libpqEnv(databaseUrl) {
  const url = new URL(databaseUrl);
  return {
    ...process.env,
    PGHOST: url.hostname,
    PGPORT: url.port || '5432',
    PGUSER: decodeURIComponent(url.username),
    PGPASSWORD: decodeURIComponent(url.password),
    PGDATABASE: url.pathname.slice(1),
  };
}

function run(tool, args, databaseUrl) {
  const result = spawnSync(pgTool(tool), args, { env: libpqEnv(databaseUrl), encoding: 'utf8' });
  if (result.error) throw new Error(`${tool} could not start: ${result.error.message}`);
  if (result.status !== 0) throw new Error(`${tool} failed (${result.status}): ${result.stderr.trim()}`);
  return result;
}

/** Writes a custom-format dump of the database to `file`. */
export function backupDatabase(databaseUrl, file) {
  mkdirSync(join(file, '..'), { recursive: true });
  run('pg_dump', ['--format=custom', '--no-owner', '--no-privileges', `--file=${file}`], databaseUrl);
  return file;
}

/**
 * Restores `file` into the (existing) database at `databaseUrl`, replacing what is there.
 * One transaction: a failed restore leaves the database as it was.
 */
export function restoreDatabase(databaseUrl, file) {
  if (!existsSync(file)) throw new Error(`no backup file at ${file}`);
  run(
    'pg_restore',
    ['--clean', '--if-exists', '--no-owner', '--no-privileges', '--single-transaction', '--exit-on-error', `--dbname=${libpqEnv(databaseUrl).PGDATABASE}`, file],
    databaseUrl,
  );
}
