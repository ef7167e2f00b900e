// What a photo upload is, judged from its bytes: the name and the declared type are only claims.
import { createHash } from 'node:crypto';

export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export type PhotoType = (typeof PHOTO_TYPES)[number];

/**
 * Upload limit. The phone downscales before upload (a 2048 px JPEG is well under 1 MB); 8 MB
 * still takes an undownscaled 12-megapixel photo, and keeps one upload from filling memory.
 */
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;

/** Edge of the square the server's thumbnails fit in: two list rows high on a phone at 3x. */
export const THUMBNAIL_EDGE_PX = 320;

/** The image type from the file's signature (JPEG SOI, PNG signature, RIFF....WEBP), or null. */
export function sniffPhotoType(bytes: Uint8Array): PhotoType | null {
  const starts = (sig: number[], at = 0) => sig.every((b, i) => bytes[at + i] === b);
  if (starts([0xff, 0xd8, 0xff])) return 'image/jpeg';
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  if (starts([0x52, 0x49, 0x46, 0x46]) && starts([0x57, 0x45, 0x42, 0x50], 8)) return 'image/webp';
  return null;
}

export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Object keys derive from the organisation and the hash, so the same bytes land on the same key. */
export function photoKeys(organisationId: string, sha256: string) {
  return { objectKey: `photos/${organisationId}/${sha256}`, thumbnailKey: `photos/${organisationId}/${sha256}.thumb.webp` };
}
