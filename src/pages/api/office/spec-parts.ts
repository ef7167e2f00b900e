import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../lib/server/http';
import { listSpecParts } from '../../../lib/server/vehicles';

export const prerender = false;

/** The filters and plugs a vehicle spec may name. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ parts: await listSpecParts(user.organisationId) });
});
