// The technician's load list on the phone: fetched once, then opened again with no network.
import { expect, test } from '@playwright/test';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { bookVisit, createVanFixture, type VanFixture } from '../support/van-fixtures';

let org: OrganisationFixture;
let van: VanFixture;

function phoneDate(offset: number) {
  const d = new Date();
  d.setDate(d.getDate() + offset);
  return [d.getFullYear(), String(d.getMonth() + 1).padStart(2, '0'), String(d.getDate()).padStart(2, '0')].join('-');
}

test.beforeAll(async () => {
  org = await createOrganisation('Phone');
  van = await createVanFixture(org);
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: phoneDate(1), position: 0 });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: phoneDate(1), position: 1 });
});

test('tomorrow’s load list opens on the phone, and again without signal', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in?next=/van');
  await page.getByLabel('E-mail').fill(org.technician.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/van$/);

  await expect(page.getByRole('heading', { name: 'Pick from the store' })).toBeVisible();
  await expect(page.getByTestId('pick-T-0W20')).toHaveText('4 × 1 L');
  await expect(page.getByTestId('pick-T-5W30')).toHaveText('1 × 5 L');
  await expect(page.getByText(/Saved on this phone/)).toBeVisible();
  // Glove-sized controls at the bottom of the screen.
  for (const name of ['Today', 'Tomorrow', 'Update', 'Print']) {
    const box = (await page.getByRole('button', { name, exact: true }).boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(48);
    expect(box.y).toBeGreaterThan(844 - 200);
  }
  await page.screenshot({ path: 'test-results/screens/phone-load-list.png' });
  await page.screenshot({ path: 'test-results/screens/phone-load-list-full.png', fullPage: true });

  // No network: the saved copy still shows (the page itself comes from the browser's cache here;
  // in the app the service worker serves it).
  await context.setOffline(true);
  await page.getByRole('button', { name: 'Update' }).click();
  await expect(page.getByRole('alert')).toHaveText(/No signal: showing the copy saved on this phone/);
  await expect(page.getByTestId('pick-T-0W20')).toHaveText('4 × 1 L');
  await context.setOffline(false);
});

test('a technician cannot open the office’s van pages', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.technician.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/round$/);
  await page.goto('/office/vans');
  await expect(page).toHaveURL(/\/round$/);
});
