// A whole visit with no signal: sign in once online, then with the network cut: cold start from
// the service worker, open the visit, tick, read (one refused, one recorded), a finding with a
// photo from the file chooser, sign-off; close and reopen and find it all; then go online, let
// it sync, and see the visit complete through the office API.
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import sharp from 'sharp';
import { signInWithRoundCached } from '../support/phone-sign-in';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { createRound, type RoundFixture } from '../support/round-fixture';
import { callJson, signIn } from '../support/http';

test.use({ timezoneId: 'Europe/London' });
// Sign-in, pull, a visit's worth of screens, sync: longer than the default minute on a busy machine.
test.setTimeout(180_000);

let org: OrganisationFixture;
let round: RoundFixture;

test.beforeAll(async () => {
  org = await createOrganisation('Offline');
  round = await createRound(org);
});

async function isOffline(page: Page) {
  return page.evaluate(() => fetch('/api/health', { cache: 'no-store' }).then(() => false, () => true));
}

async function openRound(context: BrowserContext) {
  const page = await context.newPage();
  await page.goto('/round');
  return page;
}

test('a whole visit offline, from cold start to sign-off, then synced to the office', async ({ context, page }) => {
  // Online, once: sign in; the round is pulled and the app shell cached by the service worker.
  await signInWithRoundCached(context, page, org.technician.email, round);

  // No signal from here on; the tab is closed, so the next page is a cold start.
  await context.setOffline(true);
  await page.close();
  const cold = await openRound(context);
  expect(await isOffline(cold)).toBe(true);
  await expect(cold.getByRole('heading', { name: /^Today ·/ })).toBeVisible();
  const coldCard = cold.getByRole('link', { name: new RegExp(`${round.customerName}, ${round.registration}`) });
  await expect(coldCard.getByText('Ready offline')).toBeVisible();
  await coldCard.click();
  await expect(cold).toHaveURL(new RegExp(`/visit\\?id=${round.visitId}`));
  await expect(cold.getByText('Known weak spots').or(cold.getByText('Special tools'))).toBeVisible();
  await expect(cold.getByText(/maker’s data and local regulations take precedence/)).toBeVisible();

  // Ticks.
  await cold.getByRole('button', { name: 'Checklist', exact: true }).click();
  const raised = cold.getByRole('button', { name: 'Tick: Car raised and supported on axle stands' });
  await raised.click();
  await expect(raised).toHaveAttribute('aria-pressed', 'true');
  const exhaust = cold.getByRole('button', { name: 'Tick: Exhaust system and mountings' });
  await exhaust.click();
  await expect(exhaust).toHaveAttribute('aria-pressed', 'true');

  // A reading the pad refuses (SAE J300 has no 35 grade), then a good one.
  await cold.getByRole('button', { name: 'Reading: Oil grade used' }).click();
  await cold.getByLabel('Grade as printed on the container').fill('5W-35');
  await expect(cold.getByRole('alert')).toContainText('SAE J300 defines no 35 grade');
  await expect(cold.getByRole('button', { name: /^Record/ })).toBeDisabled();
  await cold.getByRole('button', { name: '0W-20', exact: true }).click();
  await cold.getByRole('button', { name: 'Record 0W-20' }).click();
  const gradeRow = cold.getByRole('button', { name: 'Reading: Oil grade used' });
  await expect(gradeRow).toContainText('0W-20');
  await expect(gradeRow).toContainText('Within range');

  // A tread depth under the legal minimum: recorded, flagged, and a finding suggested.
  await cold.getByRole('button', { name: 'Reading: Tread depth, front left' }).click();
  for (const key of ['1', 'Decimal point', '5']) await cold.getByRole('button', { name: key, exact: true }).click();
  await expect(cold.getByTestId('judgement')).toContainText('legal minimum');
  await cold.getByRole('button', { name: 'Record 1.5 mm' }).click();
  await expect(cold.getByRole('dialog', { name: 'Add a finding?' })).toBeVisible();
  await expect(cold.getByRole('radio', { name: /Now/ })).toBeChecked();

  // A photo through the file chooser: bigger than the phone keeps, so it is downscaled first.
  const photo = await sharp({ create: { width: 2400, height: 1800, channels: 3, background: { r: 160, g: 90, b: 40 } } }).jpeg().toBuffer();
  const chooser = cold.waitForEvent('filechooser');
  await cold.getByText('Take photo').click();
  await (await chooser).setFiles({ name: 'tyre.jpg', mimeType: 'image/jpeg', buffer: photo });
  await expect(cold.getByRole('img', { name: /New photo/ })).toBeVisible();
  await cold.getByRole('button', { name: 'Save finding' }).click();
  await expect(cold.getByRole('dialog')).toHaveCount(0);

  await cold.getByRole('button', { name: /^Findings/ }).click();
  await expect(cold.getByText('Tread depth, front left: 1.5 mm').first()).toBeVisible();
  await expect(cold.getByTestId('photo-state')).toHaveText('On this phone');

  // Sign-off: odometer, a signature drawn on the screen, the declaration.
  await cold.getByRole('button', { name: 'Sign-off', exact: true }).click();
  await cold.getByLabel('Odometer (miles)').fill('31874');
  const pad = cold.getByTestId('signature-pad');
  await pad.scrollIntoViewIfNeeded();
  const box = (await pad.boundingBox())!;
  await cold.mouse.move(box.x + 30, box.y + box.height * 0.6);
  await cold.mouse.down();
  for (let i = 1; i <= 12; i += 1) await cold.mouse.move(box.x + 30 + i * 20, box.y + box.height * (0.6 - 0.3 * Math.sin(i / 2)));
  await cold.mouse.up();
  await cold.getByRole('checkbox').check();
  await cold.getByRole('button', { name: 'Sign off and lock the visit' }).click();
  await expect(cold.getByText(/This visit is locked/)).toBeVisible();
  await expect(cold.getByTestId('outbox-state')).toContainText(/\d+ changes waiting/);

  // Close and reopen, still offline: everything is there, and the visit stays locked.
  await cold.close();
  const again = await context.newPage();
  await again.goto(`/visit?id=${round.visitId}#checklist`);
  expect(await isOffline(again)).toBe(true);
  await expect(again.getByText(/This visit is locked/)).toBeVisible();
  await expect(again.getByRole('button', { name: 'Tick: Car raised and supported on axle stands' })).toHaveAttribute('aria-pressed', 'true');
  await expect(again.getByRole('button', { name: 'Tick: Exhaust system and mountings' })).toBeDisabled();
  await expect(again.getByRole('button', { name: 'Reading: Oil grade used' })).toContainText('0W-20');
  await again.getByRole('button', { name: /^Findings/ }).click();
  await expect(again.getByText('Tread depth, front left: 1.5 mm').first()).toBeVisible();
  await expect(again.getByRole('img', { name: 'Tread depth, front left: 1.5 mm' }).first()).toBeVisible();

  // Signal again: the outbox drains by itself or on "Sync now".
  await context.setOffline(false);
  await again.getByRole('button', { name: 'Sync now' }).click();
  await expect(again.getByTestId('outbox-state')).toContainText('Nothing waiting', { timeout: 30_000 });
  await expect(again.getByTestId('photo-state')).toHaveText('Uploaded');

  // The office sees the visit complete.
  const office = await signIn(org.office.email, FIXTURE_PASSWORD);
  const { status, json } = await callJson(office, `/api/office/visits/${round.visitId}`);
  expect(status).toBe(200);
  expect(json.visit.status).toBe('signed_off');
  expect(json.signOff).toMatchObject({ odometer: 31874, odometerUnit: '[mi_i]', customerName: round.customerName });
  expect(json.signOff.signatureSvg).toMatch(/^<svg/);
  const items = json.checklist.sections.flatMap((section: { items: unknown[] }) => section.items) as {
    id: string;
    check: { state: string } | null;
    reading: { value: number | null; textValue: string | null } | null;
  }[];
  const item = (key: string) => items.find((i) => i.id === round.items[key])!;
  expect(item('raised-safely').check?.state).toBe('done');
  expect(item('exhaust').check?.state).toBe('done');
  expect(item('oil-grade').reading?.textValue).toBe('0W-20');
  expect(item('tread-fl').reading?.value).toBe(1.5);
  expect(json.findings).toHaveLength(1);
  expect(json.findings[0]).toMatchObject({ title: 'Tread depth, front left: 1.5 mm', severity: 'now' });
  expect(json.findings[0].photos).toHaveLength(1);
});
