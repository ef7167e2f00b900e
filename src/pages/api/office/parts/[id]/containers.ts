import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { setContainerSizes } from '../../../../../lib/server/catalogue';
import { containerSizesRequest } from '../../../../../lib/server/van-requests';

export const prerender = false;

/** The container sizes an oil is bought and loaded in (replaces the list). */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const partId = z.uuid().parse(context.params.id);
  const body = await readJson(context.request, containerSizesRequest);
  return json({ sizesL: await setContainerSizes(user.organisationId, partId, body.sizesL) });
});
