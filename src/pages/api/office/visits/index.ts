import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, readQuery, requireRole } from '../../../../lib/server/http';
import { bookVisit } from '../../../../lib/server/rounds';
import { listVisits } from '../../../../lib/server/visit-review';
import { bookVisitInput, visitsQuery } from '../../../../lib/office/visit-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await listVisits(user.organisationId, readQuery(context.url, visitsQuery)));
});

/** Books a visit on a technician's round; clashes come back as warnings, not refusals. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const input = await readJson(context.request, bookVisitInput);
  return json(await bookVisit(user.organisationId, input), 201);
});
