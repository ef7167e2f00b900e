import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { vanOf } from '../../../../lib/server/van-access';
import { setMinimum } from '../../../../lib/server/van-stock';
import { minimumRequest } from '../../../../lib/server/van-requests';

export const prerender = false;

/** Sets the level below which a van's part shows as low; null clears it. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const body = await readJson(context.request, minimumRequest);
  const van = await vanOf(user.organisationId, body.technicianId);
  await setMinimum(van, body.partId, body.minimum);
  return json({ technicianId: van.technicianId, partId: body.partId, minimum: body.minimum });
});
