import { expect, test } from '@playwright/test';
import { newClientAddress } from '../support/client-address';

const PASSWORD = 'servicing-demo';

test.beforeEach(async ({ context }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
});

test('a technician signs in and lands on the round', async ({ page }) => {
  await page.goto('/');
  await expect(page).toHaveURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill('tom@fenwright.example');
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/round/);
});

test('the office signs in, lands on the console, and signs out', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('priya@fenwright.example');
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);
  await expect(page.getByRole('heading', { name: 'Dashboard' })).toBeVisible();
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await page.goto('/office');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Foffice/);
});

test('a wrong password gets a clear message', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('tom@fenwright.example');
  await page.getByLabel('Password').fill('not-my-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toHaveText(/Wrong e-mail or password/);
  await expect(page).toHaveURL(/\/sign-in/);
});
