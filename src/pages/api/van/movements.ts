import type { APIRoute } from 'astro';
import { endpoint, json, readQuery, requireUser } from '../../../lib/server/http';
import { vanForCaller } from '../../../lib/server/van-access';
import { vanMovements } from '../../../lib/server/van-stock';
import { movementsQuery } from '../../../lib/server/van-requests';

export const prerender = false;

/** The van's stock movements, newest first, each with the level it left. */
export const GET: APIRoute = endpoint(async (context) => {
  const query = readQuery(context.url, movementsQuery);
  const van = await vanForCaller(requireUser(context), query.technicianId);
  return json({ movements: await vanMovements(van, { partId: query.partId, limit: query.limit }) });
});
