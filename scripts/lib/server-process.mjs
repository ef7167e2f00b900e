// Runs the built app (scripts/app-server.mjs over dist/) and its job worker, and waits until the
// app answers.
import { spawn } from 'node:child_process';
import { join } from 'node:path';

export function startServer(root, env, { stdio = 'inherit' } = {}) {
  const child = spawn(process.execPath, [join(root, 'scripts', 'app-server.mjs')], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio,
  });
  return child;
}

/**
 * Runs the job-queue worker (scripts/worker.ts): it sends queued e-mail and runs scheduled jobs,
 * apart from the web server so a slow mail server never holds up a request.
 */
export function startWorker(root, env, { stdio = 'inherit' } = {}) {
  return spawn(process.execPath, ['--import', 'tsx', join(root, 'scripts', 'worker.ts')], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio,
  });
}

export async function waitForServer(url, child, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  let exited = false;
  child.once('exit', () => (exited = true));
  while (Date.now() < deadline) {
    if (exited) throw new Error('the app server exited before it answered');
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`the app server did not answer at ${url} within ${timeoutMs / 1000} s`);
}
