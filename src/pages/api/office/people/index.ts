import type { APIRoute } from 'astro';
import { endpoint, json, readJson, requireRole } from '../../../../lib/server/http';
import { addPerson, listPeople } from '../../../../lib/server/users';
import { newPersonInput } from '../../../../lib/office/people-input';

export const prerender = false;

// People and their roles are the owner's alone (PRODUCT.md, roles).
const OWNER = ['owner'] as const;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OWNER);
  return json({ people: await listPeople(user.organisationId) });
});

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OWNER);
  const input = await readJson(context.request, newPersonInput);
  return json({ person: await addPerson(user.organisationId, input) }, 201);
});
