// Photo bytes for a customer's record: only photos of that visit, not removed, read from object
// storage by the photo store of the sync area.
import { and, eq, isNull } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';

export type PhotoReader = (objectKey: string) => Promise<Buffer | null>;

// Object storage belongs to the photo upload flow (lib/server of the sync area); it registers its
// reader here so this module does not depend on how or where the bytes are kept.
let reader: PhotoReader | null = null;

export function setRecordPhotoReader(read: PhotoReader) {
  reader = read;
}

export async function recordPhoto(visitId: string, photoId: string, size: 'thumb' | 'full') {
  const [photo] = await getDb()
    .select()
    .from(s.photos)
    .where(and(eq(s.photos.id, photoId), eq(s.photos.visitId, visitId), isNull(s.photos.removedStamp)));
  if (!photo || !reader) return null;
  const key = size === 'thumb' && photo.thumbnailKey ? photo.thumbnailKey : photo.objectKey;
  const bytes = await reader(key);
  if (!bytes) return null;
  return { bytes, contentType: size === 'thumb' && photo.thumbnailKey ? 'image/jpeg' : photo.contentType };
}

export async function recordPhotoBytes(visitId: string, photoId: string, size: 'thumb' | 'full') {
  return (await recordPhoto(visitId, photoId, size))?.bytes ?? null;
}
