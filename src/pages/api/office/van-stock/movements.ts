import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { vanOf } from '../../../../lib/server/van-access';
import { moveStock } from '../../../../lib/server/van-stock';
import { stockMovementRequest } from '../../../../lib/server/van-requests';

export const prerender = false;

/** The office loads a van from the store (restock) or takes parts back (returned). */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const body = await readJson(context.request, stockMovementRequest);
  const van = await vanOf(user.organisationId, body.technicianId);
  const movements = await moveStock(van, user.id, body.reason, body.lines, body.note);
  return json({ movements }, 201);
});
