// Security headers on every kind of answer: rendered pages, the API, and the static files the
// app server sends itself (the technician's offline shells, scripts, the service worker). HSTS
// only over TLS; the policy allows each inline script the built pages hold, and nothing else inline.
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { call, signIn, type Session } from '../../support/http';
import { newClientAddress } from '../../support/client-address';
import { contentSecurityPolicy } from '../../../src/lib/server/security-policy.mjs';

const root = join(__dirname, '..', '..', '..');
const client = join(root, 'dist', 'client');

let org: OrganisationFixture;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Headers');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? files(path) : [path];
  });
}

const firstScript = () => files(join(client, '_astro')).find((f) => f.endsWith('.js'))!.slice(client.length);

// Answers of each kind: server-rendered, API, and static files from dist/client.
const samples = () => [
  { what: 'the sign-in page', path: '/sign-in', session: null },
  { what: 'an office page', path: '/office', session: office },
  { what: 'an API answer', path: '/api/me', session: office },
  { what: 'an API refusal', path: '/api/office/team', session: null },
  { what: "the technician's round shell (static)", path: '/round', session: null },
  { what: 'the visit shell (static)', path: '/visit', session: null },
  { what: 'This phone (static)', path: '/device', session: null },
  { what: 'a script (static)', path: firstScript(), session: null },
  { what: 'the service worker (static)', path: '/sw.js', session: null },
];

describe('security headers', () => {
  it('go with every kind of answer, with no HSTS over plain HTTP', async () => {
    const missing: string[] = [];
    for (const { what, path, session } of samples()) {
      const response = await call(session, path);
      await response.arrayBuffer();
      const h = response.headers;
      const expectations: [string, boolean][] = [
        ['content-security-policy with frame-ancestors none', (h.get('content-security-policy') ?? '').includes("frame-ancestors 'none'")],
        ['x-frame-options DENY', h.get('x-frame-options') === 'DENY'],
        ['x-content-type-options nosniff', h.get('x-content-type-options') === 'nosniff'],
        ['referrer-policy same-origin', h.get('referrer-policy') === 'same-origin'],
        ['permissions-policy with camera for this origin only', /(^|, )camera=\(self\)/.test(h.get('permissions-policy') ?? '')],
        ['permissions-policy without the microphone', (h.get('permissions-policy') ?? '').includes('microphone=()')],
        ['cross-origin-opener-policy same-origin', h.get('cross-origin-opener-policy') === 'same-origin'],
        ['no strict-transport-security over http', !h.has('strict-transport-security')],
      ];
      for (const [name, ok] of expectations) if (!ok) missing.push(`${what} (${path}, ${response.status}): ${name}`);
    }
    expect(missing).toEqual([]);
  });

  it('add HSTS when a proxy we trust says the request came over TLS', async () => {
    // The test server runs with TRUST_PROXY=1 (scripts/test.mjs); proxy-and-tls.test.ts shows
    // the same header counting for nothing without it.
    for (const { path, session } of samples()) {
      const response = await call(session, path, { headers: { 'x-forwarded-proto': 'https' } });
      await response.arrayBuffer();
      expect(response.headers.get('strict-transport-security'), path).toBe('max-age=31536000');
    }
  });

  it('keep scripts to our own files and the inline scripts Astro writes, each allowed by its hash', async () => {
    const policy = (await call(office, '/office')).headers.get('content-security-policy')!;
    const scriptSrc = policy.split('; ').find((d) => d.startsWith('script-src '))!;
    expect(scriptSrc).not.toContain("'unsafe-inline'");
    expect(scriptSrc).not.toContain("'unsafe-eval'");
    expect(policy).toContain("object-src 'none'");
    expect(policy).toContain("base-uri 'self'");
    expect(policy).toContain("form-action 'self'");

    const pages = [
      ...files(client).filter((f) => f.endsWith('.html')).map((f) => readFileSync(f, 'utf8')),
      await (await call(office, '/office')).text(),
      await (await call(office, '/office/rounds')).text(),
      await (await call(null, '/sign-in')).text(),
    ];
    const inline = pages.flatMap((html) => [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]!));
    expect(inline.length).toBeGreaterThan(3);
    const unlisted = inline.filter((text) => !scriptSrc.includes(`'sha256-${createHash('sha256').update(text).digest('base64')}'`));
    expect(unlisted.map((text) => text.slice(0, 80))).toEqual([]);
  });

  it("put the same policy in the offline shells' meta tag, less what a meta policy cannot carry", () => {
    for (const shell of ['round', 'visit', 'device', 'calculators']) {
      const html = readFileSync(join(client, shell, 'index.html'), 'utf8');
      const meta = html.match(/<meta http-equiv="Content-Security-Policy" content="([^"]+)"/)?.[1]?.replace(/&#39;/g, "'");
      expect(meta, shell).toBe(contentSecurityPolicy({ forMeta: true }));
      expect(meta).not.toContain('frame-ancestors');
    }
  });
});

describe('the session cookie', () => {
  async function signInCookie(headers: Record<string, string> = {}) {
    const response = await call(null, '/api/auth/sign-in/email', {
      body: { email: org.technician.email, password: FIXTURE_PASSWORD },
      headers: { 'x-forwarded-for': newClientAddress(), ...headers },
    });
    expect(response.status).toBe(200);
    return response.headers.getSetCookie().find((c) => c.startsWith('better-auth.session_token='))!;
  }
  const attributes = (cookie: string) => cookie.split(';').slice(1).map((a) => a.trim().toLowerCase());

  it('is HttpOnly, SameSite=Lax, for the whole site, with an expiry, and not Secure over plain HTTP', async () => {
    const flags = attributes(await signInCookie());
    expect(flags).toContain('httponly');
    expect(flags).toContain('samesite=lax');
    expect(flags).toContain('path=/');
    expect(flags.some((f) => f.startsWith('max-age='))).toBe(true);
    expect(flags).not.toContain('secure');
  });

  it('is Secure when the request came over TLS through a proxy we trust', async () => {
    const flags = attributes(await signInCookie({ 'x-forwarded-proto': 'https' }));
    expect(flags).toContain('secure');
    expect(flags).toContain('httponly');
    expect(flags).toContain('samesite=lax');
  });
});
