// The technician's screens hold up at 390 x 844 with gloves on: nothing wider than the screen,
// every control at least 48 x 48 CSS px, no text under 15 px. With TICKOVER_SCREENSHOTS=1 the run
// also saves the README's screenshots into docs/screenshots.
import { expect, test, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { newClientAddress } from '../support/client-address';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../support/fixtures';
import { createRound, type RoundFixture } from '../support/round-fixture';

test.use({ timezoneId: 'Europe/London' });
test.setTimeout(120_000);

const MIN_TARGET_PX = 48;
const MIN_TEXT_PX = 15;
const shotsDir = join(process.cwd(), 'docs', 'screenshots');

let org: OrganisationFixture;
let round: RoundFixture;

test.beforeAll(async () => {
  org = await createOrganisation('Screens');
  round = await createRound(org);
});

type Problem = string;

/** Controls smaller than a gloved fingertip, text too small to read, anything wider than the screen. */
async function layoutProblems(page: Page): Promise<Problem[]> {
  return page.evaluate(
    ({ minTarget, minText }) => {
      const problems: string[] = [];
      if (document.documentElement.scrollWidth > window.innerWidth + 1) problems.push(`page is ${document.documentElement.scrollWidth}px wide`);
      const visible = (el: Element) => {
        const r = el.getBoundingClientRect();
        const style = getComputedStyle(el);
        return r.width > 0 && r.height > 0 && style.visibility !== 'hidden' && !el.closest('.sr-only');
      };
      const name = (el: Element) => (el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 40);
      for (const el of document.querySelectorAll('button, a[href], input, select, textarea, label:has(input)')) {
        if (!visible(el) || el.closest('label:has(input)') !== el && el.matches('input[type=radio], input[type=checkbox]')) continue;
        // Links inside a sentence are exempt (WCAG 2.5.8, inline targets).
        if (el.matches('a') && getComputedStyle(el).display === 'inline') continue;
        const r = el.getBoundingClientRect();
        if (r.height < minTarget - 0.5 || r.width < minTarget - 0.5) problems.push(`${el.tagName.toLowerCase()} "${name(el)}" is ${Math.round(r.width)}x${Math.round(r.height)}`);
      }
      const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        const parent = node.parentElement;
        if (!parent || !node.textContent?.trim() || !visible(parent)) continue;
        const size = parseFloat(getComputedStyle(parent).fontSize);
        if (size < minText) problems.push(`text "${node.textContent.trim().slice(0, 30)}" is ${size}px`);
      }
      return [...new Set(problems)];
    },
    { minTarget: MIN_TARGET_PX, minText: MIN_TEXT_PX },
  );
}

async function check(page: Page, screenshot?: string) {
  expect(await layoutProblems(page)).toEqual([]);
  if (screenshot && process.env.TICKOVER_SCREENSHOTS) {
    mkdirSync(shotsDir, { recursive: true });
    await page.screenshot({ path: join(shotsDir, `${screenshot}.png`) });
  }
}

test('the technician’s screens hold up on a phone', async ({ context, page }) => {
  await context.setExtraHTTPHeaders({ 'x-forwarded-for': newClientAddress() });
  await page.goto('/sign-in');
  await check(page);
  await page.getByLabel('E-mail').fill(org.technician.email);
  await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  const card = page.getByRole('link', { name: new RegExp(round.customerName) });
  await expect(card.getByText('Ready offline')).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId('outbox-state')).toContainText('Nothing waiting');
  // A browser tab that is not installed is usually refused persistent storage: the round says so
  // once, and the notice goes when read.
  const notice = page.getByTestId('storage-warning');
  if (await notice.isVisible()) {
    await check(page);
    await notice.getByRole('button', { name: 'Got it' }).click();
    await expect(notice).toBeHidden();
  }
  await check(page, 'round');

  await card.click();
  await expect(page.getByText('Special tools')).toBeVisible();
  await check(page, 'visit-vehicle');

  await page.getByRole('button', { name: 'Checklist', exact: true }).click();
  await page.getByRole('button', { name: 'Tick: Car raised and supported on axle stands' }).click();
  await check(page, 'visit-checklist');

  await page.getByRole('button', { name: 'Reading: Tread depth, front left' }).click();
  for (const key of ['2', 'Decimal point', '4']) await page.getByRole('button', { name: key, exact: true }).click();
  await expect(page.getByTestId('judgement')).toBeVisible();
  await check(page, 'reading-judged');
  await page.getByRole('button', { name: 'Record 2.4 mm' }).click();
  await expect(page.getByRole('dialog', { name: 'Add a finding?' })).toBeVisible();
  await check(page, 'finding');
  await page.getByRole('button', { name: 'Save finding' }).click();

  await page.getByRole('button', { name: /^Findings/ }).click();
  await expect(page.getByText('Tread depth, front left: 2.4 mm').first()).toBeVisible();
  await check(page);
  await page.getByRole('button', { name: 'Parts', exact: true }).click();
  await check(page);

  await page.getByRole('button', { name: 'Sign-off', exact: true }).click();
  await page.getByLabel('Odometer (miles)').fill('31874');
  const pad = page.getByTestId('signature-pad');
  await pad.scrollIntoViewIfNeeded();
  const box = (await pad.boundingBox())!;
  await page.mouse.move(box.x + 30, box.y + 120);
  await page.mouse.down();
  for (let i = 1; i <= 14; i += 1) await page.mouse.move(box.x + 30 + i * 20, box.y + 120 - 50 * Math.sin(i / 2));
  await page.mouse.up();
  await page.getByRole('checkbox').check();
  await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
  await expect(page.getByRole('button', { name: 'Sign off and lock the visit' })).toBeEnabled();
  await check(page, 'sign-off');

  await page.goto('/device');
  await expect(page.getByRole('heading', { name: 'Your torque wrench' })).toBeVisible();
  await check(page);

  await page.goto('/van');
  await page.getByRole('button', { name: 'Today', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Everything the round needs' })).toBeVisible();
  await check(page, 'van-load-list');
});
