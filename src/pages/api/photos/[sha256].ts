import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, HttpError, json, readBodyBytes, requireUser } from '../../../lib/server/http';
import { MAX_PHOTO_BYTES, PHOTO_TYPES } from '../../../lib/server/photos/photo-bytes';
import { readPhoto, storePhoto } from '../../../lib/server/photos/photos';
import { photoResponse } from '../../../lib/server/photos/photo-response';

export const prerender = false;

const sha256Param = z.string().regex(/^[0-9a-f]{64}$/, 'must be the lower-case hex SHA-256 of the bytes');

/** Upload a photo's bytes under their SHA-256; sending the same bytes again changes nothing. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireUser(context);
  const sha256 = sha256Param.parse(context.params.sha256);
  const declared = (context.request.headers.get('content-type') ?? '').split(';')[0]!.trim();
  if (!(PHOTO_TYPES as readonly string[]).includes(declared)) {
    throw new HttpError(415, 'Send the photo as image/jpeg, image/png or image/webp.');
  }
  const bytes = await readBodyBytes(context.request, MAX_PHOTO_BYTES);
  const stored = await storePhoto(user, sha256, declared, bytes);
  return json(stored, stored.created ? 201 : 200);
});

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireUser(context);
  const sha256 = sha256Param.parse(context.params.sha256);
  return photoResponse(sha256, await readPhoto(user, sha256, 'original'));
});
