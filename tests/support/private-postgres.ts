// A throwaway PostgreSQL cluster in a temporary folder, for tests that stop and crash the
// database: the shared test cluster stays untouched. Debian's server binaries, run as the
// postgres user when we are root (initdb and pg_ctl refuse root), like scripts/lib/postgres.mjs.
import { spawnSync } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';

const isRoot = process.getuid?.() === 0;

function binDir(): string {
  const base = '/usr/lib/postgresql';
  const version = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a))[0];
  if (!version) throw new Error('no PostgreSQL server binaries under /usr/lib/postgresql');
  return join(base, version, 'bin');
}

function run(tool: string, args: string[]) {
  const command = join(binDir(), tool);
  const [cmd, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', command, ...args]] : [command, args];
  const result = spawnSync(cmd, argv, { encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`${tool} ${args.join(' ')} failed: ${result.stderr}`);
}

export type PrivateCluster = {
  url: (database: string) => string;
  stop: (mode: 'fast' | 'immediate') => void;
  start: () => void;
  destroy: () => void;
};

export async function privateCluster(port: number): Promise<PrivateCluster> {
  const dir = mkdtempSync(join(tmpdir(), 'tickover-pg-'));
  const data = join(dir, 'data');
  if (isRoot) {
    const id = (flag: string) => Number(spawnSync('id', [flag, 'postgres'], { encoding: 'utf8' }).stdout.trim());
    chownSync(dir, id('-u'), id('-g'));
  }
  // Trust on loopback only: a throwaway cluster that lives for one test file.
  run('initdb', ['-D', data, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--no-locale']);
  const conf = join(data, 'postgresql.conf');
  writeFileSync(conf, `${readFileSync(conf, 'utf8')}\nlisten_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = '${dir}'\nfsync = on\n`);
  const cluster: PrivateCluster = {
    url: (database) => `postgres://postgres@127.0.0.1:${port}/${database}`,
    start: () => run('pg_ctl', ['start', '-D', data, '-l', join(dir, 'log'), '-w', '-t', '60']),
    stop: (mode) => run('pg_ctl', ['stop', '-D', data, '-m', mode, '-w']),
    destroy: () => {
      try {
        cluster.stop('immediate');
      } catch {
        // already stopped
      }
      rmSync(dir, { recursive: true, force: true });
    },
  };
  cluster.start();
  const admin = new pg.Client({ connectionString: cluster.url('postgres') });
  await admin.connect();
  await admin.query('create database tickover_faults');
  await admin.end();
  return cluster;
}
