// PostgreSQL for development and tests: Debian's server, one cluster in .data/postgres of this
// checkout, listening on 127.0.0.1 only. When DATABASE_URL is set we use that server instead and
// touch nothing here.
import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { aptInstall } from './apt.mjs';
import { asUser, capture, isRoot, log, runOrThrow } from './run.mjs';

const PG_USER = 'postgres';
export const DEFAULT_PG_PORT = 54329;

function findBinDir() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? join(base, versions[0], 'bin') : undefined;
}

function clusterPaths(root) {
  const base = join(root, '.data', 'postgres');
  return {
    base,
    data: join(base, 'data'),
    logDir: join(base, 'log'),
    run: join(base, 'run'),
    credentials: join(base, 'credentials.json'),
  };
}

function pgCommand(bin, tool, args) {
  return asUser(PG_USER, join(bin, tool), args);
}

function ownByPostgres(path) {
  if (!isRoot) return;
  const { stdout } = capture('id', ['-u', PG_USER]);
  const { stdout: gid } = capture('id', ['-g', PG_USER]);
  chownSync(path, Number(stdout.trim()), Number(gid.trim()));
}

function assertEnterable(path) {
  if (!isRoot) return;
  const probe = capture('runuser', ['-u', PG_USER, '--', 'test', '-x', path]);
  if (probe.status !== 0) {
    throw new Error(
      `PostgreSQL runs as the '${PG_USER}' user and cannot enter ${path}. ` +
        'Make every parent folder of this checkout enterable (chmod o+x), or set DATABASE_URL to a server of your own.',
    );
  }
}

function readCredentials(file) {
  return JSON.parse(readFileSync(file, 'utf8'));
}

function initCluster(bin, paths, port) {
  log(`creating a PostgreSQL cluster in ${paths.data}`);
  const credentials = {
    superuserPassword: randomBytes(18).toString('base64url'),
    appPassword: randomBytes(18).toString('base64url'),
  };
  writeFileSync(paths.credentials, JSON.stringify(credentials, null, 2), { mode: 0o600 });
  // initdb reads the password from a file; it must be readable by the postgres user.
  const pwfile = join(paths.run, 'initdb-password');
  writeFileSync(pwfile, credentials.superuserPassword + '\n', { mode: 0o600 });
  ownByPostgres(pwfile);
  try {
    const [cmd, args] = pgCommand(bin, 'initdb', [
      '-D', paths.data,
      '-U', PG_USER,
      `--pwfile=${pwfile}`,
      '--auth-host=scram-sha-256',
      '--auth-local=peer',
      '--encoding=UTF8',
      '--no-locale',
    ]);
    runOrThrow(cmd, args, { stdio: ['ignore', 'ignore', 'inherit'] });
  } finally {
    rmSync(pwfile, { force: true });
  }
  const conf = [
    '',
    '# Tickover: loopback only, socket inside the checkout.',
    "listen_addresses = '127.0.0.1'",
    `port = ${port}`,
    `unix_socket_directories = '${paths.run}'`,
    'max_connections = 200',
    '',
  ].join('\n');
  writeFileSync(join(paths.data, 'postgresql.conf'), readFileSync(join(paths.data, 'postgresql.conf'), 'utf8') + conf);
}

/** pg_ctl status: 0 running, 3 not running, 4 no usable data directory. */
function clusterStatus(bin, paths) {
  const [cmd, args] = pgCommand(bin, 'pg_ctl', ['status', '-D', paths.data]);
  return capture(cmd, args).status;
}

function startCluster(bin, paths, port) {
  const status = clusterStatus(bin, paths);
  if (status === 0) return;
  const pidFile = join(paths.data, 'postmaster.pid');
  if (existsSync(pidFile)) {
    // pg_ctl says no server runs, so the pid file was left by a crash or a killed machine.
    log('removing a stale postmaster.pid left by an earlier crash');
    rmSync(pidFile);
  }
  log(`starting PostgreSQL on 127.0.0.1:${port}`);
  const [cmd, args] = pgCommand(bin, 'pg_ctl', [
    'start',
    '-D', paths.data,
    '-l', join(paths.logDir, 'postgresql.log'),
    '-w',
    '-t', '60',
    '-o', `-p ${port}`,
  ]);
  try {
    runOrThrow(cmd, args, { stdio: ['ignore', 'ignore', 'inherit'] });
  } catch (error) {
    const tail = capture('tail', ['-n', '20', join(paths.logDir, 'postgresql.log')]).stdout;
    throw new Error(
      `PostgreSQL did not start (${error.message}). If port ${port} is taken, set TICKOVER_PG_PORT.\n${tail}`,
    );
  }
}

async function ensureRoleAndDatabase(root, adminUrl, appPassword, database) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const role = await client.query("select 1 from pg_roles where rolname = 'tickover'");
    if (role.rowCount === 0) {
      await client.query(`create role tickover login createdb password '${appPassword}'`);
    }
    const db = await client.query('select 1 from pg_database where datname = $1', [database]);
    if (db.rowCount === 0) await client.query(`create database "${database}" owner tickover`);
  } finally {
    await client.end();
  }
}

/**
 * Makes sure a PostgreSQL server is running and the app database exists.
 * Returns the application's connection URL; call after npm packages are installed.
 */
export async function ensurePostgres(root, { database = 'tickover' } = {}) {
  if (process.env.DATABASE_URL) {
    return { databaseUrl: process.env.DATABASE_URL, managed: false };
  }
  const port = Number(process.env.TICKOVER_PG_PORT ?? DEFAULT_PG_PORT);
  let bin = findBinDir();
  if (!bin) {
    aptInstall(['postgresql'], 'Tickover');
    bin = findBinDir();
    if (!bin) throw new Error('the postgresql package installed, but no pg_ctl was found under /usr/lib/postgresql');
  }
  const paths = clusterPaths(root);
  mkdirSync(join(root, '.data'), { recursive: true, mode: 0o755 });
  chmodSync(join(root, '.data'), 0o755);
  for (const dir of [paths.base, paths.logDir, paths.run]) {
    mkdirSync(dir, { recursive: true, mode: 0o755 });
  }
  chmodSync(paths.base, 0o755);
  ownByPostgres(paths.logDir);
  ownByPostgres(paths.run);
  assertEnterable(paths.base);
  if (!existsSync(join(paths.data, 'PG_VERSION'))) {
    rmSync(paths.data, { recursive: true, force: true });
    mkdirSync(paths.data, { mode: 0o700 });
    ownByPostgres(paths.data);
    initCluster(bin, paths, port);
  }
  startCluster(bin, paths, port);
  const { superuserPassword, appPassword } = readCredentials(paths.credentials);
  const host = `127.0.0.1:${port}`;
  const adminUrl = `postgres://${PG_USER}:${encodeURIComponent(superuserPassword)}@${host}/postgres`;
  await ensureRoleAndDatabase(root, adminUrl, appPassword, database);
  return {
    databaseUrl: `postgres://tickover:${encodeURIComponent(appPassword)}@${host}/${database}`,
    managed: true,
  };
}

export function stopPostgres(root) {
  const bin = findBinDir();
  const paths = clusterPaths(root);
  if (!bin || !existsSync(join(paths.data, 'PG_VERSION'))) {
    log('no PostgreSQL cluster in this checkout');
    return;
  }
  if (clusterStatus(bin, paths) !== 0) {
    log('PostgreSQL is not running');
    return;
  }
  const [cmd, args] = pgCommand(bin, 'pg_ctl', ['stop', '-D', paths.data, '-m', 'fast', '-w']);
  runOrThrow(cmd, args, { stdio: ['ignore', 'ignore', 'inherit'] });
  log('PostgreSQL stopped');
}

/** A URL for another database on the same server and with the same role. */
export function withDatabase(url, database) {
  const u = new URL(url);
  u.pathname = `/${database}`;
  return u.toString();
}

/**
 * DROP DATABASE ... WITH (FORCE) as a non-superuser cannot end an autovacuum worker that happens
 * to be in the database; such a worker finishes within moments, so try again briefly.
 */
export async function dropDatabase(client, database, attempts = 20) {
  for (let attempt = 1; ; attempt += 1) {
    try {
      await client.query(`drop database if exists "${database}" with (force)`);
      return;
    } catch (error) {
      if (attempt >= attempts) throw error;
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
  }
}

/** Drops and creates `database` (the tests' own), connecting as the app role. */
export async function recreateDatabase(root, databaseUrl, database) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ connectionString: withDatabase(databaseUrl, 'postgres') });
  await client.connect();
  try {
    await dropDatabase(client, database);
    await client.query(`create database "${database}"`);
  } finally {
    await client.end();
  }
  return withDatabase(databaseUrl, database);
}
