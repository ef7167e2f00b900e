// What a technician records on a visit. Each row holds the winning value of one thing and the
// hybrid-logical-clock stamp that won (see lib/sync/merge-rules); losers live in sync_operations
// and conflicts. Ids of findings, notes, photos and part lines are made on the device.
import { sql } from 'drizzle-orm';
import {
  boolean,
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { user } from './auth';
import { organisations } from './organisations';
import { visits } from './visits';
import { templateItems } from './templates';
import { parts } from './catalogue';
import { DISTANCE_UNITS } from './organisations';
import { changeSeqColumn } from './change-feed';

import { CHECK_STATES, SEVERITIES, type Severity } from '../../lib/sync/operations';
import type { SeverityLog } from '../../lib/sync/severity-log';

export { CHECK_STATES, SEVERITIES, type Severity };
export type CheckState = (typeof CHECK_STATES)[number];

export const checkResults = pgTable(
  'check_results',
  {
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    itemId: uuid('item_id')
      .notNull()
      .references(() => templateItems.id, { onDelete: 'restrict' }),
    state: text('state', { enum: CHECK_STATES }).notNull(),
    stamp: text('stamp').notNull(),
    opId: uuid('op_id').notNull(),
    updatedBy: text('updated_by').notNull(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    primaryKey({ columns: [t.visitId, t.itemId] }),
    index('check_results_change_seq_idx').on(t.changeSeq),
    check('check_results_state_check', sql`${t.state} in ('done', 'skipped', 'not_yet')`),
  ],
);

export const readingResults = pgTable(
  'reading_results',
  {
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    itemId: uuid('item_id')
      .notNull()
      .references(() => templateItems.id, { onDelete: 'restrict' }),
    // A number in `unit`, or, for readings such as an oil grade, text.
    value: doublePrecision('value'),
    textValue: text('text_value'),
    unit: text('unit'),
    stamp: text('stamp').notNull(),
    opId: uuid('op_id').notNull(),
    updatedBy: text('updated_by').notNull(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    primaryKey({ columns: [t.visitId, t.itemId] }),
    index('reading_results_change_seq_idx').on(t.changeSeq),
    check('reading_results_value_check', sql`${t.value} is not null or ${t.textValue} is not null`),
  ],
);

export const findings = pgTable(
  'findings',
  {
    id: uuid('id').primaryKey(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    itemId: uuid('item_id').references(() => templateItems.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    detail: text('detail').notNull().default(''),
    severity: text('severity', { enum: SEVERITIES }).notNull(),
    severityStamp: text('severity_stamp').notNull(),
    // What the severity merge needs to stay order-independent (lib/sync/severity-log); null on
    // rows written before it existed, read as a single event (severity, severity_stamp).
    severityLog: jsonb('severity_log').$type<SeverityLog>(),
    // Stamp of the latest change to the fields other than severity (later stamp wins).
    stamp: text('stamp').notNull(),
    createdBy: text('created_by').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('findings_visit_idx').on(t.visitId),
    index('findings_severity_idx').on(t.severity),
    index('findings_change_seq_idx').on(t.changeSeq),
    check('findings_severity_check', sql`${t.severity} in ('ok', 'watch', 'soon', 'now')`),
  ],
);

export const visitNotes = pgTable(
  'visit_notes',
  {
    id: uuid('id').primaryKey(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    body: text('body').notNull(),
    authorId: text('author_id').notNull(),
    stamp: text('stamp').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [index('visit_notes_visit_idx').on(t.visitId), index('visit_notes_change_seq_idx').on(t.changeSeq)],
);

export const photos = pgTable(
  'photos',
  {
    id: uuid('id').primaryKey(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    findingId: uuid('finding_id'),
    itemId: uuid('item_id'),
    caption: text('caption').notNull().default(''),
    // Content address: the object key is derived from the SHA-256 of the bytes.
    objectKey: text('object_key').notNull(),
    sha256: text('sha256').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    contentType: text('content_type').notNull(),
    width: integer('width'),
    height: integer('height'),
    thumbnailKey: text('thumbnail_key'),
    addStamp: text('add_stamp').notNull(),
    // Set only by a remove that had seen this add (an unseen remove loses to the add).
    removedStamp: text('removed_stamp'),
    createdBy: text('created_by').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('photos_visit_idx').on(t.visitId),
    index('photos_change_seq_idx').on(t.changeSeq),
    check('photos_sha256_check', sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
    check('photos_size_check', sql`${t.sizeBytes} > 0`),
  ],
);

export const partLines = pgTable(
  'part_lines',
  {
    id: uuid('id').primaryKey(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    itemId: uuid('item_id').references(() => templateItems.id, { onDelete: 'set null' }),
    partId: uuid('part_id').references(() => parts.id, { onDelete: 'set null' }),
    partNumber: text('part_number').notNull(),
    description: text('description').notNull(),
    quantity: doublePrecision('quantity').notNull(),
    unit: text('unit').notNull(),
    // Tombstone: a removed line stays so a late, older edit cannot bring it back.
    removed: boolean('removed').notNull().default(false),
    stamp: text('stamp').notNull(),
    updatedBy: text('updated_by').notNull(),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('part_lines_visit_idx').on(t.visitId),
    index('part_lines_change_seq_idx').on(t.changeSeq),
    check('part_lines_quantity_check', sql`${t.quantity} > 0`),
  ],
);

export const signOffs = pgTable(
  'sign_offs',
  {
    id: uuid('id').primaryKey(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    odometer: integer('odometer').notNull(),
    odometerUnit: text('odometer_unit', { enum: DISTANCE_UNITS }).notNull(),
    customerName: text('customer_name').notNull(),
    // The customer's signature as drawn on the phone: an SVG document (small, scales for print).
    signatureSvg: text('signature_svg').notNull(),
    declaration: text('declaration').notNull(),
    technicianId: text('technician_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    signedAt: timestamp('signed_at', { withTimezone: true }).notNull(),
    stamp: text('stamp').notNull(),
    opId: uuid('op_id').notNull(),
    // Set when the office reopens the visit; the next sign-off then wins again.
    voidedAt: timestamp('voided_at', { withTimezone: true }),
    voidedBy: text('voided_by'),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    uniqueIndex('sign_offs_one_live_per_visit').on(t.visitId).where(sql`${t.voidedAt} is null`),
    index('sign_offs_change_seq_idx').on(t.changeSeq),
    check('sign_offs_odometer_check', sql`${t.odometer} >= 0`),
  ],
);

/**
 * Photo bytes the server holds, per organisation, by SHA-256 (the object key derives from it, so
 * a repeated upload is a no-op). A photo.add operation may name only a stored object.
 */
export const photoObjects = pgTable(
  'photo_objects',
  {
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    sha256: text('sha256').notNull(),
    objectKey: text('object_key').notNull(),
    thumbnailKey: text('thumbnail_key').notNull(),
    contentType: text('content_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    uploadedBy: text('uploaded_by').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.organisationId, t.sha256] }),
    check('photo_objects_sha256_check', sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
  ],
);
