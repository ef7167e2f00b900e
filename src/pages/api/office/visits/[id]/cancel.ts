import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { cancelVisit } from '../../../../../lib/server/rounds';
import { idParam } from '../../../../../lib/server/params';

export const prerender = false;

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ visit: await cancelVisit(user.organisationId, idParam(context, 'id', 'visit')) });
});
