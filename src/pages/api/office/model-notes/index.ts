import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, readQuery, requireRole } from '../../../../lib/server/http';
import { createModelNote, listModelNotes } from '../../../../lib/server/model-notes';
import { modelNoteInput } from '../../../../lib/office/model-note-input';
import { tableQuery } from '../../../../lib/office/table-query';

export const prerender = false;

const query = tableQuery(['make'] as const, 'make');

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  return json(await listModelNotes(user.organisationId, readQuery(context.url, query)));
});

export const POST: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const input = await readJson(context.request, modelNoteInput);
  return json({ modelNote: await createModelNote(user.organisationId, input) }, 201);
});
