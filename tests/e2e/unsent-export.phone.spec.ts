// With no signal, This phone saves the unsent changes to a file the office can import; after two
// days without reaching the server it puts that first, in alarm colours, and the outbox line on
// every screen points to it.
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { expect, test } from '@playwright/test';
import { createOrganisation, type OrganisationFixture } from '../support/fixtures';
import { signInWithRoundCached } from '../support/phone-sign-in';
import { createRound, type RoundFixture } from '../support/round-fixture';
import { unsentFileSchema } from '../../src/lib/sync/unsent-file';

test.use({ timezoneId: 'Europe/London' });
test.setTimeout(120_000);

let org: OrganisationFixture;
let round: RoundFixture;

test.beforeAll(async () => {
  org = await createOrganisation('Unsent file');
  round = await createRound(org);
});

test('offline, the unsent changes are saved to a file; after two days without signal, first on the screen', async ({ context, page }) => {
  await signInWithRoundCached(context, page, org.technician.email, round);

  await context.setOffline(true);
  await page.goto(`/visit?id=${round.visitId}#checklist`);
  for (const label of ['Car raised and supported on axle stands', 'Exhaust system and mountings']) {
    const tick = page.getByRole('button', { name: `Tick: ${label}` });
    await tick.click();
    await expect(tick).toHaveAttribute('aria-pressed', 'true');
  }
  await expect(page.getByTestId('outbox-state')).toContainText('2 changes waiting');

  await page.goto('/device');
  const section = page.getByRole('region', { name: 'Unsent changes' });
  await expect(section).toContainText('2 changes have not reached the office');
  const download = page.waitForEvent('download');
  await section.getByRole('button', { name: 'Save unsent changes to a file' }).click();
  const saved = await download;
  expect(saved.suggestedFilename()).toMatch(/^tickover-unsent-tara-tech-\d{4}-\d\d-\d\d-\d\d-\d\d-\d\d\.json$/);
  const file = unsentFileSchema.parse(JSON.parse(await readFile((await saved.path())!, 'utf8')));
  expect(file.user.id).toBe(org.technician.id);
  expect(file.operations.map((e) => [e.op.kind, e.op.visitId, e.state])).toEqual([
    ['check', round.visitId, 'pending'],
    ['check', round.visitId, 'pending'],
  ]);
  await expect(section.getByRole('status')).toContainText('2 changes, 0 photos');
  // Saving sends nothing and removes nothing.
  await expect(page.getByTestId('outbox-state')).toContainText('2 changes waiting');

  // Three days without reaching the server (the last sync moved back in the phone's database).
  await page.evaluate(async (userId) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const open = indexedDB.open(`tickover-${userId}`);
      open.onsuccess = () => resolve(open.result);
      open.onerror = () => reject(open.error);
    });
    await new Promise<void>((resolve, reject) => {
      const tx = db.transaction('meta', 'readwrite');
      tx.objectStore('meta').put({ key: 'lastSyncedAt', value: new Date(Date.now() - 3 * 86_400_000 - 60_000).toISOString() });
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
    });
    db.close();
  }, org.technician.id);
  await page.reload();
  const urgent = page.getByRole('region', { name: 'No contact with the office for 3 days' });
  await expect(urgent).toBeVisible();
  // First on the screen, above the settings.
  const urgentBox = (await urgent.boundingBox())!;
  const signedIn = (await page.getByText(/^Signed in as/).boundingBox())!;
  expect(urgentBox.y).toBeLessThan(signedIn.y);
  await expect(urgent.getByRole('button', { name: 'Save unsent changes to a file' })).toBeVisible();
  await expect(page.getByTestId('outbox-state').getByRole('link', { name: 'No contact for 3 days: save unsent changes to a file' })).toHaveAttribute(
    'href',
    '/device#unsent',
  );
  if (process.env.TICKOVER_SCREENSHOTS) await page.screenshot({ path: join(process.cwd(), 'docs', 'screenshots', 'unsent-changes.png') });
});
