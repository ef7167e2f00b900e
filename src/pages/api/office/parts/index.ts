import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { catalogueOf, createPart } from '../../../../lib/server/catalogue';
import { partCreateRequest } from '../../../../lib/server/van-requests';

export const prerender = false;

/** The parts catalogue with each oil's container sizes. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ parts: await catalogueOf(user.organisationId) });
});

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const body = await readJson(context.request, partCreateRequest);
  return json({ part: await createPart(user.organisationId, body) }, 201);
});
