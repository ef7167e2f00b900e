import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { creditBody, idParam } from '../../../../../lib/server/follow-up-schemas';
import { creditInvoice } from '../../../../../lib/server/invoices';

export const prerender = false;

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const { reason } = await readJson(context.request, creditBody);
  return json(await creditInvoice(user.organisationId, id, reason, user.id), 201);
});
