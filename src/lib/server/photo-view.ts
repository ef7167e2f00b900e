// How the office sees a photo row: its bytes through the photo endpoint of the sync service,
// which checks the viewer may see a visit holding that photo; the thumbnail once the server has
// made one.
import type * as s from '../../db/schema';
import { photoUrl } from './sync/pull';

export function photoView(photo: typeof s.photos.$inferSelect) {
  return {
    id: photo.id,
    findingId: photo.findingId,
    caption: photo.caption,
    sha256: photo.sha256,
    contentType: photo.contentType,
    sizeBytes: photo.sizeBytes,
    width: photo.width,
    height: photo.height,
    createdAt: photo.createdAt,
    url: photoUrl(photo.sha256) as string | null,
    thumbnailUrl: photo.thumbnailKey ? `${photoUrl(photo.sha256)}/thumbnail` : null,
  };
}
