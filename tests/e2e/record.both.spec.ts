// The customer's record on a phone and at a desk: approve advised work and pay by card through the
// local Stripe fake, then the office sees it. Screenshots go to .data/screens/ for a person to look at.
import { expect, test } from '@playwright/test';
import { createOrganisation, FIXTURE_PASSWORD } from '../support/fixtures';
import { createSignedOffVisit } from '../support/visit-fixtures';
import { newClientAddress } from '../support/client-address';

test('a customer approves advised work and pays from the record link', async ({ page, browser }, testInfo) => {
  // A long flow through two sites (the app and the payment fake) on a shared, busy machine.
  test.setTimeout(180_000);
  const org = await createOrganisation('Record e2e');
  const visit = await createSignedOffVisit(org);
  const office = await browser.newContext({ viewport: { width: 1440, height: 900 }, extraHTTPHeaders: { 'x-forwarded-for': newClientAddress() } });
  const desk = await office.newPage();
  await desk.goto('/sign-in');
  await desk.getByLabel('E-mail').fill(org.office.email);
  await desk.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await desk.getByRole('button', { name: 'Sign in' }).click();
  await expect(desk).toHaveURL(/\/office$/);
  const api = desk.request;
  const priced = await api.put(`/api/office/findings/${visit.findingIds.soon}/advised`, { data: { description: 'Coolant drain and refill', priceMinor: 8500, labourCentiHours: 75 } });
  expect(priced.ok()).toBe(true);
  const invoiceId = (await (await api.post(`/api/office/visits/${visit.visitId}/invoice`, { data: {} })).json()).invoiceId;
  expect((await api.post(`/api/office/invoices/${invoiceId}/send`, { data: {} })).ok()).toBe(true);
  const sent = await (await api.post(`/api/office/visits/${visit.visitId}/record/send`, { data: { again: true } })).json();
  const recordPath = new URL(sent.url).pathname;

  const shot = (name: string) => `.data/screens/${testInfo.project.name}-${name}.png`;
  await page.goto(recordPath);
  await expect(page.getByTestId('registration')).toHaveText(visit.registration);
  await expect(page.getByText('Coolant protection only to −18 °C')).toBeVisible();
  await page.screenshot({ path: shot('record-top') });
  await page.screenshot({ path: shot('record-full'), fullPage: true });

  await page.getByRole('button', { name: /Approve £102\.00/ }).click();
  await expect(page.getByText('You approved this work')).toBeVisible();

  await page.getByRole('button', { name: 'Pay £165.36 by card' }).click();
  await expect(page.getByText('Local test payment service')).toBeVisible();
  await page.screenshot({ path: shot('fake-checkout') });
  await page.getByRole('button', { name: 'Pay £165.36' }).click();
  await expect(page).toHaveURL(/payment=done/);
  await expect(page.getByText('your payment was received')).toBeVisible();
  await expect(page.getByRole('button', { name: /Pay £/ })).toHaveCount(0);
  await page.screenshot({ path: shot('record-paid') });

  if (testInfo.project.name === 'desk') {
    await desk.goto('/office/advised-work?show=approved');
    await expect(desk.getByText('Coolant drain and refill')).toBeVisible();
    await desk.screenshot({ path: shot('office-advised'), fullPage: true });
    // The form reloads the page once the visit is booked; wait for that load before moving on.
    await Promise.all([desk.waitForEvent('load'), desk.getByRole('button', { name: 'Book visit' }).click()]);
    await expect(desk.getByText('Booked', { exact: true })).toBeVisible();
    await desk.goto('/office/invoices');
    await desk.screenshot({ path: shot('office-invoices'), fullPage: true });
    await desk.goto(`/office/invoices/${invoiceId}`);
    await expect(desk.getByTestId('invoice-total')).toHaveText('£165.36');
    await desk.screenshot({ path: shot('office-invoice'), fullPage: true });
    await desk.goto('/office/messages');
    await desk.getByRole('link', { name: /Payment received/ }).first().click();
    await expect(desk.locator('iframe[title="The e-mail as sent"]')).toBeVisible();
    await desk.screenshot({ path: shot('office-messages'), fullPage: true });
    await desk.goto(`/office/visits/${visit.visitId}/follow-up`);
    await desk.screenshot({ path: shot('office-follow-up'), fullPage: true });
  }
  await office.close();
});

test('an expired or altered link shows a clear message', async ({ page }) => {
  const response = await page.goto('/record/0000000000000000000000000000000a.zzzz.AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA');
  expect(response?.status()).toBe(404);
  await expect(page.getByRole('alert')).toContainText('not valid');
});
