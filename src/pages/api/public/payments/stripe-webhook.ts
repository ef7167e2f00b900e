import type { APIRoute } from 'astro';
import { endpoint, HttpError, json } from '../../../../lib/server/http';
import { handleStripeWebhook } from '../../../../lib/server/payments';

export const prerender = false;

// Stripe's events are a few kilobytes; anything far larger is not from Stripe.
const MAX_WEBHOOK_BYTES = 256_000;

/** Stripe calls this; the raw body is needed to verify its signature. */
export const POST: APIRoute = endpoint(async (context) => {
  const body = await context.request.text();
  if (body.length > MAX_WEBHOOK_BYTES) throw new HttpError(413, 'Webhook body too large.');
  const outcome = await handleStripeWebhook(body, context.request.headers.get('stripe-signature'));
  return json({ received: true, outcome });
});
