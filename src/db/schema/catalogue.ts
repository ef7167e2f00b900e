// Parts and consumables the business stocks. Vehicle specs point here so a vehicle knows
// its filters and plugs; oil is matched by grade.
import { sql } from 'drizzle-orm';
import { boolean, check, index, integer, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { changeSeqColumn } from './change-feed';

import { PART_KINDS, PART_UNITS } from '../../lib/words';

export { PART_KINDS, PART_UNITS };
export type PartKind = (typeof PART_KINDS)[number];

export const parts = pgTable(
  'parts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    partNumber: text('part_number').notNull(),
    description: text('description').notNull(),
    kind: text('kind', { enum: PART_KINDS }).notNull(),
    unit: text('unit', { enum: PART_UNITS }).notNull(),
    // SAE J300 label, normalised, for kind = 'oil'.
    oilGrade: text('oil_grade'),
    costMinor: integer('cost_minor').notNull().default(0),
    priceMinor: integer('price_minor').notNull().default(0),
    supplier: text('supplier').notNull().default(''),
    active: boolean('active').notNull().default(true),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    unique('parts_org_part_number_unique').on(t.organisationId, t.partNumber),
    index('parts_org_kind_idx').on(t.organisationId, t.kind),
    check('parts_money_check', sql`${t.costMinor} >= 0 and ${t.priceMinor} >= 0`),
    check('parts_oil_grade_check', sql`(${t.kind} = 'oil') = (${t.oilGrade} is not null)`),
    check('parts_unit_check', sql`${t.unit} in ('L', '{each}')`),
  ],
);
