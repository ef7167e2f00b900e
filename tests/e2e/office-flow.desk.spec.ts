// The office at a desk: add a customer and a vehicle (a bad VIN is refused, a good one kept),
// book a visit on a technician's round, see it reach the technician's phone through pull, and
// review it once it syncs back. Runs in its own organisation, never the demo business.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { expect, request, test, type APIRequestContext } from '@playwright/test';
import { and, eq } from 'drizzle-orm';
import * as s from '../../src/db/schema';
import { encodeStamp } from '../../src/lib/sync/clock';
import { newClientAddress } from '../support/client-address';
import { testDb, testPool } from '../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { publishedChecklist, syncedSignedOffVisit } from '../support/office-fixtures';

const root = process.env.TICKOVER_ROOT ?? process.cwd();
const syncRoute = (name: string) => existsSync(join(root, 'src', 'pages', 'api', 'sync', `${name}.ts`));

// A Tuesday in March 2031: before summer time, so London time is UTC, and far from today.
const DAY = '2031-03-04';

let org: OrganisationFixture;
const registration = `QE${randomUUID().slice(0, 4).toUpperCase().replace(/[^A-Z0-9]/g, '7')}`;

test.describe.configure({ mode: 'serial' });

test.beforeAll(async () => {
  org = await createOrganisation('Desk flow');
  await publishedChecklist(org, 'Test service');
});
test.afterAll(async () => {
  await testPool().end();
});

test.beforeEach(async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.office.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);
});

async function signedInAs(email: string): Promise<APIRequestContext> {
  const baseURL = process.env.TEST_BASE_URL ?? 'http://127.0.0.1:4329';
  const api = await request.newContext({ baseURL, extraHTTPHeaders: { 'x-forwarded-for': newClientAddress(), origin: baseURL } });
  const response = await api.post('/api/auth/sign-in/email', { data: { email, password: FIXTURE_PASSWORD } });
  expect(response.ok()).toBe(true);
  return api;
}

async function bookedVisit() {
  const [visit] = await testDb()
    .select()
    .from(s.visits)
    .where(and(eq(s.visits.organisationId, org.organisationId), eq(s.visits.roundDate, DAY)));
  return visit!;
}

test('adds a customer, then a vehicle: a bad VIN is refused with a reason, a good one is kept', async ({ page }) => {
  await page.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Customers' }).click();
  await page.getByRole('link', { name: 'New customer' }).click();
  await page.getByLabel('Name').fill('Ada Testwell');
  await page.getByLabel('Phone').fill('07700 900777');
  await page.getByLabel('E-mail').fill('ada@test.example');
  await page.getByLabel('Address (where the vehicle usually stands)').fill('1 Test Lane, Aldersby');
  await page.getByLabel('Postcode').fill('qx1 1tt');
  await page.getByRole('button', { name: 'Add customer' }).click();
  await expect(page.getByRole('heading', { name: 'Ada Testwell' })).toBeVisible();

  await page.getByRole('link', { name: 'Add vehicle' }).click();
  await expect(page.getByText('Customer: Ada Testwell')).toBeVisible();
  await page.getByLabel('Registration').fill(registration.toLowerCase());
  // 49 CFR 565.15: the weighted sum of 1M8GDM9A?KP042789 is 353, and 353 mod 11 = 1, so X is wrong
  // (TRADE-REFERENCES §8.1).
  await page.getByLabel('VIN', { exact: true }).fill('1M8GDM9AXKP042789');
  await page.getByLabel('Make', { exact: true }).fill('Corvane');
  await page.getByLabel('Model', { exact: true }).fill('Pippet');
  await page.getByLabel('Oil grade (SAE J300)').fill('0w20');
  await page.getByRole('button', { name: 'Add vehicle' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'VIN: The check digit (9th character) is X but should be 1' })).toBeVisible();
  await expect(page).toHaveURL(/\/office\/vehicles\/new/);

  // The regulation's own worked example (Table V): check digit 4.
  await page.getByLabel('VIN', { exact: true }).fill('1G4AH59H45G118341');
  await expect(page.getByText('VIN looks right')).toBeVisible();
  await page.getByRole('button', { name: 'Add vehicle' }).click();
  await expect(page.getByRole('heading', { name: `${registration}: Corvane Pippet` })).toBeVisible();
  await expect(page.getByLabel('Oil grade (SAE J300)')).toHaveValue('0W-20');
  await page.screenshot({ path: test.info().outputPath('vehicle.png') });
});

test('books a visit for a technician on the rounds planner', async ({ page }) => {
  await page.goto(`/office/rounds?week=${DAY}`);
  await page.getByRole('button', { name: 'Book a visit for Tara Tech on Tue 4 Mar' }).click();
  const dialog = page.getByRole('dialog', { name: 'Book a visit' });
  await dialog.getByLabel('Customer', { exact: true }).fill('Ada');
  await dialog.getByRole('button', { name: /Ada Testwell/ }).click();
  await expect(dialog.getByLabel('Vehicle', { exact: true })).toHaveValue(/.+/);
  await dialog.getByLabel('Checklist', { exact: true }).selectOption({ label: 'Test service (v1)' });
  await dialog.getByLabel('From', { exact: true }).fill('09:00');
  await expect(dialog.getByLabel('To', { exact: true })).toHaveValue('10:30');
  await expect(dialog.getByLabel('Where the vehicle stands')).toHaveValue('1 Test Lane, Aldersby');
  await dialog.getByRole('button', { name: 'Book visit' }).click();
  await expect(page.getByRole('status')).toContainText('Visit booked.');
  const round = page.getByRole('list', { name: 'Tara Tech, Tue 4 Mar' });
  await expect(round.getByText(registration)).toBeVisible();
  await expect(round.getByText('09:00–10:30')).toBeVisible();
  await page.screenshot({ path: test.info().outputPath('rounds.png') });
});

test('the booked visit reaches the technician’s round on the next pull', async () => {
  test.skip(!syncRoute('pull'), 'needs GET /api/sync/pull from the sync work (issue 5)');
  const visit = await bookedVisit();
  expect(await pulledVisitIds(org.technician.email)).toContain(visit.id);
  expect(await pulledVisitIds(org.otherTechnician.email)).not.toContain(visit.id);
});

/** Every visit id a phone signed in as `email` receives, pulling page after page from the start. */
async function pulledVisitIds(email: string): Promise<string[]> {
  const phone = await signedInAs(email);
  const ids: string[] = [];
  let cursor = '0';
  for (let page = 0; page < 50; page += 1) {
    const response = await phone.get(`/api/sync/pull?cursor=${cursor}`);
    expect(response.status()).toBe(200);
    const body = await response.json();
    ids.push(...body.visits.map((v: { id: string }) => v.id));
    cursor = body.cursor;
    if (!body.hasMore) break;
  }
  return ids;
}

test('reviews the visit after it syncs back, and marks it reviewed', async ({ page }) => {
  const visit = await bookedVisit();
  if (syncRoute('push')) await pushSignedOffVisit(visit);
  // Until the push endpoint exists, write what a push would leave behind.
  else await syncedSignedOffVisit(org, visit);

  await page.goto('/office/visits?attention=1');
  await page.getByRole('link', { name: /Tue 4 Mar 2031 09:00/ }).click();
  await expect(page.getByRole('heading', { name: `Visit: ${registration}, Ada Testwell` })).toBeVisible();
  await expect(page.getByText('Front left tyre below the legal limit')).toBeVisible();
  await expect(page.getByRole('row', { name: /Tread depth, front left/ })).toContainText('Now');
  const signature = page.getByRole('img', { name: 'Signature of Ada Testwell' });
  await expect(signature).toBeVisible();
  // The signature is an image: a script inside the SVG never runs in the page.
  expect(await page.evaluate(() => (window as unknown as { __signed?: number }).__signed)).toBeUndefined();
  await page.screenshot({ path: test.info().outputPath('review.png'), fullPage: true });

  await page.getByRole('button', { name: 'Mark reviewed' }).click();
  await expect(page.getByText('Already reviewed.')).toBeVisible();
  const [row] = await testDb().select().from(s.visits).where(eq(s.visits.id, visit.id));
  expect(row!.status).toBe('reviewed');
});

/** The technician's phone pushes the visit: results, a finding and the sign-off. */
async function pushSignedOffVisit(visit: typeof s.visits.$inferSelect) {
  const items = await testDb().select().from(s.templateItems).where(eq(s.templateItems.versionId, visit.templateVersionId));
  const item = (label: string) => items.find((i) => i.label === label)!.id;
  const deviceId = 'e2e-phone';
  let counter = 0;
  const envelope = () => ({ opId: randomUUID(), visitId: visit.id, deviceId, stamp: encodeStamp({ wallMs: Date.now(), counter: counter++, deviceId }), seenStamp: null });
  const findingId = randomUUID();
  const operations = [
    { ...envelope(), kind: 'check', payload: { itemId: item('Coolant level and hoses'), state: 'done' } },
    { ...envelope(), kind: 'reading', payload: { itemId: item('Battery resting voltage'), value: 12.2, textValue: null, unit: 'V' } },
    { ...envelope(), kind: 'reading', payload: { itemId: item('Tread depth, front left'), value: 1.4, textValue: null, unit: 'mm' } },
    { ...envelope(), kind: 'finding', payload: { findingId, itemId: item('Tread depth, front left'), title: 'Front left tyre below the legal limit', detail: '1.4 mm.', severity: 'now', downgrade: false } },
    {
      ...envelope(),
      kind: 'sign_off',
      payload: {
        signOffId: randomUUID(),
        odometer: 41_000,
        odometerUnit: '[mi_i]',
        customerName: 'Ada Testwell',
        signatureSvg: '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M0 5 L10 5" stroke="black"/></svg>',
        declaration: 'I carried out the work recorded here.',
        signedAt: new Date().toISOString(),
      },
    },
  ];
  const phone = await signedInAs(org.technician.email);
  const response = await phone.post('/api/sync/push', { data: { deviceId, operations } });
  expect(response.status()).toBe(200);
  const { results } = await response.json();
  expect(results.map((r: { outcome: string }) => r.outcome)).toEqual(['applied', 'applied', 'applied', 'applied', 'applied']);
  // Sync refuses a signature holding a script (lib/sync/operations.ts); one stored before that
  // check, or written some other way, must still only ever be shown as an image.
  const hostile = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><script>window.__signed=1</script><path d="M0 5 L10 5" stroke="black"/></svg>';
  await testDb().update(s.signOffs).set({ signatureSvg: hostile }).where(eq(s.signOffs.visitId, visit.id));
}
