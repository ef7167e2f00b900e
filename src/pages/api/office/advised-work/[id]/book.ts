import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { bookingBody, idParam } from '../../../../../lib/server/follow-up-schemas';
import { bookAdvisedWork } from '../../../../../lib/server/advised-work';

export const prerender = false;

/** Books approved advised work as a visit in one step. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const booking = await readJson(context.request, bookingBody);
  return json(await bookAdvisedWork(user.organisationId, id, booking), 201);
});
