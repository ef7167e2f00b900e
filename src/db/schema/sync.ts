// Every operation a device pushed, whatever became of it (idempotency and audit), and the
// conflict list the office works through.
import { sql } from 'drizzle-orm';
import { check, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations';
import { visits } from './visits';
import { changeSeqColumn } from './change-feed';

import { OUTCOMES as OP_OUTCOMES, type Outcome as OpOutcome } from '../../lib/sync/operations';
import { CONFLICT_REASONS } from '../../lib/sync/apply-operation';

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
    // As the device sent it; `effective_stamp` is what it merged with when the server bounded
    // a stamp from a clock running ahead (lib/sync/stamp-bound), null when it was not bounded.
    stamp: text('stamp').notNull(),
    effectiveStamp: text('effective_stamp'),
    // Translated to the server's stamp when it named the device's own bounded operation.
    seenStamp: text('seen_stamp'),
    payload: jsonb('payload').notNull(),
    outcome: text('outcome', { enum: OP_OUTCOMES }).notNull(),
    reason: text('reason'),
    receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('sync_operations_visit_idx').on(t.visitId, t.receivedAt),
    index('sync_operations_entity_idx').on(t.visitId, t.entityId),
    index('sync_operations_device_stamp_idx').on(t.organisationId, t.deviceId, t.stamp),
    check(
      'sync_operations_outcome_check',
      sql`${t.outcome} in ('applied', 'duplicate', 'superseded', 'conflict', 'locked', 'rejected')`,
    ),
  ],
);

export { CONFLICT_REASONS };

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

/** Per device: the last stamp the server bounded for it, so its bounded stamps keep their order. */
export const syncDevices = pgTable(
  'sync_devices',
  {
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    deviceId: text('device_id').notNull(),
    userId: text('user_id').notNull(),
    lastBoundedStamp: text('last_bounded_stamp'),
    boundedCount: integer('bounded_count').notNull().default(0),
    lastPushAt: timestamp('last_push_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.organisationId, t.deviceId] })],
);

/**
 * The server's hybrid logical clock, one per organisation: it moves on every operation received
 * and stamps the office's own changes, so they order after everything the server has accepted.
 */
export const syncClocks = pgTable('sync_clocks', {
  organisationId: uuid('organisation_id')
    .primaryKey()
    .references(() => organisations.id, { onDelete: 'cascade' }),
  stamp: text('stamp').notNull(),
});

/**
 * Operations the server refused outright (malformed, a visit the pusher may not touch, an id
 * already used elsewhere). Nothing of them was applied, but they reached the server, so they are
 * kept, as sent, for the office to see; the phone keeps them in its outbox until the technician
 * lets them go. A refusal the device is expected to cure by itself (a photo's bytes not uploaded
 * yet) is not kept.
 */
export const refusedOperations = pgTable(
  'refused_operations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    userId: text('user_id').notNull(),
    deviceId: text('device_id').notNull(),
    // As the device named them: not trusted, not joined (the visit may not exist or not be ours).
    opId: text('op_id').notNull(),
    visitId: text('visit_id'),
    kind: text('kind'),
    body: jsonb('body').notNull(),
    reason: text('reason').notNull(),
    receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // The same refused operation sent again (a retry) is kept once.
    uniqueIndex('refused_operations_once').on(t.organisationId, t.deviceId, t.opId, t.reason),
    index('refused_operations_org_idx').on(t.organisationId, t.receivedAt),
  ],
);
