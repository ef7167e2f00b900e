import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../lib/server/http';
import { updateModelNote } from '../../../../lib/server/model-notes';
import { idParam } from '../../../../lib/server/params';
import { modelNoteInput } from '../../../../lib/office/model-note-input';

export const prerender = false;

export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const id = idParam(context, 'id', 'model note');
  const input = await readJson(context.request, modelNoteInput);
  return json({ modelNote: await updateModelNote(user.organisationId, id, input) });
});
