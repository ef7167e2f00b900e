import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { getCustomer, updateCustomer } from '../../../../lib/server/customers';
import { idParam } from '../../../../lib/server/params';
import { customerInput } from '../../../../lib/office/customer-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ customer: await getCustomer(user.organisationId, idParam(context, 'id', 'customer')) });
});

export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = idParam(context, 'id', 'customer');
  const input = await readJson(context.request, customerInput);
  return json({ customer: await updateCustomer(user.organisationId, id, input) });
});
