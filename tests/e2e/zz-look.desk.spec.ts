import { expect, test } from '@playwright/test';
import { newClientAddress } from '../support/client-address';
test('look', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('priya@fenwright.example');
  await page.getByLabel('Password').fill('servicing-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);
  for (const [name, path] of [['vans', '/office/vans'], ['order', '/office/order-list'], ['oil', '/office/used-oil'], ['parts', '/office/parts'], ['load', '/office/vans/load-list']]) {
    await page.goto(path!);
    await page.waitForLoadState('networkidle');
    await page.screenshot({ path: `test-results/look/${name}.png`, fullPage: true });
  }
  await page.emulateMedia({ media: 'print' });
  await page.screenshot({ path: `test-results/look/load-print.png`, fullPage: true });
});
