import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, readQuery, requireRole } from '../../../../lib/server/http';
import { createCustomer, listCustomers } from '../../../../lib/server/customers';
import { CUSTOMER_SORTS, customerInput } from '../../../../lib/office/customer-input';
import { tableQuery } from '../../../../lib/office/table-query';

export const prerender = false;

const query = tableQuery(CUSTOMER_SORTS, 'name');

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await listCustomers(user.organisationId, readQuery(context.url, query)));
});

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const input = await readJson(context.request, customerInput);
  return json({ customer: await createCustomer(user.organisationId, input) }, 201);
});
