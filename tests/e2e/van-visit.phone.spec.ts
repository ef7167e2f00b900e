// The van through a visit on the phone: the litres drained are prefilled from the vehicle's oil
// capacity, the parts fitted come off the van when they sync, and the office sees both.
import { expect, test } from '@playwright/test';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { callJson, signIn } from '../support/http';
import { bookVisit, createVanFixture, type VanFixture } from '../support/van-fixtures';

test.use({ timezoneId: 'Europe/London' });
test.setTimeout(180_000);

let org: OrganisationFixture;
let van: VanFixture;
let visitId: string;

test.beforeAll(async () => {
  org = await createOrganisation('Van visit');
  van = await createVanFixture(org);
  const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London' }).format(new Date());
  visitId = await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: today });
  const office = await signIn(org.office.email, FIXTURE_PASSWORD);
  const restock = await callJson(office, '/api/office/van-stock/movements', {
    body: { technicianId: org.technician.id, reason: 'restock', lines: [{ partId: van.parts.oil0w20, quantity: 5 }, { partId: van.parts.of, quantity: 2 }] },
  });
  expect(restock.status).toBe(201);
});

test('used oil prefilled from the capacity and parts fitted on the phone reach the van’s records', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.technician.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('link', { name: /Test Keeper, TP01ABC/ }).getByText('Ready offline')).toBeVisible({ timeout: 30_000 });
  await page.goto(`/visit?id=${visitId}`);

  // The petrol car takes 3.2 L (van fixture): the pad opens with that, ready to record.
  await page.getByRole('button', { name: 'Checklist', exact: true }).click();
  await page.getByRole('button', { name: 'Reading: Used oil drained' }).click();
  await page.getByRole('button', { name: 'Record 3.2 L' }).click();
  await expect(page.getByRole('button', { name: 'Reading: Used oil drained' })).toContainText('3.2');

  // The oil and its filter, as the spec suggests them.
  await page.getByRole('button', { name: 'Parts', exact: true }).click();
  await page.getByRole('button', { name: /T-0W20 × 3\.2 L\s*Fitted/ }).click();
  await page.getByRole('button', { name: /T-OF1 × 1\s*Fitted/ }).click();
  await expect(page.getByLabel('Quantity of T-OF1')).toBeVisible();
  await expect(page.getByTestId('outbox-state')).toContainText('Nothing waiting', { timeout: 30_000 });

  const office = await signIn(org.office.email, FIXTURE_PASSWORD);
  await expect
    .poll(async () => {
      const { json } = await callJson(office, `/api/van/stock?technicianId=${org.technician.id}`);
      const level = (partNumber: string) => json.stock.find((row: { partNumber: string }) => row.partNumber === partNumber)?.level;
      return { oil: level('T-0W20'), filter: level('T-OF1'), usedOil: json.usedOilHeldL };
    })
    .toEqual({ oil: 1.8, filter: 1, usedOil: 3.2 });
  const oilMoves = await callJson(office, `/api/van/movements?technicianId=${org.technician.id}&partId=${van.parts.oil0w20}`);
  expect(oilMoves.json.movements.map((m: { reason: string; quantity: number }) => [m.reason, m.quantity])).toEqual([
    ['fitted', -3.2],
    ['restock', 5],
  ]);
});
