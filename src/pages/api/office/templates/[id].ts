import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { getTemplate, updateTemplateDetails } from '../../../../lib/server/templates';
import { idParam } from '../../../../lib/server/params';
import { templateDetailsInput } from '../../../../lib/office/template-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await getTemplate(user.organisationId, idParam(context, 'id', 'checklist')));
});

/** Name, description and labour time: not versioned, they describe the checklist as a whole. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = idParam(context, 'id', 'checklist');
  const input = await readJson(context.request, templateDetailsInput);
  return json({ template: await updateTemplateDetails(user.organisationId, id, input) });
});
