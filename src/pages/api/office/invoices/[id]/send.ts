import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { idParam } from '../../../../../lib/server/follow-up-schemas';
import { sendInvoice } from '../../../../../lib/server/invoices';

export const prerender = false;

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  return json(await sendInvoice(user.organisationId, id, user.id));
});
