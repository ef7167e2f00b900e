import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../../lib/server/http';
import { idParam } from '../../../../../../lib/server/follow-up-schemas';
import { withdrawRecordLinks } from '../../../../../../lib/server/record-sharing';

export const prerender = false;

/** Withdraws every link to this visit's record (sent to the wrong address, say). */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const withdrawn = await withdrawRecordLinks(user.organisationId, id);
  return json({ withdrawn: withdrawn.length });
});
