import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../../../lib/server/http';
import { publishDraft } from '../../../../../lib/server/templates';
import { idParam } from '../../../../../lib/server/params';

export const prerender = false;

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ version: await publishDraft(user.organisationId, idParam(context, 'id', 'checklist version'), user.id) });
});
