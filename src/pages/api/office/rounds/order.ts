import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { reorderRound } from '../../../../lib/server/rounds';
import { reorderRoundInput } from '../../../../lib/office/visit-input';

export const prerender = false;

export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const input = await readJson(context.request, reorderRoundInput);
  return json(await reorderRound(user.organisationId, input));
});
