import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readQuery, requireRole } from '../../../../lib/server/http';
import { advisedListQuery } from '../../../../lib/server/follow-up-schemas';
import { listAdvisedWork } from '../../../../lib/server/advised-work';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const query = readQuery(context.url, advisedListQuery);
  return json({ items: await listAdvisedWork(user.organisationId, query) });
});
