// The local Stripe fake: speaks the Checkout Session endpoints the Stripe SDK calls, shows a test
// payment page, and sends webhooks signed the way Stripe signs them. Each app address gets its own
// account (secret key, webhook secret, webhook URL), so `npm start` and `npm test` can share one
// fake without receiving each other's events. Skipped when STRIPE_SECRET_KEY is set.
import { createHash } from 'node:crypto';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDetached } from './detached.mjs';
import { localSecret } from '../secrets.mjs';

export const DEFAULT_STRIPE_PORT = 12111;

export async function ensure(root, { appUrl } = {}) {
  if (process.env.STRIPE_SECRET_KEY) return {};
  const port = Number(process.env.TICKOVER_STRIPE_PORT ?? DEFAULT_STRIPE_PORT);
  await ensureDetached(root, {
    name: 'stripe',
    script: fileURLToPath(new URL('./stripe-server.mjs', import.meta.url)),
    port,
    env: { FAKE_STATE_DIR: join(root, '.data', 'stripe') },
  });
  const env = { STRIPE_API_HOST: '127.0.0.1', STRIPE_API_PORT: String(port), STRIPE_API_PROTOCOL: 'http' };
  if (!appUrl) return env;
  const seed = createHash('sha256').update(localSecret(root, 'stripe-fake-seed')).update(appUrl).digest('hex');
  const account = {
    secretKey: `sk_test_fake_${seed.slice(0, 32)}`,
    webhookSecret: `whsec_${seed.slice(32, 64)}`,
    webhookUrl: `${appUrl.replace(/\/$/, '')}/api/public/payments/stripe-webhook`,
  };
  const response = await fetch(`http://127.0.0.1:${port}/_fake/accounts`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(account),
  });
  if (!response.ok) throw new Error(`the Stripe fake refused the account: ${response.status} ${await response.text()}`);
  return { ...env, STRIPE_SECRET_KEY: account.secretKey, STRIPE_WEBHOOK_SECRET: account.webhookSecret };
}
