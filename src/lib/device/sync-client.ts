// One sync run: upload photo bytes, push the outbox, pull what changed. Talks HTTP through the
// `fetch` it is given, so tests run it against the real server from Node.
import { MAX_BATCH_OPERATIONS, MAX_PUSH_BYTES, pushResponseSchema } from '../sync/push';
import { pullResponseSchema, type PullResponse } from '../sync/pull';
import type { DeviceDb, OutboxEntry } from './db';
import { deviceIdOf, receiveServerStamp } from './clock-store';
import { storePulledPage, sweepGoneVisits } from './pull-store';
import { errorOf, OfflineError, request, ServerError, SignedOutError, understood } from './http';
import { refreshLoadLists } from './load-lists';

export { OfflineError, ServerError, SignedOutError };

export type UploadProgress = { photosDone: number; photosTotal: number; bytesDone: number; bytesTotal: number };

export type PutBytes = (url: string, blob: Blob, contentType: string, onProgress: (loaded: number) => void) => Promise<{ status: number; body: string }>;

export type SyncDeps = {
  db: DeviceDb;
  fetch: typeof fetch;
  /** Defaults to a fetch PUT; the browser passes an XMLHttpRequest one that reports progress. */
  putBytes?: PutBytes;
  baseUrl?: string;
  onUploadProgress?: (progress: UploadProgress) => void;
};

export type SyncReport = { pushed: number; rejected: number; pulledPages: number; photosUploaded: number; loadListsSaved: number };

// A runaway server answering hasMore forever must not keep the phone busy for ever.
const MAX_PULL_PAGES_PER_RUN = 200;

export async function syncOnce(deps: SyncDeps): Promise<SyncReport> {
  const photosUploaded = await uploadPhotos(deps);
  const { pushed, rejected, overruled } = await pushOutbox(deps);
  await sweepGoneVisits(deps.db);
  // An operation the server kept but did not apply (superseded, in conflict, visit locked) leaves
  // the phone showing a value the server does not hold, and the server's row has not changed, so
  // a pull from the cursor would not bring it back: pull everything again instead (rare, small).
  if (overruled) await startPullOver(deps.db);
  const { pages: pulledPages, rows } = await pullAll(deps);
  await deps.db.meta.put({ key: 'lastSyncedAt', value: new Date().toISOString() });
  // The load list follows the round: a pull that changed anything may have moved a visit or a
  // vehicle's spec, so the lists are fetched again; otherwise only when the copy has aged.
  const { saved: loadListsSaved } = await refreshLoadLists(deps, { roundChanged: rows > 0 });
  return { pushed, rejected, pulledPages, photosUploaded, loadListsSaved };
}

// ---- photos ---------------------------------------------------------------------------------

/** Photos whose add is still unsent and whose bytes the server does not have yet. */
async function photosToUpload(db: DeviceDb) {
  const adds = await db.outbox.where('kind').equals('photo.add').toArray();
  const pendingAdds = new Set(adds.filter((e) => e.state === 'pending').map((e) => e.entityId));
  const photos = await db.photos.bulkGet([...pendingAdds]);
  return photos.filter((p): p is NonNullable<typeof p> => !!p && !p.uploaded);
}

async function uploadPhotos(deps: SyncDeps): Promise<number> {
  const { db } = deps;
  const photos = await photosToUpload(db);
  if (photos.length === 0) return 0;
  const blobs = await db.photoBlobs.bulkGet(photos.map((p) => p.sha256));
  const bytesTotal = photos.reduce((sum, p) => sum + p.sizeBytes, 0);
  const progress: UploadProgress = { photosDone: 0, photosTotal: photos.length, bytesDone: 0, bytesTotal };
  deps.onUploadProgress?.({ ...progress });
  const put = deps.putBytes ?? fetchPut(deps);
  for (const [i, photo] of photos.entries()) {
    const blob = blobs[i]?.blob;
    if (!blob) {
      await rejectPhotoAdd(db, photo.id, 'The photo’s bytes are missing on this phone, so it cannot be uploaded.');
      continue;
    }
    const before = progress.bytesDone;
    let answer: { status: number; body: string };
    try {
      answer = await put(`${deps.baseUrl ?? ''}/api/photos/${photo.sha256}`, blob, photo.contentType, (loaded) => {
        deps.onUploadProgress?.({ ...progress, bytesDone: before + Math.min(loaded, photo.sizeBytes) });
      });
    } catch {
      throw new OfflineError('The connection dropped while a photo was uploading. It will be sent again.');
    }
    if (answer.status === 401) throw new SignedOutError();
    if (answer.status >= 200 && answer.status < 300) {
      await db.photos.update(photo.id, { uploaded: true });
    } else if ([400, 413, 415, 422].includes(answer.status)) {
      // The server will never take these bytes: say so on the phone instead of retrying for ever.
      await rejectPhotoAdd(db, photo.id, reasonFrom(answer.body, `The server refused the photo (${answer.status}).`));
    } else {
      throw new ServerError(answer.status, reasonFrom(answer.body, `Photo upload failed (${answer.status}).`));
    }
    progress.photosDone += 1;
    progress.bytesDone = before + photo.sizeBytes;
    deps.onUploadProgress?.({ ...progress });
  }
  return progress.photosDone;
}

function reasonFrom(body: string, fallback: string): string {
  try {
    const parsed = JSON.parse(body) as { error?: unknown };
    return typeof parsed.error === 'string' ? parsed.error : fallback;
  } catch {
    return fallback;
  }
}

async function rejectPhotoAdd(db: DeviceDb, photoId: string, reason: string) {
  await db.outbox
    .where('kind')
    .equals('photo.add')
    .filter((e) => e.entityId === photoId && e.state === 'pending')
    .modify({ state: 'rejected', reason });
}

function fetchPut(deps: SyncDeps): PutBytes {
  return async (url, blob, contentType, onProgress) => {
    const response = await deps.fetch(url, { method: 'PUT', body: blob, headers: { 'content-type': contentType }, credentials: 'same-origin' });
    onProgress(blob.size);
    return { status: response.status, body: await response.text() };
  };
}

// ---- push -----------------------------------------------------------------------------------

/** The next batch in outbox order, stopping before a photo whose bytes are not on the server. */
async function nextBatch(db: DeviceDb): Promise<OutboxEntry[]> {
  const pending = await db.outbox.where('state').equals('pending').sortBy('seq');
  const batch: OutboxEntry[] = [];
  let bytes = 0;
  for (const entry of pending) {
    if (entry.kind === 'photo.add') {
      const photo = await db.photos.get(entry.entityId);
      if (!photo?.uploaded) break;
    }
    const size = JSON.stringify(entry.op).length + 1;
    // Leave room for the envelope around the operations.
    if (batch.length >= MAX_BATCH_OPERATIONS || bytes + size > MAX_PUSH_BYTES - 1024) break;
    batch.push(entry);
    bytes += size;
  }
  return batch;
}

/** Forget the pull cursor, so the next pull brings the server's whole view of this user's round. */
export async function startPullOver(db: DeviceDb): Promise<void> {
  await db.meta.delete('cursor');
}

async function pushOutbox(deps: SyncDeps): Promise<{ pushed: number; rejected: number; overruled: boolean }> {
  const { db } = deps;
  const deviceId = await deviceIdOf(db);
  let pushed = 0;
  let rejected = 0;
  let overruled = false;
  for (;;) {
    const batch = await nextBatch(db);
    if (batch.length === 0) break;
    await db.outbox.bulkUpdate(batch.map((e) => ({ key: e.seq!, changes: { attempts: e.attempts + 1 } })));
    const response = await request(deps, '/api/sync/push', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ deviceId, operations: batch.map((e) => e.op) }),
    });
    if (!response.ok) throw await errorOf(response);
    const answer = await understood(response, pushResponseSchema);
    const outcomes = new Map(answer.results.map((r) => [r.opId, r]));
    await db.transaction('rw', db.outbox, async () => {
      for (const entry of batch) {
        const result = outcomes.get(entry.opId);
        // No answer for an operation: it stays and goes again; the server ignores a duplicate.
        if (!result) continue;
        if (result.outcome === 'rejected') {
          rejected += 1;
          await db.outbox.update(entry.seq!, { state: 'rejected', reason: result.reason ?? 'The server refused this change.' });
        } else {
          // applied, duplicate, superseded, conflict, locked: the server holds it (conflicts in
          // the office's list), so the phone may let go of the operation.
          pushed += 1;
          if (result.outcome !== 'applied' && result.outcome !== 'duplicate') overruled = true;
          await db.outbox.delete(entry.seq!);
        }
      }
    });
    await receiveServerStamp(db, answer.serverStamp);
    if (answer.results.length === 0) break;
  }
  return { pushed, rejected, overruled };
}

// ---- pull -----------------------------------------------------------------------------------

type PullCount = { pages: number; rows: number };

async function pullAll(deps: SyncDeps): Promise<PullCount> {
  try {
    return await pullPages(deps);
  } catch (error) {
    // 409: the cursor belongs to data this server no longer has (restored from a backup, say).
    if (!(error instanceof ServerError) || error.status !== 409) throw error;
    await startPullOver(deps.db);
    return pullPages(deps);
  }
}

/** How many rows a page brought (visits taken off the round included). */
function rowsIn(page: PullResponse): number {
  return Object.values(page).reduce<number>((sum, value) => sum + (Array.isArray(value) ? value.length : 0), 0);
}

async function pullPages(deps: SyncDeps): Promise<PullCount> {
  const { db } = deps;
  const row = await db.meta.get('cursor');
  let cursor = row?.key === 'cursor' ? row.value : null;
  // From no cursor the answer is the server's whole view: gather every page and store them as
  // one, so records the server does not hold can be dropped in the same transaction.
  const whole = cursor === null;
  let gathered: PullResponse | null = null;
  let pages = 0;
  let rows = 0;
  while (pages < MAX_PULL_PAGES_PER_RUN) {
    const response = await request(deps, `/api/sync/pull?cursor=${encodeURIComponent(cursor ?? '0')}`);
    if (!response.ok) throw await errorOf(response);
    const page = await understood(response, pullResponseSchema);
    pages += 1;
    rows += rowsIn(page);
    if (whole) gathered = gathered ? joinPages(gathered, page) : page;
    else await storePulledPage(db, page);
    // Later local changes must order after everything the pull brought (lib/sync/README.md).
    const latest = latestStamp(page);
    if (latest) await receiveServerStamp(db, latest);
    cursor = page.cursor;
    if (!page.hasMore) break;
  }
  if (gathered) await storePulledPage(db, gathered, { replace: true });
  return { pages, rows };
}

/** The latest clock stamp a pulled page carries, if any. */
export function latestStamp(page: PullResponse): string | null {
  const stamps = [
    ...page.checkResults.map((r) => r.stamp),
    ...page.readingResults.map((r) => r.stamp),
    ...page.findings.flatMap((r) => [r.stamp, r.severityStamp]),
    ...page.notes.map((r) => r.stamp),
    ...page.photos.map((r) => r.addStamp),
    ...page.partLines.map((r) => r.stamp),
    ...page.signOffs.map((r) => r.stamp),
  ];
  return stamps.reduce<string | null>((max, stamp) => (max === null || stamp > max ? stamp : max), null);
}

function joinPages(a: PullResponse, b: PullResponse): PullResponse {
  const joined = { ...b };
  for (const key of Object.keys(b) as (keyof PullResponse)[]) {
    const left = a[key];
    const right = b[key];
    if (Array.isArray(left) && Array.isArray(right)) (joined as Record<string, unknown>)[key] = [...left, ...right];
  }
  return joined;
}
