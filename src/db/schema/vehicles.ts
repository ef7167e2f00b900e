// Vehicles, their service spec, and model notes (known weak spots by make, model and engine).
import { sql } from 'drizzle-orm';
import {
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core';
import { organisations, DISTANCE_UNITS } from './organisations';
import { customers } from './customers';
import { parts } from './catalogue';
import { changeSeqColumn } from './change-feed';

import { BRAKE_FLUID_GRADES, FUEL_TYPES, PLUG_SEATS } from '../../lib/words';

export { BRAKE_FLUID_GRADES, FUEL_TYPES, PLUG_SEATS };

export const vehicles = pgTable(
  'vehicles',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    customerId: uuid('customer_id')
      .notNull()
      .references(() => customers.id, { onDelete: 'restrict' }),
    // Stored normalised (upper case, no spaces) so search and uniqueness ignore formatting.
    registration: text('registration').notNull(),
    vin: text('vin'),
    make: text('make').notNull(),
    model: text('model').notNull(),
    engine: text('engine').notNull().default(''),
    fuel: text('fuel', { enum: FUEL_TYPES }).notNull(),
    year: integer('year'),
    odometerUnit: text('odometer_unit', { enum: DISTANCE_UNITS }).notNull().default('[mi_i]'),
    // Spec: what the technician needs before touching the car. Quantities in SI (L, mm, N.m).
    oilGrade: text('oil_grade'),
    oilCapacityL: doublePrecision('oil_capacity_l'),
    oilFilterPartId: uuid('oil_filter_part_id').references(() => parts.id, { onDelete: 'set null' }),
    airFilterPartId: uuid('air_filter_part_id').references(() => parts.id, { onDelete: 'set null' }),
    cabinFilterPartId: uuid('cabin_filter_part_id').references(() => parts.id, { onDelete: 'set null' }),
    fuelFilterPartId: uuid('fuel_filter_part_id').references(() => parts.id, { onDelete: 'set null' }),
    sparkPlugPartId: uuid('spark_plug_part_id').references(() => parts.id, { onDelete: 'set null' }),
    sparkPlugCount: integer('spark_plug_count'),
    plugThread: text('plug_thread'),
    plugSeat: text('plug_seat', { enum: PLUG_SEATS }),
    plugGapMm: doublePrecision('plug_gap_mm'),
    plugTorqueNm: doublePrecision('plug_torque_nm'),
    sumpPlugTorqueNm: doublePrecision('sump_plug_torque_nm'),
    wheelNutTorqueNm: doublePrecision('wheel_nut_torque_nm'),
    brakeFluidGrade: text('brake_fluid_grade', { enum: BRAKE_FLUID_GRADES }),
    tyrePressureFrontKpa: doublePrecision('tyre_pressure_front_kpa'),
    tyrePressureRearKpa: doublePrecision('tyre_pressure_rear_kpa'),
    specialTools: jsonb('special_tools').$type<string[]>().notNull().default([]),
    serviceIntervalMonths: integer('service_interval_months'),
    serviceIntervalDistance: integer('service_interval_distance'),
    // The last service we know of, whether done by us or declared by the customer.
    lastServiceDate: date('last_service_date'),
    lastServiceOdometer: integer('last_service_odometer'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('vehicles_org_registration_idx').on(t.organisationId, t.registration),
    index('vehicles_customer_idx').on(t.customerId),
    index('vehicles_change_seq_idx').on(t.changeSeq),
    check('vehicles_registration_check', sql`${t.registration} ~ '^[A-Z0-9]{1,10}$'`),
    check('vehicles_vin_check', sql`${t.vin} is null or ${t.vin} ~ '^[A-HJ-NPR-Z0-9]{17}$'`),
    check('vehicles_year_check', sql`${t.year} is null or ${t.year} between 1900 and 2100`),
    check('vehicles_oil_capacity_check', sql`${t.oilCapacityL} is null or (${t.oilCapacityL} > 0 and ${t.oilCapacityL} < 50)`),
    check('vehicles_plug_gap_check', sql`${t.plugGapMm} is null or (${t.plugGapMm} > 0 and ${t.plugGapMm} < 3)`),
    check(
      'vehicles_interval_check',
      sql`(${t.serviceIntervalMonths} is null or ${t.serviceIntervalMonths} > 0) and (${t.serviceIntervalDistance} is null or ${t.serviceIntervalDistance} > 0)`,
    ),
  ],
);

export const modelNotes = pgTable(
  'model_notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    make: text('make').notNull(),
    model: text('model').notNull(),
    // Empty string matches every engine of that make and model.
    engine: text('engine').notNull().default(''),
    title: text('title').notNull(),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('model_notes_match_idx').on(t.organisationId, t.make, t.model),
    index('model_notes_change_seq_idx').on(t.changeSeq),
  ],
);
