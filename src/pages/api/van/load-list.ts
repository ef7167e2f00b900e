import type { APIRoute } from 'astro';
import { endpoint, json, readQuery, requireUser } from '../../../lib/server/http';
import { localToday, shiftDate } from '../../../lib/office/local-time';
import { loadListForRound } from '../../../lib/server/load-list';
import { vanForCaller } from '../../../lib/server/van-access';
import { loadListQuery } from '../../../lib/server/van-requests';

export const prerender = false;

/** The load list for a round; without a date, tomorrow's (the technician loads the evening before). */
export const GET: APIRoute = endpoint(async (context) => {
  const query = readQuery(context.url, loadListQuery);
  const van = await vanForCaller(requireUser(context), query.technicianId);
  return json(await loadListForRound(van, query.date ?? shiftDate(localToday(van.timeZone), 1)));
});
