import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, HttpError, json, readJson, requireRole } from '../../../../lib/server/http';
import { changeRole } from '../../../../lib/server/users';
import { roleChangeInput } from '../../../../lib/office/people-input';

export const prerender = false;

export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, ['owner']);
  const id = z.string().min(1).max(64).safeParse(context.params.id);
  if (!id.success) throw new HttpError(404, 'No such person in this business.');
  const { role } = await readJson(context.request, roleChangeInput);
  return json({ person: await changeRole(user.organisationId, id.data, role) });
});
