// A session that ends while changes wait on the phone: sync meets a 401, the technician is sent
// to sign in, and after signing in the same changes are still there and go out.
import { expect, test } from '@playwright/test';
import { eq } from 'drizzle-orm';
import * as s from '../../src/db/schema';
import { newClientAddress } from '../support/client-address';
import { testDb } from '../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { createRound, type RoundFixture } from '../support/round-fixture';

test.use({ timezoneId: 'Europe/London' });
test.setTimeout(120_000);

let org: OrganisationFixture;
let round: RoundFixture;

test.beforeAll(async () => {
  org = await createOrganisation('Signed out');
  round = await createRound(org);
});

test('a lapsed session sends the technician to sign in and keeps the outbox', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  const signInAs = async () => {
    await page.getByLabel('E-mail').fill(org.technician.email);
    await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
  };
  await page.goto('/sign-in');
  await signInAs();
  await expect(page.getByRole('link', { name: new RegExp(round.customerName) }).getByText('Ready offline')).toBeVisible({ timeout: 30_000 });

  // Offline: a tick waits in the outbox.
  await context.setOffline(true);
  await page.goto(`/visit?id=${round.visitId}#checklist`);
  const tick = page.getByRole('button', { name: 'Tick: Exhaust system and mountings' });
  await tick.click();
  await expect(tick).toHaveAttribute('aria-pressed', 'true');
  await expect(page.getByTestId('outbox-state')).toContainText('1 change waiting');

  // Meanwhile the session ends on the server (expired, or revoked by the owner).
  await testDb().delete(s.session).where(eq(s.session.userId, org.technician.id));

  // Signal again: sync starts by itself, meets the 401 and asks for a sign-in.
  await context.setOffline(false);
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fvisit%3Fid%3D/, { timeout: 30_000 });
  await signInAs();
  await expect(page).toHaveURL(new RegExp(`/visit\\?id=${round.visitId}`));
  await page.getByRole('button', { name: 'Checklist', exact: true }).click();
  await expect(page.getByRole('button', { name: 'Tick: Exhaust system and mountings' })).toHaveAttribute('aria-pressed', 'true');
  await expect(page.getByTestId('outbox-state')).toContainText('Nothing waiting', { timeout: 30_000 });
});
