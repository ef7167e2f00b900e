import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readQuery, requireRole } from '../../../../lib/server/http';
import { roundsWeek } from '../../../../lib/server/rounds';
import { roundsQuery } from '../../../../lib/office/visit-input';

export const prerender = false;

/** The week holding ?week= (any day of it; this week when absent), by technician and day. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { week } = readQuery(context.url, roundsQuery);
  return json(await roundsWeek(user.organisationId, week));
});
