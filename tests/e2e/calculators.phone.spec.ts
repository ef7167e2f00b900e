// The calculators page on a phone: load it once, cut the network, and every calculator still
// works, because all of it runs on the device.
import { expect, test, type Page } from '@playwright/test';

async function openTab(page: Page, name: string) {
  await page.getByRole('tab', { name }).click();
  await expect(page.getByRole('tab', { name })).toHaveAttribute('aria-selected', 'true');
}

test('every calculator works with the network off', async ({ page, context }) => {
  const requests: string[] = [];
  await page.goto('/calculators');
  await expect(page.getByRole('heading', { name: 'Unit converter' })).toBeVisible();
  // Wait for the island to hydrate before going offline.
  await expect(page.getByRole('radio', { name: 'Torque' })).toBeChecked();
  await page.waitForLoadState('networkidle');

  await context.setOffline(true);
  page.on('request', (r) => requests.push(r.url()));

  // Unit converter: 25 N·m is 18.439 lbf·ft (NIST SP 811 factors).
  await page.getByLabel('Value in N·m').fill('25');
  await expect(page.getByTestId('unit-result-value')).toHaveText('18.4391 lbf·ft');
  await page.getByText('Pressure', { exact: true }).click();
  await page.getByLabel('Value in psi').fill('32');
  await expect(page.getByTestId('unit-result-value')).toHaveText('220.6322 kPa');
  await page.getByRole('button', { name: 'Swap the units' }).click();
  await expect(page.getByLabel('Value in kPa')).toBeVisible();
  await page.getByLabel('Value in kPa').fill('abc');
  await expect(page.getByRole('alert')).toHaveText(/"abc" is not a number/);
  await expect(page.getByText("The vehicle maker's data and local regulations take precedence over these figures.")).toBeVisible();

  // Oil fill: 2.8 L with a 1 L jug is 1 + 1 + 0.8.
  await openTab(page, 'Oil fill');
  await page.getByLabel('Oil capacity with filter').fill('2.8');
  await expect(page.getByTestId('oil-pours')).toHaveText('1 L + 1 L + 0.8 L');
  await page.getByLabel('Volume between dipstick marks (optional)').fill('1');
  await page.getByLabel('Level now, from lower mark (optional)').fill('25');
  await expect(page.getByTestId('oil-top-up')).toHaveText(/0\.75 L/);
  await page.getByText('2 L', { exact: true }).click();
  await expect(page.getByTestId('oil-pours')).toHaveText('2 L + 0.8 L');
  await expect(page.getByText(/Engine oil and the exhaust can be hot/)).toBeVisible();

  // Coolant: propylene glycol 30 % by volume freezes at −12.8 °C (Lange's Table 5.13).
  await openTab(page, 'Coolant');
  await page.getByText('Propylene', { exact: true }).click();
  await page.getByLabel('Glycol strength by volume').fill('30');
  await expect(page.getByTestId('coolant-value')).toHaveText('-12.8 °C');
  await page.getByText('Glycol needed', { exact: true }).click();
  await page.getByText('Ethylene', { exact: true }).click();
  await page.getByLabel('Protect down to').fill('-25');
  await expect(page.getByTestId('coolant-value')).toHaveText(/38\.5 % by volume/);
  await page.getByLabel('Protect down to').fill('-70');
  await expect(page.getByRole('alert')).toHaveText(/colder than the table reaches/);
  await expect(page.getByText(/Source:.*Melinder/)).toBeVisible();

  // Battery: 12.345 V is 62.5 % (BCI table) → shown as 63 %, watch.
  await openTab(page, 'Battery');
  await page.getByLabel('Resting voltage').fill('12.345');
  await expect(page.getByTestId('battery-percent')).toHaveText('63 %');
  await expect(page.getByTestId('battery-result').getByText('Watch')).toBeVisible();
  await page.getByLabel('Charging voltage at fast idle').fill('12.7');
  await expect(page.getByTestId('charging-result')).toContainText('not charging');
  await page.getByLabel('Earth-side drop while cranking').fill('0.15');
  await expect(page.getByTestId('earth-result')).toContainText('within the 0.2 V limit');

  // Torque wrench: 25 N·m on a 19–110 N·m wrench is in the weakest part of the scale.
  await openTab(page, 'Torque');
  await page.getByLabel('Torque to set').fill('25');
  await page.getByLabel('Wrench lowest mark').fill('19');
  await page.getByLabel('Wrench maximum').fill('110');
  await expect(page.getByTestId('torque-verdict')).toHaveText('On the scale, weakest part');
  await page.getByLabel('Torque to set').fill('15');
  await expect(page.getByTestId('torque-verdict')).toHaveText('Off the scale');
  await expect(page.getByTestId('plug-torque')).toHaveText('25–29 N·m');
  await page.getByText('Taper', { exact: true }).click();
  await expect(page.getByTestId('plug-torque')).toHaveText('10–20 N·m');

  // Nothing above needed the network (the browser itself re-asks for the icon on a hash change).
  expect(requests.filter((u) => !u.startsWith('data:') && !u.endsWith('/favicon.svg'))).toEqual([]);
});

test('the tab is kept in the address and the targets are big enough for gloves', async ({ page }) => {
  await page.goto('/calculators#battery');
  await expect(page.getByRole('heading', { name: 'Battery state' })).toBeVisible();
  for (const tab of await page.getByRole('tab').all()) {
    const box = (await tab.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(48);
    expect(box.width).toBeGreaterThanOrEqual(48);
  }
  const field = (await page.getByLabel('Resting voltage').boundingBox())!;
  expect(field.height).toBeGreaterThanOrEqual(48);
});
