import type { APIRoute } from 'astro';
import { endpoint, json, readQuery, requireUser } from '../../../lib/server/http';
import { businessDate } from '../../../lib/server/business-day';
import { loadListForRound } from '../../../lib/server/load-list';
import { vanForCaller } from '../../../lib/server/van-access';
import { loadListQuery } from '../../../lib/server/van-requests';

export const prerender = false;

/** The load list for a round; without a date, tomorrow's (the technician loads the evening before). */
export const GET: APIRoute = endpoint(async (context) => {
  const query = readQuery(context.url, loadListQuery);
  const van = await vanForCaller(requireUser(context), query.technicianId);
  return json(await loadListForRound(van, query.date ?? businessDate(van.timeZone, 1)));
});
