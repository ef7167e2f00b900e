// Small rules of the phone app: what the service worker may answer offline, how sync backs off,
// how far a visit has got, which part a checklist item means, how big a stored photo is.
import { describe, expect, it } from 'vitest';
import { technicianFiles, technicianWorkbox, TECHNICIAN_SHELLS } from '../../../src/lib/pwa-config.mjs';
import { backoffDelay } from '../../../src/lib/device/sync-scheduler';
import { itemDone, itemsLeft, visitProgress } from '../../../src/lib/device/visit-progress';
import { suggestPart } from '../../../src/lib/device/part-suggestion';
import { scaledSize, PHOTO_MAX_EDGE_PX } from '../../../src/lib/device/photo-prepare';
import { signInPath } from '../../../src/lib/device/session';
import { validateWrench } from '../../../src/lib/device/settings';
import type { Stamp } from '../../../src/lib/sync/clock';
import { roundPage } from './pull-page';

const S = '000000001-0000-dev' as Stamp;

describe('service worker navigation', () => {
  const allowed = (path: string) => technicianWorkbox.navigateFallbackAllowlist!.some((r) => r.test(path));
  const denied = (path: string) => technicianWorkbox.navigateFallbackDenylist!.some((r) => r.test(path));

  it('opens the technician shells offline, with or without a query', () => {
    for (const path of [...TECHNICIAN_SHELLS, '/round/', '/visit?id=9b1c', '/device']) expect(allowed(path) && !denied(path)).toBe(true);
  });

  it('never answers the API, the office, sign-in or a customer record from the cache', () => {
    for (const path of ['/api/me', '/api/sync/pull?cursor=0', '/office', '/office/visits', '/sign-in', '/record/abc']) {
      expect(allowed(path) && !denied(path)).toBe(false);
    }
  });

  it('does not mistake look-alike paths for shells', () => {
    expect(allowed('/rounds-report')).toBe(false);
    expect(allowed('/visitors')).toBe(false);
  });
});

describe('what the phone precaches', () => {
  const build: Record<string, string> = {
    'round/index.html': '<link href="/_astro/site.css"><astro-island component-url="/_astro/RoundApp.js" renderer-url="/_astro/client.js">',
    'icons/icon.svg': '<svg/>',
    '_astro/RoundApp.js': 'import{a}from"./shell.js";const m=["_astro/Lazy.js"];import("./Pad.js")',
    '_astro/shell.js': 'export const a=1',
    '_astro/Pad.js': 'export default 1',
    '_astro/Lazy.js': 'export default 2',
    '_astro/client.js': 'export{}',
    '_astro/site.css': 'body{font:url(/_astro/font.woff2)}',
    '_astro/font.woff2': '',
    '_astro/OfficeCharts.js': 'import"./shell.js"',
  };

  it('keeps the shells, icons and everything they load, and leaves the office’s scripts out', () => {
    const kept = technicianFiles(new Set(Object.keys(build)), (f) => build[f]!);
    expect([...kept].sort()).toEqual(
      ['_astro/Lazy.js', '_astro/Pad.js', '_astro/RoundApp.js', '_astro/client.js', '_astro/font.woff2', '_astro/shell.js', '_astro/site.css', 'icons/icon.svg', 'round/index.html'].sort(),
    );
  });
});

describe('sync backoff', () => {
  it('doubles from 2 s and stops growing at 5 minutes, with at most 20 % jitter', () => {
    expect(backoffDelay(1, () => 0)).toBe(2_000);
    expect(backoffDelay(2, () => 0)).toBe(4_000);
    expect(backoffDelay(5, () => 0)).toBe(32_000);
    expect(backoffDelay(30, () => 0)).toBe(300_000);
    expect(backoffDelay(30, () => 0.999)).toBeLessThanOrEqual(360_000);
  });
});

describe('visit progress', () => {
  const { page, ids } = roundPage();
  const version = page.templateVersions[0]!;
  const none = { checks: [], readings: [], partLines: [] };

  it('counts every item of every section', () => {
    expect(visitProgress(version, none)).toEqual({ done: 0, total: 4 });
  });

  it('counts a not-applicable check, a reading and a fitted part, but not a removed part', () => {
    const line = { id: 'l', visitId: 'v', itemId: ids.oilFilter, partId: null, partNumber: 'OF', description: '', quantity: 1, unit: '{each}', removed: false, stamp: S };
    const recorded = {
      checks: [{ visitId: 'v', itemId: ids.check, state: 'skipped' as const, stamp: S }],
      readings: [{ visitId: 'v', itemId: ids.tread, value: 4, textValue: null, unit: 'mm', stamp: S }],
      partLines: [line],
    };
    expect(visitProgress(version, recorded)).toEqual({ done: 3, total: 4 });
    expect(itemsLeft(version, recorded).map((i) => i.id)).toEqual([ids.oilGrade]);
    const removed = { ...recorded, partLines: [{ ...line, removed: true }] };
    expect(itemsLeft(version, removed).map((i) => i.id)).toEqual([ids.oilFilter, ids.oilGrade]);
    const unticked = { ...none, checks: [{ visitId: 'v', itemId: ids.check, state: 'not_yet' as const, stamp: S }] };
    expect(itemDone(version.sections[0]!.items[0]!, unticked)).toBe(false);
  });
});

describe('part suggestion', () => {
  const { page, ids } = roundPage();
  const vehicle = page.vehicles[0]!;
  const filterItem = page.templateVersions[0]!.sections[0]!.items[1]!;

  it('takes the filter from the vehicle’s spec', () => {
    expect(suggestPart(filterItem, vehicle, page.parts)).toEqual({ partId: ids.filterPart, partNumber: 'OF-118', description: 'Oil filter', quantity: 1, unit: '{each}' });
  });

  it('fills oil of the vehicle’s grade to its capacity, and suggests nothing without a matching oil', () => {
    const oilItem = { ...filterItem, partKind: 'oil' };
    const oil = { id: 'o', partNumber: 'LUB-0W20', description: 'Engine oil 0W-20', kind: 'oil', unit: 'L', oilGrade: '0W-20' };
    expect(suggestPart(oilItem, vehicle, [oil])).toMatchObject({ partNumber: 'LUB-0W20', quantity: 3.2, unit: 'L' });
    expect(suggestPart(oilItem, vehicle, [{ ...oil, oilGrade: '5W-30' }])).toBeNull();
  });
});

describe('photos kept on the phone', () => {
  it('scales the long edge down to the limit and keeps the shape', () => {
    expect(scaledSize(4000, 3000)).toEqual({ width: PHOTO_MAX_EDGE_PX, height: 1200 });
    expect(scaledSize(3000, 4000)).toEqual({ width: 1200, height: PHOTO_MAX_EDGE_PX });
  });

  it('never scales a small photo up', () => {
    expect(scaledSize(800, 600)).toEqual({ width: 800, height: 600 });
  });
});

describe('session and settings', () => {
  it('sends a signed-out technician back to the same screen after sign-in', () => {
    expect(signInPath({ pathname: '/visit', search: '?id=abc', hash: '#checklist' })).toBe('/sign-in?next=%2Fvisit%3Fid%3Dabc%23checklist');
  });

  it('accepts a wrench range only with a lowest mark above zero and below the highest', () => {
    expect(validateWrench(19, 110)).toBeNull();
    expect(validateWrench(0, 110)).toMatch(/above 0/);
    expect(validateWrench(60, 40)).toMatch(/above the lowest/);
    expect(validateWrench(Number.NaN, 40)).toMatch(/numbers/);
  });
});

describe('applying an app update', () => {
  it('waits while a form holds unsaved input, and says which', async () => {
    const { markUnsaved, updateBlocker } = await import('../../../src/lib/device/boot');
    expect(updateBlocker()).toBeNull();
    markUnsaved('reading', 'the reading for “Tread depth”');
    markUnsaved('finding', 'the open finding');
    expect(updateBlocker()).toBe('Save or cancel the reading for “Tread depth” and the open finding first; then update.');
    markUnsaved('reading', null);
    markUnsaved('finding', null);
    expect(updateBlocker()).toBeNull();
  });
});
