import type { APIRoute } from 'astro';
import { endpoint, json, OFFICE_ROLES, requireRole } from '../../../lib/server/http';
import { vansOf } from '../../../lib/server/van-access';
import { disposalsOf, usedOilByMonth, usedOilForVan } from '../../../lib/server/used-oil';

export const prerender = false;

/** Used oil: each van's running total, the disposals recorded, and litres per month. */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const vans = await vansOf(user.organisationId);
  return json({
    vans: await Promise.all(vans.map(usedOilForVan)),
    disposals: await disposalsOf(user.organisationId),
    months: await usedOilByMonth(user.organisationId),
  });
});
