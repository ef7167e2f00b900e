import { expect, test } from '@playwright/test';
import { newClientAddress } from '../support/client-address';
test('look', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in?next=/van');
  await page.getByLabel('E-mail').fill('tom@fenwright.example');
  await page.getByLabel('Password').fill('servicing-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/van$/);
  await page.getByRole('button', { name: 'Today' }).click();
  await page.waitForTimeout(1500);
  await page.screenshot({ path: `test-results/look/phone-today.png` });
  await page.screenshot({ path: `test-results/look/phone-today-full.png`, fullPage: true });
});
