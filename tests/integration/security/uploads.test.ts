// Everything a client can send the server, bounded and judged by its content, never by its name
// or declared type alone. Upload paths: photo bytes (PUT /api/photos/{sha256}), signatures (inside
// a sync sign-off), JSON bodies (readJson), the sync push, sign-in, the Stripe webhook, the office's
// import of a file of unsent changes (its photos through the same storePhoto). There is no
// multipart upload and no file name anywhere: photos are stored under their organisation and
// SHA-256 (tests/integration/sync/photos.test.ts covers type, hash and the 8 MB limit).
import { createHash, randomUUID } from 'node:crypto';
import http from 'node:http';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { baseUrl, call, callJson, signIn, type Session } from '../../support/http';
import { newClientAddress } from '../../support/client-address';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup } from '../../support/visit-fixtures';

let org: OrganisationFixture;
let technician: Session;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Uploads');
  [technician, office] = await Promise.all([signIn(org.technician.email, FIXTURE_PASSWORD), signIn(org.office.email, FIXTURE_PASSWORD)]);
});
afterAll(async () => {
  await testPool().end();
});

const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');
const upload = (bytes: Uint8Array, type: string, hash = sha(bytes)) =>
  call(technician, `/api/photos/${hash}`, { method: 'PUT', body: bytes, headers: { 'content-type': type } });

describe('photo bytes', () => {
  it('are cut off at 8 MB even when sent without a length (chunked), and the server carries on', async () => {
    // On a connection of its own (agent: false): the server answers before the body ends and
    // closes it, which must not break the connections other requests share.
    const url = new URL(`/api/photos/${'e'.repeat(64)}`, baseUrl());
    const chunk = Buffer.alloc(1024 * 1024, 0x41);
    chunk.set([0xff, 0xd8, 0xff, 0xe0]);
    const answer = await new Promise<{ status: number; text: string }>((resolve, reject) => {
      const request = http.request(
        {
          host: url.hostname,
          port: url.port,
          path: url.pathname,
          method: 'PUT',
          agent: false,
          headers: { 'content-type': 'image/jpeg', 'transfer-encoding': 'chunked', cookie: technician.cookie, 'x-forwarded-for': technician.address },
        },
        (response) => {
          let text = '';
          response.on('data', (c) => (text += c));
          response.on('end', () => resolve({ status: response.statusCode!, text }));
        },
      );
      request.on('error', reject);
      let sent = 0;
      const more = () => {
        while (sent < 9 && !request.destroyed) {
          sent += 1;
          if (!request.write(chunk)) return void request.once('drain', more);
        }
        if (!request.destroyed) request.end();
      };
      more();
    });
    expect(answer.status).toBe(413);
    expect(answer.text).toMatch(/larger than 8388608 bytes/);
    expect((await call(null, '/api/health')).status).toBe(200);
  });

  it('that are markup are refused whatever they claim to be', async () => {
    const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>');
    expect((await upload(svg, 'image/png')).status).toBe(415);
    expect((await upload(svg, 'image/svg+xml')).status).toBe(415);
    const html = new TextEncoder().encode('<!doctype html><script>alert(1)</script>');
    expect((await upload(html, 'image/jpeg')).status).toBe(415);
  });

  it('that start like a JPEG but are not a picture are refused, and nothing is stored', async () => {
    const disguised = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, ...new TextEncoder().encode('<html><script>alert(1)</script></html>')]);
    const response = await upload(disguised, 'image/jpeg');
    expect(response.status).toBe(422);
    const rows = await testDb().select().from(s.photoObjects).where(eq(s.photoObjects.sha256, sha(disguised)));
    expect(rows).toEqual([]);
  });

  it('are addressed only by a SHA-256: a path or name in its place is refused', async () => {
    for (const name of ['..%2F..%2Fetc%2Fpasswd', 'photo.jpg', `${'a'.repeat(63)}G`, 'A'.repeat(64)]) {
      const response = await call(technician, `/api/photos/${name}`, { method: 'PUT', body: new Uint8Array([0xff, 0xd8, 0xff]), headers: { 'content-type': 'image/jpeg' } });
      expect([400, 404], name).toContain(response.status);
    }
  });
});

describe('a signature', () => {
  it('that holds anything but a drawing is rejected, and the visit is not signed off', async () => {
    const setup = await createVisitSetup(org);
    const visitId = await createVisit(org, setup);
    const device = new TestDevice('uploads-phone', Date.now());
    const signOff = device.signOff(visitId);
    signOff.payload.signatureSvg = '<svg xmlns="http://www.w3.org/2000/svg"><image href="https://tracker.example/seen.png"/><path d="M1 1 L9 9"/></svg>';
    const response = await callJson(technician, '/api/sync/push', { body: { deviceId: 'uploads-phone', operations: [signOff] } });
    expect(response.status).toBe(200);
    expect(response.json.results[0]).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/drawing of paths/) });
    expect(await testDb().select().from(s.signOffs).where(eq(s.signOffs.visitId, visitId))).toEqual([]);
  });

  it('of more than 200 000 characters is rejected', async () => {
    const setup = await createVisitSetup(org);
    const visitId = await createVisit(org, setup);
    const device = new TestDevice('uploads-phone-2', Date.now());
    const signOff = device.signOff(visitId);
    signOff.payload.signatureSvg = `<svg xmlns="http://www.w3.org/2000/svg"><path d="M0 0${' L1 1'.repeat(40_000)}"/></svg>`;
    const response = await callJson(technician, '/api/sync/push', { body: { deviceId: 'uploads-phone-2', operations: [signOff] } });
    expect(response.json.results[0].outcome).toBe('rejected');
  });
});

describe('bodies', () => {
  it('of sign-in are bounded at 16 KB', async () => {
    const response = await callJson(null, '/api/auth/sign-in/email', {
      body: { email: org.office.email, password: 'x'.repeat(20_000) },
      headers: { 'x-forwarded-for': newClientAddress() },
    });
    expect(response.status).toBe(413);
  });

  it("of Stripe's webhook are bounded before the signature is checked", async () => {
    const response = await callJson(null, '/api/public/payments/stripe-webhook', {
      body: JSON.stringify({ id: `evt_${randomUUID()}`, padding: 'x'.repeat(300_000) }),
      headers: { 'content-type': 'application/json', 'stripe-signature': 't=1,v1=00' },
    });
    expect(response.status).toBe(413);
  });

  it('of an office form are bounded at 1 MB', async () => {
    const response = await callJson(office, '/api/office/customers', {
      body: { name: 'Big', email: '', phone: '', addressLines: '', postcode: '', notes: 'x'.repeat(1_100_000) },
    });
    expect(response.status).toBe(413);
  });

  it('are read with a bound by every route: none reads a whole body itself', () => {
    const pages = join(__dirname, '..', '..', '..', 'src', 'pages');
    const sources = (dir: string): string[] =>
      readdirSync(dir).flatMap((name) => {
        const path = join(dir, name);
        return statSync(path).isDirectory() ? sources(path) : /\.(ts|astro)$/.test(name) ? [path] : [];
      });
    const unbounded = sources(pages).filter((file) => /request\.(text|json|formData|arrayBuffer|blob)\(\)|\.body\.getReader\(\)/.test(readFileSync(file, 'utf8')));
    expect(unbounded.map((f) => f.slice(pages.length))).toEqual([]);
  });
});
