// The app works under its Content-Security-Policy on the phone: sign-in, the round, every tab of
// a visit (a photo and a drawn signature included), This phone and the calculators raise no
// violation, and the service worker still registers. A script injected into the page is blocked,
// which shows the policy is there and the listener hears it.
import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { createRound, type RoundFixture } from '../support/round-fixture';
import { watchPolicy } from '../support/csp-watch';

test.use({ timezoneId: 'Europe/London' });
test.setTimeout(150_000);

let org: OrganisationFixture;
let round: RoundFixture;

test.beforeAll(async () => {
  org = await createOrganisation('Policy phone');
  round = await createRound(org);
});

async function drawSignature(page: Page) {
  const pad = page.getByTestId('signature-pad');
  await pad.scrollIntoViewIfNeeded();
  const box = (await pad.boundingBox())!;
  await page.mouse.move(box.x + 30, box.y + box.height * 0.6);
  await page.mouse.down();
  for (let i = 1; i <= 10; i += 1) await page.mouse.move(box.x + 30 + i * 20, box.y + box.height * (0.6 - 0.3 * Math.sin(i / 2)));
  await page.mouse.up();
}

test('the technician’s screens raise no policy violation and the service worker registers', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  const policy = await watchPolicy(context);

  const signInPage = await page.goto('/sign-in');
  expect(signInPage!.headers()['content-security-policy']).toContain("script-src 'self' 'sha256-");
  await page.getByLabel('E-mail').fill(org.technician.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/round/);
  const card = page.getByRole('link', { name: new RegExp(`${round.customerName}, ${round.registration}`) });
  await expect(card.getByText('Ready offline')).toBeVisible({ timeout: 30_000 });
  const worker = await page.evaluate(async () => (await navigator.serviceWorker.ready).active?.state);
  expect(['activating', 'activated']).toContain(worker);

  await card.click();
  await expect(page).toHaveURL(new RegExp(`/visit\\?id=${round.visitId}`));
  await expect(page.getByText(/maker’s data and local regulations take precedence/)).toBeVisible();

  await page.getByRole('button', { name: 'Checklist', exact: true }).click();
  const tick = page.getByRole('button', { name: 'Tick: Exhaust system and mountings' });
  await tick.click();
  await expect(tick).toHaveAttribute('aria-pressed', 'true');
  await page.getByRole('button', { name: 'Reading: Tread depth, front left' }).click();
  for (const key of ['1', 'Decimal point', '5']) await page.getByRole('button', { name: key, exact: true }).click();
  await page.getByRole('button', { name: 'Record 1.5 mm' }).click();
  await expect(page.getByRole('dialog', { name: 'Add a finding?' })).toBeVisible();
  const photo = await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 90, g: 90, b: 40 } } }).jpeg().toBuffer();
  const chooser = page.waitForEvent('filechooser');
  await page.getByText('Take photo').click();
  await (await chooser).setFiles({ name: 'tyre.jpg', mimeType: 'image/jpeg', buffer: photo });
  await expect(page.getByRole('img', { name: /New photo/ })).toBeVisible();
  await page.getByRole('button', { name: 'Save finding' }).click();
  await expect(page.getByRole('dialog')).toHaveCount(0);

  await page.getByRole('button', { name: /^Findings/ }).click();
  await expect(page.getByRole('img', { name: 'Tread depth, front left: 1.5 mm' }).first()).toBeVisible();
  await page.getByRole('button', { name: /^Parts/ }).click();
  await page.getByRole('button', { name: 'Sign-off', exact: true }).click();
  await drawSignature(page);
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect(page.getByTestId('outbox-state')).toContainText('Nothing waiting', { timeout: 30_000 });

  await page.goto('/device');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await page.goto('/calculators');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();

  expect(await policy.violations()).toEqual([]);
  await policy.expectInjectedScriptBlocked(page);
});
