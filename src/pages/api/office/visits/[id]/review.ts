import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { markReviewed } from '../../../../../lib/server/visit-review';
import { idParam } from '../../../../../lib/server/params';

export const prerender = false;

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ visit: await markReviewed(user.organisationId, idParam(context, 'id', 'visit'), user.id) });
});
