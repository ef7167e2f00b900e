// Stores one page of GET /api/sync/pull in the device database, in one transaction with the new
// cursor: a page is either stored whole or not at all, so the cursor never runs ahead of the data.
import type { Stamp } from '../sync/clock';
import type { PullResponse } from '../sync/pull';
import type { DeviceDb, LocalPhoto, OutboxEntry } from './db';
import { keepLocal, severityToShow } from './pull-merge';

type UnsentIndex = Map<string, string[]>;

const keyOf = (visitId: string, kind: string, entityId: string) => `${visitId}|${kind}|${entityId}`;

function indexUnsent(entries: OutboxEntry[]): UnsentIndex {
  const index: UnsentIndex = new Map();
  for (const entry of entries) {
    const key = keyOf(entry.visitId, entry.kind, entry.entityId);
    const stamps = index.get(key) ?? [];
    stamps.push(entry.op.stamp);
    index.set(key, stamps);
  }
  return index;
}

/**
 * `replace`: the page is the server's whole view (a pull from no cursor). Records of its visits
 * that the server does not hold and no unsent operation touches are dropped: an operation the
 * server overruled (say, a finding added to a visit the office had locked) leaves nothing behind.
 */
export async function storePulledPage(db: DeviceDb, page: PullResponse, options: { replace?: boolean } = {}): Promise<void> {
  await db.transaction(
    'rw',
    db.tables,
    async () => {
      // Rejected operations count too: what they recorded is still on the phone and must stay visible.
      const unsent = indexUnsent(await db.outbox.toArray());
      const stampsFor = (visitId: string, kind: string, entityId: string) => unsent.get(keyOf(visitId, kind, entityId)) ?? [];

      if (options.replace) await dropWhatTheServerLacks(db, page, (visitId, kind, entityId) => stampsFor(visitId, kind, entityId).length > 0);
      await db.customers.bulkPut(page.customers);
      await db.vehicles.bulkPut(page.vehicles);
      await db.parts.bulkPut(page.parts);
      await db.modelNotes.bulkPut(page.modelNotes);
      await db.templateVersions.bulkPut(page.templateVersions);
      await db.visits.bulkPut(page.visits);

      for (const row of page.checkResults) {
        if (keepLocal(row.stamp, stampsFor(row.visitId, 'check', row.itemId))) continue;
        await db.checkResults.put({ visitId: row.visitId, itemId: row.itemId, state: row.state, stamp: row.stamp as Stamp });
      }
      for (const row of page.readingResults) {
        if (keepLocal(row.stamp, stampsFor(row.visitId, 'reading', row.itemId))) continue;
        const { visitId, itemId, value, textValue, unit } = row;
        await db.readingResults.put({ visitId, itemId, value, textValue, unit, stamp: row.stamp as Stamp });
      }
      for (const row of page.findings) {
        const stamps = stampsFor(row.visitId, 'finding', row.id);
        const local = await db.findings.get(row.id);
        const severity = local ? severityToShow(local.severity, row.severity, stamps.length > 0) : row.severity;
        if (local && keepLocal(row.stamp, stamps)) {
          await db.findings.put({ ...local, severity });
          continue;
        }
        const { id, visitId, itemId, title, detail } = row;
        await db.findings.put({ id, visitId, itemId, title, detail, severity, stamp: row.stamp as Stamp });
      }
      for (const row of page.notes) {
        // Notes are only ever added, so the first copy is the copy.
        if (!(await db.notes.get(row.id))) {
          await db.notes.put({ id: row.id, visitId: row.visitId, body: row.body, stamp: row.stamp as Stamp });
        }
      }
      for (const row of page.photos) await storePulledPhoto(db, row, stampsFor(row.visitId, 'photo.remove', row.id));
      for (const row of page.partLines) {
        if (keepLocal(row.stamp, stampsFor(row.visitId, 'part_line', row.id))) continue;
        const { id, visitId, itemId, partId, partNumber, description, quantity, unit, removed } = row;
        await db.partLines.put({ id, visitId, itemId, partId, partNumber, description, quantity, unit, removed, stamp: row.stamp as Stamp });
      }
      for (const row of page.signOffs) {
        if (stampsFor(row.visitId, 'sign_off', row.visitId).length > 0) continue;
        const local = await db.signOffs.get(row.visitId);
        if (row.voided) {
          // The office reopened the visit: the lock goes, unless a newer sign-off replaced it.
          if (local?.id === row.id) await db.signOffs.delete(row.visitId);
          continue;
        }
        const { id, visitId, odometer, odometerUnit, customerName, signatureSvg, declaration, signedAt } = row;
        await db.signOffs.put({ id, visitId, odometer, odometerUnit, customerName, signatureSvg, declaration, signedAt, stamp: row.stamp as Stamp });
      }

      for (const visitId of page.removedVisitIds) await forgetVisit(db, visitId);
      await db.meta.put({ key: 'cursor', value: page.cursor });
    },
  );
}

async function dropWhatTheServerLacks(db: DeviceDb, page: PullResponse, unsent: (visitId: string, kind: string, entityId: string) => boolean) {
  // Visits missing from the whole view have left this round.
  const inView = new Set(page.visits.map((v) => v.id));
  for (const visitId of await db.visits.toCollection().primaryKeys()) {
    if (!inView.has(visitId)) await forgetVisit(db, visitId);
  }
  const keep = (visitId: string, kinds: string[], entityId: string, pulled: Set<string>) =>
    pulled.has(entityId) || kinds.some((kind) => unsent(visitId, kind, entityId));
  for (const { id: visitId } of page.visits) {
    const pulledItems = (rows: { visitId: string; itemId: string }[]) => new Set(rows.filter((r) => r.visitId === visitId).map((r) => r.itemId));
    const pulledIds = (rows: { visitId: string; id: string }[]) => new Set(rows.filter((r) => r.visitId === visitId).map((r) => r.id));
    const checks = pulledItems(page.checkResults);
    const readings = pulledItems(page.readingResults);
    const findings = pulledIds(page.findings);
    const photos = pulledIds(page.photos);
    const lines = pulledIds(page.partLines);
    await db.checkResults.where('visitId').equals(visitId).filter((r) => !keep(visitId, ['check'], r.itemId, checks)).delete();
    await db.readingResults.where('visitId').equals(visitId).filter((r) => !keep(visitId, ['reading'], r.itemId, readings)).delete();
    await db.findings.where('visitId').equals(visitId).filter((r) => !keep(visitId, ['finding'], r.id, findings)).delete();
    await db.partLines.where('visitId').equals(visitId).filter((r) => !keep(visitId, ['part_line'], r.id, lines)).delete();
    // Photo rows only: the bytes stay in photoBlobs under their hash, still viewable offline.
    await db.photos.where('visitId').equals(visitId).filter((r) => !keep(visitId, ['photo.add', 'photo.remove'], r.id, photos)).delete();
    const liveSignOff = page.signOffs.some((so) => so.visitId === visitId && !so.voided);
    if (!liveSignOff && !unsent(visitId, 'sign_off', visitId)) await db.signOffs.delete(visitId);
  }
}

async function storePulledPhoto(db: DeviceDb, row: PullResponse['photos'][number], unsentRemoves: string[]) {
  const local = await db.photos.get(row.id);
  const removed = unsentRemoves.length > 0 ? true : row.removed;
  if (local) {
    await db.photos.put({ ...local, uploaded: true, removed, remoteUrl: row.thumbnailUrl ?? row.url });
    return;
  }
  const photo: LocalPhoto = {
    id: row.id,
    visitId: row.visitId,
    findingId: row.findingId,
    itemId: row.itemId,
    caption: row.caption,
    sha256: row.sha256,
    contentType: row.contentType,
    sizeBytes: 0,
    width: null,
    height: null,
    uploaded: true,
    remoteUrl: row.thumbnailUrl ?? row.url,
    removed,
    stamp: row.addStamp as Stamp,
    takenAt: '',
  };
  await db.photos.put(photo);
}

/**
 * A visit that left this round. Its records go, unless the outbox still holds changes to it:
 * then it is only hidden, and goes once those are acknowledged (`sweepGoneVisits`).
 */
async function forgetVisit(db: DeviceDb, visitId: string) {
  if ((await db.outbox.where('visitId').equals(visitId).count()) > 0) {
    await db.visits.update(visitId, { gone: true });
    return;
  }
  await deleteVisitRecords(db, visitId);
}

async function deleteVisitRecords(db: DeviceDb, visitId: string) {
  const photos = await db.photos.where('visitId').equals(visitId).toArray();
  for (const photo of photos) {
    const others = await db.photos.where('sha256').equals(photo.sha256).count();
    if (others <= 1) await db.photoBlobs.delete(photo.sha256);
  }
  await db.photos.where('visitId').equals(visitId).delete();
  await db.checkResults.where('visitId').equals(visitId).delete();
  await db.readingResults.where('visitId').equals(visitId).delete();
  await db.findings.where('visitId').equals(visitId).delete();
  await db.notes.where('visitId').equals(visitId).delete();
  await db.partLines.where('visitId').equals(visitId).delete();
  await db.signOffs.delete(visitId);
  await db.visits.delete(visitId);
}

/** Drops hidden visits whose last unsent change has been acknowledged. */
export async function sweepGoneVisits(db: DeviceDb): Promise<void> {
  await db.transaction('rw', [db.visits, db.photos, db.photoBlobs, db.checkResults, db.readingResults, db.findings, db.notes, db.partLines, db.signOffs, db.outbox], async () => {
    const gone = await db.visits.filter((v) => v.gone === true).toArray();
    for (const visit of gone) {
      if ((await db.outbox.where('visitId').equals(visit.id).count()) === 0) await deleteVisitRecords(db, visit.id);
    }
  });
}
