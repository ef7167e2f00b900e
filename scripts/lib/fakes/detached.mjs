// Runs a local fake as a detached process on 127.0.0.1 that outlives the script that started it,
// so the next `npm start` or `npm test` reuses it. Its pid file in .data/fakes/ records the port
// and a hash of its source: a fake whose code or port changed is restarted.
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { connect } from 'node:net';
import { join } from 'node:path';
import { log } from '../run.mjs';

function isAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

function portAnswers(port) {
  return new Promise((resolve) => {
    const socket = connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

async function waitForPort(port, child, name, logFile) {
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    if (await portAnswers(port)) return;
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
  throw new Error(`the ${name} fake did not start on 127.0.0.1:${port}. Is the port taken?\n${tail}`);
}

/**
 * Starts `script` (an .mjs file) detached unless a matching copy already runs.
 * `env` is passed to it; it must listen on 127.0.0.1:`port`.
 */
export async function ensureDetached(root, { name, script, port, env = {} }) {
  const dir = join(root, '.data', 'fakes');
  mkdirSync(dir, { recursive: true });
  const pidFile = join(dir, `${name}.pid.json`);
  const logFile = join(dir, `${name}.log`);
  const sourceHash = createHash('sha256').update(readFileSync(script)).update(JSON.stringify(env)).digest('hex').slice(0, 16);
  if (existsSync(pidFile)) {
    const running = JSON.parse(readFileSync(pidFile, 'utf8'));
    if (isAlive(running.pid) && running.port === port && running.sourceHash === sourceHash && (await portAnswers(port))) {
      return;
    }
    if (isAlive(running.pid)) {
      log(`restarting the ${name} fake (its code, settings or port changed)`);
      try {
        process.kill(running.pid, 'SIGTERM');
      } catch {
        // already gone
      }
      const deadline = Date.now() + 5_000;
      while (isAlive(running.pid) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
    }
    rmSync(pidFile, { force: true });
  }
  log(`starting the ${name} fake on 127.0.0.1:${port}`);
  const out = openSync(logFile, 'a');
  const child = spawn(process.execPath, [script], {
    cwd: root,
    detached: true,
    stdio: ['ignore', out, out],
    env: { ...process.env, ...env, FAKE_PORT: String(port) },
  });
  child.unref();
  await waitForPort(port, child, name, logFile);
  writeFileSync(pidFile, JSON.stringify({ pid: child.pid, port, sourceHash }));
}
