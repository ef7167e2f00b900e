import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { idParam } from '../../../../../lib/server/follow-up-schemas';
import { resendMessage } from '../../../../../lib/server/messages';

export const prerender = false;

/** Sends a failed or uncertain message again, on a person's decision. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  return json(await resendMessage(user.organisationId, id, user.id), 202);
});
