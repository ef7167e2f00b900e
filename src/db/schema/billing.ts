// Invoices, credit notes and payments. A sent invoice is never edited: it is credited with a
// credit note and a corrected invoice is issued. Numbers are allocated per organisation and per
// series from `document_counters` inside the issuing transaction, so a rollback returns the
// number and the sequence has no gaps.
import { sql } from 'drizzle-orm';
import {
  check,
  doublePrecision,
  index,
  integer,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { customers } from './customers';
import { visits } from './visits';
import { user } from './auth';

export const DOCUMENT_SERIES = ['invoice', 'credit_note'] as const;
export type DocumentSeries = (typeof DOCUMENT_SERIES)[number];

export const INVOICE_STATUSES = ['draft', 'sent', 'paid', 'void'] as const;
export type InvoiceStatus = (typeof INVOICE_STATUSES)[number];

export const INVOICE_LINE_KINDS = ['part', 'labour', 'other'] as const;
export type InvoiceLineKind = (typeof INVOICE_LINE_KINDS)[number];

export const documentCounters = pgTable(
  'document_counters',
  {
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    series: text('series', { enum: DOCUMENT_SERIES }).notNull(),
    lastNumber: integer('last_number').notNull().default(0),
  },
  (t) => [
    primaryKey({ columns: [t.organisationId, t.series] }),
    check('document_counters_series_check', sql`${t.series} in ('invoice', 'credit_note')`),
    check('document_counters_number_check', sql`${t.lastNumber} >= 0`),
  ],
);

export const invoices = pgTable(
  'invoices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'restrict' }),
    customerId: uuid('customer_id')
      .notNull()
      .references(() => customers.id, { onDelete: 'restrict' }),
    // Null while a draft: a number is given only when the invoice is issued.
    number: integer('number'),
    status: text('status', { enum: INVOICE_STATUSES }).notNull().default('draft'),
    currency: text('currency').notNull(),
    // Frozen from the organisation when the draft is made, so a later rate change cannot alter it.
    taxRateBasisPoints: integer('tax_rate_basis_points').notNull(),
    netMinor: integer('net_minor').notNull().default(0),
    taxMinor: integer('tax_minor').notNull().default(0),
    totalMinor: integer('total_minor').notNull().default(0),
    issuedAt: timestamp('issued_at', { withTimezone: true }),
    dueAt: timestamp('due_at', { withTimezone: true }),
    paidAt: timestamp('paid_at', { withTimezone: true }),
    voidedAt: timestamp('voided_at', { withTimezone: true }),
    createdBy: text('created_by')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('invoices_org_number_unique').on(t.organisationId, t.number),
    // One live invoice per visit; a voided one may be followed by a corrected one.
    uniqueIndex('invoices_one_live_per_visit').on(t.visitId).where(sql`${t.status} <> 'void'`),
    index('invoices_org_status_idx').on(t.organisationId, t.status, t.createdAt),
    check('invoices_status_check', sql`${t.status} in ('draft', 'sent', 'paid', 'void')`),
    check('invoices_number_check', sql`(${t.status} = 'draft') = (${t.number} is null)`),
    check('invoices_currency_check', sql`${t.currency} ~ '^[A-Z]{3}$'`),
    check('invoices_money_check', sql`${t.netMinor} >= 0 and ${t.taxMinor} >= 0 and ${t.totalMinor} = ${t.netMinor} + ${t.taxMinor}`),
  ],
);

export const invoiceLines = pgTable(
  'invoice_lines',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    invoiceId: uuid('invoice_id')
      .notNull()
      .references(() => invoices.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    kind: text('kind', { enum: INVOICE_LINE_KINDS }).notNull(),
    description: text('description').notNull(),
    partNumber: text('part_number'),
    quantity: doublePrecision('quantity').notNull(),
    // UCUM: 'L', '{each}', 'h'.
    unit: text('unit').notNull(),
    unitPriceMinor: integer('unit_price_minor').notNull(),
    discountMinor: integer('discount_minor').notNull().default(0),
    netMinor: integer('net_minor').notNull(),
    taxMinor: integer('tax_minor').notNull(),
  },
  (t) => [
    unique('invoice_lines_position_unique').on(t.invoiceId, t.position),
    check('invoice_lines_kind_check', sql`${t.kind} in ('part', 'labour', 'other')`),
    check('invoice_lines_quantity_check', sql`${t.quantity} > 0`),
    check('invoice_lines_money_check', sql`${t.unitPriceMinor} >= 0 and ${t.discountMinor} >= 0 and ${t.netMinor} >= 0 and ${t.taxMinor} >= 0`),
  ],
);

export const creditNotes = pgTable(
  'credit_notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    invoiceId: uuid('invoice_id')
      .notNull()
      .references(() => invoices.id, { onDelete: 'restrict' }),
    number: integer('number').notNull(),
    reason: text('reason').notNull(),
    currency: text('currency').notNull(),
    netMinor: integer('net_minor').notNull(),
    taxMinor: integer('tax_minor').notNull(),
    totalMinor: integer('total_minor').notNull(),
    issuedAt: timestamp('issued_at', { withTimezone: true }).notNull().defaultNow(),
    createdBy: text('created_by')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
  },
  (t) => [
    unique('credit_notes_org_number_unique').on(t.organisationId, t.number),
    // This version credits an invoice in full, once.
    unique('credit_notes_invoice_unique').on(t.invoiceId),
    check('credit_notes_reason_check', sql`length(trim(${t.reason})) > 0`),
  ],
);

export const PAYMENT_ATTEMPT_STATUSES = ['open', 'paid', 'expired', 'mismatch'] as const;

/** A Checkout Session we opened for an invoice; the webhook names it when the customer pays. */
export const paymentAttempts = pgTable(
  'payment_attempts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    invoiceId: uuid('invoice_id')
      .notNull()
      .references(() => invoices.id, { onDelete: 'restrict' }),
    checkoutSessionId: text('checkout_session_id').notNull().unique(),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency').notNull(),
    status: text('status', { enum: PAYMENT_ATTEMPT_STATUSES }).notNull().default('open'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    completedAt: timestamp('completed_at', { withTimezone: true }),
  },
  (t) => [
    index('payment_attempts_invoice_idx').on(t.invoiceId),
    check('payment_attempts_status_check', sql`${t.status} in ('open', 'paid', 'expired', 'mismatch')`),
  ],
);

export const payments = pgTable(
  'payments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    invoiceId: uuid('invoice_id')
      .notNull()
      .references(() => invoices.id, { onDelete: 'restrict' }),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency').notNull(),
    method: text('method').notNull(),
    // The provider's reference (a payment intent id), shown to the office for reconciliation.
    providerReference: text('provider_reference'),
    receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // One payment settles an invoice in this version: a second one is a bug, not a part payment.
    unique('payments_invoice_unique').on(t.invoiceId),
    check('payments_amount_check', sql`${t.amountMinor} > 0`),
  ],
);

/** Every verified webhook event, by the provider's event id: the same event twice is applied once. */
export const webhookEvents = pgTable('webhook_events', {
  id: text('id').primaryKey(),
  provider: text('provider').notNull(),
  type: text('type').notNull(),
  organisationId: uuid('organisation_id').references(() => organisations.id, { onDelete: 'cascade' }),
  outcome: text('outcome').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});
