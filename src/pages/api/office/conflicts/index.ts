import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, json, OFFICE_ROLES, readQuery, requireRole } from '../../../../lib/server/http';
import { listConflicts } from '../../../../lib/server/sync/conflicts';
import { OPERATION_KINDS } from '../../../../lib/sync/operations';
import { CONFLICT_REASONS } from '../../../../lib/sync/apply-operation';

export const prerender = false;

const query = z.object({
  visitId: z.uuid('must be a visit id').optional(),
  status: z.enum(['open', 'resolved', 'all']).default('open'),
  kind: z.enum(OPERATION_KINDS as [string, ...string[]]).optional(),
  reason: z.enum(CONFLICT_REASONS).optional(),
  technicianId: z.string().min(1).max(100).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});

/** The conflict list, newest open first; ?visitId= for one visit's conflicts. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const filter = readQuery(context.url, query);
  return json(await listConflicts(user, { ...filter, kind: filter.kind as never }));
});
