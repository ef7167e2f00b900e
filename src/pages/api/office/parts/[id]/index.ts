import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { updatePart } from '../../../../../lib/server/catalogue';
import { partUpdateRequest } from '../../../../../lib/server/van-requests';

export const prerender = false;

export const PATCH: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const partId = z.uuid().parse(context.params.id);
  const body = await readJson(context.request, partUpdateRequest);
  await updatePart(user.organisationId, partId, body);
  return json({ id: partId });
});
