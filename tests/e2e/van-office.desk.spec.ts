// The office works the vans at a desk: restock, see the level and its movement, download the
// order list. Runs on its own business so the demo stays as seeded.
import { expect, test } from '@playwright/test';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { bookVisit, createVanFixture, type VanFixture } from '../support/van-fixtures';
import { shiftDate } from '../../src/lib/office/local-time';

let org: OrganisationFixture;
let van: VanFixture;

test.beforeAll(async () => {
  org = await createOrganisation('Desk');
  van = await createVanFixture(org);
  const tomorrow = shiftDate(new Date().toISOString().slice(0, 10), 1);
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: tomorrow });
});

test.beforeEach(async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.office.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);
});

test('the office loads a van and sees the level and the movement that explains it', async ({ page }) => {
  await page.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Vans' }).click();
  await page.getByRole('link', { name: `${org.technician.name}’s van` }).click();
  await expect(page.getByText('Nothing recorded in this van yet.')).toBeVisible();

  const form = page.getByRole('form', { name: `Restock ${org.technician.name}'s van` });
  await form.getByLabel('Part 1').selectOption({ label: 'T-OF1 · T-OF1 test part' });
  await form.getByLabel('Quantity').fill('3');
  await form.getByRole('button', { name: 'Add a line' }).click();
  await form.getByLabel('Part 2').selectOption({ label: 'T-0W20 · T-0W20 test part' });
  await form.getByLabel('Quantity (L)').fill('5');
  await form.getByLabel('Note').fill('Evening load');
  await form.getByRole('button', { name: 'Record the load' }).click();

  const row = page.getByTestId('stock-T-OF1');
  await expect(row).toContainText('3');
  await row.getByLabel('Minimum for T-OF1').fill('4');
  await row.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByTestId('stock-T-OF1')).toContainText('Low');
  await expect(page.getByTestId('low-summary')).toHaveText(/1 part below its minimum/);
  await expect(page.locator('#movements')).toContainText('Evening load');
  await page.screenshot({ path: 'test-results/screens/office-van-stock.png', fullPage: true });

  await page.getByRole('link', { name: 'Tomorrow’s load list' }).click();
  await expect(page.getByRole('heading', { name: 'Pick from the store' })).toBeVisible();
  await expect(page.getByTestId('pick-T-SP1')).toHaveText('× 4');
  await page.screenshot({ path: 'test-results/screens/office-load-list.png', fullPage: true });
});

test('the office downloads the order list as CSV', async ({ page }) => {
  await page.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Vans' }).click();
  await page.getByRole('navigation', { name: 'Vans' }).getByRole('link', { name: 'Order list' }).click();
  await expect(page.getByRole('heading', { name: 'Sparks Test' })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/office-order-list.png', fullPage: true });
  const downloading = page.waitForEvent('download');
  await page.getByRole('link', { name: 'Download CSV' }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toMatch(/^order-list-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.csv$/);
});

test('the office records a used-oil disposal', async ({ page }) => {
  await page.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Vans' }).click();
  await page.getByRole('navigation', { name: 'Vans' }).getByRole('link', { name: 'Used oil' }).click();
  await expect(page.getByText('Local waste rules apply')).toBeVisible();
  const form = page.getByRole('form', { name: 'Record a disposal' });
  await form.getByLabel('Licensed site').fill('Desk Test Site');
  await form.getByLabel('Litres handed over').fill('12.5');
  await form.getByRole('button', { name: 'Record the disposal' }).click();
  await expect(page.getByRole('cell', { name: 'Desk Test Site' })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/office-used-oil.png', fullPage: true });
});

test('the office adds an oil to the catalogue with its containers, and counts a van', async ({ page }) => {
  await page.goto('/office/vans/parts');
  const add = page.getByRole('form', { name: 'Add a part' });
  await add.getByLabel('Part number').fill('T-15W40');
  await add.getByLabel('Description').fill('Desk test oil');
  await add.getByLabel('Kind').selectOption('oil');
  await add.getByLabel('SAE grade').fill('15w40');
  await add.getByLabel(/^Cost/).fill('5.10');
  await add.getByLabel(/^Price/).fill('9.80');
  await add.getByRole('button', { name: 'Add the part' }).click();
  const row = page.getByRole('row', { name: /T-15W40/ });
  await expect(row).toContainText('oil 15W-40');
  await expect(row).toContainText('£5.10');

  await row.getByRole('button', { name: 'Edit T-15W40' }).click();
  const edit = page.getByRole('form', { name: 'Edit T-15W40' });
  await edit.getByLabel('Containers (L)').fill('1, 5, 20');
  await edit.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByRole('row', { name: /T-15W40/ })).toContainText('1 L, 5 L, 20 L');
  await page.screenshot({ path: 'test-results/screens/office-parts.png', fullPage: true });

  await page.goto(`/office/vans?technician=${org.otherTechnician.id}`);
  const count = page.getByRole('form', { name: 'Stock count' });
  await count.getByLabel('Part').selectOption({ label: 'T-15W40 · Desk test oil' });
  await count.getByLabel('Counted').fill('3.5');
  await count.getByRole('button', { name: 'Record the count' }).click();
  await expect(page.getByTestId('stock-T-15W40')).toContainText('3.5 L');
  await expect(page.locator('#movements')).toContainText('Stock count');
});
