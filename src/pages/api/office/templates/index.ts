import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { createTemplate, listTemplates } from '../../../../lib/server/templates';
import { newTemplateInput } from '../../../../lib/office/template-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ templates: await listTemplates(user.organisationId) });
});

/** A new checklist starts as draft version 1. */
export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const input = await readJson(context.request, newTemplateInput);
  return json(await createTemplate(user.organisationId, input), 201);
});
