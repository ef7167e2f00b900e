// What happens after a visit: the customer's signed link to the service record, the advised work
// the office prices from findings (and the customer's decision on it), and service reminders.
import { sql } from 'drizzle-orm';
import { check, date, index, integer, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { visits } from './visits';
import { vehicles } from './vehicles';
import { findings } from './visit-records';
import { outgoingMessages } from './messages';

/**
 * A link handed to a customer. The URL carries this id, the expiry and an HMAC of both (see
 * lib/server/record-links); the row lets the office withdraw a link and see that it was opened.
 */
export const recordLinks = pgTable(
  'record_links',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    firstOpenedAt: timestamp('first_opened_at', { withTimezone: true }),
    lastOpenedAt: timestamp('last_opened_at', { withTimezone: true }),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('record_links_visit_idx').on(t.visitId)],
);

export const ADVISED_DECISIONS = ['pending', 'approved', 'declined'] as const;
export type AdvisedDecision = (typeof ADVISED_DECISIONS)[number];

/** A finding the office has priced as work to offer the customer. */
export const advisedWork = pgTable(
  'advised_work',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    findingId: uuid('finding_id')
      .notNull()
      .unique()
      .references(() => findings.id, { onDelete: 'cascade' }),
    description: text('description').notNull(),
    // Net of tax, in the organisation's currency; the customer sees it with tax added.
    priceMinor: integer('price_minor').notNull(),
    labourCentiHours: integer('labour_centi_hours').notNull().default(0),
    decision: text('decision', { enum: ADVISED_DECISIONS }).notNull().default('pending'),
    decidedAt: timestamp('decided_at', { withTimezone: true }),
    // 'customer' through the signed link, or the id of the office user who recorded a phone call.
    decidedBy: text('decided_by'),
    bookedVisitId: uuid('booked_visit_id').references(() => visits.id, { onDelete: 'set null' }),
    createdBy: text('created_by').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('advised_work_org_decision_idx').on(t.organisationId, t.decision),
    index('advised_work_visit_idx').on(t.visitId),
    check('advised_work_decision_check', sql`${t.decision} in ('pending', 'approved', 'declined')`),
    check('advised_work_price_check', sql`${t.priceMinor} >= 0 and ${t.labourCentiHours} >= 0`),
  ],
);

/**
 * One reminder per due service: the due service is named by the service it follows (its date
 * and odometer), so the unique key stops a second reminder until the vehicle is serviced again.
 */
export const serviceReminders = pgTable(
  'service_reminders',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    vehicleId: uuid('vehicle_id')
      .notNull()
      .references(() => vehicles.id, { onDelete: 'cascade' }),
    basisDate: date('basis_date').notNull(),
    basisOdometer: integer('basis_odometer'),
    dueDate: date('due_date').notNull(),
    dueOdometer: integer('due_odometer'),
    // Which limit brought the reminder: the calendar, or the estimated distance.
    trigger: text('trigger').notNull(),
    messageId: uuid('message_id').references(() => outgoingMessages.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('service_reminders_once_per_due').on(t.vehicleId, t.basisDate, t.basisOdometer).nullsNotDistinct(),
    check('service_reminders_trigger_check', sql`${t.trigger} in ('date', 'distance')`),
  ],
);
