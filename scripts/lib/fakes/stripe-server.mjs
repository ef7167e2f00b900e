// A small stand-in for the Stripe API, run detached by stripe.mjs. It implements what Tickover's
// payment flow uses: POST/GET /v1/checkout/sessions, POST /v1/checkout/sessions/:id/expire, a
// test payment page at /pay/:id, and `checkout.session.completed` webhooks signed like Stripe's
// (Stripe-Signature: t=<unix>,v1=<HMAC-SHA256 of "t.body" with the webhook secret>).
// Control endpoints for scripts and tests live under /_fake/.
import { createHmac, randomBytes } from 'node:crypto';
import { createServer } from 'node:http';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const port = Number(process.env.FAKE_PORT);
const dir = process.env.FAKE_STATE_DIR;
mkdirSync(dir, { recursive: true });
const stateFile = join(dir, 'state.json');
const state = existsSync(stateFile)
  ? JSON.parse(readFileSync(stateFile, 'utf8'))
  : { accounts: {}, sessions: {}, events: {}, idempotency: {} };

function save() {
  const tmp = `${stateFile}.tmp`;
  writeFileSync(tmp, JSON.stringify(state));
  renameSync(tmp, stateFile);
}

const id = (prefix) => `${prefix}_${randomBytes(12).toString('hex')}`;
const now = () => Math.floor(Date.now() / 1000);

/** Parses Stripe's form encoding (a[b][0][c]=v) into nested objects and arrays. */
function parseForm(body) {
  const out = {};
  for (const [key, value] of new URLSearchParams(body)) {
    const path = key.replace(/\]/g, '').split('[');
    let node = out;
    path.forEach((part, i) => {
      if (i === path.length - 1) {
        node[part] = value;
        return;
      }
      const nextIsIndex = /^\d+$/.test(path[i + 1]);
      node[part] ??= nextIsIndex ? [] : {};
      node = node[part];
    });
  }
  return out;
}

function send(res, status, body, headers = {}) {
  res.writeHead(status, { 'content-type': 'application/json', 'request-id': id('req'), ...headers });
  res.end(JSON.stringify(body));
}

function stripeError(res, status, message, type = 'invalid_request_error') {
  send(res, status, { error: { type, message } });
}

function html(res, status, body) {
  res.writeHead(status, { 'content-type': 'text/html; charset=utf-8' });
  res.end(body);
}

function readBody(req) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    req.on('data', (c) => chunks.push(c));
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function accountFor(req) {
  const match = (req.headers.authorization ?? '').match(/^Bearer (.+)$/);
  if (!match) return undefined;
  return Object.values(state.accounts).find((a) => a.secretKey === match[1]);
}

function sessionView(session) {
  const { accountKey: _a, ...view } = session;
  return view;
}

function createSession(account, params) {
  const lineItems = Array.isArray(params.line_items) ? params.line_items : [];
  if (params.mode !== 'payment') return { error: 'mode must be payment in this fake' };
  if (!params.success_url) return { error: 'Missing required param: success_url.' };
  if (lineItems.length === 0) return { error: 'Missing required param: line_items.' };
  let amount = 0;
  let currency;
  for (const item of lineItems) {
    const price = item.price_data;
    if (!price?.currency || price.unit_amount === undefined) return { error: 'line_items need price_data with currency and unit_amount' };
    const unit = Number(price.unit_amount);
    const quantity = Number(item.quantity ?? 1);
    if (!Number.isInteger(unit) || unit < 0 || !Number.isInteger(quantity) || quantity < 1) return { error: 'Invalid integer in line_items' };
    currency ??= price.currency.toLowerCase();
    if (price.currency.toLowerCase() !== currency) return { error: 'All line_items must share one currency' };
    amount += unit * quantity;
  }
  const sessionId = id('cs_test');
  const session = {
    id: sessionId,
    object: 'checkout.session',
    accountKey: account.secretKey,
    amount_subtotal: amount,
    amount_total: amount,
    currency,
    mode: 'payment',
    status: 'open',
    payment_status: 'unpaid',
    payment_intent: null,
    client_reference_id: params.client_reference_id ?? null,
    customer_email: params.customer_email ?? null,
    metadata: params.metadata ?? {},
    success_url: params.success_url,
    cancel_url: params.cancel_url ?? null,
    created: now(),
    expires_at: Number(params.expires_at ?? now() + 24 * 3600),
    livemode: false,
    url: `http://127.0.0.1:${port}/pay/${sessionId}`,
    line_items_summary: lineItems.map((i) => ({ name: i.price_data.product_data?.name ?? '', amount: Number(i.price_data.unit_amount) * Number(i.quantity ?? 1) })),
  };
  state.sessions[sessionId] = session;
  save();
  return { session };
}

function signedHeader(secret, payload, timestamp = now()) {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`).digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

async function deliver(eventId) {
  const event = state.events[eventId];
  const account = Object.values(state.accounts).find((a) => a.secretKey === event.accountKey);
  if (!account) return { ok: false, status: 0, error: 'no account' };
  const { accountKey: _k, deliveries: _d, ...wire } = event;
  const payload = JSON.stringify(wire, null, 2);
  let result;
  try {
    const response = await fetch(account.webhookUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signedHeader(account.webhookSecret, payload) },
      body: payload,
    });
    result = { ok: response.ok, status: response.status, body: (await response.text()).slice(0, 500) };
  } catch (error) {
    result = { ok: false, status: 0, error: String(error.message ?? error) };
  }
  event.deliveries.push({ at: new Date().toISOString(), ...result });
  save();
  return result;
}

// Stripe retries failed deliveries for days; the fake tries a few times, a little apart.
async function deliverWithRetries(eventId) {
  for (let attempt = 0; attempt < 5; attempt++) {
    const result = await deliver(eventId);
    if (result.ok) return;
    await new Promise((r) => setTimeout(r, 500 * 2 ** attempt));
  }
}

function completeSession(session) {
  session.status = 'complete';
  session.payment_status = 'paid';
  session.payment_intent = id('pi');
  const eventId = id('evt');
  state.events[eventId] = {
    id: eventId,
    object: 'event',
    accountKey: session.accountKey,
    api_version: '2026-10-28.endive',
    created: now(),
    data: { object: sessionView(session) },
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    type: 'checkout.session.completed',
    deliveries: [],
  };
  save();
  return eventId;
}

const escape = (s) => String(s).replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function money(amount, currency) {
  try {
    return new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(amount / 100);
  } catch {
    return `${amount} ${currency}`;
  }
}

function payPage(session) {
  const done = session.status !== 'open';
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test card payment</title>
<style>body{font-family:system-ui,sans-serif;background:#eef1f4;color:#1b2430;margin:0;padding:24px;font-size:18px}
main{max-width:420px;margin:0 auto;background:#fff;border-radius:12px;padding:24px;box-shadow:0 2px 10px #0002}
h1{font-size:22px;margin:0 0 4px}.amount{font-size:34px;font-weight:700;margin:16px 0}
.note{background:#fff6d6;border:1px solid #e0c060;border-radius:8px;padding:10px;font-size:15px}
label{display:block;margin-top:14px;font-size:15px}input{width:100%;box-sizing:border-box;font-size:18px;padding:12px;border:1px solid #98a2ae;border-radius:8px}
button{width:100%;min-height:56px;font-size:20px;font-weight:700;border:0;border-radius:10px;margin-top:18px;background:#1b4f8a;color:#fff}
.cancel{background:#fff;color:#1b4f8a;border:2px solid #1b4f8a}</style></head><body><main>
<h1>Card payment</h1><div class="note">Local test payment service. No real card is charged.</div>
${session.line_items_summary.map((l) => `<p>${escape(l.name)}</p>`).join('')}
<div class="amount">${escape(money(session.amount_total, session.currency))}</div>
${done ? `<p>This payment is ${escape(session.status)}.</p>` : `<form method="post" action="/pay/${escape(session.id)}/confirm">
<label>Card number<input name="card" value="4242 4242 4242 4242" inputmode="numeric" autocomplete="off"></label>
<button type="submit">Pay ${escape(money(session.amount_total, session.currency))}</button></form>
${session.cancel_url ? `<form method="get" action="${escape(session.cancel_url)}"><button class="cancel" type="submit">Cancel</button></form>` : ''}`}
</main></body></html>`;
}

async function handle(req, res) {
  const url = new URL(req.url, `http://127.0.0.1:${port}`);
  const parts = url.pathname.split('/').filter(Boolean);

  if (url.pathname === '/_fake/health') return send(res, 200, { ok: true });
  if (url.pathname === '/_fake/accounts' && req.method === 'POST') {
    const account = JSON.parse(await readBody(req));
    if (!account.secretKey || !account.webhookSecret || !account.webhookUrl) return stripeError(res, 400, 'need secretKey, webhookSecret, webhookUrl');
    state.accounts[account.secretKey] = account;
    save();
    return send(res, 200, { ok: true });
  }
  if (parts[0] === '_fake' && parts[1] === 'events') {
    if (req.method === 'GET' && parts.length === 2) {
      const session = url.searchParams.get('session');
      const events = Object.values(state.events).filter((e) => !session || e.data.object.id === session);
      return send(res, 200, { data: events.map(({ accountKey: _k, ...e }) => e) });
    }
    if (req.method === 'POST' && parts[3] === 'redeliver' && state.events[parts[2]]) {
      return send(res, 200, await deliver(parts[2]));
    }
    return stripeError(res, 404, 'No such event');
  }

  if (parts[0] === 'pay' && parts[1]) {
    const session = state.sessions[parts[1]];
    if (!session) return html(res, 404, '<h1>No such payment</h1>');
    if (req.method === 'GET' && parts.length === 2) return html(res, 200, payPage(session));
    if (req.method === 'POST' && parts[2] === 'confirm') {
      await readBody(req);
      if (session.status !== 'open' || session.expires_at < now()) return html(res, 409, payPage(session));
      const eventId = completeSession(session);
      // The first delivery is awaited so the app usually knows before the customer is back.
      const first = await deliver(eventId);
      if (!first.ok) void deliverWithRetries(eventId);
      res.writeHead(303, { location: session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id) });
      return res.end();
    }
  }

  if (parts[0] === 'v1' && parts[1] === 'checkout' && parts[2] === 'sessions') {
    const account = accountFor(req);
    if (!account) return stripeError(res, 401, 'Invalid API Key provided.', 'invalid_request_error');
    const body = req.method === 'POST' ? await readBody(req) : '';
    if (req.method === 'POST' && parts.length === 3) {
      const key = req.headers['idempotency-key'];
      const remembered = key ? state.idempotency[`${account.secretKey}:${key}`] : undefined;
      if (remembered) return send(res, 200, sessionView(state.sessions[remembered]), { 'idempotent-replayed': 'true' });
      const result = createSession(account, parseForm(body));
      if (result.error) return stripeError(res, 400, result.error);
      if (key) {
        state.idempotency[`${account.secretKey}:${key}`] = result.session.id;
        save();
      }
      return send(res, 200, sessionView(result.session));
    }
    const session = state.sessions[parts[3]];
    if (!session || session.accountKey !== account.secretKey) return stripeError(res, 404, `No such checkout.session: '${parts[3]}'`);
    if (req.method === 'GET' && parts.length === 4) return send(res, 200, sessionView(session));
    if (req.method === 'POST' && parts[4] === 'expire') {
      if (session.status !== 'open') return stripeError(res, 400, `Only Checkout Sessions with a status in ["open"] can be expired.`);
      session.status = 'expired';
      save();
      return send(res, 200, sessionView(session));
    }
  }
  return stripeError(res, 404, `Unrecognized request URL (${req.method}: ${url.pathname}).`);
}

const server = createServer((req, res) => {
  handle(req, res).catch((error) => {
    console.error('[stripe fake]', error);
    if (!res.headersSent) stripeError(res, 500, 'fake failed', 'api_error');
  });
});
server.listen(port, '127.0.0.1', () => console.log(`[stripe fake] listening on 127.0.0.1:${port}, state in ${dir}`));
for (const signal of ['SIGTERM', 'SIGINT']) process.on(signal, () => server.close(() => process.exit(0)));
