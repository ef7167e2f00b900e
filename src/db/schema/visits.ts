// Visits: one vehicle, one place, one time slot, one technician. A round is a technician's
// visits on one day, ordered by round_position.
import { sql } from 'drizzle-orm';
import { check, date, index, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { user } from './auth';
import { customers } from './customers';
import { vehicles } from './vehicles';
import { templateVersions } from './templates';
import { changeSeqColumn } from './change-feed';

import { VISIT_STATUSES } from '../../lib/words';

export { VISIT_STATUSES };
export type VisitStatus = (typeof VISIT_STATUSES)[number];

export const visits = pgTable(
  'visits',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    customerId: uuid('customer_id')
      .notNull()
      .references(() => customers.id, { onDelete: 'restrict' }),
    vehicleId: uuid('vehicle_id')
      .notNull()
      .references(() => vehicles.id, { onDelete: 'restrict' }),
    technicianId: text('technician_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    templateVersionId: uuid('template_version_id')
      .notNull()
      .references(() => templateVersions.id, { onDelete: 'restrict' }),
    // The business's local calendar day of the round; slot times are UTC instants.
    roundDate: date('round_date').notNull(),
    roundPosition: integer('round_position').notNull().default(0),
    slotStart: timestamp('slot_start', { withTimezone: true }).notNull(),
    slotEnd: timestamp('slot_end', { withTimezone: true }).notNull(),
    addressLines: text('address_lines').notNull(),
    postcode: text('postcode').notNull().default(''),
    accessNotes: text('access_notes').notNull().default(''),
    status: text('status', { enum: VISIT_STATUSES }).notNull().default('booked'),
    reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
    reviewedBy: text('reviewed_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('visits_round_idx').on(t.technicianId, t.roundDate, t.roundPosition),
    index('visits_org_status_idx').on(t.organisationId, t.status, t.roundDate),
    index('visits_org_date_idx').on(t.organisationId, t.roundDate),
    index('visits_vehicle_idx').on(t.vehicleId, t.roundDate),
    // The customers table's "last visit" and a customer's history.
    index('visits_customer_idx').on(t.customerId, t.roundDate),
    // The visits table, newest first, a page at a time.
    index('visits_org_slot_idx').on(t.organisationId, t.slotStart),
    index('visits_change_seq_idx').on(t.changeSeq),
    check('visits_slot_check', sql`${t.slotStart} < ${t.slotEnd}`),
    check(
      'visits_status_check',
      sql`${t.status} in ('booked', 'in_progress', 'signed_off', 'reviewed', 'invoiced', 'paid', 'cancelled')`,
    ),
  ],
);

/**
 * A visit that left a technician's round (moved to another technician, or cancelled) must
 * vanish from the old technician's phone: pull sends these as tombstones.
 */
export const roundRemovals = pgTable(
  'round_removals',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    technicianId: text('technician_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    removedAt: timestamp('removed_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [index('round_removals_tech_seq_idx').on(t.technicianId, t.changeSeq)],
);
