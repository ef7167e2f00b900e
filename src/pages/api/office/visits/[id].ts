import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { moveVisit } from '../../../../lib/server/rounds';
import { visitDetail } from '../../../../lib/server/visit-review';
import { idParam } from '../../../../lib/server/params';
import { moveVisitInput } from '../../../../lib/office/visit-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await visitDetail(user.organisationId, idParam(context, 'id', 'visit')));
});

/** Moves a booked visit: another technician, day or time, or a new address. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = idParam(context, 'id', 'visit');
  const input = await readJson(context.request, moveVisitInput);
  return json(await moveVisit(user.organisationId, id, input));
});
