import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, requireUser } from '../../../../lib/server/http';
import { readPhoto } from '../../../../lib/server/photos/photos';
import { photoResponse } from '../../../../lib/server/photos/photo-response';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireUser(context);
  const sha256 = z.string().regex(/^[0-9a-f]{64}$/).parse(context.params.sha256);
  return photoResponse(sha256, await readPhoto(user, sha256, 'thumbnail'));
});
