import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../../lib/server/http';
import { idParam, sendRecordBody } from '../../../../../../lib/server/follow-up-schemas';
import { sendRecord } from '../../../../../../lib/server/record-sharing';

export const prerender = false;

/** E-mails the customer a link to the visit's service record. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const { again } = await readJson(context.request, sendRecordBody);
  return json(await sendRecord(user.organisationId, id, user.id, { again }), 202);
});
