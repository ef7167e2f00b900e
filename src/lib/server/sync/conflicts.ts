// The office's conflict list: operations that lost a concurrent edit or reached a locked visit,
// with both values, who and when; and resolving one: keep the standing value or use the other,
// optionally keeping the value not chosen as a note, reopening a signed-off visit if needed.
// Using the other value goes through the same merge path as a device's push, as an operation
// of the office stamped by the server's clock, so it is recorded like any other change.
import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, inArray, isNotNull, isNull, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { getDb, type Transaction } from '../../../db/client';
import * as s from '../../../db/schema';
import type { UserRole } from '../../../db/schema';
import { HttpError } from '../http';
import { withChangeFeedWrite } from '../change-feed';
import { decodeStamp, isStamp, type Stamp } from '../../sync/clock';
import type { Operation, OperationKind } from '../../sync/operations';
import type { ConflictReason } from '../../sync/apply-operation';
import { applyBatch } from './apply-batch';
import { ServerClock, SERVER_DEVICE_ID } from './server-clock';
import { reopenVisit } from './visit-reopen';
import { describeValue, subjectOf } from './conflict-text';

export type Office = { id: string; name: string; role: UserRole; organisationId: string };

export type ConflictFilter = {
  visitId?: string | undefined;
  status: 'open' | 'resolved' | 'all';
  kind?: OperationKind | undefined;
  reason?: ConflictReason | undefined;
  technicianId?: string | undefined;
  limit: number;
  offset: number;
};

type Side = { value: Record<string, unknown>; stamp: string; opId: string | null; author: string | null };

export async function listConflicts(office: Office, filter: ConflictFilter) {
  const db = getDb();
  const technician = alias(s.user, 'technician');
  const resolver = alias(s.user, 'resolver');
  const where: SQL[] = [eq(s.conflicts.organisationId, office.organisationId)];
  if (filter.visitId) where.push(eq(s.conflicts.visitId, filter.visitId));
  if (filter.status === 'open') where.push(isNull(s.conflicts.resolvedAt));
  if (filter.status === 'resolved') where.push(isNotNull(s.conflicts.resolvedAt));
  if (filter.kind) where.push(eq(s.conflicts.kind, filter.kind));
  if (filter.reason) where.push(eq(s.conflicts.reason, filter.reason));
  if (filter.technicianId) where.push(eq(s.visits.technicianId, filter.technicianId));

  const base = db
    .select({
      conflict: s.conflicts,
      visit: { id: s.visits.id, roundDate: s.visits.roundDate, status: s.visits.status, technicianId: s.visits.technicianId },
      technicianName: technician.name,
      registration: s.vehicles.registration,
      vehicle: sql<string>`${s.vehicles.make} || ' ' || ${s.vehicles.model}`,
      customerName: s.customers.name,
      resolvedByName: resolver.name,
    })
    .from(s.conflicts)
    .innerJoin(s.visits, eq(s.visits.id, s.conflicts.visitId))
    .innerJoin(technician, eq(technician.id, s.visits.technicianId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .leftJoin(resolver, eq(resolver.id, s.conflicts.resolvedBy))
    .where(and(...where));
  const [rows, [total]] = await Promise.all([
    base.orderBy(isNull(s.conflicts.resolvedAt), desc(s.conflicts.createdAt), asc(s.conflicts.id)).limit(filter.limit).offset(filter.offset),
    db
      .select({ n: count() })
      .from(s.conflicts)
      .innerJoin(s.visits, eq(s.visits.id, s.conflicts.visitId))
      .where(and(...where)),
  ]);

  const sides = rows.flatMap((r) => [r.conflict.proposed as Side, r.conflict.standing as Side | null]).filter((x): x is Side => x !== null);
  const names = await userNames([...new Set(sides.map((x) => x.author).filter((a): a is string => a !== null))]);
  const labels = await itemLabels(rows.map((r) => r.conflict));
  const describeSide = (side: Side | null, kind: string) =>
    side && {
      value: side.value,
      text: describeValue(kind, side.value),
      stamp: side.stamp,
      at: isStamp(side.stamp) ? new Date(decodeStamp(side.stamp).wallMs).toISOString() : null,
      opId: side.opId,
      author: side.author ? { id: side.author, name: names.get(side.author) ?? 'someone no longer here' } : null,
    };

  return {
    total: total?.n ?? 0,
    conflicts: rows.map((r) => ({
      id: r.conflict.id,
      visit: { ...r.visit, technicianName: r.technicianName, registration: r.registration, vehicle: r.vehicle, customerName: r.customerName },
      kind: r.conflict.kind,
      entityId: r.conflict.entityId,
      subject: subjectOf(r.conflict.kind, r.conflict.proposed as Side, labels, r.conflict.entityId),
      reason: r.conflict.reason,
      proposed: describeSide(r.conflict.proposed as Side, r.conflict.kind)!,
      standing: describeSide(r.conflict.standing as Side | null, r.conflict.kind),
      receivedAt: r.conflict.createdAt.toISOString(),
      resolvedAt: r.conflict.resolvedAt?.toISOString() ?? null,
      resolvedBy: r.resolvedByName,
      resolution: r.conflict.resolution,
    })),
  };
}

async function userNames(ids: string[]) {
  if (ids.length === 0) return new Map<string, string>();
  const rows = await getDb().select({ id: s.user.id, name: s.user.name }).from(s.user).where(inArray(s.user.id, ids));
  return new Map(rows.map((r) => [r.id, r.name]));
}

/** Checklist labels for the items conflicts name (a check or reading is keyed by its item). */
async function itemLabels(conflicts: { kind: string; entityId: string; proposed: unknown }[]) {
  const ids = new Set<string>();
  for (const c of conflicts) {
    if (c.kind === 'check' || c.kind === 'reading') ids.add(c.entityId);
    const itemId = (c.proposed as Side).value.itemId;
    if (typeof itemId === 'string') ids.add(itemId);
  }
  const uuidLike = [...ids].filter((id) => /^[0-9a-f-]{36}$/i.test(id));
  if (uuidLike.length === 0) return new Map<string, string>();
  const rows = await getDb().select({ id: s.templateItems.id, label: s.templateItems.label }).from(s.templateItems).where(inArray(s.templateItems.id, uuidLike));
  return new Map(rows.map((r) => [r.id, r.label]));
}

export type Resolution = { use: 'standing' | 'proposed'; keepOtherAsNote: boolean; reopen: boolean };

export async function resolveConflict(office: Office, conflictId: string, choice: Resolution, nowMs = Date.now()) {
  return withChangeFeedWrite(office.organisationId, async (tx) => {
    const [conflict] = await tx
      .select()
      .from(s.conflicts)
      .where(and(eq(s.conflicts.id, conflictId), eq(s.conflicts.organisationId, office.organisationId)))
      .for('update');
    if (!conflict) throw new HttpError(404, 'No such conflict.');
    if (conflict.resolvedAt) throw new HttpError(409, 'This conflict is already resolved.');
    const proposed = conflict.proposed as Side;
    const standing = conflict.standing as Side | null;
    const clock = await ServerClock.load(tx, office.organisationId);
    let resolution: string;

    if (choice.use === 'proposed') {
      const locked = await visitLocked(tx, conflict.visitId);
      if (locked && !choice.reopen) {
        throw new HttpError(409, 'The visit is signed off. Reopen it to use this value (send reopen: true).');
      }
      if (locked) await reopenVisit(tx, office, conflict.visitId);
      const op = await officeOperation(tx, conflict.kind as OperationKind, conflict.entityId, conflict.visitId, proposed, clock, nowMs);
      const [result] = await applyBatch(tx, office, SERVER_DEVICE_ID, [op], clock, nowMs);
      if (result?.outcome !== 'applied') {
        throw new HttpError(409, `The value could not be applied: ${result?.reason ?? result?.outcome}.`);
      }
      resolution = locked ? 'reopened the visit and used the other value' : 'used the other value';
      if (choice.keepOtherAsNote && standing) await addNote(tx, office, conflict.visitId, noteText('Replaced', conflict.kind, standing), clock, nowMs);
    } else {
      resolution = 'kept the standing value';
      if (choice.keepOtherAsNote) await addNote(tx, office, conflict.visitId, noteText('Not used', conflict.kind, proposed), clock, nowMs);
    }
    if (choice.keepOtherAsNote) resolution += '; the other is kept as a note';
    await tx
      .update(s.conflicts)
      .set({ resolvedAt: new Date(nowMs), resolvedBy: office.id, resolution, changeSeq: s.nextChangeSeq })
      .where(eq(s.conflicts.id, conflictId));
    await clock.save(tx);
    return { id: conflictId, resolution };
  });
}

async function visitLocked(tx: Transaction, visitId: string) {
  const [live] = await tx.select({ id: s.signOffs.id }).from(s.signOffs).where(and(eq(s.signOffs.visitId, visitId), isNull(s.signOffs.voidedAt)));
  const [visit] = await tx.select({ status: s.visits.status }).from(s.visits).where(eq(s.visits.id, visitId));
  return Boolean(live) || ['signed_off', 'reviewed', 'invoiced', 'paid'].includes(visit?.status ?? '');
}

/** The office's operation that puts the proposed value in place, stamped after what stands. */
async function officeOperation(
  tx: Transaction,
  kind: OperationKind,
  entityId: string,
  visitId: string,
  proposed: Side,
  clock: ServerClock,
  nowMs: number,
): Promise<Operation> {
  const current = await currentStamp(tx, kind, entityId, visitId);
  const envelope = {
    opId: randomUUID(),
    visitId,
    deviceId: SERVER_DEVICE_ID,
    stamp: clock.next(nowMs, current ?? undefined),
    // The office has seen what stands, so using the other value is not a new concurrent edit.
    seenStamp: current,
  };
  const v = proposed.value;
  switch (kind) {
    case 'check':
      return { ...envelope, kind, payload: { itemId: entityId, state: v.state as 'done' } };
    case 'reading':
      return { ...envelope, kind, payload: { itemId: entityId, value: v.value as number | null, textValue: v.textValue as string | null, unit: String(v.unit) } };
    case 'finding': {
      const [f] = await tx.select().from(s.findings).where(eq(s.findings.id, entityId));
      return {
        ...envelope,
        kind,
        payload: {
          findingId: entityId,
          itemId: (v.itemId as string | null | undefined) ?? f?.itemId ?? null,
          title: (v.title as string | undefined) ?? f?.title ?? 'Finding',
          detail: (v.detail as string | undefined) ?? f?.detail ?? '',
          severity: v.severity as 'ok',
          // The office's choice stands as a reset, whether it lowers the severity or raises it.
          downgrade: true,
        },
      };
    }
    case 'note':
      return { ...envelope, kind, payload: { noteId: randomUUID(), body: String(v.body) } };
    default:
      // Operations kept from a locked or reassigned visit carry their whole payload.
      return { ...envelope, kind, payload: v } as Operation;
  }
}

async function currentStamp(tx: Transaction, kind: OperationKind, entityId: string, visitId: string): Promise<Stamp | null> {
  const one = async (q: Promise<{ stamp: string }[]>) => ((await q)[0]?.stamp ?? null) as Stamp | null;
  switch (kind) {
    case 'check':
      return one(tx.select({ stamp: s.checkResults.stamp }).from(s.checkResults).where(and(eq(s.checkResults.visitId, visitId), eq(s.checkResults.itemId, entityId))));
    case 'reading':
      return one(tx.select({ stamp: s.readingResults.stamp }).from(s.readingResults).where(and(eq(s.readingResults.visitId, visitId), eq(s.readingResults.itemId, entityId))));
    case 'finding':
      return one(tx.select({ stamp: s.findings.stamp }).from(s.findings).where(eq(s.findings.id, entityId)));
    case 'photo.add':
    case 'photo.remove':
      return one(tx.select({ stamp: s.photos.addStamp }).from(s.photos).where(eq(s.photos.id, entityId)));
    case 'part_line':
      return one(tx.select({ stamp: s.partLines.stamp }).from(s.partLines).where(eq(s.partLines.id, entityId)));
    default:
      return null;
  }
}

function noteText(prefix: string, kind: string, side: Side) {
  const when = isStamp(side.stamp) ? new Date(decodeStamp(side.stamp).wallMs).toISOString().slice(0, 16).replace('T', ' ') : '';
  return `${prefix} after a sync conflict (${kind.replace('_', ' ')}): ${describeValue(kind, side.value)}${when ? `, recorded ${when} UTC` : ''}.`;
}

/** An office note: written directly, since it annotates the visit rather than changing its record. */
async function addNote(tx: Transaction, office: Office, visitId: string, body: string, clock: ServerClock, nowMs: number) {
  await tx.insert(s.visitNotes).values({ id: randomUUID(), visitId, body, authorId: office.id, stamp: clock.next(nowMs) });
}
