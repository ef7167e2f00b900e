// The online start every offline phone test makes: sign in as the technician, wait until the
// round is on the phone and the service worker holds the app, and nothing waits to be sent.
import { expect, type BrowserContext, type Page } from '@playwright/test';
import { newClientAddress } from './client-address';
import { FIXTURE_PASSWORD } from './fixtures';
import type { RoundFixture } from './round-fixture';

export async function signInWithRoundCached(context: BrowserContext, page: Page, email: string, round: RoundFixture) {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/round/);
  const card = page.getByRole('link', { name: new RegExp(`${round.customerName}, ${round.registration}`) });
  await expect(card.getByText('Ready offline')).toBeVisible({ timeout: 30_000 });
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect(page.getByTestId('outbox-state')).toContainText('Nothing waiting');
}
