import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { decisionBody, idParam } from '../../../../../lib/server/follow-up-schemas';
import { decideAdvisedWork } from '../../../../../lib/server/advised-work';

export const prerender = false;

/** Records a customer's answer given to the office (on the phone, say). */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const { decision } = await readJson(context.request, decisionBody);
  return json(await decideAdvisedWork(id, decision, { organisationId: user.organisationId, userId: user.id }));
});
