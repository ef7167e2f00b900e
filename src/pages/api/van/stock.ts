import type { APIRoute } from 'astro';
import { endpoint, json, readQuery, requireUser } from '../../../lib/server/http';
import { vanForCaller } from '../../../lib/server/van-access';
import { vanStock } from '../../../lib/server/van-stock';
import { usedOilHeld } from '../../../lib/server/used-oil';
import { vanQuery } from '../../../lib/server/van-requests';

export const prerender = false;

/** What a van holds, with minimums and low-stock flags, and the used oil it carries. */
export const GET: APIRoute = endpoint(async (context) => {
  const query = readQuery(context.url, vanQuery);
  const van = await vanForCaller(requireUser(context), query.technicianId);
  return json({
    technician: { id: van.technicianId, name: van.technicianName },
    stock: await vanStock(van),
    usedOilHeldL: await usedOilHeld(van),
  });
});
