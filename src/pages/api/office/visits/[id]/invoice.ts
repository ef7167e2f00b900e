import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { idParam } from '../../../../../lib/server/follow-up-schemas';
import { prepareDraftInvoice } from '../../../../../lib/server/invoices';

export const prerender = false;

/** Makes a draft invoice from the visit's parts and labour. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  return json({ invoiceId: await prepareDraftInvoice(user.organisationId, id, user.id) }, 201);
});
