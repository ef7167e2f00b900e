// The technician's load list on the phone: kept on the phone when the round is pulled, opened
// from a cold start with the network cut, and brought up to date once there is signal again.
import { expect, test, type Page } from '@playwright/test';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { callJson, signIn } from '../support/http';
import { bookVisit, createVanFixture, type VanFixture } from '../support/van-fixtures';

test.use({ timezoneId: 'Europe/London' });
// Sign-in, pull, the service worker's install and a cold start: more than a minute on a busy machine.
test.setTimeout(180_000);

let org: OrganisationFixture;
let van: VanFixture;

/** A calendar day on the phone's clock (Europe/London), `offset` days from today. */
function phoneDate(offset: number) {
  const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London' }).format(new Date());
  const [y, m, d] = today.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + offset)).toISOString().slice(0, 10);
}
const NEXT = phoneDate(1);

test.beforeAll(async () => {
  org = await createOrganisation('Phone');
  van = await createVanFixture(org);
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: NEXT, position: 0 });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: NEXT, position: 1 });
});

/** Whether the phone's database holds the load list of `date` (read straight from IndexedDB). */
function loadListKept(page: Page, date: string) {
  return page.evaluate(
    ({ name, date }) =>
      new Promise<boolean>((resolve) => {
        const open = indexedDB.open(name);
        open.onerror = () => resolve(false);
        open.onsuccess = () => {
          const idb = open.result;
          if (!idb.objectStoreNames.contains('loadLists')) {
            idb.close();
            resolve(false);
            return;
          }
          const get = idb.transaction('loadLists').objectStore('loadLists').get(date);
          get.onsuccess = () => {
            idb.close();
            resolve(!!get.result);
          };
          get.onerror = () => {
            idb.close();
            resolve(false);
          };
        };
      }),
    { name: `tickover-${org.technician.id}`, date },
  );
}

test('the next round’s load list opens on the phone with no signal, and updates when signal returns', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.technician.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/round/);

  // The round's pull brings the load list with it: the technician never opened /van online.
  await expect.poll(() => loadListKept(page, NEXT), { timeout: 30_000 }).toBe(true);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect(page.getByRole('link', { name: 'Load list' })).toBeVisible();

  // No signal, and the tab closed: the next page is a cold start from the service worker.
  await context.setOffline(true);
  await page.close();
  const cold = await context.newPage();
  await cold.goto('/van');
  expect(await cold.evaluate(() => fetch('/api/health', { cache: 'no-store' }).then(() => false, () => true))).toBe(true);
  await expect(cold.getByRole('button', { name: 'Tomorrow' })).toHaveAttribute('aria-pressed', 'true');
  await expect(cold.getByTestId('load-list-freshness')).toContainText(/Last brought up to date today at \d\d:\d\d/);
  await expect(cold.getByTestId('load-list-freshness')).toContainText('No signal now');
  await expect(cold.getByRole('heading', { name: 'Pick from the store' })).toBeVisible();
  // 3.2 L of 0W-20 and 4.8 L of 5W-30 from an empty van, in the fixture's 1 L and 5 L containers.
  await expect(cold.getByTestId('pick-T-0W20')).toHaveText('4 × 1 L');
  await expect(cold.getByTestId('pick-T-5W30')).toHaveText('1 × 5 L');
  await expect(cold.getByText(/maker’s data and local regulations take precedence/)).toBeVisible();
  // Glove-sized controls at the bottom of the screen.
  for (const name of ['Today', 'Tomorrow', 'Update', 'Print']) {
    const box = (await cold.getByRole('button', { name, exact: true }).boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(48);
    expect(box.y).toBeGreaterThan(844 - 200);
  }
  await cold.screenshot({ path: 'test-results/screens/phone-load-list-offline.png' });
  await cold.screenshot({ path: 'test-results/screens/phone-load-list-full.png', fullPage: true });

  // Update with no signal says so and keeps the copy.
  await cold.getByRole('button', { name: 'Update' }).click();
  await expect(cold.getByRole('alert')).toHaveText('No signal: showing the copy kept on this phone.');
  await expect(cold.getByTestId('pick-T-0W20')).toHaveText('4 × 1 L');

  // Meanwhile the office loads the van; with signal again, Update shows it.
  const office = await signIn(org.office.email, FIXTURE_PASSWORD);
  const restock = await callJson(office, '/api/office/van-stock/movements', {
    body: { technicianId: org.technician.id, reason: 'restock', lines: [{ partId: van.parts.oil0w20, quantity: 4 }] },
  });
  expect(restock.status).toBe(201);
  await context.setOffline(false);
  await cold.getByRole('button', { name: 'Update' }).click();
  await expect(cold.getByTestId('pick-T-0W20')).toHaveCount(0);
  await expect(cold.getByTestId('pick-T-5W30')).toHaveText('1 × 5 L');
  await expect(cold.getByTestId('load-list-freshness')).not.toContainText('No signal');
  await cold.screenshot({ path: 'test-results/screens/phone-load-list.png' });
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
