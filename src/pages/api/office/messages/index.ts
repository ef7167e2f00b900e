import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readQuery, requireRole } from '../../../../lib/server/http';
import { messageListQuery } from '../../../../lib/server/follow-up-schemas';
import { listMessages } from '../../../../lib/server/messages';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const query = readQuery(context.url, messageListQuery);
  return json(await listMessages(user.organisationId, { ...query, pageSize: 50 }));
});
