// What counts as TLS. Servers of our own (tests/support/app-process.ts): one without TRUST_PROXY,
// where X-Forwarded-* headers are anyone's to write and must count for nothing, and one holding
// its own certificate (the Node adapter's SERVER_CERT_PATH and SERVER_KEY_PATH), where every
// answer is over TLS: HSTS on pages and static files, and a Secure session cookie.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import https from 'node:https';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startApp, type AppProcess } from '../../support/app-process';
import { testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { newClientAddress } from '../../support/client-address';

let org: OrganisationFixture;
const apps: AppProcess[] = [];
const scratch = mkdtempSync(join(tmpdir(), 'tickover-tls-'));

beforeAll(async () => {
  org = await createOrganisation('Proxy and TLS');
});
afterAll(async () => {
  await Promise.all(apps.map((app) => app.stop()));
  rmSync(scratch, { recursive: true, force: true });
  await testPool().end();
});

async function signInAt(baseUrl: string, headers: Record<string, string>, fetcher = fetch) {
  return fetcher(`${baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl, ...headers },
    body: JSON.stringify({ email: org.office.email, password: FIXTURE_PASSWORD }),
  });
}

const sessionCookie = (response: Response) => response.headers.getSetCookie().find((c) => c.includes('better-auth.session_token='))!;
const flags = (cookie: string) => cookie.split(';').slice(1).map((a) => a.trim().toLowerCase());

describe('without TRUST_PROXY', () => {
  let app: AppProcess;
  beforeAll(async () => {
    app = await startApp({ TRUST_PROXY: '' }, await freePort());
    apps.push(app);
  });

  it('sends no HSTS and no Secure cookie because a client wrote X-Forwarded-Proto', async () => {
    for (const path of ['/sign-in', '/round']) {
      const page = await fetch(`${app.baseUrl}${path}`, { headers: { 'x-forwarded-proto': 'https' } });
      expect(page.headers.has('strict-transport-security'), path).toBe(false);
      expect(page.headers.get('x-frame-options')).toBe('DENY');
    }
    const signedIn = await signInAt(app.baseUrl, { 'x-forwarded-proto': 'https' });
    expect(signedIn.status).toBe(200);
    expect(flags(sessionCookie(signedIn))).not.toContain('secure');
  });

  it('does not take a client-written X-Forwarded-Host as its own name for the origin check', async () => {
    const signedIn = await signInAt(app.baseUrl, {});
    const cookie = sessionCookie(signedIn).split(';')[0]!;
    const response = await fetch(`${app.baseUrl}/api/office/customers`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json', origin: 'https://forms.evil.example', 'x-forwarded-host': 'forms.evil.example', 'x-forwarded-proto': 'https' },
      body: JSON.stringify({ name: 'Forged', email: '', phone: '', addressLines: '', postcode: '', notes: '' }),
    });
    expect(response.status).toBe(403);
  });
});

/** fetch over https that accepts our throwaway self-signed certificate. */
function insecureFetch(url: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Response> {
  return new Promise((resolve, reject) => {
    const request = https.request(url, { method: init.method ?? 'GET', headers: init.headers, rejectUnauthorized: false }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const headers = new Headers();
        for (const [name, value] of Object.entries(res.headers)) {
          for (const v of Array.isArray(value) ? value : [value ?? '']) headers.append(name, v);
        }
        resolve(new Response(Buffer.concat(chunks), { status: res.statusCode, headers }));
      });
    });
    request.on('error', reject);
    request.end(init.body);
  });
}

function openssl(): boolean {
  try {
    execFileSync('openssl', ['version'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

describe.skipIf(!openssl())('with its own certificate (SERVER_CERT_PATH, SERVER_KEY_PATH)', () => {
  let baseUrl: string;
  beforeAll(async () => {
    const key = join(scratch, 'key.pem');
    const cert = join(scratch, 'cert.pem');
    execFileSync('openssl', ['req', '-x509', '-newkey', 'ec', '-pkeyopt', 'ec_paramgen_curve:prime256v1', '-nodes', '-keyout', key, '-out', cert, '-days', '1', '-subj', '/CN=127.0.0.1', '-addext', 'subjectAltName=IP:127.0.0.1'], { stdio: 'ignore' });
    const port = await freePort();
    baseUrl = `https://127.0.0.1:${port}`;
    // startApp waits on plain http, which a TLS server never answers; wait over https here.
    apps.push(await startApp({ TRUST_PROXY: '', SERVER_CERT_PATH: cert, SERVER_KEY_PATH: key, PUBLIC_BASE_URL: baseUrl }, port, { waitForHealth: false }));
    for (let i = 0; i < 200; i++) {
      try {
        if ((await insecureFetch(`${baseUrl}/api/health`)).ok) return;
      } catch {
        // not listening yet
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error('the TLS server did not answer');
  });

  it('sends HSTS with pages, static files and the API', async () => {
    for (const path of ['/sign-in', '/round', '/sw.js', '/api/health']) {
      const response = await insecureFetch(`${baseUrl}${path}`);
      expect(response.headers.get('strict-transport-security'), path).toBe('max-age=31536000');
    }
  });

  it('sets a Secure, HttpOnly, SameSite=Lax session cookie', async () => {
    const response = await signInAt(baseUrl, { 'x-forwarded-for': newClientAddress() }, insecureFetch as typeof fetch);
    expect(response.status).toBe(200);
    const cookie = flags(sessionCookie(response));
    expect(cookie).toEqual(expect.arrayContaining(['secure', 'httponly', 'samesite=lax', 'path=/']));
  });
});
