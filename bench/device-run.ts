// The device benchmark proper (started by bench/device.mjs): Debian's Chromium at a phone's
// 390 x 844 with the page's CPU slowed down BENCH_CPU_SLOWDOWN times (CDP
// Emulation.setCPUThrottlingRate), against the built server. Three figures, each also measured
// with no slowdown in the same run so they can be read against something:
//
// - cold start offline: the service worker is installed and the round pulled online once; then
//   each run starts the browser anew on the same profile with the network cut and times, in the
//   page, from navigation start to the first visit card being in the page one frame after React
//   drew it (it is interactive from then: the island hydrates as it renders).
// - tap to durable: BENCH_TAPS taps on check items; for each, from the tap's pointerdown to the
//   `complete` event of the IndexedDB transaction that added the outbox entry, i.e. the change is
//   committed and survives the tab closing. The bench wraps IDBObjectStore#add in the page (an
//   init script) to see which transaction writes the outbox; the app's code is not changed.
//   Baseline: a bare IndexedDB put in its own transaction, in the same page and conditions.
// - tick latency: the Event Timing API's `event` entries (what INP is built on), the longest
//   entry per interaction, from input to the next paint. Entries shorter than 16 ms are not
//   reported by the browser (its floor), so such taps count as "under 16 ms".
//
// What the slowdown does not cover: IndexedDB itself and the service worker run outside the
// page's main thread and are not slowed, so a real mid-range phone's storage may be slower.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from '@playwright/test';
import { newClientAddress } from '../tests/support/client-address';
import { testPool } from '../tests/support/database';
import { createOrganisation, FIXTURE_PASSWORD } from '../tests/support/fixtures';
import { createRound } from '../tests/support/round-fixture';

const BASE = process.env.BENCH_BASE_URL!;
const COLD_RUNS = Number(process.env.BENCH_COLD_RUNS ?? 5);
const TAPS = Number(process.env.BENCH_TAPS ?? 200);
const SLOWDOWN = Number(process.env.BENCH_CPU_SLOWDOWN ?? 4);
const EXECUTABLE = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
// The same flags as playwright.config.ts: no sandbox as root, no calls home on a closed network.
const ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'];

declare global {
  interface Window {
    __bench: {
      usableAt?: number;
      lastTap?: number;
      durable: { tap: number; added: number; committed: number }[];
      events: { interactionId: number; name: string; duration: number }[];
    };
  }
}

// Runs in the page before the app. Watches for the first visit card, remembers each tap's
// pointerdown time, and notes when a transaction that added an outbox entry commits.
function pageHooks() {
  const bench: Window['__bench'] = { durable: [], events: [] };
  window.__bench = bench;
  const seeCard = () => {
    if (bench.usableAt !== undefined || !document.querySelector('a[href^="/visit?id="]')) return false;
    requestAnimationFrame(() => setTimeout(() => (bench.usableAt ??= performance.now())));
    return true;
  };
  const observer = new MutationObserver(() => seeCard() && observer.disconnect());
  observer.observe(document, { childList: true, subtree: true });
  addEventListener('pointerdown', (event) => (bench.lastTap = event.timeStamp), { capture: true });
  const marked = new WeakSet<IDBTransaction>();
  const add = IDBObjectStore.prototype.add;
  IDBObjectStore.prototype.add = function (this: IDBObjectStore, ...args: Parameters<IDBObjectStore['add']>) {
    const tx = this.transaction;
    if (this.name === 'outbox' && !marked.has(tx)) {
      marked.add(tx);
      const tap = bench.lastTap;
      const added = performance.now();
      tx.addEventListener('complete', () => {
        if (tap !== undefined) bench.durable.push({ tap, added, committed: performance.now() });
      });
    }
    return add.apply(this, args);
  };
  try {
    new PerformanceObserver((list) => {
      // interactionId is newer than TypeScript's DOM types.
        for (const e of list.getEntries() as (PerformanceEventTiming & { interactionId?: number })[]) {
        if (e.interactionId) bench.events.push({ interactionId: e.interactionId, name: e.name, duration: e.duration });
      }
    }).observe({ type: 'event', durationThreshold: 16, buffered: true } as PerformanceObserverInit);
  } catch {
    // No Event Timing in this browser: the latency row says so.
  }
}

const address = newClientAddress();
const profile = mkdtempSync(join(tmpdir(), 'tickover-bench-device-'));

async function launch(offline: boolean): Promise<BrowserContext> {
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: EXECUTABLE,
    args: ARGS,
    headless: true,
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2.625,
    isMobile: true,
    hasTouch: true,
    timezoneId: 'Europe/London',
    baseURL: BASE,
    offline,
    extraHTTPHeaders: { 'x-forwarded-for': address },
  });
  // tsx compiles this file with esbuild's keepNames, which wraps functions in `__name(...)`;
  // the functions handed to the page need that helper there too.
  await context.addInitScript({ content: 'globalThis.__name = (fn) => fn;' });
  await context.addInitScript(pageHooks);
  return context;
}

async function slowPage(context: BrowserContext, rate: number): Promise<Page> {
  const page = context.pages()[0] ?? (await context.newPage());
  const cdp = await context.newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate });
  return page;
}

async function isOffline(page: Page) {
  return page.evaluate(() => fetch('/api/health', { cache: 'no-store' }).then(() => false, () => true));
}

const percentile = (values: number[], p: number) => {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
};
const median = (values: number[]) => percentile(values, 50);

async function installOnline(customerName: string, registration: string, email: string) {
  const context = await launch(false);
  try {
    const page = await slowPage(context, 1);
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(FIXTURE_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/round/, { timeout: 60_000 });
    const card = page.getByRole('link', { name: new RegExp(`${customerName}, ${registration}`) });
    await card.getByText('Ready offline').waitFor({ timeout: 60_000 });
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.getByTestId('outbox-state').getByText('Nothing waiting').waitFor({ timeout: 60_000 });
  } finally {
    await context.close();
  }
}

type Cold = { usable: number; html: number; scripts: number };

async function openRound(page: Page): Promise<Cold> {
  await page.goto('/round', { waitUntil: 'commit', timeout: 60_000 });
  await page.waitForFunction(() => window.__bench?.usableAt !== undefined, null, { timeout: 60_000 }).catch(async (error) => {
    await page.screenshot({ path: join(tmpdir(), 'tickover-bench-cold.png') });
    console.error(`cold start: no visit card; the page said: ${(await page.locator('body').innerText()).slice(0, 400)}`);
    throw error;
  });
  const figures = await page.evaluate(() => {
    const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
    return { usable: window.__bench.usableAt!, html: nav.responseEnd, scripts: nav.domContentLoadedEventEnd };
  });
  if (!(await isOffline(page))) throw new Error('the page reached the server: the cold start was not offline');
  return figures;
}

/** A cold start (the browser started anew, offline), then the tab closed and opened again. */
async function coldStart(rate: number): Promise<{ cold: Cold; reopened: Cold }> {
  const context = await launch(true);
  try {
    const first = await slowPage(context, rate);
    const cold = await openRound(first);
    const second = await context.newPage();
    await first.close();
    const cdp = await context.newCDPSession(second);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate });
    const reopened = await openRound(second);
    return { cold, reopened };
  } finally {
    await context.close();
  }
}

type TapFigures = { durable: number[]; beforeWrite: number[]; latency: number[]; unreported: number; bare: number[]; first: number };

async function taps(rate: number, visitId: string, count: number): Promise<TapFigures> {
  const context = await launch(true);
  try {
    const page = await slowPage(context, rate);
    await page.goto(`/visit?id=${visitId}#checklist`, { timeout: 60_000 });
    const ticks = page.locator('button[aria-label^="Tick: "]');
    await ticks.first().waitFor({ timeout: 60_000 });
    const items = await ticks.count();
    for (let i = 0; i < count; i++) {
      const button = ticks.nth(i % items);
      const was = await button.getAttribute('aria-pressed');
      // A technician taps once the screen has settled from the last change.
      await page.evaluate(() => new Promise((resolve) => requestIdleCallback(resolve, { timeout: 2000 })));
      const before = await page.evaluate(() => window.__bench.durable.length);
      await button.tap();
      await page.waitForFunction((n) => window.__bench.durable.length > n, before, { timeout: 30_000 });
      await page.waitForFunction(
        ([el, state]) => (el as Element).getAttribute('aria-pressed') !== state,
        [await button.elementHandle(), was] as const,
        { timeout: 30_000 },
      );
    }
    // Let the last interactions' paints land and their Event Timing entries arrive.
    await page.waitForTimeout(500);
    const { durable, events } = await page.evaluate(() => window.__bench);
    const perInteraction = new Map<number, number>();
    for (const e of events) perInteraction.set(e.interactionId, Math.max(perInteraction.get(e.interactionId) ?? 0, e.duration));
    const latency = [...perInteraction.values()];
    const durations = durable.map((d) => d.committed - d.tap);
    const beforeWrite = durable.map((d) => d.added - d.tap);
    // A bare IndexedDB put in its own transaction, same page, same slowdown: the floor.
    const bare = await page.evaluate(async (n) => {
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const open = indexedDB.open('bench-bare', 1);
        open.onupgradeneeded = () => open.result.createObjectStore('rows', { keyPath: 'seq' });
        open.onsuccess = () => resolve(open.result);
        open.onerror = () => reject(open.error);
      });
      const times: number[] = [];
      for (let i = 0; i < n; i++) {
        const started = performance.now();
        await new Promise<void>((resolve, reject) => {
          const tx = db.transaction('rows', 'readwrite');
          tx.objectStore('rows').put({ seq: i, opId: crypto.randomUUID(), kind: 'check', state: 'done', at: new Date().toISOString() });
          tx.oncomplete = () => resolve();
          tx.onerror = () => reject(tx.error);
        });
        times.push(performance.now() - started);
      }
      db.close();
      return times;
    }, count);
    return { durable: durations.slice(1), beforeWrite: beforeWrite.slice(1), first: durations[0]!, latency, unreported: Math.max(0, count - latency.length), bare };
  } finally {
    await context.close();
  }
}

const ms = (n: number) => (Number.isNaN(n) ? '     –' : `${n.toFixed(0).padStart(6)}`);
/** A percentile of the tap latencies where taps under the browser's 16 ms floor count as 0. */
function latencyPercentile(f: TapFigures, p: number): string {
  const value = percentile([...f.latency, ...Array(f.unreported).fill(0)], p);
  return value === 0 ? '   <16' : ms(value);
}

const org = await createOrganisation('Bench device');
const round = await createRound(org);
console.log(`device benchmark: Chromium ${EXECUTABLE}, 390 x 844, CPU slowdown ${SLOWDOWN}x against none; ${COLD_RUNS} cold starts, ${TAPS} taps each`);
try {
  await installOnline(round.customerName, round.registration, org.technician.email);
  const cold: Record<number, Cold[]> = { [SLOWDOWN]: [], 1: [] };
  const reopened: Record<number, number[]> = { [SLOWDOWN]: [], 1: [] };
  for (let run = 0; run < COLD_RUNS; run++) {
    for (const rate of [SLOWDOWN, 1]) {
      const figures = await coldStart(rate);
      cold[rate]!.push(figures.cold);
      reopened[rate]!.push(figures.reopened.usable);
    }
  }
  const usable = (rate: number) => cold[rate]!.map((c) => c.usable);
  const part = (rate: number, key: keyof Cold) => median(cold[rate]!.map((c) => c[key]));
  console.log(`  cold starts (ms): ${SLOWDOWN}x ${usable(SLOWDOWN).map((t) => t.toFixed(0)).join(', ')}; 1x ${usable(1).map((t) => t.toFixed(0)).join(', ')}`);
  const slow = await taps(SLOWDOWN, round.visitId, TAPS);
  const fast = await taps(1, round.visitId, TAPS);

  const line = (label: string, a: string, b: string) => console.log(`${label.padEnd(44)} ${a.padStart(12)} ${b.padStart(12)}`);
  console.log('');
  line('figure (ms)', `${SLOWDOWN}x slowdown`, 'no slowdown');
  line('cold start offline (browser started), median', ms(median(usable(SLOWDOWN))), ms(median(usable(1))));
  line('cold start offline (browser started), slowest', ms(Math.max(...usable(SLOWDOWN))), ms(Math.max(...usable(1))));
  line('  page from the service worker, median', ms(part(SLOWDOWN, 'html')), ms(part(1, 'html')));
  line('  scripts run (DOMContentLoaded), median', ms(part(SLOWDOWN, 'scripts')), ms(part(1, 'scripts')));
  line('tab closed and reopened offline, median', ms(median(reopened[SLOWDOWN]!)), ms(median(reopened[1]!)));
  line('tap to durable in IndexedDB, p50', ms(percentile(slow.durable, 50)), ms(percentile(fast.durable, 50)));
  line('tap to durable in IndexedDB, p95', ms(percentile(slow.durable, 95)), ms(percentile(fast.durable, 95)));
  line('  of which before the outbox write, p50', ms(percentile(slow.beforeWrite, 50)), ms(percentile(fast.beforeWrite, 50)));
  line('  first tap (loads the operation schema)', ms(slow.first), ms(fast.first));
  line('  baseline: bare IndexedDB put, p50', ms(percentile(slow.bare, 50)), ms(percentile(fast.bare, 50)));
  line('  baseline: bare IndexedDB put, p95', ms(percentile(slow.bare, 95)), ms(percentile(fast.bare, 95)));
  line('tick latency (Event Timing), p50', latencyPercentile(slow, 50), latencyPercentile(fast, 50));
  line('tick latency (Event Timing), p95', latencyPercentile(slow, 95), latencyPercentile(fast, 95));
  line('  taps under 16 ms (not reported)', String(slow.unreported), String(fast.unreported));
  console.log(`\n(${TAPS - 1} taps after the first for tap to durable; load average ${(await import('node:os')).loadavg().map((l) => l.toFixed(1)).join(' ')})`);
} finally {
  rmSync(profile, { recursive: true, force: true });
  await testPool().end();
}
