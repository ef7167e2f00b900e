import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { vanOf } from '../../../../lib/server/van-access';
import { recordDisposal } from '../../../../lib/server/used-oil';
import { disposalRequest } from '../../../../lib/server/van-requests';

export const prerender = false;

/** Records used oil taken from a van to a licensed site. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const body = await readJson(context.request, disposalRequest);
  const van = await vanOf(user.organisationId, body.technicianId);
  const disposal = await recordDisposal(van, user.id, { ...body, disposedAt: new Date(body.disposedAt) });
  return json({ disposal }, 201);
});
