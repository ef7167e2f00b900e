import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { startDraft } from '../../../../../lib/server/templates';
import { idParam } from '../../../../../lib/server/params';

export const prerender = false;

/** Opens the checklist's draft, copying the latest version when there is none. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const result = await startDraft(user.organisationId, idParam(context, 'id', 'checklist'));
  return json(result, result.created ? 201 : 200);
});
