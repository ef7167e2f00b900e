import type { APIRoute } from 'astro';
import { endpoint, json } from '../../../../../lib/server/http';
import { recordTokenParam } from '../../../../../lib/server/follow-up-schemas';
import { startCheckout } from '../../../../../lib/server/payments';

export const prerender = false;

/** Opens a card payment for the invoice on this record; answers with the payment page's URL. */
export const POST: APIRoute = endpoint(async (context) => {
  const { token } = recordTokenParam.parse(context.params);
  return json(await startCheckout(token));
});
