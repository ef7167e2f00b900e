import type { APIRoute } from 'astro';
import { endpoint, json, readBodyBytes } from '../../../../lib/server/http';
import { handleStripeWebhook } from '../../../../lib/server/payments';

export const prerender = false;

// Stripe's events are a few kilobytes; anything far larger is not from Stripe.
const MAX_WEBHOOK_BYTES = 256_000;

/** Stripe calls this; the raw body is needed to verify its signature. */
export const POST: APIRoute = endpoint(async (context) => {
  // Read with a bound: a body is held in memory before its signature can be checked.
  const body = new TextDecoder().decode(await readBodyBytes(context.request, MAX_WEBHOOK_BYTES));
  const outcome = await handleStripeWebhook(body, context.request.headers.get('stripe-signature'));
  return json({ received: true, outcome });
});
