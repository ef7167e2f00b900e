// Cross-site writes are refused (src/lib/server/origin-check.ts), whatever their content type,
// while the app's own pages may write from 127.0.0.1, from localhost and from behind a proxy.
import http from 'node:http';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { baseUrl, call, signIn, type Session } from '../../support/http';
import { newClientAddress } from '../../support/client-address';

let org: OrganisationFixture;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Origins');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

async function customerCount() {
  const [row] = await testDb().select({ n: count() }).from(s.customers).where(eq(s.customers.organisationId, org.organisationId));
  return row!.n;
}

const customer = { name: 'Orla Origin', email: '', phone: '', addressLines: '1 Same Street', postcode: 'QX1 1OO', notes: '' };

/** A request with headers fetch will not let us set (Host), as a browser or a proxy sends them. */
function raw(path: string, options: { method?: string; headers?: Record<string, string>; body?: string }) {
  const url = new URL(path, baseUrl());
  return new Promise<{ status: number; text: string; headers: http.IncomingHttpHeaders }>((resolve, reject) => {
    const request = http.request(
      { host: url.hostname, port: url.port, path: url.pathname + url.search, method: options.method ?? 'POST', headers: options.headers },
      (response) => {
        let text = '';
        response.on('data', (chunk) => (text += chunk));
        response.on('end', () => resolve({ status: response.statusCode!, text, headers: response.headers }));
      },
    );
    request.on('error', reject);
    request.end(options.body);
  });
}

describe('a write from another site', () => {
  it('is refused as a form post, a text/plain post, multipart or JSON, and creates nothing', async () => {
    const before = await customerCount();
    const evil = 'https://forms.evil.example';
    const attempts = [
      { type: 'application/x-www-form-urlencoded', body: 'name=Forged&addressLines=x&postcode=x&notes=' },
      { type: 'text/plain', body: JSON.stringify(customer) },
      { type: 'multipart/form-data; boundary=x', body: '--x\r\nContent-Disposition: form-data; name="name"\r\n\r\nForged\r\n--x--\r\n' },
      { type: 'application/json', body: JSON.stringify(customer) },
    ];
    for (const { type, body } of attempts) {
      const response = await call(office, '/api/office/customers', { method: 'POST', body, headers: { origin: evil, 'content-type': type } });
      expect(response.status, type).toBe(403);
      expect((await response.json()).error).toMatch(/another site/);
    }
    expect(await customerCount()).toBe(before);
  });

  it('is refused on sign-in too, and sets no session', async () => {
    const response = await call(null, '/api/auth/sign-in/email', {
      method: 'POST',
      body: `email=${encodeURIComponent(org.office.email)}&password=${FIXTURE_PASSWORD}`,
      headers: { origin: 'https://forms.evil.example', 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': newClientAddress() },
    });
    expect(response.status).toBe(403);
    expect(response.headers.getSetCookie()).toEqual([]);
  });

  it('is refused from a sandboxed page (Origin: null) and when only Sec-Fetch-Site says cross-site', async () => {
    const nullOrigin = await call(office, '/api/office/customers', { body: customer, headers: { origin: 'null' } });
    expect(nullOrigin.status).toBe(403);
    const headers = { cookie: office.cookie, 'content-type': 'application/json', 'sec-fetch-site': 'cross-site' };
    expect((await raw('/api/office/customers', { headers, body: JSON.stringify(customer) })).status).toBe(403);
    expect((await raw('/api/office/customers', { headers: { ...headers, 'sec-fetch-site': 'same-site' } , body: JSON.stringify(customer) })).status).toBe(403);
  });

  it('from a page on another port of the same host is refused (cookies are shared across ports)', async () => {
    const port = Number(new URL(baseUrl()).port);
    const response = await call(office, '/api/office/customers', { body: customer, headers: { origin: `http://127.0.0.1:${port + 1}` } });
    expect(response.status).toBe(403);
  });
});

describe("the app's own writes", () => {
  it('pass from 127.0.0.1, with or without a body', async () => {
    expect((await call(office, '/api/office/customers', { body: customer })).status).toBe(201);
    // A body-less write (Astro's own check refused these when its rebuilt URL said localhost).
    const run = await call(office, '/api/office/reminders/run', { method: 'POST' });
    expect(run.status).toBe(200);
  });

  it('pass when the app is opened as localhost (Host and Origin agree)', async () => {
    const port = new URL(baseUrl()).port;
    const response = await raw('/api/office/customers', {
      headers: { host: `localhost:${port}`, origin: `http://localhost:${port}`, cookie: office.cookie, 'content-type': 'application/json', 'sec-fetch-site': 'same-origin' },
      body: JSON.stringify(customer),
    });
    expect(response.status).toBe(201);
  });

  it('pass behind a proxy we trust that forwards the public name and TLS, and not over the wrong scheme', async () => {
    const proxied = { host: '10.0.0.7:8080', 'x-forwarded-host': 'servicing.example', 'x-forwarded-proto': 'https', cookie: office.cookie, 'content-type': 'application/json' };
    const ok = await raw('/api/office/customers', { headers: { ...proxied, origin: 'https://servicing.example' }, body: JSON.stringify(customer) });
    expect(ok.status).toBe(201);
    expect(ok.headers['strict-transport-security']).toBe('max-age=31536000');
    const downgraded = await raw('/api/office/customers', { headers: { ...proxied, origin: 'http://servicing.example' }, body: JSON.stringify(customer) });
    expect(downgraded.status).toBe(403);
  });

  it('leave programs that send no Origin (Stripe, scripts) to the endpoint’s own check', async () => {
    const response = await raw('/api/public/payments/stripe-webhook', { headers: { 'content-type': 'application/json' }, body: '{}' });
    expect(response.status).toBe(400);
    expect(response.text).toMatch(/Stripe-Signature/);
  });
});
