// Small process helpers for the set-up scripts: they run before node_modules exists, so they
// use Node's standard library only.
import { spawn, spawnSync } from 'node:child_process';

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function log(message) {
  process.stdout.write(`[tickover] ${message}\n`);
}

/** Runs a command to completion, inheriting stdio; throws with the command line on failure. */
export function runOrThrow(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.error) throw new Error(`${command} could not start: ${result.error.message}`);
  if (result.status !== 0) {
    throw new Error(`${command} ${args.join(' ')} exited with ${result.status ?? result.signal}`);
  }
}

/** Runs a command and returns { status, stdout, stderr } without throwing. */
export function capture(command, args, options = {}) {
  const result = spawnSync(command, args, { encoding: 'utf8', ...options });
  return {
    status: result.error ? -1 : result.status,
    stdout: result.stdout ?? '',
    stderr: result.stderr ?? (result.error ? result.error.message : ''),
  };
}

/** Runs a command, resolving with its exit code; stdio is inherited. */
export function runAsync(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

/** Prefixes a command so it runs as `user` when we are root (PostgreSQL refuses root). */
export function asUser(user, command, args) {
  if (!isRoot) return [command, args];
  return ['runuser', ['-u', user, '--', command, ...args]];
}
