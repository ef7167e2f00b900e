// Saving the outbox to a file (lib/sync/unsent-file.ts) when the phone cannot reach the server:
// read in one transaction so the file is a consistent picture, then offered as a download. The
// outbox is left as it is: the phone still sends it when it finds signal, and the server takes
// each operation once whichever way it arrives first.
import type { DeviceUser } from './session';
import type { DeviceDb } from './db';
import { UNSENT_FILE_FORMAT, UNSENT_FILE_VERSION, unsentFileName, type UnsentFile } from '../sync/unsent-file';

async function base64Of(blob: Blob): Promise<string> {
  const bytes = new Uint8Array(await blob.arrayBuffer());
  let binary = '';
  // In slices: String.fromCharCode with a whole photo's bytes as arguments overflows the stack.
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

/** The file's content: every outbox entry in order, with the bytes of photos the server lacks. */
export async function collectUnsent(db: DeviceDb, user: Pick<DeviceUser, 'id' | 'name' | 'email'>, now = new Date()): Promise<UnsentFile> {
  const { entries, clock, last, blobs } = await db.transaction('r', [db.outbox, db.meta, db.photos, db.photoBlobs], async () => {
    const entries = await db.outbox.orderBy('seq').toArray();
    const [clock, last] = await Promise.all([db.meta.get('clock'), db.meta.get('lastSyncedAt')]);
    const hashes = [...new Set(entries.flatMap((e) => (e.op.kind === 'photo.add' ? [e.op.payload.sha256] : [])))];
    const photos = await db.photos.where('sha256').anyOf(hashes).toArray();
    const uploaded = new Set(photos.filter((p) => p.uploaded).map((p) => p.sha256));
    const blobs = await db.photoBlobs.bulkGet(hashes.filter((h) => !uploaded.has(h)));
    return { entries, clock, last, blobs };
  });
  const deviceId = clock?.key === 'clock' ? clock.value.deviceId : (entries[0]?.op.deviceId ?? 'unknown');
  const photos: UnsentFile['photos'] = [];
  for (const blob of blobs) {
    if (!blob) continue;
    const contentType = blob.blob.type as UnsentFile['photos'][number]['contentType'];
    photos.push({ sha256: blob.sha256, contentType: contentType || 'image/jpeg', base64: await base64Of(blob.blob) });
  }
  return {
    format: UNSENT_FILE_FORMAT,
    version: UNSENT_FILE_VERSION,
    createdAt: now.toISOString(),
    user: { id: user.id, name: user.name, email: user.email },
    deviceId,
    lastSyncedAt: last?.key === 'lastSyncedAt' ? last.value : null,
    operations: entries.map((e) => ({ state: e.state, reason: e.reason, createdAt: e.createdAt, op: e.op })),
    photos,
  };
}

/** Saves the file through the browser's download (works offline: nothing leaves the phone). */
export async function saveUnsentFile(db: DeviceDb, user: Pick<DeviceUser, 'id' | 'name' | 'email'>): Promise<{ name: string; operations: number; photos: number }> {
  const file = await collectUnsent(db, user);
  const name = unsentFileName(user.name, file.createdAt);
  const url = URL.createObjectURL(new Blob([JSON.stringify(file)], { type: 'application/json' }));
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = name;
    document.body.append(link);
    link.click();
    link.remove();
  } finally {
    // The download has taken its copy once click() returns; a short grace for slow browsers.
    setTimeout(() => URL.revokeObjectURL(url), 60_000);
  }
  return { name, operations: file.operations.length, photos: file.photos.length };
}
