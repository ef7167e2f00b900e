// Loads, for the visits of one push, the ledger the merge engine works on: the visit's lock
// state and checklist items, and the standing value and history of each thing the batch names
// (not the whole visit: a batch's cost stays proportional to its size).
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../../../db/client';
import * as s from '../../../db/schema';
import type { Stamp } from '../../sync/clock';
import { entityIdOf, type Operation } from '../../sync/operations';
import { emptyLedger, historyKey, type ItemKind, type Ledger } from '../../sync/ledger';
import { logOfSingleEvent } from '../../sync/severity-log';
import { asStanding } from '../../sync/standing';
import type { HistoryEntry } from '../../sync/history';

export type VisitRow = Pick<typeof s.visits.$inferSelect, 'id' | 'organisationId' | 'technicianId' | 'templateVersionId' | 'status'>;

const stamp = (value: string) => value as Stamp;

// Published checklist versions never change, so their items are cached for the process's life.
const itemsByVersion = new Map<string, ReadonlyMap<string, ItemKind>>();
const ITEM_CACHE_LIMIT = 500;

async function checklistItems(db: Executor, versionIds: string[]) {
  const result = new Map<string, Map<string, ItemKind>>();
  const missing: string[] = [];
  for (const id of versionIds) {
    const cached = itemsByVersion.get(id);
    if (cached) result.set(id, cached as Map<string, ItemKind>);
    else missing.push(id);
  }
  if (missing.length === 0) return result;
  const rows = await db
    .select({ id: s.templateItems.id, versionId: s.templateItems.versionId, kind: s.templateItems.kind, status: s.templateVersions.status })
    .from(s.templateItems)
    .innerJoin(s.templateVersions, eq(s.templateVersions.id, s.templateItems.versionId))
    .where(inArray(s.templateItems.versionId, missing));
  for (const id of missing) result.set(id, new Map());
  for (const row of rows) result.get(row.versionId)!.set(row.id, row.kind);
  if (itemsByVersion.size > ITEM_CACHE_LIMIT) itemsByVersion.clear();
  // Only a published (or retired) version is frozen; a draft may still gain items.
  for (const row of rows) if (row.status !== 'draft') itemsByVersion.set(row.versionId, result.get(row.versionId)!);
  return result;
}

/** Where a device-made id already lives: "table:id" to its visit (see `ownerOf`). */
export type IdOwners = ReadonlyMap<string, string>;

/** The visit that already holds the thing an operation names by a device-made id, if any. */
export function ownerOf(owners: IdOwners, op: Operation): string | undefined {
  const table = op.kind.startsWith('photo.') ? 'photo' : op.kind;
  return owners.get(`${table}:${entityIdOf(op)}`);
}

// Visits in these states have a live sign-off; no other state does (a sign-off sets signed_off,
// reopening voids it), so only these need their sign-off loaded.
const SIGNED = ['signed_off', 'reviewed', 'invoiced', 'paid'];

export async function loadLedgers(db: Executor, visits: VisitRow[], operations: Operation[]): Promise<{ ledgers: Map<string, Ledger>; owners: IdOwners }> {
  const visitIds = visits.map((v) => v.id);
  const items = await checklistItems(db, [...new Set(visits.map((v) => v.templateVersionId))]);
  const ledgers = new Map(visits.map((v) => [v.id, emptyLedger(v.id, items.get(v.templateVersionId)!, v.status)] as const));
  const owners = new Map<string, string>();
  if (visitIds.length === 0) return { ledgers, owners };
  const signed = visits.filter((v) => SIGNED.includes(v.status)).map((v) => v.id);

  const ids = (kinds: Operation['kind'][]) => [...new Set(operations.filter((o) => kinds.includes(o.kind)).map(entityIdOf))];
  const within = <T extends { visitId: unknown }>(table: T) => inArray(table.visitId as never, visitIds);
  const ledgerOf = (visitId: string) => ledgers.get(visitId)!;
  // Device-made ids are looked up whatever visit holds them: one of another visit must not be
  // touched, and finding it here spares a query of its own.
  const owned = <T extends { id: string; visitId: string }>(table: string, rows: T[]) => {
    for (const r of rows) owners.set(`${table}:${r.id}`, r.visitId);
    return rows.filter((r) => ledgers.has(r.visitId));
  };

  // One after another: these run on the transaction's single connection.
  const checks = await some(ids(['check']), (list) => db.select().from(s.checkResults).where(and(within(s.checkResults), inArray(s.checkResults.itemId, list))));
  const readings = await some(ids(['reading']), (list) => db.select().from(s.readingResults).where(and(within(s.readingResults), inArray(s.readingResults.itemId, list))));
  const findings = owned('finding', await some(ids(['finding']), (list) => db.select().from(s.findings).where(inArray(s.findings.id, list))));
  const notes = owned('note', await some(ids(['note']), (list) => db.select().from(s.visitNotes).where(inArray(s.visitNotes.id, list))));
  const photos = owned('photo', await some(ids(['photo.add', 'photo.remove']), (list) => db.select().from(s.photos).where(inArray(s.photos.id, list))));
  const lines = owned('part_line', await some(ids(['part_line']), (list) => db.select().from(s.partLines).where(inArray(s.partLines.id, list))));
  const signOffs = await some(signed, (list) => db.select().from(s.signOffs).where(and(inArray(s.signOffs.visitId, list), isNull(s.signOffs.voidedAt))));
  // History answers "had anyone seen the value that lost?": a first reading cannot lose, so only
  // readings that already stand need it; photos always do (a remove may have come before its add).
  const needHistory = [...new Set([...readings.map((r) => r.itemId), ...ids(['photo.add', 'photo.remove'])])];
  const history = await some(needHistory, (list) =>
      db
        .select({
          opId: s.syncOperations.opId,
          visitId: s.syncOperations.visitId,
          kind: s.syncOperations.kind,
          entityId: s.syncOperations.entityId,
          stamp: sql<string>`coalesce(${s.syncOperations.effectiveStamp}, ${s.syncOperations.stamp})`,
          seenStamp: s.syncOperations.seenStamp,
          deviceId: s.syncOperations.deviceId,
        })
        .from(s.syncOperations)
        .where(and(within(s.syncOperations), inArray(s.syncOperations.entityId, list))),
    );

  for (const r of checks) ledgerOf(r.visitId).checks.set(r.itemId, asStanding({ state: r.state, stamp: stamp(r.stamp), opId: r.opId, author: r.updatedBy }));
  for (const r of readings) {
    ledgerOf(r.visitId).readings.set(
      r.itemId,
      asStanding({ value: r.value, textValue: r.textValue, unit: r.unit, stamp: stamp(r.stamp), opId: r.opId, author: r.updatedBy }),
    );
  }
  for (const f of findings) {
    const severityStamp = stamp(f.severityStamp);
    ledgerOf(f.visitId).findings.set(
      f.id,
      asStanding({
        itemId: f.itemId,
        title: f.title,
        detail: f.detail,
        stamp: stamp(f.stamp),
        severity: f.severity,
        severityStamp,
        severityLog: f.severityLog ?? logOfSingleEvent({ stamp: severityStamp, severity: f.severity, opId: null }),
        author: f.createdBy,
      }),
    );
  }
  for (const n of notes) ledgerOf(n.visitId).notes.set(n.id, asStanding({ body: n.body, stamp: stamp(n.stamp), author: n.authorId }));
  for (const p of photos) {
    const { id, visitId, objectKey: _o, thumbnailKey: _t, addStamp, removedStamp, createdBy, createdAt: _c, changeSeq: _s, ...photo } = p;
    ledgerOf(visitId).photos.set(
      id,
      asStanding({ ...photo, addStamp: stamp(addStamp), removedStamp: removedStamp ? stamp(removedStamp) : null, author: createdBy }),
    );
  }
  for (const l of lines) {
    const { id, visitId, stamp: lineStamp, updatedBy, changeSeq: _s, ...line } = l;
    ledgerOf(visitId).partLines.set(id, asStanding({ ...line, stamp: stamp(lineStamp), opId: null, author: updatedBy }));
  }
  for (const so of signOffs) {
    ledgerOf(so.visitId).liveSignOff = asStanding({
      id: so.id,
      odometer: so.odometer,
      odometerUnit: so.odometerUnit,
      customerName: so.customerName,
      signatureSvg: so.signatureSvg,
      declaration: so.declaration,
      technicianId: so.technicianId,
      signedAt: so.signedAt.toISOString(),
      stamp: stamp(so.stamp),
      opId: so.opId,
    });
  }
  for (const h of history) {
    const entry: HistoryEntry = {
      opId: h.opId,
      kind: h.kind as HistoryEntry['kind'],
      entityId: h.entityId,
      stamp: stamp(h.stamp),
      seenStamp: h.seenStamp ? stamp(h.seenStamp) : null,
      deviceId: h.deviceId,
    };
    const ledger = ledgerOf(h.visitId);
    const key = historyKey(entry.kind, entry.entityId);
    ledger.history.set(key, [...(ledger.history.get(key) ?? []), entry]);
  }
  return { ledgers, owners };
}

async function some<T>(list: string[], query: (list: string[]) => Promise<T[]>): Promise<T[]> {
  return list.length ? query(list) : [];
}
