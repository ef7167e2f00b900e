import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { customerHistory } from '../../../../../lib/server/customers';
import { idParam } from '../../../../../lib/server/params';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await customerHistory(user.organisationId, idParam(context, 'id', 'customer')));
});
