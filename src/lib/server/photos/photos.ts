// Photo uploads and downloads. The device PUTs the bytes to /api/photos/{sha256} before it
// pushes the photo.add operation that names them (lib/sync/README.md).
import { and, eq, exists } from 'drizzle-orm';
import sharp from 'sharp';
import { getDb } from '../../../db/client';
import * as s from '../../../db/schema';
import type { UserRole } from '../../../db/schema';
import { HttpError } from '../http';
import { getObject, putObject } from './object-store';
import { photoKeys, sha256Hex, sniffPhotoType, THUMBNAIL_EDGE_PX, type PhotoType } from './photo-bytes';

type Uploader = { id: string; role: UserRole; organisationId: string };

export type StoredPhoto = { sha256: string; contentType: string; sizeBytes: number; width: number; height: number; created: boolean };

export async function storePhoto(user: Uploader, sha256: string, declaredType: string, bytes: Uint8Array): Promise<StoredPhoto> {
  const type = sniffPhotoType(bytes);
  if (!type) throw new HttpError(415, 'The bytes are not a JPEG, PNG or WebP image.');
  if (declaredType !== type) throw new HttpError(415, `The bytes are ${type}, but the request says ${declaredType}.`);
  if (sha256Hex(bytes) !== sha256) {
    throw new HttpError(422, 'The bytes do not match the SHA-256 in the address; the upload may be damaged. Send it again.');
  }
  const db = getDb();
  const [existing] = await db
    .select()
    .from(s.photoObjects)
    .where(and(eq(s.photoObjects.organisationId, user.organisationId), eq(s.photoObjects.sha256, sha256)));
  if (existing) return { ...describe(existing), created: false };

  let size: { width: number; height: number };
  let thumbnail: Buffer;
  try {
    const image = sharp(bytes, { failOn: 'error' });
    const meta = await image.metadata();
    if (!meta.width || !meta.height) throw new Error('no dimensions');
    // EXIF orientation 5-8 means the picture is shown turned a quarter.
    size = (meta.orientation ?? 1) >= 5 ? { width: meta.height, height: meta.width } : { width: meta.width, height: meta.height };
    thumbnail = await sharp(bytes)
      .rotate()
      .resize(THUMBNAIL_EDGE_PX, THUMBNAIL_EDGE_PX, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 70 })
      .toBuffer();
  } catch {
    throw new HttpError(422, 'The image cannot be read; it may be damaged. Take the photo again.');
  }
  const keys = photoKeys(user.organisationId, sha256);
  // Store first, record after: a crash in between leaves bytes that the retry overwrites
  // with the same bytes, never a record without bytes.
  await putObject(keys.objectKey, bytes, type);
  await putObject(keys.thumbnailKey, thumbnail, 'image/webp');
  const row = { organisationId: user.organisationId, sha256, ...keys, contentType: type, sizeBytes: bytes.byteLength, ...size, uploadedBy: user.id };
  const inserted = await db.insert(s.photoObjects).values(row).onConflictDoNothing().returning();
  return { ...describe(row), created: inserted.length > 0 };
}

function describe(row: { sha256: string; contentType: string; sizeBytes: number; width: number; height: number }) {
  return { sha256: row.sha256, contentType: row.contentType as PhotoType, sizeBytes: row.sizeBytes, width: row.width, height: row.height };
}

/**
 * The photo's bytes (or its thumbnail) for a user allowed to see it: office and owner see every
 * photo of their business; a technician sees photos they uploaded and those on their own visits.
 * Anyone else gets a 404, so a hash reveals nothing.
 */
export async function readPhoto(user: Uploader, sha256: string, variant: 'original' | 'thumbnail') {
  const db = getDb();
  const [object] = await db
    .select()
    .from(s.photoObjects)
    .where(and(eq(s.photoObjects.organisationId, user.organisationId), eq(s.photoObjects.sha256, sha256)));
  const notFound = new HttpError(404, 'No such photo.');
  if (!object) throw notFound;
  if (user.role === 'technician' && object.uploadedBy !== user.id) {
    const onTheirVisit = await db
      .select({ one: s.photos.id })
      .from(s.photos)
      .where(
        and(
          eq(s.photos.sha256, sha256),
          exists(
            db
              .select({ one: s.visits.id })
              .from(s.visits)
              .where(and(eq(s.visits.id, s.photos.visitId), eq(s.visits.technicianId, user.id), eq(s.visits.organisationId, user.organisationId))),
          ),
        ),
      )
      .limit(1);
    if (onTheirVisit.length === 0) throw notFound;
  }
  const stored = await getObject(variant === 'thumbnail' ? object.thumbnailKey : object.objectKey);
  if (!stored) throw new HttpError(503, 'The photo store does not have these bytes right now; try again later.');
  return stored;
}
