// Photos are downscaled on the phone before they are stored: a full-size camera shot is several
// megabytes, and a day of them would fill the outbox and a slow upload. Browser only (canvas).
import type { PreparedPhoto } from './visit-actions';

// 1600 px on the long side shows a worn pad or a split hose clearly on a report; JPEG at 0.8
// keeps such a photo around 200–400 KB.
export const PHOTO_MAX_EDGE_PX = 1600;
const JPEG_QUALITY = 0.8;

export function scaledSize(width: number, height: number, maxEdge = PHOTO_MAX_EDGE_PX): { width: number; height: number } {
  const scale = Math.min(1, maxEdge / Math.max(width, height));
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

export async function sha256Hex(blob: Blob): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', await blob.arrayBuffer());
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
}

export class PhotoError extends Error {}

export async function preparePhoto(file: Blob): Promise<PreparedPhoto> {
  if (!file.type.startsWith('image/')) throw new PhotoError('That file is not a photo. Take or choose a photo.');
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    throw new PhotoError('This photo could not be read. Try taking it again.');
  }
  const { width, height } = scaledSize(bitmap.width, bitmap.height);
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const context = canvas.getContext('2d');
  if (!context) throw new PhotoError('This phone could not prepare the photo (no canvas).');
  context.drawImage(bitmap, 0, 0, width, height);
  bitmap.close();
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/jpeg', JPEG_QUALITY));
  if (!blob) throw new PhotoError('This phone could not prepare the photo. Try again.');
  return { blob, sha256: await sha256Hex(blob), contentType: 'image/jpeg', width, height };
}
