// Applies a batch of operations in one transaction: validate each, authorise the visits, skip
// what was seen before, bound stamps from clocks that run ahead, merge by the rules in lib/sync,
// then write the standing values, the operations (whatever became of them) and the conflicts in
// bulk. The caller answers only after the commit, so nothing is acknowledged before it is durable.
import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Transaction } from '../../../db/client';
import * as s from '../../../db/schema';
import type { UserRole } from '../../../db/schema';
import { describeZodError, HttpError } from '../http';
import { decodeStamp, type Stamp } from '../../sync/clock';
import { entityIdOf, operationSchema, type Operation, type OperationKind, type OperationResult } from '../../sync/operations';
import { applyOperation, invalidForVisit, type RecordedConflict } from '../../sync/apply-operation';
import { boundStamp, normaliseSeen } from '../../sync/stamp-bound';
import { loadLedgers, ownerOf, type VisitRow } from './load-ledgers';
import { persistLedgers } from './persist-ledgers';
import { runPostApplyHooks } from './hooks';
import type { ServerClock } from './server-clock';

export type Pusher = { id: string; role: UserRole; organisationId: string };

type Candidate = { index: number; op: Operation };
type Recorded = {
  op: Operation;
  effective: Stamp;
  bounded: boolean;
  outcome: OperationResult['outcome'];
  reason: string | undefined;
};


export async function applyBatch(
  tx: Transaction,
  user: Pusher,
  deviceId: string,
  raw: readonly unknown[],
  clock: ServerClock,
  nowMs: number,
): Promise<OperationResult[]> {
  const results: OperationResult[] = raw.map((r) => ({ opId: opIdOf(r), outcome: 'rejected', reason: 'not processed' }));
  const answer = (index: number, outcome: OperationResult['outcome'], reason?: string) => {
    results[index] = reason === undefined ? { opId: results[index]!.opId, outcome } : { opId: results[index]!.opId, outcome, reason };
  };

  // Refusals the device cures by itself (it uploads the photo's bytes, then sends again).
  const curable = new Set<number>();
  let candidates = parseAll(raw, deviceId, answer);
  // Locking the visits first orders pushes to the same visit (a retry racing its original
  // included): the second waits here and then sees what the first committed.
  const { visits, reassigned } = await authoriseVisits(tx, user, candidates);
  candidates = await skipDuplicates(tx, user, candidates, answer);
  candidates = candidates.filter((c) => {
    if (visits.has(c.op.visitId)) return true;
    answer(c.index, 'rejected', `visit ${c.op.visitId}: no such visit`);
    return false;
  });
  const objects = await storedObjects(tx, user.organisationId, candidates);
  candidates = candidates.flatMap((c) => {
    if (c.op.kind !== 'photo.add') return [c];
    const stored = objects.get(c.op.payload.sha256);
    if (!stored) {
      answer(c.index, 'rejected', `upload the photo's bytes first (PUT /api/photos/${c.op.payload.sha256}), then send this again`);
      curable.add(c.index);
      return [];
    }
    // Type, size and dimensions come from the bytes the server checked, not from the device.
    const { contentType, sizeBytes, width, height } = stored;
    return [{ ...c, op: { ...c.op, payload: { ...c.op.payload, contentType, sizeBytes, width, height } } }];
  });

  const { ledgers, owners } = await loadLedgers(tx, [...visits.values()], candidates.map((c) => c.op));
  const device = await deviceState(tx, user, deviceId);
  const boundedEarlier = await boundedStampsNamed(tx, user.organisationId, deviceId, candidates, device.everBounded);

  const recorded: Recorded[] = [];
  const conflicts: (RecordedConflict & { opId: string; visitId: string })[] = [];
  const applied = new Map<string, Set<OperationKind>>();
  for (const { index, op } of candidates) {
    const ledger = ledgers.get(op.visitId)!;
    const owner = ownerOf(owners, op);
    const invalid =
      owner !== undefined && owner !== op.visitId ? `id ${entityIdOf(op)} is already used on another visit; make a new id` : invalidForVisit(ledger, op);
    if (invalid) {
      answer(index, 'rejected', invalid);
      continue;
    }
    const bound = boundStamp(op.stamp, nowMs, device.lastBounded);
    if (bound.bounded) {
      device.lastBounded = bound.stamp;
      boundedEarlier.set(op.stamp, bound.stamp);
    }
    clock.receive(bound.stamp, nowMs);
    const merged = { ...op, seenStamp: normaliseSeen(op.seenStamp, op.deviceId, (seen) => boundedEarlier.get(seen)) } as Operation;
    const result = reassigned.has(op.visitId)
      ? keepForReassignedVisit(merged, bound.stamp, user.id)
      : applyOperation(ledger, { op: merged, stamp: bound.stamp, author: user.id, mayDowngrade: user.role !== 'technician' });
    answer(index, result.outcome, result.reason);
    recorded.push({ op: merged, effective: bound.stamp, bounded: bound.bounded, outcome: result.outcome, reason: result.reason });
    for (const conflict of result.conflicts) conflicts.push({ ...conflict, opId: op.opId, visitId: op.visitId });
    if (result.outcome === 'applied') applied.set(op.visitId, (applied.get(op.visitId) ?? new Set()).add(op.kind));
  }

  await writeOperations(tx, user, recorded, conflicts);
  await pauseIfFaultInjected(tx);
  await persistLedgers(tx, user.organisationId, ledgers.values());
  await runPostApplyHooks(tx, applied);
  await saveDeviceState(tx, user, deviceId, device, recorded);
  await keepRefused(tx, user, deviceId, raw, results, curable);
  logBounded(user, deviceId, recorded, nowMs);
  return results;
}

/** Every operation that reached the server is kept: the refused ones as sent, with the reason. */
async function keepRefused(
  tx: Transaction,
  user: Pusher,
  deviceId: string,
  raw: readonly unknown[],
  results: OperationResult[],
  curable: ReadonlySet<number>,
) {
  const refused = results.flatMap((result, index) => {
    if (result.outcome !== 'rejected' || curable.has(index)) return [];
    const sent = (raw[index] ?? null) as { visitId?: unknown; kind?: unknown } | null;
    return [
      {
        organisationId: user.organisationId,
        userId: user.id,
        deviceId,
        opId: result.opId,
        visitId: typeof sent?.visitId === 'string' ? sent.visitId.slice(0, 64) : null,
        kind: typeof sent?.kind === 'string' ? sent.kind.slice(0, 32) : null,
        body: sent ?? {},
        reason: result.reason ?? 'refused',
      },
    ];
  });
  if (refused.length) await tx.insert(s.refusedOperations).values(refused).onConflictDoNothing();
}

function opIdOf(raw: unknown): string {
  const opId = (raw as { opId?: unknown } | null)?.opId;
  return typeof opId === 'string' ? opId.slice(0, 64) : '';
}

function parseAll(raw: readonly unknown[], deviceId: string, answer: (i: number, o: 'rejected', r: string) => void): Candidate[] {
  const candidates: Candidate[] = [];
  raw.forEach((item, index) => {
    const parsed = operationSchema.safeParse(item);
    if (!parsed.success) return answer(index, 'rejected', describeZodError(parsed.error).join('; '));
    const op = parsed.data;
    if (op.deviceId !== deviceId) return answer(index, 'rejected', `deviceId ${op.deviceId} differs from the pushing device ${deviceId}`);
    if (decodeStamp(op.stamp).deviceId !== op.deviceId) return answer(index, 'rejected', 'the stamp was made by another device');
    candidates.push({ index, op });
  });
  return candidates;
}

async function skipDuplicates(
  tx: Transaction,
  user: Pusher,
  candidates: Candidate[],
  answer: (i: number, o: 'duplicate' | 'rejected', r: string) => void,
): Promise<Candidate[]> {
  if (candidates.length === 0) return candidates;
  const earlier = await tx
    .select({ opId: s.syncOperations.opId, organisationId: s.syncOperations.organisationId, visitId: s.syncOperations.visitId, outcome: s.syncOperations.outcome })
    .from(s.syncOperations)
    .where(inArray(s.syncOperations.opId, candidates.map((c) => c.op.opId)));
  const byId = new Map(earlier.map((e) => [e.opId, e]));
  const inBatch = new Set<string>();
  return candidates.filter(({ index, op }) => {
    const seen = byId.get(op.opId);
    if (seen && (seen.organisationId !== user.organisationId || seen.visitId !== op.visitId)) {
      answer(index, 'rejected', 'this operation id belongs to another operation; make a new id');
      return false;
    }
    if (seen) {
      answer(index, 'duplicate', `already received (${seen.outcome})`);
      return false;
    }
    if (inBatch.has(op.opId)) {
      answer(index, 'duplicate', 'sent twice in this batch');
      return false;
    }
    inBatch.add(op.opId);
    return true;
  });
}

/**
 * The visits the batch names, of the pusher's organisation. A technician may push for their own
 * visits only: another technician's visit makes the whole batch a 403. A visit taken off their
 * round after they worked on it offline is different: that work is kept for the office.
 */
async function authoriseVisits(tx: Transaction, user: Pusher, candidates: Candidate[]) {
  const visitIds = [...new Set(candidates.map((c) => c.op.visitId))];
  const rows: VisitRow[] = visitIds.length
    ? await tx
        .select({
          id: s.visits.id,
          organisationId: s.visits.organisationId,
          technicianId: s.visits.technicianId,
          templateVersionId: s.visits.templateVersionId,
          status: s.visits.status,
        })
        .from(s.visits)
        .where(and(inArray(s.visits.id, visitIds), eq(s.visits.organisationId, user.organisationId)))
        // Always in id order, so two batches that share visits cannot deadlock.
        .orderBy(s.visits.id)
        .for('update')
    : [];
  const visits = new Map(rows.map((v) => [v.id, v]));
  const reassigned = new Set<string>();
  if (user.role !== 'technician') return { visits, reassigned };
  const others = rows.filter((v) => v.technicianId !== user.id).map((v) => v.id);
  if (others.length) {
    const removals = await tx
      .select({ visitId: s.roundRemovals.visitId })
      .from(s.roundRemovals)
      .where(and(inArray(s.roundRemovals.visitId, others), eq(s.roundRemovals.technicianId, user.id)));
    for (const r of removals) reassigned.add(r.visitId);
    const forbidden = others.filter((id) => !reassigned.has(id));
    if (forbidden.length) {
      throw new HttpError(403, `Visit ${forbidden[0]} is on another technician's round; nothing in this batch was applied.`);
    }
  }
  return { visits, reassigned };
}

async function storedObjects(tx: Transaction, organisationId: string, candidates: Candidate[]) {
  const hashes = [...new Set(candidates.flatMap((c) => (c.op.kind === 'photo.add' ? [c.op.payload.sha256] : [])))];
  const objects = new Map<string, { contentType: 'image/jpeg' | 'image/png' | 'image/webp'; sizeBytes: number; width: number; height: number }>();
  if (hashes.length === 0) return objects;
  const rows = await tx
    .select()
    .from(s.photoObjects)
    .where(and(eq(s.photoObjects.organisationId, organisationId), inArray(s.photoObjects.sha256, hashes)));
  for (const r of rows) objects.set(r.sha256, { ...r, contentType: r.contentType as 'image/jpeg' });
  return objects;
}

type DeviceState = { lastBounded: Stamp | null; everBounded: boolean };

async function deviceState(tx: Transaction, user: Pusher, deviceId: string): Promise<DeviceState> {
  const [row] = await tx
    .select({ lastBounded: s.syncDevices.lastBoundedStamp })
    .from(s.syncDevices)
    .where(and(eq(s.syncDevices.organisationId, user.organisationId), eq(s.syncDevices.deviceId, deviceId)));
  const lastBounded = (row?.lastBounded ?? null) as Stamp | null;
  return { lastBounded, everBounded: lastBounded !== null };
}

/** Bounded stamps this device's earlier operations got, for the seen stamps this batch names. */
async function boundedStampsNamed(tx: Transaction, organisationId: string, deviceId: string, candidates: Candidate[], everBounded: boolean) {
  const found = new Map<string, Stamp>();
  const named = [...new Set(candidates.flatMap((c) => (c.op.seenStamp ? [c.op.seenStamp] : [])))];
  if (!everBounded || named.length === 0) return found;
  const rows = await tx
    .select({ stamp: s.syncOperations.stamp, effective: s.syncOperations.effectiveStamp })
    .from(s.syncOperations)
    .where(
      and(
        eq(s.syncOperations.organisationId, organisationId),
        eq(s.syncOperations.deviceId, deviceId),
        inArray(s.syncOperations.stamp, named),
        sql`${s.syncOperations.effectiveStamp} is not null`,
      ),
    );
  for (const r of rows) found.set(r.stamp, r.effective as Stamp);
  return found;
}

function keepForReassignedVisit(op: Operation, stamp: Stamp, author: string) {
  return {
    outcome: 'locked' as const,
    reason: 'the visit was moved to another technician; kept for the office',
    conflicts: [
      {
        kind: op.kind,
        entityId: entityIdOf(op),
        reason: 'visit_reassigned' as const,
        proposed: { value: { ...op.payload }, stamp, opId: op.opId, author },
        standing: null,
      },
    ],
  };
}

async function writeOperations(
  tx: Transaction,
  user: Pusher,
  recorded: Recorded[],
  conflicts: (RecordedConflict & { opId: string; visitId: string })[],
) {
  if (recorded.length) {
    await tx.insert(s.syncOperations).values(
      recorded.map((r) => ({
        opId: r.op.opId,
        organisationId: user.organisationId,
        visitId: r.op.visitId,
        userId: user.id,
        deviceId: r.op.deviceId,
        kind: r.op.kind,
        entityId: entityIdOf(r.op),
        stamp: r.op.stamp,
        effectiveStamp: r.bounded ? r.effective : null,
        seenStamp: r.op.seenStamp,
        payload: r.op.payload,
        outcome: r.outcome as s.OpOutcome,
        reason: r.reason ?? null,
      })),
    );
  }
  if (conflicts.length) {
    await tx.insert(s.conflicts).values(
      conflicts.map((c) => ({
        organisationId: user.organisationId,
        visitId: c.visitId,
        opId: c.opId,
        kind: c.kind,
        entityId: c.entityId,
        reason: c.reason,
        proposed: c.proposed,
        standing: c.standing,
      })),
    );
  }
}

async function saveDeviceState(tx: Transaction, user: Pusher, deviceId: string, device: DeviceState, recorded: Recorded[]) {
  const bounded = recorded.filter((r) => r.bounded).length;
  await tx
    .insert(s.syncDevices)
    .values({ organisationId: user.organisationId, deviceId, userId: user.id, lastBoundedStamp: device.lastBounded, boundedCount: bounded })
    .onConflictDoUpdate({
      target: [s.syncDevices.organisationId, s.syncDevices.deviceId],
      set: {
        userId: user.id,
        lastBoundedStamp: device.lastBounded,
        boundedCount: sql`${s.syncDevices.boundedCount} + ${bounded}`,
        lastPushAt: new Date(),
      },
    });
}

function logBounded(user: Pusher, deviceId: string, recorded: Recorded[], nowMs: number) {
  const bounded = recorded.filter((r) => r.bounded);
  if (bounded.length === 0) return;
  const aheadMinutes = Math.round(Math.max(...bounded.map((r) => decodeStamp(r.op.stamp).wallMs - nowMs)) / 60_000);
  console.warn(
    `[sync] device ${deviceId} of user ${user.id}: ${bounded.length} stamp(s) up to ${aheadMinutes} min ahead of the server were bounded`,
  );
}

/**
 * Fault injection for the crash tests: with TICKOVER_FAULT_PAUSE_MID_BATCH_MS set, the push
 * waits here, after writing the operations and before the standing values, so a test can kill
 * the server in the middle of a batch. Unset in every real deployment.
 */
async function pauseIfFaultInjected(tx: Transaction) {
  const ms = Number(process.env.TICKOVER_FAULT_PAUSE_MID_BATCH_MS ?? 0);
  if (!ms) return;
  console.error('[sync] fault injection: pausing in the middle of a batch');
  await tx.execute(sql`select pg_sleep(${ms / 1000})`);
}

