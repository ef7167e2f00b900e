// The sync client's side of the contract, against a small in-memory stand-in for the server's
// HTTP answers (the real server is exercised by the e2e test): upload before push, a dropped
// upload retried, refusals kept, 401 leaving the outbox alone, pages stored with their cursor.
import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { DeviceDb } from '../../../src/lib/device/db';
import { storePulledPage } from '../../../src/lib/device/pull-store';
import { OfflineError, ServerError, SignedOutError, syncOnce, type PutBytes } from '../../../src/lib/device/sync-client';
import { addPhoto, setCheck } from '../../../src/lib/device/visit-actions';
import { decodeStamp, encodeStamp } from '../../../src/lib/sync/clock';
import { emptyPage, roundPage, openDeviceWithRound, closeDevice } from './pull-page';

type Pushed = { deviceId: string; operations: { opId: string; kind: string }[] };

function fakeServer() {
  const state = {
    pushes: [] as Pushed[],
    photos: new Set<string>(),
    status: 200,
    reject: new Set<string>(),
    pullCursors: [] as string[],
    serverStamp: encodeStamp({ wallMs: Date.now() + 60_000, counter: 5, deviceId: 'server' }),
  };
  const fetchImpl = (async (input: string | URL | Request, init?: RequestInit) => {
    const url = new URL(String(input), 'http://phone.test');
    if (state.status !== 200) return new Response(JSON.stringify({ error: 'Sign in first.' }), { status: state.status });
    if (url.pathname === '/api/sync/push') {
      const body = JSON.parse(String(init?.body)) as Pushed;
      state.pushes.push(body);
      for (const op of body.operations) {
        if (op.kind === 'photo.add' && !state.photos.has((op as unknown as { payload: { sha256: string } }).payload.sha256)) {
          throw new Error('the client pushed a photo.add before uploading its bytes');
        }
      }
      const results = body.operations.map((op) =>
        state.reject.has(op.opId) ? { opId: op.opId, outcome: 'rejected', reason: 'That item is not on this visit’s checklist.' } : { opId: op.opId, outcome: 'applied' },
      );
      return Response.json({ results, serverStamp: state.serverStamp });
    }
    if (url.pathname === '/api/sync/pull') {
      const cursor = url.searchParams.get('cursor')!;
      state.pullCursors.push(cursor);
      return Response.json({ ...emptyPage(String(Number(cursor) + 1)), hasMore: state.pullCursors.length < 2 });
    }
    return new Response('not found', { status: 404 });
  }) as typeof fetch;
  return { state, fetchImpl };
}

let db: DeviceDb;
let ids: ReturnType<typeof roundPage>['ids'];

beforeEach(async () => {
  ({ db, ids } = await openDeviceWithRound('sync'));
});

afterEach(() => closeDevice(db));

const jpeg = (bytes: number[]) => new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' });

describe('syncOnce', () => {
  it('pushes the outbox in order, empties it, moves the clock past the server and pulls every page', async () => {
    const { state, fetchImpl } = fakeServer();
    const a = await setCheck(db, ids.visit, ids.check, 'done');
    const b = await setCheck(db, ids.visit, ids.check, 'not_yet');
    const report = await syncOnce({ db, fetch: fetchImpl });
    expect(state.pushes[0]!.operations.map((o) => o.opId)).toEqual([a.opId, b.opId]);
    expect(state.pushes[0]!.deviceId).toBe(a.deviceId);
    expect(await db.outbox.count()).toBe(0);
    expect(report).toMatchObject({ pushed: 2, rejected: 0, pulledPages: 2 });
    expect(state.pullCursors).toEqual(['10', '11']);
    expect(await db.meta.get('cursor')).toEqual({ key: 'cursor', value: '12' });
    const next = await setCheck(db, ids.visit, ids.check, 'done');
    expect(decodeStamp(next.stamp).wallMs).toBeGreaterThanOrEqual(decodeStamp(state.serverStamp).wallMs);
  });

  it('uploads a photo before its add, and retries a dropped upload without losing anything', async () => {
    const { state, fetchImpl } = fakeServer();
    const photo = await addPhoto(db, ids.visit, { blob: jpeg([1, 2, 3]), sha256: 'b'.repeat(64), contentType: 'image/jpeg', width: 3, height: 1 });
    let drops = 1;
    const put: PutBytes = async (url, blob, _type, onProgress) => {
      onProgress(1);
      if (drops-- > 0) throw new Error('connection reset');
      state.photos.add(url.split('/').pop()!);
      onProgress(blob.size);
      return { status: 201, body: '{}' };
    };
    await expect(syncOnce({ db, fetch: fetchImpl, putBytes: put })).rejects.toThrow(OfflineError);
    expect((await db.photos.get(photo.payload.photoId))?.uploaded).toBe(false);
    expect(await db.outbox.count()).toBe(1);
    expect(state.pushes).toHaveLength(0);

    const progress: number[] = [];
    await syncOnce({ db, fetch: fetchImpl, putBytes: put, onUploadProgress: (p) => progress.push(p.bytesDone) });
    expect((await db.photos.get(photo.payload.photoId))?.uploaded).toBe(true);
    expect(await db.outbox.count()).toBe(0);
    expect(progress.at(-1)).toBe(3);
    expect((await db.photoBlobs.get('b'.repeat(64)))?.blob.size).toBe(3);
  });

  it('keeps a refused operation, with the reason, and does not send it again', async () => {
    const { state, fetchImpl } = fakeServer();
    const refused = await setCheck(db, ids.visit, ids.tread, 'skipped');
    state.reject.add(refused.opId);
    await setCheck(db, ids.visit, ids.check, 'done');
    const report = await syncOnce({ db, fetch: fetchImpl });
    expect(report).toMatchObject({ pushed: 1, rejected: 1 });
    const kept = await db.outbox.toArray();
    expect(kept).toHaveLength(1);
    expect(kept[0]).toMatchObject({ opId: refused.opId, state: 'rejected', reason: 'That item is not on this visit’s checklist.' });
    await syncOnce({ db, fetch: fetchImpl });
    expect(state.pushes).toHaveLength(1);
    expect((await db.checkResults.get([ids.visit, ids.tread]))?.state).toBe('skipped');
  });

  it('stops at a 401 with the outbox untouched', async () => {
    const { state, fetchImpl } = fakeServer();
    state.status = 401;
    await setCheck(db, ids.visit, ids.check, 'done');
    await expect(syncOnce({ db, fetch: fetchImpl })).rejects.toThrow(SignedOutError);
    expect(await db.outbox.where('state').equals('pending').count()).toBe(1);
  });

  it('reports a server error with the server’s own message', async () => {
    const { state, fetchImpl } = fakeServer();
    state.status = 503;
    await expect(syncOnce({ db, fetch: fetchImpl })).rejects.toThrow(ServerError);
  });

  it('treats a network failure as offline', async () => {
    const failing = (async () => {
      throw new TypeError('Failed to fetch');
    }) as typeof fetch;
    await setCheck(db, ids.visit, ids.check, 'done');
    await expect(syncOnce({ db, fetch: failing })).rejects.toThrow(OfflineError);
    expect(await db.outbox.count()).toBe(1);
  });
});

describe('an operation the server overrules', () => {
  it('pulls the whole round again and drops what the server does not hold', async () => {
    const { state, fetchImpl } = fakeServer();
    const { saveFinding } = await import('../../../src/lib/device/visit-actions');
    const finding = await saveFinding(db, ids.visit, { itemId: null, title: 'Wiper split', detail: '', severity: 'watch' });
    const other = roundPage();
    // The server answers `locked` (the office had locked the visit), and its whole view holds the
    // visit without the finding; the other round's visit is no longer this technician's.
    await storePulledPage(db, { ...other.page, cursor: '20' });
    const lockedFetch = (async (input: string | URL | Request, init?: RequestInit) => {
      const url = new URL(String(input), 'http://phone.test');
      if (url.pathname === '/api/sync/push') {
        const body = JSON.parse(String(init?.body)) as Pushed;
        return Response.json({ results: body.operations.map((o) => ({ opId: o.opId, outcome: 'locked' })), serverStamp: state.serverStamp });
      }
      if (url.pathname === '/api/sync/pull') {
        state.pullCursors.push(url.searchParams.get('cursor')!);
        const whole = roundPage();
        return Response.json({ ...whole.page, cursor: '30', visits: whole.page.visits.map((v) => ({ ...v, id: ids.visit })) });
      }
      return fetchImpl(input, init);
    }) as typeof fetch;
    await syncOnce({ db, fetch: lockedFetch });
    expect(state.pullCursors).toEqual(['0']);
    expect(await db.findings.get(finding.payload.findingId)).toBeUndefined();
    expect(await db.visits.get(ids.visit)).toBeDefined();
    expect(await db.visits.get(other.ids.visit)).toBeUndefined();
    expect(await db.meta.get('cursor')).toEqual({ key: 'cursor', value: '30' });
  });
});

describe('pulling', () => {
  it('moves the clock past the latest stamp a pull brings', async () => {
    const { fetchImpl } = fakeServer();
    const ahead = encodeStamp({ wallMs: Date.now() + 3_600_000, counter: 2, deviceId: 'tablet' });
    const withStamp = (async (input: string | URL | Request, init?: RequestInit) => {
      const url = new URL(String(input), 'http://phone.test');
      if (url.pathname === '/api/sync/pull') {
        return Response.json({ ...emptyPage('11'), checkResults: [{ visitId: ids.visit, itemId: ids.check, state: 'done', stamp: ahead }] });
      }
      return fetchImpl(input, init);
    }) as typeof fetch;
    await syncOnce({ db, fetch: withStamp });
    const next = await setCheck(db, ids.visit, ids.check, 'not_yet');
    expect(next.stamp > ahead).toBe(true);
    expect(next.seenStamp).toBe(ahead);
  });

  it('starts again from cursor 0 when the server says the cursor is not its own (409)', async () => {
    const cursors: string[] = [];
    const restored = (async (input: string | URL | Request) => {
      const url = new URL(String(input), 'http://phone.test');
      // After the pull the run asks for the load lists; this server has none.
      if (url.pathname !== '/api/sync/pull') return new Response('not found', { status: 404 });
      const cursor = url.searchParams.get('cursor')!;
      cursors.push(cursor);
      if (cursor !== '0') return Response.json({ error: 'The cursor is ahead of this server.' }, { status: 409 });
      return Response.json({ ...roundPage().page, cursor: '3', visits: [] });
    }) as typeof fetch;
    await syncOnce({ db, fetch: restored });
    expect(cursors).toEqual(['10', '0']);
    expect(await db.meta.get('cursor')).toEqual({ key: 'cursor', value: '3' });
    // The whole view held no visit for this technician: the phone's round is gone too.
    expect(await db.visits.count()).toBe(0);
  });
});
