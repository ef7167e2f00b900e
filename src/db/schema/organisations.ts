// One business using Tickover. Every row of business data carries its organisation id.
import { sql } from 'drizzle-orm';
import { check, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

import { DISTANCE_UNITS } from '../../lib/words';

export { DISTANCE_UNITS };
export type DistanceUnit = (typeof DISTANCE_UNITS)[number];

export const organisations = pgTable(
  'organisations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    name: text('name').notNull(),
    slug: text('slug').notNull().unique(),
    addressLines: text('address_lines').notNull().default(''),
    phone: text('phone').notNull().default(''),
    email: text('email').notNull().default(''),
    // ISO 4217 code; money everywhere is integer minor units in this currency.
    currency: text('currency').notNull().default('GBP'),
    // Basis points (2000 = 20.00 %) so a rate like 12.5 % needs no floating point.
    taxRateBasisPoints: integer('tax_rate_basis_points').notNull().default(2000),
    labourRateMinorPerHour: integer('labour_rate_minor_per_hour').notNull().default(6000),
    distanceUnit: text('distance_unit', { enum: DISTANCE_UNITS }).notNull().default('[mi_i]'),
    timeZone: text('time_zone').notNull().default('Europe/London'),
    // Minutes after local midnight; used for the out-of-hours clash warning.
    workdayStartMinute: integer('workday_start_minute').notNull().default(8 * 60),
    workdayEndMinute: integer('workday_end_minute').notNull().default(18 * 60),
    reminderLeadDays: integer('reminder_lead_days').notNull().default(21),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('organisations_currency_check', sql`${t.currency} ~ '^[A-Z]{3}$'`),
    check('organisations_tax_check', sql`${t.taxRateBasisPoints} between 0 and 10000`),
    check('organisations_labour_check', sql`${t.labourRateMinorPerHour} >= 0`),
    check('organisations_distance_unit_check', sql`${t.distanceUnit} in ('km', '[mi_i]')`),
    check(
      'organisations_workday_check',
      sql`${t.workdayStartMinute} >= 0 and ${t.workdayEndMinute} <= 1440 and ${t.workdayStartMinute} < ${t.workdayEndMinute}`,
    ),
  ],
);
