// The load list on the phone: which rounds it keeps, when a sync run fetches them again, and
// that a copy already on the phone survives no signal, a refusal or a malformed answer.
import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { DeviceDb } from '../../../src/lib/device/db';
import { SignedOutError } from '../../../src/lib/device/http';
import { loadListDates, phoneDay } from '../../../src/lib/device/load-list-days';
import { fetchLoadList, LOAD_LIST_MAX_AGE_MS, refreshLoadLists } from '../../../src/lib/device/load-lists';
import { syncOnce } from '../../../src/lib/device/sync-client';
import { roundLoadListSchema, type RoundLoadList } from '../../../src/lib/van/load-list-contract';
import { closeDevice, emptyPage, openDeviceWithRound } from './pull-page';

describe('loadListDates', () => {
  it('keeps today and the next round after today on the phone', () => {
    expect(loadListDates(['2026-03-02', '2026-03-06', '2026-02-27', '2026-03-04'], '2026-03-02', '2026-03-03')).toEqual({ today: '2026-03-02', next: '2026-03-04' });
  });

  it('falls back to tomorrow when no later round is on the phone', () => {
    expect(loadListDates(['2026-02-27', '2026-03-02'], '2026-03-02', '2026-03-03')).toEqual({ today: '2026-03-02', next: '2026-03-03' });
    expect(loadListDates([], '2026-03-02', '2026-03-03').next).toBe('2026-03-03');
  });
});

describe('phoneDay', () => {
  it('counts calendar days on the phone’s clock, across a month and a year end', () => {
    expect(phoneDay(new Date(2026, 1, 28, 23, 30), 1)).toBe('2026-03-01');
    expect(phoneDay(new Date(2025, 11, 31, 0, 5), 1)).toBe('2026-01-01');
    // The night the clocks go forward in the UK (29 March 2026) is still one calendar day.
    expect(phoneDay(new Date(2026, 2, 28, 22, 0), 1)).toBe('2026-03-29');
  });
});

/** A load list as the server answers it (checked against the contract, so it stays true to it). */
function listFor(roundDate: string, pick: number): RoundLoadList {
  const part = { id: 'p-oil', partNumber: 'T-0W20', description: 'Engine oil 0W-20', kind: 'oil', unit: 'L', oilGrade: '0W-20' };
  return roundLoadListSchema.parse({
    technician: { id: 'tech-1', name: 'Tess Test' },
    roundDate,
    lines: [
      {
        part,
        needed: 3.2,
        neededInContainers: { containers: [{ sizeL: 1, count: 4 }], totalL: 4 },
        onHand: 3.2 - pick,
        shortfall: pick,
        pick: pick > 0 ? { containers: [{ sizeL: 1, count: Math.ceil(pick) }], totalL: Math.ceil(pick) } : null,
        pickQuantity: Math.ceil(pick),
        visits: 1,
      },
    ],
    grades: [{ oilGrade: '0W-20', needed: 3.2, onHand: 3.2 - pick, shortfall: pick }],
    visits: [],
    gaps: [],
    usedOil: { heldL: 0, expectedL: 3.2 },
  });
}

function fakeServer() {
  const state = { pick: 2, status: 200, offline: false, body: null as unknown, asked: [] as string[] };
  const fetchImpl = (async (input: string | URL | Request) => {
    if (state.offline) throw new TypeError('Failed to fetch');
    const url = new URL(String(input), 'http://phone.test');
    if (url.pathname === '/api/sync/pull') return Response.json(emptyPage(url.searchParams.get('cursor') ?? '0'));
    if (url.pathname !== '/api/van/load-list') return new Response('not found', { status: 404 });
    const date = url.searchParams.get('date')!;
    state.asked.push(date);
    if (state.status !== 200) return Response.json({ error: 'The server is having a moment.' }, { status: state.status });
    return Response.json(state.body ?? listFor(date, state.pick));
  }) as typeof fetch;
  return { state, fetchImpl };
}

// The evening before the round in pull-page.ts (2 March 2026), on the phone's clock.
const EVENING = new Date(2026, 2, 1, 18, 0);
const later = (ms: number) => new Date(EVENING.getTime() + ms);

let db: DeviceDb;
beforeEach(async () => {
  ({ db } = await openDeviceWithRound('load-lists'));
});
afterEach(() => closeDevice(db));

describe('refreshLoadLists', () => {
  it('fetches today’s and the next round’s lists when the phone has none, and drops days gone by', async () => {
    const { state, fetchImpl } = fakeServer();
    await db.loadLists.put({ roundDate: '2026-02-27', list: listFor('2026-02-27', 0), fetchedAt: '2026-02-26T18:00:00.000Z' });
    const result = await refreshLoadLists({ db, fetch: fetchImpl, now: () => EVENING }, { roundChanged: false });
    expect(result).toEqual({ saved: 2, failed: null });
    expect(state.asked).toEqual(['2026-03-01', '2026-03-02']);
    expect(await db.loadLists.toCollection().primaryKeys()).toEqual(['2026-03-01', '2026-03-02']);
    const next = await db.loadLists.get('2026-03-02');
    expect(next?.list.lines[0]?.pickQuantity).toBe(2);
    expect(next?.fetchedAt).toBe(EVENING.toISOString());
  });

  it('leaves a fresh copy alone, and fetches again when the round changed or the copy aged', async () => {
    const { state, fetchImpl } = fakeServer();
    await refreshLoadLists({ db, fetch: fetchImpl, now: () => EVENING }, { roundChanged: false });
    state.asked = [];
    await refreshLoadLists({ db, fetch: fetchImpl, now: () => later(LOAD_LIST_MAX_AGE_MS - 1) }, { roundChanged: false });
    expect(state.asked).toEqual([]);
    await refreshLoadLists({ db, fetch: fetchImpl, now: () => later(60_000) }, { roundChanged: true });
    expect(state.asked).toEqual(['2026-03-01', '2026-03-02']);
    state.asked = [];
    state.pick = 0;
    await refreshLoadLists({ db, fetch: fetchImpl, now: () => later(60_000 + LOAD_LIST_MAX_AGE_MS) }, { roundChanged: false });
    expect(state.asked).toEqual(['2026-03-01', '2026-03-02']);
    expect((await db.loadLists.get('2026-03-02'))?.list.lines[0]?.pickQuantity).toBe(0);
  });

  it('keeps the copy on the phone when there is no signal, the server refuses, or the answer is not a load list', async () => {
    const { state, fetchImpl } = fakeServer();
    await refreshLoadLists({ db, fetch: fetchImpl, now: () => EVENING }, { roundChanged: false });
    const kept = await db.loadLists.get('2026-03-02');
    state.pick = 5;

    state.offline = true;
    const offline = await refreshLoadLists({ db, fetch: fetchImpl, now: () => later(LOAD_LIST_MAX_AGE_MS) }, { roundChanged: true });
    expect(offline.saved).toBe(0);
    expect(offline.failed).toMatch(/No connection/);
    state.offline = false;

    state.status = 500;
    expect((await refreshLoadLists({ db, fetch: fetchImpl, now: () => later(LOAD_LIST_MAX_AGE_MS) }, { roundChanged: true })).failed).toBe('The server is having a moment.');
    state.status = 200;

    state.body = { roundDate: '2026-03-02', lines: 'not a list' };
    expect((await refreshLoadLists({ db, fetch: fetchImpl, now: () => later(LOAD_LIST_MAX_AGE_MS) }, { roundChanged: true })).failed).toMatch(/did not match/);
    state.body = listFor('2026-03-09', 1);
    await expect(fetchLoadList({ db, fetch: fetchImpl }, '2026-03-02')).rejects.toThrow(/another day/);

    expect(await db.loadLists.get('2026-03-02')).toEqual(kept);
  });

  it('stops the sync run at a 401, as the outbox does', async () => {
    const { state, fetchImpl } = fakeServer();
    state.status = 401;
    await expect(refreshLoadLists({ db, fetch: fetchImpl, now: () => EVENING }, { roundChanged: true })).rejects.toThrow(SignedOutError);
  });
});

describe('syncOnce and the load list', () => {
  it('keeps the next round’s load list on the phone after a pull, and a sync run still succeeds when the list cannot be fetched', async () => {
    const { state, fetchImpl } = fakeServer();
    const report = await syncOnce({ db, fetch: fetchImpl });
    expect(report.loadListsSaved).toBe(2);
    expect(await db.loadLists.count()).toBe(2);

    await db.loadLists.clear();
    state.status = 503;
    const failed = await syncOnce({ db, fetch: fetchImpl });
    expect(failed.loadListsSaved).toBe(0);
    expect(await db.loadLists.count()).toBe(0);
  });
});
