// Card payment through the local Stripe fake: the invoice is paid only by a webhook whose signature
// the Stripe SDK verifies; forged, replayed and duplicate webhooks change nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { eq } from 'drizzle-orm';
import { call, callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { createSignedOffVisit, type VisitFixture } from '../../support/visit-fixtures';
import { readMail, waitForMail } from '../../support/mailbox';
import * as s from '../../../src/db/schema';

let org: OrganisationFixture;
let office: Session;
const stripeBase = () => `http://127.0.0.1:${process.env.STRIPE_API_PORT}`;
const webhookSecret = () => process.env.STRIPE_WEBHOOK_SECRET!;
const signer = new Stripe('sk_test_unused');

beforeAll(async () => {
  org = await createOrganisation('Payments');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

async function invoicedVisit(): Promise<{ visit: VisitFixture; invoiceId: string; recordPath: string; token: string }> {
  const visit = await createSignedOffVisit(org);
  const invoiceId = (await callJson(office, `/api/office/visits/${visit.visitId}/invoice`, { body: {} })).json.invoiceId;
  expect((await callJson(office, `/api/office/invoices/${invoiceId}/send`, { body: {} })).status).toBe(200);
  const [entry] = await waitForMail(visit.customerEmail);
  const mail = await readMail(entry!);
  const url = mail.html ? mail.html.match(/href="(http[^"]+\/record\/[^"]+)"/)![1]! : '';
  const recordPath = new URL(url).pathname;
  return { visit, invoiceId, recordPath, token: recordPath.split('/')[2]! };
}

async function invoiceStatus(invoiceId: string) {
  const [row] = await testDb().select().from(s.invoices).where(eq(s.invoices.id, invoiceId));
  return row!.status;
}

async function paymentsFor(invoiceId: string) {
  return testDb().select().from(s.payments).where(eq(s.payments.invoiceId, invoiceId));
}

async function sendWebhook(payload: string, header: string) {
  return callJson(null, '/api/public/payments/stripe-webhook', {
    body: payload,
    headers: { 'content-type': 'application/json', 'stripe-signature': header },
  });
}

describe('paying from the record link', () => {
  it('pays in full through the fake checkout; the webhook marks it paid and thanks the customer', async () => {
    const { visit, invoiceId, recordPath, token } = await invoicedVisit();
    const page = await (await call(null, recordPath)).text();
    expect(page).toContain('Pay £165.36 by card');
    const started = await callJson(null, `/api/public/record/${token}/pay`, { body: {} });
    expect(started.status).toBe(200);
    const checkoutUrl = new URL(started.json.url);
    expect(checkoutUrl.origin).toBe(stripeBase());
    // Returning to the record alone pays nothing: only the verified webhook does.
    expect(await invoiceStatus(invoiceId)).toBe('sent');
    const again = await callJson(null, `/api/public/record/${token}/pay`, { body: {} });
    expect(again.json.url).toBe(started.json.url);
    // The customer presses Pay on the fake's page; the fake signs and sends the webhook.
    const paid = await fetch(`${checkoutUrl.href}/confirm`, { method: 'POST', redirect: 'manual', body: new URLSearchParams({ card: '4242424242424242' }) });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toContain(`${recordPath}?payment=done`);
    expect(await invoiceStatus(invoiceId)).toBe('paid');
    const payments = await paymentsFor(invoiceId);
    expect(payments).toHaveLength(1);
    expect(payments[0]).toMatchObject({ amountMinor: 16536, currency: 'GBP', method: 'card' });
    const [visitRow] = await testDb().select().from(s.visits).where(eq(s.visits.id, visit.visitId));
    expect(visitRow!.status).toBe('paid');
    const mails = await waitForMail(visit.customerEmail, 2);
    expect(mails.map((m) => m.subject).join(' | ')).toMatch(/Payment received/);
    const after = await (await call(null, `${recordPath}?payment=done`)).text();
    expect(after).toContain('your payment was received');
    expect((await callJson(null, `/api/public/record/${token}/pay`, { body: {} })).status).toBe(409);

    // The same event delivered again (Stripe retries) pays once.
    const events = await (await fetch(`${stripeBase()}/_fake/events?session=${checkoutUrl.pathname.split('/').pop()}`)).json();
    expect(events.data).toHaveLength(1);
    const redelivered = await (await fetch(`${stripeBase()}/_fake/events/${events.data[0].id}/redeliver`, { method: 'POST' })).json();
    expect(redelivered.ok).toBe(true);
    expect(redelivered.body).toContain('"duplicate"');
    expect(await paymentsFor(invoiceId)).toHaveLength(1);
    expect((await waitForMail(visit.customerEmail, 2)).length).toBe(2);
  });
});

describe('webhooks that must change nothing', () => {
  async function openCheckout() {
    const ctx = await invoicedVisit();
    const started = await callJson(null, `/api/public/record/${ctx.token}/pay`, { body: {} });
    const sessionId = new URL(started.json.url).pathname.split('/').pop()!;
    const session = await (await fetch(`${stripeBase()}/v1/checkout/sessions/${sessionId}`, { headers: { authorization: `Bearer ${process.env.STRIPE_SECRET_KEY}` } })).json();
    const event = (overrides: Record<string, unknown> = {}) =>
      JSON.stringify({
        id: `evt_test_${Math.random().toString(36).slice(2)}`,
        object: 'event',
        type: 'checkout.session.completed',
        created: Math.floor(Date.now() / 1000),
        data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: 'pi_test_forged', ...overrides } },
      });
    return { ...ctx, event };
  }

  it('refuses a forged signature', async () => {
    const { invoiceId, event } = await openCheckout();
    const payload = event();
    const forged = signer.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_the_real_secret' });
    const response = await sendWebhook(payload, forged);
    expect(response.status).toBe(400);
    expect(response.json.error).toMatch(/signature/i);
    expect((await sendWebhook(payload, 'garbage')).status).toBe(400);
    expect(await invoiceStatus(invoiceId)).toBe('sent');
  });

  it('refuses a correctly signed event replayed after the tolerance window', async () => {
    const { invoiceId, event } = await openCheckout();
    const payload = event();
    // Stripe's SDK accepts signatures up to 300 s old (its default tolerance).
    const old = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret(), timestamp: Math.floor(Date.now() / 1000) - 3600 });
    const response = await sendWebhook(payload, old);
    expect(response.status).toBe(400);
    expect(await invoiceStatus(invoiceId)).toBe('sent');
  });

  it('does not pay when the amount differs from the invoice', async () => {
    const { invoiceId, event } = await openCheckout();
    const payload = event({ amount_total: 100 });
    const response = await sendWebhook(payload, signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret() }));
    expect(response.status).toBe(200);
    expect(response.json.outcome).toBe('mismatch');
    expect(await invoiceStatus(invoiceId)).toBe('sent');
    expect(await paymentsFor(invoiceId)).toHaveLength(0);
  });

  it('applies a signed event once, however often it arrives', async () => {
    const { invoiceId, event } = await openCheckout();
    const payload = event();
    const header = () => signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret() });
    const results = await Promise.all([sendWebhook(payload, header()), sendWebhook(payload, header()), sendWebhook(payload, header())]);
    expect(results.map((r) => r.status)).toEqual([200, 200, 200]);
    expect(results.map((r) => r.json.outcome).sort()).toEqual(['duplicate', 'duplicate', 'paid']);
    expect(await paymentsFor(invoiceId)).toHaveLength(1);
  });

  it('ignores a session this app never opened', async () => {
    const payload = JSON.stringify({
      id: `evt_test_${Math.random().toString(36).slice(2)}`,
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { id: 'cs_test_unknown', object: 'checkout.session', amount_total: 100, currency: 'gbp', payment_status: 'paid' } },
    });
    const response = await sendWebhook(payload, signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret() }));
    expect(response.json.outcome).toBe('unknown_session');
  });
});
