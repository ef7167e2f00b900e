// Writes back what the engine changed in a batch's ledgers: one multi-row upsert per table, each
// row taking a fresh change_seq so the next pull carries it. Run inside the push transaction.
import { inArray, sql, type SQL } from 'drizzle-orm';
import type { PgColumn, PgTable } from 'drizzle-orm/pg-core';
import type { Transaction } from '../../../db/client';
import * as s from '../../../db/schema';
import { nextChangeSeq } from '../../../db/schema';
import type { Ledger } from '../../sync/ledger';
import { photoKeys } from '../photos/photo-bytes';

function dirtyOf(ledger: Ledger, table: string): string[] {
  const prefix = `${table}:`;
  return [...ledger.dirty].filter((k) => k.startsWith(prefix)).map((k) => k.slice(prefix.length));
}

/**
 * `insert ... on conflict (target) do update` taking the new values of `columns` and a new
 * change_seq. Only ever updates a row of the same visit: ids made on devices are checked for
 * clashes with other visits before the merge (push.ts), and this guard holds even if they were not.
 */
async function upsert<T extends PgTable & { visitId: PgColumn }>(
  tx: Transaction,
  table: T,
  rows: T['$inferInsert'][],
  target: PgColumn[],
  columns: PgColumn[],
) {
  if (rows.length === 0) return;
  const set: Record<string, SQL> = { changeSeq: nextChangeSeq };
  const byName = Object.entries(table as unknown as Record<string, unknown>);
  for (const column of columns) {
    const key = byName.find(([, value]) => value === column)?.[0];
    if (!key) throw new Error(`column ${column.name} is not in the table`);
    set[key] = sql.raw(`excluded."${column.name}"`);
  }
  await tx
    .insert(table)
    .values(rows)
    .onConflictDoUpdate({ target, set, setWhere: sql`${table.visitId} = excluded."visit_id"` });
}

export async function persistLedgers(tx: Transaction, organisationId: string, ledgers: Iterable<Ledger>) {
  const checks: (typeof s.checkResults.$inferInsert)[] = [];
  const readings: (typeof s.readingResults.$inferInsert)[] = [];
  const findings: (typeof s.findings.$inferInsert)[] = [];
  const notes: (typeof s.visitNotes.$inferInsert)[] = [];
  const photos: (typeof s.photos.$inferInsert)[] = [];
  const lines: (typeof s.partLines.$inferInsert)[] = [];
  const signOffs: (typeof s.signOffs.$inferInsert)[] = [];
  const statuses = new Map<string, string[]>();

  for (const ledger of ledgers) {
    const visitId = ledger.visitId;
    if (ledger.dirty.has('visit')) statuses.set(ledger.status, [...(statuses.get(ledger.status) ?? []), visitId]);
    for (const itemId of dirtyOf(ledger, 'check')) {
      const c = ledger.checks.get(itemId)!;
      checks.push({ visitId, itemId, state: c.state, stamp: c.stamp, opId: c.opId!, updatedBy: c.author! });
    }
    for (const itemId of dirtyOf(ledger, 'reading')) {
      const r = ledger.readings.get(itemId)!;
      readings.push({ visitId, itemId, value: r.value, textValue: r.textValue, unit: r.unit, stamp: r.stamp, opId: r.opId!, updatedBy: r.author! });
    }
    for (const id of dirtyOf(ledger, 'finding')) {
      const f = ledger.findings.get(id)!;
      findings.push({
        id,
        visitId,
        itemId: f.itemId,
        title: f.title,
        detail: f.detail,
        severity: f.severity,
        severityStamp: f.severityStamp,
        severityLog: f.severityLog,
        stamp: f.stamp,
        createdBy: f.author!,
      });
    }
    for (const id of dirtyOf(ledger, 'note')) {
      const n = ledger.notes.get(id)!;
      notes.push({ id, visitId, body: n.body, authorId: n.author!, stamp: n.stamp });
    }
    for (const id of dirtyOf(ledger, 'photo')) {
      const p = ledger.photos.get(id)!;
      // Keys derive from the hash; the push checked the bytes are stored before any photo.add.
      const stored = photoKeys(organisationId, p.sha256);
      photos.push({
        id,
        visitId,
        findingId: p.findingId,
        itemId: p.itemId,
        caption: p.caption,
        objectKey: stored.objectKey,
        thumbnailKey: stored.thumbnailKey,
        sha256: p.sha256,
        sizeBytes: p.sizeBytes,
        contentType: p.contentType,
        width: p.width,
        height: p.height,
        addStamp: p.addStamp,
        removedStamp: p.removedStamp,
        createdBy: p.author!,
      });
    }
    for (const id of dirtyOf(ledger, 'part_line')) {
      const l = ledger.partLines.get(id)!;
      const { stamp, opId: _opId, author, ...line } = l;
      lines.push({ id, visitId, ...line, stamp, updatedBy: author! });
    }
    for (const id of dirtyOf(ledger, 'sign_off')) {
      const so = ledger.liveSignOff!;
      if (so.id !== id) continue;
      signOffs.push({ ...so, visitId, signedAt: new Date(so.signedAt), opId: so.opId! });
    }
  }

  const t = s;
  await upsert(tx, t.checkResults, checks, [t.checkResults.visitId, t.checkResults.itemId], [
    t.checkResults.state,
    t.checkResults.stamp,
    t.checkResults.opId,
    t.checkResults.updatedBy,
  ]);
  await upsert(tx, t.readingResults, readings, [t.readingResults.visitId, t.readingResults.itemId], [
    t.readingResults.value,
    t.readingResults.textValue,
    t.readingResults.unit,
    t.readingResults.stamp,
    t.readingResults.opId,
    t.readingResults.updatedBy,
  ]);
  await upsert(tx, t.findings, findings, [t.findings.id], [
    t.findings.itemId,
    t.findings.title,
    t.findings.detail,
    t.findings.severity,
    t.findings.severityStamp,
    t.findings.severityLog,
    t.findings.stamp,
  ]);
  if (notes.length) await tx.insert(t.visitNotes).values(notes);
  await upsert(tx, t.photos, photos, [t.photos.id], [
    t.photos.findingId,
    t.photos.itemId,
    t.photos.caption,
    t.photos.objectKey,
    t.photos.thumbnailKey,
    t.photos.sha256,
    t.photos.sizeBytes,
    t.photos.contentType,
    t.photos.width,
    t.photos.height,
    t.photos.addStamp,
    t.photos.removedStamp,
  ]);
  await upsert(tx, t.partLines, lines, [t.partLines.id], [
    t.partLines.itemId,
    t.partLines.partId,
    t.partLines.partNumber,
    t.partLines.description,
    t.partLines.quantity,
    t.partLines.unit,
    t.partLines.removed,
    t.partLines.stamp,
    t.partLines.updatedBy,
  ]);
  if (signOffs.length) await tx.insert(t.signOffs).values(signOffs);
  for (const [status, ids] of statuses) {
    await tx
      .update(t.visits)
      .set({ status: status as s.VisitStatus, updatedAt: new Date(), changeSeq: nextChangeSeq })
      .where(inArray(t.visits.id, ids));
  }
}
