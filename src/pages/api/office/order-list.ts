import type { APIRoute } from 'astro';
import { endpoint, HttpError, json, OFFICE_ROLES, readQuery, requireRole } from '../../../lib/server/http';
import { localToday, shiftDate } from '../../../lib/office/local-time';
import { getOrganisation } from '../../../lib/server/organisation';
import { orderListCsv, orderListFor } from '../../../lib/server/order-list';
import { MAX_ORDER_DAYS, orderListQuery } from '../../../lib/server/van-requests';

export const prerender = false;

/** What to buy for the rounds from `from` to `to` (default: the seven days from tomorrow). */
export const GET: APIRoute = endpoint(async (context) => {
  const user = requireRole(context, OFFICE_ROLES);
  const query = readQuery(context.url, orderListQuery);
  const from = query.from ?? shiftDate(localToday((await getOrganisation(user.organisationId)).timeZone), 1);
  const to = query.to ?? shiftDate(from, 6);
  if (shiftDate(from, MAX_ORDER_DAYS - 1) < to) {
    throw new HttpError(400, `An order list covers at most ${MAX_ORDER_DAYS} days; shorten the range.`);
  }
  const list = await orderListFor(user.organisationId, from, to);
  if (query.format === 'csv') {
    return new Response(orderListCsv(list), {
      headers: {
        'content-type': 'text/csv; charset=utf-8; header=present',
        'content-disposition': `attachment; filename="order-list-${from}-to-${to}.csv"`,
        'cache-control': 'no-store',
      },
    });
  }
  return json(list);
});
