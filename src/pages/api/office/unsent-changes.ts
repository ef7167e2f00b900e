import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../lib/server/http';
import { MAX_UNSENT_FILE_BYTES, unsentFileSchema } from '../../../lib/sync/unsent-file';
import { importUnsentFile } from '../../../lib/server/sync/unsent-import';

export const prerender = false;

/** A technician's file of unsent changes, pushed as their sync would have; safe to send twice. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const file = await readJson(context.request, unsentFileSchema, MAX_UNSENT_FILE_BYTES);
  return json(await importUnsentFile(user, file));
});
