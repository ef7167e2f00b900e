// A server process of the built app of our own, for tests that must kill or starve it without
// disturbing the shared test server other files use (scripts/app-server.mjs, like npm test).
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { newClientAddress } from './client-address';
import type { Session } from './http';

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

export type AppProcess = { child: ChildProcess; baseUrl: string; stderr: () => string; stop: () => Promise<void> };

/** `waitForHealth: false` for a server that does not answer plain HTTP (one with its own certificate). */
export async function startApp(env: Record<string, string>, port: number, { waitForHealth = true } = {}): Promise<AppProcess> {
  const root = process.env.TICKOVER_ROOT ?? process.cwd();
  const child = spawn(process.execPath, [join(root, 'scripts', 'app-server.mjs')], {
    cwd: root,
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), PUBLIC_BASE_URL: '', ...env },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  for (let i = 0; waitForHealth && i < 200; i++) {
    if (child.exitCode !== null) throw new Error(`the app exited early: ${stderr}`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) break;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGKILL');
    await exited;
  };
  return { child, baseUrl, stderr: () => stderr, stop };
}

/** Resolves when the process has written `text` to stderr. */
export async function waitForStderr(app: AppProcess, text: string, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  while (!app.stderr().includes(text)) {
    if (Date.now() > deadline) throw new Error(`"${text}" did not appear; stderr: ${app.stderr()}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

export async function signInAt(baseUrl: string, email: string, password: string): Promise<Session & { baseUrl: string }> {
  const address = newClientAddress();
  const response = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl, 'x-forwarded-for': address },
    body: JSON.stringify({ email, password }),
  });
  if (!response.ok) throw new Error(`sign-in at ${baseUrl} failed: ${response.status} ${await response.text()}`);
  const cookie = response.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  return { cookie, address, user: (await response.json()).user, baseUrl };
}

export async function pushAt(session: Session & { baseUrl: string }, deviceId: string, operations: unknown[]) {
  const response = await fetch(`${session.baseUrl}/api/sync/push`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: session.baseUrl, cookie: session.cookie, 'x-forwarded-for': session.address },
    body: JSON.stringify({ deviceId, operations }),
  });
  const text = await response.text();
  return { status: response.status, json: JSON.parse(text) as { results: { opId: string; outcome: string; reason?: string }[]; error?: string } };
}
