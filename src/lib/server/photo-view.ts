// How the office sees a photo row. The bytes are served by the photo endpoint of the sync
// service (GET /api/photos/{sha256}, thumbnails beside it); until it serves them, the review
// shows what the row holds.
import type * as s from '../../db/schema';

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
    url: null as string | null,
    thumbnailUrl: null as string | null,
  };
}
