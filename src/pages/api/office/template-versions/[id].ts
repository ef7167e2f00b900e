import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { discardDraft, getVersionContent, saveDraft } from '../../../../lib/server/templates';
import { idParam } from '../../../../lib/server/params';
import { templateContentInput } from '../../../../lib/office/template-input';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json({ version: await getVersionContent(user.organisationId, idParam(context, 'id', 'checklist version')) });
});

/** Replaces a draft's sections and items; a published version answers 409. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = idParam(context, 'id', 'checklist version');
  const input = await readJson(context.request, templateContentInput);
  return json({ version: await saveDraft(user.organisationId, id, input) });
});

export const DELETE: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  await discardDraft(user.organisationId, idParam(context, 'id', 'checklist version'));
  return json({ discarded: true });
});
