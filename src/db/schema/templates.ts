// Checklist templates. A template has versions; only a draft is edited, publishing freezes it,
// and a visit keeps the version it was booked with.
import { sql } from 'drizzle-orm';
import {
  check,
  doublePrecision,
  index,
  integer,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { PART_KINDS } from './catalogue';
import { changeSeqColumn } from './change-feed';

import { ITEM_KINDS, TEMPLATE_VERSION_STATUSES } from '../../lib/words';

export { ITEM_KINDS, TEMPLATE_VERSION_STATUSES };
export type ItemKind = (typeof ITEM_KINDS)[number];

export const checklistTemplates = pgTable(
  'checklist_templates',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    // Labour the office prices a visit of this kind at, in hundredths of an hour.
    labourCentiHours: integer('labour_centi_hours').notNull().default(100),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('checklist_templates_org_name_unique').on(t.organisationId, t.name),
    check('checklist_templates_labour_check', sql`${t.labourCentiHours} >= 0`),
  ],
);

export const templateVersions = pgTable(
  'template_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    templateId: uuid('template_id')
      .notNull()
      .references(() => checklistTemplates.id, { onDelete: 'cascade' }),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    status: text('status', { enum: TEMPLATE_VERSION_STATUSES }).notNull().default('draft'),
    publishedAt: timestamp('published_at', { withTimezone: true }),
    publishedBy: text('published_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    unique('template_versions_template_version_unique').on(t.templateId, t.version),
    index('template_versions_change_seq_idx').on(t.changeSeq),
    check('template_versions_status_check', sql`${t.status} in ('draft', 'published', 'retired')`),
    check('template_versions_published_check', sql`(${t.status} = 'draft') = (${t.publishedAt} is null)`),
  ],
);

export const templateSections = pgTable(
  'template_sections',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    versionId: uuid('version_id')
      .notNull()
      .references(() => templateVersions.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    title: text('title').notNull(),
  },
  (t) => [unique('template_sections_position_unique').on(t.versionId, t.position)],
);

export const templateItems = pgTable(
  'template_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    versionId: uuid('version_id')
      .notNull()
      .references(() => templateVersions.id, { onDelete: 'cascade' }),
    sectionId: uuid('section_id')
      .notNull()
      .references(() => templateSections.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    kind: text('kind', { enum: ITEM_KINDS }).notNull(),
    label: text('label').notNull(),
    // UCUM code for readings ('mm', 'V', 'Cel', ...) and parts ('L', '{each}').
    unit: text('unit'),
    expectedMin: doublePrecision('expected_min'),
    expectedMax: doublePrecision('expected_max'),
    // Names a trade rule that judges the reading beyond its range (see lib/trade/judge-reading).
    rule: text('rule'),
    // For part items: which slot of the vehicle spec supplies the part.
    partKind: text('part_kind', { enum: PART_KINDS }),
    caution: text('caution'),
    hint: text('hint'),
  },
  (t) => [
    unique('template_items_position_unique').on(t.sectionId, t.position),
    index('template_items_version_idx').on(t.versionId),
    check('template_items_kind_check', sql`${t.kind} in ('check', 'reading', 'part')`),
    check('template_items_reading_unit_check', sql`${t.kind} <> 'reading' or ${t.unit} is not null`),
    check(
      'template_items_range_check',
      sql`${t.expectedMin} is null or ${t.expectedMax} is null or ${t.expectedMin} <= ${t.expectedMax}`,
    ),
  ],
);
