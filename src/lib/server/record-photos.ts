// Photo bytes for a customer's record: only photos of that visit, not removed, read from object
// storage by the photo store of the sync area.
import { and, eq, isNull } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';

export type PhotoReader = (objectKey: string) => Promise<Buffer | null>;

type ObjectStore = { getObject(key: string): Promise<{ bytes: Uint8Array } | null> };

// Object storage belongs to the photo upload flow (lib/server/photos/object-store.ts, from the sync
// work). It is found by glob so this area builds and runs before that module lands; once present,
// its getObject serves the record's photos. A test or another store can set a reader instead.
const stores = import.meta.glob<ObjectStore>('./photos/object-store.ts');
let reader: PhotoReader | null = null;

export function setRecordPhotoReader(read: PhotoReader) {
  reader = read;
}

async function currentReader(): Promise<PhotoReader | null> {
  if (reader) return reader;
  const load = Object.values(stores)[0];
  if (!load) return null;
  const store = await load();
  reader = async (key) => {
    const found = await store.getObject(key);
    return found ? Buffer.from(found.bytes) : null;
  };
  return reader;
}

export async function recordPhoto(visitId: string, photoId: string, size: 'thumb' | 'full') {
  const [photo] = await getDb()
    .select()
    .from(s.photos)
    .where(and(eq(s.photos.id, photoId), eq(s.photos.visitId, visitId), isNull(s.photos.removedStamp)));
  const read = photo ? await currentReader() : null;
  if (!photo || !read) return null;
  const key = size === 'thumb' && photo.thumbnailKey ? photo.thumbnailKey : photo.objectKey;
  const bytes = await read(key);
  if (!bytes) return null;
  return { bytes, contentType: size === 'thumb' && photo.thumbnailKey ? 'image/jpeg' : photo.contentType };
}

export async function recordPhotoBytes(visitId: string, photoId: string, size: 'thumb' | 'full') {
  return (await recordPhoto(visitId, photoId, size))?.bytes ?? null;
}
