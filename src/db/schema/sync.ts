// Every operation a device pushed, whatever became of it (idempotency and audit), and the
// conflict list the office works through.
import { sql } from 'drizzle-orm';
import { check, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { visits } from './visits';
import { changeSeqColumn } from './change-feed';

import { OUTCOMES as OP_OUTCOMES, type Outcome as OpOutcome } from '../../lib/sync/operations';

export { OP_OUTCOMES, type OpOutcome };

export const syncOperations = pgTable(
  'sync_operations',
  {
    opId: uuid('op_id').primaryKey(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    userId: text('user_id').notNull(),
    deviceId: text('device_id').notNull(),
    kind: text('kind').notNull(),
    entityId: text('entity_id').notNull(),
    stamp: text('stamp').notNull(),
    seenStamp: text('seen_stamp'),
    payload: jsonb('payload').notNull(),
    outcome: text('outcome', { enum: OP_OUTCOMES }).notNull(),
    reason: text('reason'),
    receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('sync_operations_visit_idx').on(t.visitId, t.receivedAt),
    check(
      'sync_operations_outcome_check',
      sql`${t.outcome} in ('applied', 'duplicate', 'superseded', 'conflict', 'locked', 'rejected')`,
    ),
  ],
);

export const CONFLICT_REASONS = ['concurrent_edit', 'visit_locked'] as const;

export const conflicts = pgTable(
  'conflicts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    opId: uuid('op_id')
      .notNull()
      .references(() => syncOperations.opId, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    entityId: text('entity_id').notNull(),
    reason: text('reason', { enum: CONFLICT_REASONS }).notNull(),
    // The value that lost (or could not be applied) and the value that stood at the time.
    proposed: jsonb('proposed').notNull(),
    standing: jsonb('standing'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    resolvedBy: text('resolved_by'),
    resolution: text('resolution'),
    changeSeq: changeSeqColumn(),
  },
  (t) => [
    index('conflicts_open_idx').on(t.organisationId, t.resolvedAt),
    index('conflicts_visit_idx').on(t.visitId),
  ],
);
