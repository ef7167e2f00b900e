// Photo bytes never change under their address, so a device may keep them as long as it likes;
// "private" keeps shared caches from holding a customer's car.
export function photoResponse(sha256: string, stored: { bytes: Uint8Array; contentType: string }): Response {
  return new Response(Buffer.from(stored.bytes), {
    headers: {
      'content-type': stored.contentType,
      'cache-control': 'private, max-age=31536000, immutable',
      etag: `"${sha256}"`,
      'x-content-type-options': 'nosniff',
    },
  });
}
