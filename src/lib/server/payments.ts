// Card payment through Stripe Checkout. The customer starts it from the record's link; the invoice
// becomes paid only when a webhook arrives whose signature the Stripe SDK verifies, for a checkout
// we opened, with the amount and currency we asked for. Each event id is recorded once, so a
// duplicate delivery changes nothing, and the SDK rejects signatures older than five minutes, so a
// captured webhook cannot be replayed later.
import Stripe from 'stripe';
import { and, eq, sql } from 'drizzle-orm';
import { getDb, type Database } from '../../db/client';
import * as s from '../../db/schema';
import { nextChangeSeq } from '../../db/schema/change-feed';
import { lockChangeFeed } from './change-feed';
import { formatDocumentNumber } from '../billing/document-numbers';
import { formatMoney } from '../billing/money';
import { stripeSettings } from './follow-up-config';
import { HttpError } from './http';
import { transactionWithJobs, type Enqueue } from './jobs/transaction';
import { currentRecordLink } from './record-sharing';
import { queueMessage } from './mail/outbox';
import { paymentReceivedMail } from './mail/templates';
import { recordUrl, resolveRecordToken } from './record-links';
import { dayLabel, localDate } from './local-date';

let client: Stripe | undefined;

export function stripeClient(): Stripe {
  const settings = stripeSettings();
  client ??= new Stripe(settings.secretKey, {
    host: settings.host,
    port: settings.port,
    protocol: settings.protocol,
    maxNetworkRetries: 2,
    telemetry: false,
    appInfo: { name: 'Tickover' },
  });
  return client;
}

/** Opens (or reopens) a Checkout Session for the invoice on this record link; returns its URL. */
export async function startCheckout(token: string): Promise<{ url: string }> {
  const db = getDb();
  const link = await resolveRecordToken(db, token);
  const [invoice] = await db
    .select()
    .from(s.invoices)
    .where(and(eq(s.invoices.visitId, link.visitId), eq(s.invoices.organisationId, link.organisationId), sql`${s.invoices.status} in ('sent', 'paid')`));
  if (!invoice) throw new HttpError(404, 'There is no invoice to pay for this visit yet.');
  if (invoice.status === 'paid') throw new HttpError(409, 'This invoice is already paid. Thank you.');
  const stripe = stripeClient();
  const [open] = await db
    .select()
    .from(s.paymentAttempts)
    .where(and(eq(s.paymentAttempts.invoiceId, invoice.id), eq(s.paymentAttempts.status, 'open'), eq(s.paymentAttempts.amountMinor, invoice.totalMinor)));
  if (open) {
    const session = await stripe.checkout.sessions.retrieve(open.checkoutSessionId);
    if (session.status === 'open' && session.url) return { url: session.url };
    if (session.status === 'expired') await db.update(s.paymentAttempts).set({ status: 'expired' }).where(eq(s.paymentAttempts.id, open.id));
    if (session.status === 'complete') throw new HttpError(409, 'This payment went through; the invoice will show as paid in a moment.');
  }
  const [customer] = await db.select({ email: s.customers.email }).from(s.customers).where(eq(s.customers.id, invoice.customerId));
  const back = recordUrl(token);
  const session = await stripe.checkout.sessions.create({
    mode: 'payment',
    line_items: [
      {
        quantity: 1,
        price_data: {
          currency: invoice.currency.toLowerCase(),
          unit_amount: invoice.totalMinor,
          product_data: { name: `Invoice ${formatDocumentNumber('invoice', invoice.number!)}` },
        },
      },
    ],
    client_reference_id: invoice.id,
    customer_email: customer?.email ?? undefined,
    metadata: { invoiceId: invoice.id, organisationId: invoice.organisationId },
    success_url: `${back}?payment=done`,
    cancel_url: `${back}?payment=cancelled`,
  });
  if (!session.url) throw new HttpError(502, 'The card payment service did not give a payment page. Try again in a minute.');
  await db.insert(s.paymentAttempts).values({
    organisationId: invoice.organisationId,
    invoiceId: invoice.id,
    checkoutSessionId: session.id,
    amountMinor: invoice.totalMinor,
    currency: invoice.currency,
  });
  return { url: session.url };
}

export type WebhookOutcome = 'paid' | 'duplicate' | 'ignored' | 'unknown_session' | 'mismatch' | 'already_paid' | 'invoice_not_payable';

/** Verifies and applies one webhook delivery. Throws HttpError 400 for a bad signature. */
export async function handleStripeWebhook(rawBody: string, signatureHeader: string | null): Promise<WebhookOutcome> {
  if (!signatureHeader) throw new HttpError(400, 'Missing Stripe-Signature header.');
  let event: Stripe.Event;
  try {
    event = stripeClient().webhooks.constructEvent(rawBody, signatureHeader, stripeSettings().webhookSecret);
  } catch (error) {
    throw new HttpError(400, `Webhook signature not accepted: ${(error as Error).message}`);
  }
  return transactionWithJobs(async (db, enqueue) => {
    const record = async (outcome: WebhookOutcome, organisationId: string | null = null) => {
      await db.update(s.webhookEvents).set({ outcome, organisationId }).where(eq(s.webhookEvents.id, event.id));
      return outcome;
    };
    const [fresh] = await db
      .insert(s.webhookEvents)
      .values({ id: event.id, provider: 'stripe', type: event.type, outcome: 'received' })
      .onConflictDoNothing()
      .returning({ id: s.webhookEvents.id });
    if (!fresh) return 'duplicate';
    if (event.type !== 'checkout.session.completed') return record('ignored');
    const session = event.data.object;
    if (session.payment_status !== 'paid') return record('ignored');
    const [attempt] = await db.select().from(s.paymentAttempts).where(eq(s.paymentAttempts.checkoutSessionId, session.id)).for('update');
    if (!attempt) return record('unknown_session');
    const [invoice] = await db.select().from(s.invoices).where(eq(s.invoices.id, attempt.invoiceId)).for('update');
    if (!invoice) return record('unknown_session');
    const amountMatches =
      session.amount_total === attempt.amountMinor && session.amount_total === invoice.totalMinor && (session.currency ?? '').toUpperCase() === invoice.currency;
    if (!amountMatches) {
      await db.update(s.paymentAttempts).set({ status: 'mismatch', completedAt: sql`now()` }).where(eq(s.paymentAttempts.id, attempt.id));
      return record('mismatch', invoice.organisationId);
    }
    await db.update(s.paymentAttempts).set({ status: 'paid', completedAt: sql`now()` }).where(eq(s.paymentAttempts.id, attempt.id));
    if (invoice.status === 'paid') return record('already_paid', invoice.organisationId);
    if (invoice.status !== 'sent') return record('invoice_not_payable', invoice.organisationId);
    const paidAt = new Date();
    await db.update(s.invoices).set({ status: 'paid', paidAt, updatedAt: sql`now()` }).where(eq(s.invoices.id, invoice.id));
    await db.insert(s.payments).values({
      organisationId: invoice.organisationId,
      invoiceId: invoice.id,
      amountMinor: session.amount_total!,
      currency: invoice.currency,
      method: 'card',
      providerReference: typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? session.id),
    });
    // Devices pull the visit's status: write it as a change-feed writer (change-feed.ts).
    await lockChangeFeed(db, invoice.organisationId);
    await db.update(s.visits).set({ status: 'paid', updatedAt: sql`now()`, changeSeq: nextChangeSeq }).where(eq(s.visits.id, invoice.visitId));
    await queuePaymentReceived(db, enqueue, invoice, paidAt);
    return record('paid', invoice.organisationId);
  });
}

async function queuePaymentReceived(
  db: Database,
  enqueue: Enqueue,
  invoice: typeof s.invoices.$inferSelect,
  paidAt: Date,
) {
  const [customer] = await db.select().from(s.customers).where(eq(s.customers.id, invoice.customerId));
  if (!customer?.email) return;
  const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, invoice.organisationId));
  const link = await currentRecordLink(db, { organisationId: invoice.organisationId, visitId: invoice.visitId, createdBy: null });
  await queueMessage(db, enqueue, {
    organisationId: invoice.organisationId,
    kind: 'payment_received',
    idempotencyKey: `payment_received:${invoice.id}`,
    to: { address: customer.email, name: customer.name },
    mail: paymentReceivedMail({
      business: org!,
      customerName: customer.name,
      invoiceNumber: formatDocumentNumber('invoice', invoice.number!),
      amount: formatMoney(invoice.totalMinor, invoice.currency),
      paidOn: dayLabel(localDate(paidAt, org!.timeZone), 'd MMMM yyyy'),
      url: link.url,
    }),
    customerId: customer.id,
    visitId: invoice.visitId,
    invoiceId: invoice.id,
  });
}
