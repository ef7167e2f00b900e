import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { vanOf } from '../../../../lib/server/van-access';
import { recordCount } from '../../../../lib/server/van-stock';
import { stockCountRequest } from '../../../../lib/server/van-requests';

export const prerender = false;

/** A stock count: the difference from the recorded level becomes a movement. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const body = await readJson(context.request, stockCountRequest);
  const van = await vanOf(user.organisationId, body.technicianId);
  return json(await recordCount(van, user.id, body.partId, body.counted, body.note));
});
