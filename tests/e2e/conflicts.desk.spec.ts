// The office's conflict list at a desk (1440x900): two phones changed the same reading, a note
// arrived after the customer signed, and the office settles both. Screenshots go to .data/screens/.
import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { createOrganisation, FIXTURE_PASSWORD } from '../support/fixtures';
import { createVisit, createVisitSetup } from '../support/visit-fixtures';
import { newClientAddress } from '../support/client-address';
import { TestDevice } from '../support/sync-ops';

test('the office sees both values of a conflict and settles it', async ({ browser }, testInfo) => {
  test.setTimeout(120_000);
  const org = await createOrganisation('Conflicts e2e');
  const setup = await createVisitSetup(org);
  const visitId = await createVisit(org, setup);
  const lockedVisit = await createVisit(org, setup);

  // The phones push through the API as the technician.
  const phone = await browser.newContext({ extraHTTPHeaders: { 'x-forwarded-for': newClientAddress() } });
  const signIn = await phone.request.post('/api/auth/sign-in/email', { data: { email: org.technician.email, password: FIXTURE_PASSWORD } });
  expect(signIn.ok()).toBe(true);
  const early = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 900_000);
  const late = new TestDevice(`van-${randomUUID().slice(0, 6)}`, Date.now() - 600_000);
  const push = async (device: TestDevice, operations: unknown[]) => {
    const response = await phone.request.post('/api/sync/push', { data: { deviceId: device.deviceId, operations } });
    expect(response.ok()).toBe(true);
  };
  await push(late, [late.reading(visitId, setup.checklist.readings[0]!, 2.1)]);
  await push(early, [early.reading(visitId, setup.checklist.readings[0]!, 1.6)]);
  await push(early, [early.signOff(lockedVisit)]);
  await push(early, [early.note(lockedVisit, 'Customer says the handbrake needs two clicks more than before.')]);

  const desk = await browser.newContext({ viewport: { width: 1440, height: 900 }, extraHTTPHeaders: { 'x-forwarded-for': newClientAddress() } });
  const page = await desk.newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(org.office.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);

  // A technician's warning that the office lowered without having seen it.
  const findingId = randomUUID();
  const created = early.finding(visitId, findingId, 'watch', { title: 'Rear brake hose perished' });
  await push(early, [created]);
  const officeDevice = new TestDevice(`desk-${randomUUID().slice(0, 6)}`, Date.now() - 300_000);
  const lowered = await page.request.post('/api/sync/push', {
    data: { deviceId: officeDevice.deviceId, operations: [officeDevice.finding(visitId, findingId, 'ok', { title: 'Rear brake hose perished', downgrade: true, seen: created.stamp })] },
  });
  expect(lowered.ok()).toBe(true);
  await push(late, [late.finding(visitId, findingId, 'now', { title: 'Rear brake hose perished', seen: created.stamp })]);

  await page.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Conflicts' }).click();
  await expect(page.getByText('3 conflicts')).toBeVisible();
  const severity = page.locator('li[data-conflict]').filter({ hasText: 'Finding: Rear brake hose perished' });
  await expect(severity.getByText('Needs doing now')).toBeVisible();
  await expect(severity.getByText('Fine')).toBeVisible();
  // The severity that stands is the office's downgrade, and says so.
  await expect(severity.getByText(/Oscar Office/)).toBeVisible();
  const reading = page.locator('li[data-conflict]').filter({ hasText: 'Tread depth, rear right' });
  await expect(reading.getByText('Changed at the same time')).toBeVisible();
  await expect(reading.getByText('2.1 mm')).toBeVisible();
  await expect(reading.getByText('1.6 mm')).toBeVisible();
  const note = page.locator('li[data-conflict]').filter({ hasText: 'handbrake' });
  await expect(note.getByText('Arrived after sign-off')).toBeVisible();
  await expect(note.getByRole('button', { name: 'Reopen visit and apply' })).toBeVisible();
  await page.screenshot({ path: `.data/screens/${testInfo.project.name}-conflicts-open.png` });

  // Use the earlier reading; the one replaced stays as a note.
  await Promise.all([page.waitForEvent('load'), reading.getByRole('button', { name: 'Use the other value' }).click()]);
  await expect(page.getByText('2 conflicts', { exact: true })).toBeVisible();

  // Keep the signed record as it is; the late note is kept as an office note.
  await Promise.all([page.waitForEvent('load'), note.getByRole('button', { name: 'Do not apply it' }).click()]);
  await expect(page.getByText('1 conflict', { exact: true })).toBeVisible();
  // The office stands by its downgrade.
  await Promise.all([page.waitForEvent('load'), severity.getByRole('button', { name: 'Keep what stands' }).click()]);
  await expect(page.getByText('Nothing to decide')).toBeVisible();

  await page.goto(`/office/conflicts?status=resolved&visitId=${visitId}`);
  const decided = page.locator('li[data-conflict]').filter({ hasText: 'Tread depth, rear right' });
  await expect(decided.getByText(/Decided by Oscar Office/)).toBeVisible();
  await expect(decided.getByText(/used the other value; the other is kept as a note/)).toBeVisible();
  await expect(decided.getByText('Stood then')).toBeVisible();
  await page.screenshot({ path: `.data/screens/${testInfo.project.name}-conflicts-decided.png`, fullPage: true });
  await phone.close();
  await desk.close();
});
