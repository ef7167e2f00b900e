// The van: the containers each oil is stocked in, what each technician's van holds (as stock
// movements, so every level can be explained), low-stock minimums, and the used oil the van
// carries away to a licensed site.
import { sql } from 'drizzle-orm';
import {
  check,
  doublePrecision,
  index,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { user } from './auth';
import { parts } from './catalogue';
import { visits } from './visits';
import { partLines } from './visit-records';

/** The container sizes the business buys and loads an oil in (say 1 L and 5 L). */
export const oilContainers = pgTable(
  'oil_containers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    partId: uuid('part_id')
      .notNull()
      .references(() => parts.id, { onDelete: 'cascade' }),
    sizeL: doublePrecision('size_l').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('oil_containers_part_size_unique').on(t.partId, t.sizeL),
    check('oil_containers_size_check', sql`${t.sizeL} > 0 and ${t.sizeL} <= 1000`),
  ],
);

export const STOCK_MOVEMENT_REASONS = [
  // The office loaded the van from the store.
  'restock',
  // Parts fitted on a visit (negative), or given back when the part line changed or was removed.
  'fitted',
  // A stock count found a different level: the movement is the difference.
  'count',
  // Taken out of the van back to the store.
  'returned',
] as const;
export type StockMovementReason = (typeof STOCK_MOVEMENT_REASONS)[number];

/** Every change to a van's stock. A van's level of a part is the sum of its movements. */
export const vanStockMovements = pgTable(
  'van_stock_movements',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    // The van is known by the technician who drives it.
    technicianId: text('technician_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    partId: uuid('part_id')
      .notNull()
      .references(() => parts.id, { onDelete: 'restrict' }),
    // Signed, in the part's unit: + into the van, − out of it.
    quantity: doublePrecision('quantity').notNull(),
    reason: text('reason', { enum: STOCK_MOVEMENT_REASONS }).notNull(),
    // For 'fitted': the visit and part line the stock went into.
    visitId: uuid('visit_id').references(() => visits.id, { onDelete: 'set null' }),
    partLineId: uuid('part_line_id').references(() => partLines.id, { onDelete: 'set null' }),
    note: text('note').notNull().default(''),
    recordedBy: text('recorded_by').references(() => user.id, { onDelete: 'set null' }),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('van_stock_movements_van_idx').on(t.organisationId, t.technicianId, t.partId),
    index('van_stock_movements_part_line_idx').on(t.partLineId),
    index('van_stock_movements_recorded_idx').on(t.technicianId, t.recordedAt),
    check('van_stock_movements_quantity_check', sql`${t.quantity} <> 0`),
    check('van_stock_movements_reason_check', sql`${t.reason} in ('restock', 'fitted', 'count', 'returned')`),
  ],
);

/** Below this level the office sees a low-stock warning for the van. */
export const vanStockMinimums = pgTable(
  'van_stock_minimums',
  {
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    technicianId: text('technician_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    partId: uuid('part_id')
      .notNull()
      .references(() => parts.id, { onDelete: 'cascade' }),
    minimum: doublePrecision('minimum').notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.technicianId, t.partId] }),
    check('van_stock_minimums_check', sql`${t.minimum} >= 0`),
  ],
);

/** Used oil taken from a van to a licensed site: the business's own record. */
export const usedOilDisposals = pgTable(
  'used_oil_disposals',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    technicianId: text('technician_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    disposedAt: timestamp('disposed_at', { withTimezone: true }).notNull(),
    siteName: text('site_name').notNull(),
    // The site's permit or licence number, and the transfer note's reference, where given.
    siteLicence: text('site_licence').notNull().default(''),
    reference: text('reference').notNull().default(''),
    litres: doublePrecision('litres').notNull(),
    recordedBy: text('recorded_by').references(() => user.id, { onDelete: 'set null' }),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('used_oil_disposals_van_idx').on(t.organisationId, t.technicianId, t.disposedAt),
    check('used_oil_disposals_litres_check', sql`${t.litres} > 0 and ${t.litres} < 100000`),
    check('used_oil_disposals_site_check', sql`length(trim(${t.siteName})) > 0`),
  ],
);
