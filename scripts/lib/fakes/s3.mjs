// The local S3-compatible store (s3-server.mjs) as a service our scripts start: once per
// checkout, in the background, reused by later runs (pid file and data in .data/s3), listening
// on 127.0.0.1 only. With S3_ENDPOINT set we use that store and start nothing.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { log } from '../run.mjs';

export const DEFAULT_S3_PORT = 4569;
const BUCKET = 'tickover-photos';

function paths(root) {
  const base = join(root, '.data', 's3');
  return { base, objects: join(base, 'objects'), pid: join(base, 'server.pid'), log: join(base, 'server.log'), credentials: join(base, 'credentials.json') };
}

function credentials(file) {
  if (!existsSync(file)) {
    const fresh = { accessKeyId: `TK${randomBytes(9).toString('hex').toUpperCase()}`, secretAccessKey: randomBytes(30).toString('base64url') };
    writeFileSync(file, JSON.stringify(fresh, null, 2), { mode: 0o600 });
  }
  return JSON.parse(readFileSync(file, 'utf8'));
}

function alive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

async function healthy(port, objects) {
  try {
    const response = await fetch(`http://127.0.0.1:${port}/_tickover/health`, { signal: AbortSignal.timeout(1000) });
    if (!response.ok) return false;
    return (await response.json()).dataDir === objects;
  } catch {
    return false;
  }
}

async function waitUntilHealthy(port, objects, child) {
  for (let i = 0; i < 100; i++) {
    if (child.exitCode !== null) return false;
    if (await healthy(port, objects)) return true;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return false;
}

async function ensure(root) {
  if (process.env.S3_ENDPOINT) return {};
  const port = Number(process.env.TICKOVER_S3_PORT ?? DEFAULT_S3_PORT);
  const p = paths(root);
  mkdirSync(join(p.objects, BUCKET), { recursive: true });
  const keys = credentials(p.credentials);
  const env = {
    S3_ENDPOINT: `http://127.0.0.1:${port}`,
    S3_REGION: 'us-east-1',
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: keys.accessKeyId,
    S3_SECRET_ACCESS_KEY: keys.secretAccessKey,
    S3_FORCE_PATH_STYLE: '1',
  };
  const pid = existsSync(p.pid) ? Number(readFileSync(p.pid, 'utf8')) : 0;
  if (pid && alive(pid) && (await healthy(port, p.objects))) return env;
  if (pid && !alive(pid)) rmSync(p.pid, { force: true });

  log(`starting the local S3 store on 127.0.0.1:${port}`);
  const out = openSync(p.log, 'a');
  const child = spawn(process.execPath, [join(root, 'scripts', 'lib', 'fakes', 's3-server.mjs'), '--port', String(port), '--data', p.objects], {
    cwd: root,
    detached: true,
    stdio: ['ignore', out, out],
    env: { ...process.env, S3_FAKE_ACCESS_KEY_ID: keys.accessKeyId, S3_FAKE_SECRET_ACCESS_KEY: keys.secretAccessKey },
  });
  child.unref();
  if (!(await waitUntilHealthy(port, p.objects, child))) {
    throw new Error(`the local S3 store did not start on port ${port}; see ${p.log}. If the port is taken, set TICKOVER_S3_PORT.`);
  }
  writeFileSync(p.pid, String(child.pid));
  return env;
}

function stop(root) {
  const p = paths(root);
  const pid = existsSync(p.pid) ? Number(readFileSync(p.pid, 'utf8')) : 0;
  if (pid && alive(pid)) {
    process.kill(pid, 'SIGTERM');
    log('local S3 store stopped');
  }
  rmSync(p.pid, { force: true });
}

export const s3Store = { name: 'S3 object store', ensure, stop };
