import type { APIRoute } from 'astro';
import { z } from 'zod';
import { endpoint, json, readQuery, requireUser } from '../../../lib/server/http';
import { pullChanges, PULL_PAGE_SIZE } from '../../../lib/server/sync/pull';

export const prerender = false;

const query = z.object({
  cursor: z.string().regex(/^\d{1,18}$/, 'must be the cursor a previous pull returned, or 0').default('0'),
  limit: z.coerce.number().int().min(1).max(PULL_PAGE_SIZE).default(PULL_PAGE_SIZE),
});

/** What changed since the cursor, for what this user may see. Pull again while hasMore. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireUser(context);
  const { cursor, limit } = readQuery(context.url, query);
  return json(await pullChanges(user, Number(cursor), limit));
});
