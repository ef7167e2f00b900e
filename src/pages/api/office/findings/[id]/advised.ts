import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { advisedPriceBody, idParam } from '../../../../../lib/server/follow-up-schemas';
import { priceFinding } from '../../../../../lib/server/advised-work';

export const prerender = false;

/** Prices a finding as advised work for the customer to approve or decline. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const price = await readJson(context.request, advisedPriceBody);
  return json({ advisedWorkId: await priceFinding(user.organisationId, id, price, user.id) });
});
