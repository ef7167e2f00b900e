import type { APIRoute } from 'astro';
import { z } from 'zod';
import { getDb } from '../../../../db/client';
import { endpoint, HttpError } from '../../../../lib/server/http';
import { resolveRecordToken } from '../../../../lib/server/record-links';
import { recordPhoto } from '../../../../lib/server/record-photos';

export const prerender = false;

const params = z.object({ token: z.string().min(10).max(200), photoId: z.uuid() });

/** A finding's photo on the customer's record; only photos of the link's own visit. */
export const GET: APIRoute = endpoint(async (context) => {
  const { token, photoId } = params.parse(context.params);
  const link = await resolveRecordToken(getDb(), token);
  const size = context.url.searchParams.get('size') === 'thumb' ? 'thumb' : 'full';
  const photo = await recordPhoto(link.visitId, photoId, size);
  if (!photo) throw new HttpError(404, 'No such photo on this record.');
  return new Response(new Uint8Array(photo.bytes), {
    headers: { 'content-type': photo.contentType, 'cache-control': 'private, max-age=3600' },
  });
});
