// The office console and the customer's record work under the Content-Security-Policy: every
// office page (charts, tables, forms, a visit's review with its photo and signature) and the
// record page raise no violation, and a script injected into a page is blocked.
import { expect, test } from '@playwright/test';
import { createHash, randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { call, signIn } from '../support/http';
import { createSignedOffVisit, type VisitFixture } from '../support/visit-fixtures';
import { watchPolicy } from '../support/csp-watch';
import { testDb } from '../support/database';
import * as s from '../../src/db/schema';
import { createRecordLink } from '../../src/lib/server/record-links';
import { encodeStamp } from '../../src/lib/sync/clock';

test.setTimeout(150_000);

let org: OrganisationFixture;
let visit: VisitFixture;
let recordPath: string;

test.beforeAll(async () => {
  org = await createOrganisation('Policy desk');
  visit = await createSignedOffVisit(org);
  // A photo on the visit, so the review shows one.
  const technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  const bytes = new Uint8Array(await sharp({ create: { width: 400, height: 300, channels: 3, background: { r: 30, g: 120, b: 90 } } }).jpeg().toBuffer());
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  expect((await call(technician, `/api/photos/${sha256}`, { method: 'PUT', body: bytes, headers: { 'content-type': 'image/jpeg' } })).status).toBe(201);
  await testDb().insert(s.photos).values({
    id: randomUUID(),
    visitId: visit.visitId,
    findingId: visit.findingIds.soon,
    objectKey: `photos/${org.organisationId}/${sha256}`,
    sha256,
    sizeBytes: bytes.byteLength,
    contentType: 'image/jpeg',
    addStamp: encodeStamp({ wallMs: Date.now(), counter: 0, deviceId: 'policy-phone' }),
    createdBy: org.technician.id,
  });
  const link = await createRecordLink(testDb(), { organisationId: org.organisationId, visitId: visit.visitId, createdBy: org.office.id });
  recordPath = new URL(link.url).pathname;
});

const OFFICE_PAGES = [
  '/office',
  '/office/rounds',
  '/office/visits',
  '/office/customers',
  '/office/vehicles',
  '/office/templates',
  '/office/model-notes',
  '/office/conflicts',
  '/office/invoices',
  '/office/advised-work',
  '/office/messages',
  '/office/people',
  '/office/settings',
  '/office/customers/new',
  '/office/vehicles/new',
];

test('the office console and the record raise no policy violation', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  const policy = await watchPolicy(context);

  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.owner.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);

  for (const path of OFFICE_PAGES) {
    const response = await page.goto(path);
    expect(response!.status(), path).toBe(200);
    expect(response!.headers()['content-security-policy'], path).toContain("frame-ancestors 'none'");
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    await page.waitForLoadState('networkidle');
  }
  await page.goto(`/office/visits/${visit.visitId}`);
  await expect(page.getByRole('img', { name: /Signature of/ })).toBeVisible();
  await expect(page.locator('img[src*="/api/photos/"]').first()).toBeVisible();
  await page.goto(`/office/customers/${visit.customerId}`);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await page.goto(`/office/vehicles/${visit.vehicleId}`);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();

  await page.goto(recordPath);
  await expect(page.getByTestId('registration')).toHaveText(visit.registration);
  await page.waitForLoadState('networkidle');

  expect(await policy.violations()).toEqual([]);
  await policy.expectInjectedScriptBlocked(page);
});
