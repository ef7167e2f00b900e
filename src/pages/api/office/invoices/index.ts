import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readQuery, requireRole } from '../../../../lib/server/http';
import { invoiceListQuery } from '../../../../lib/server/follow-up-schemas';
import { listInvoices } from '../../../../lib/server/invoices';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const query = readQuery(context.url, invoiceListQuery);
  return json(await listInvoices(user.organisationId, { ...query, pageSize: 50 }));
});
