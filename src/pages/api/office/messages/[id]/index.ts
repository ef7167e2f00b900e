import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { idParam } from '../../../../../lib/server/follow-up-schemas';
import { messageDetail } from '../../../../../lib/server/messages';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  return json({ message: await messageDetail(user.organisationId, id) });
});
