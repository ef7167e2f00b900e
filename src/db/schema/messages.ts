// Outgoing messages: one row per e-mail we mean to send, written in the same transaction as the
// business change that causes it. `idempotency_key` is unique, so a retried request or a double
// click cannot make a second message; the job queue only moves rows from queued to sent.
import { sql } from 'drizzle-orm';
import { check, index, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { customers } from './customers';
import { visits } from './visits';
import { vehicles } from './vehicles';
import { invoices } from './billing';

export const MESSAGE_KINDS = ['record_ready', 'invoice', 'payment_received', 'service_reminder'] as const;
export type MessageKind = (typeof MESSAGE_KINDS)[number];

// sending: claimed by a worker. uncertain: a worker stopped mid-send, so the message may or may not
// have left; only a person may send it again (never sent twice without someone deciding).
export const MESSAGE_STATUSES = ['queued', 'sending', 'retrying', 'sent', 'failed', 'uncertain'] as const;
export type MessageStatus = (typeof MESSAGE_STATUSES)[number];

export const outgoingMessages = pgTable(
  'outgoing_messages',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: MESSAGE_KINDS }).notNull(),
    idempotencyKey: text('idempotency_key').notNull().unique(),
    toAddress: text('to_address').notNull(),
    toName: text('to_name').notNull().default(''),
    subject: text('subject').notNull(),
    html: text('html').notNull(),
    text: text('text').notNull(),
    status: text('status', { enum: MESSAGE_STATUSES }).notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    // The SMTP server's answer on acceptance, for tracing a message through the mail system.
    providerResponse: text('provider_response'),
    customerId: uuid('customer_id').references(() => customers.id, { onDelete: 'set null' }),
    visitId: uuid('visit_id').references(() => visits.id, { onDelete: 'set null' }),
    vehicleId: uuid('vehicle_id').references(() => vehicles.id, { onDelete: 'set null' }),
    invoiceId: uuid('invoice_id').references(() => invoices.id, { onDelete: 'set null' }),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    claimedAt: timestamp('claimed_at', { withTimezone: true }),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('outgoing_messages_org_created_idx').on(t.organisationId, t.createdAt),
    index('outgoing_messages_status_idx').on(t.status, t.createdAt),
    index('outgoing_messages_visit_idx').on(t.visitId),
    check(
      'outgoing_messages_kind_check',
      sql`${t.kind} in ('record_ready', 'invoice', 'payment_received', 'service_reminder')`,
    ),
    check(
      'outgoing_messages_status_check',
      sql`${t.status} in ('queued', 'sending', 'retrying', 'sent', 'failed', 'uncertain')`,
    ),
  ],
);
