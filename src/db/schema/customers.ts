// The business's customers: the keepers of the vehicles we service.
import { sql } from 'drizzle-orm';
import { check, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { changeSeqColumn } from './change-feed';

export const customers = pgTable(
  'customers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    email: text('email'),
    phone: text('phone'),
    // Where the vehicle usually stands; a visit copies it and may override it.
    addressLines: text('address_lines').notNull().default(''),
    postcode: text('postcode').notNull().default(''),
    notes: text('notes').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('customers_org_name_idx').on(t.organisationId, t.name),
    index('customers_change_seq_idx').on(t.changeSeq),
    check('customers_name_check', sql`length(trim(${t.name})) > 0`),
  ],
);
