import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { resolveConflict } from '../../../../../lib/server/sync/conflicts';

export const prerender = false;

const body = z.object({
  use: z.enum(['standing', 'proposed']),
  keepOtherAsNote: z.boolean().default(false),
  reopen: z.boolean().default(false),
});

/** Settles one conflict: keep the standing value or use the other; see lib/server/sync/conflicts. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = z.uuid('must be a conflict id').parse(context.params.id);
  const choice = await readJson(context.request, body);
  return json(await resolveConflict(user, id, choice));
});
