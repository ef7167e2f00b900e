import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, readJson, requireRole } from '../../../../../lib/server/http';
import { draftLinesBody, idParam } from '../../../../../lib/server/follow-up-schemas';
import { discardDraft, invoiceDetail, replaceDraftLines } from '../../../../../lib/server/invoices';

export const prerender = false;

export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  return json(await invoiceDetail(user.organisationId, id));
});

/** Replaces a draft's lines. */
export const PUT: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  const body = await readJson(context.request, draftLinesBody);
  await replaceDraftLines(user.organisationId, id, body.lines);
  return json(await invoiceDetail(user.organisationId, id));
});

/** Discards a draft (it has no number yet, so nothing is lost from the sequence). */
export const DELETE: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const { id } = idParam.parse(context.params);
  await discardDraft(user.organisationId, id);
  return json({ discarded: true });
});
