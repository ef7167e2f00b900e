// GET /api/sync/pull as a service: the rows that changed after the device's cursor, for what
// this user may see, in pages that end on a change_seq every row up to which is committed
// (change-feed.ts).
//
// A technician sees the visits of their own round from VISIT_HISTORY_DAYS ago onwards; office
// and owner see every visit of the organisation in that window. With a visit they get what it
// needs offline: its customer, vehicle, checklist version, the vehicle's parts and model notes.
// When a visit row itself changes (booked, moved to this technician, status) the page carries the
// whole visit with all its records, so a visit that just came into sight arrives complete even
// though its older rows sit below the cursor.
import { and, asc, eq, gt, gte, inArray, isNotNull, lte, or, sql, type Column } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import * as s from '../../../db/schema';
import type { UserRole } from '../../../db/schema';
import { HttpError } from '../http';
import { committedChangeSeq } from '../change-feed';
import type { PullResponse } from '../../sync/pull';
import { logOfSingleEvent } from '../../sync/severity-log';
import type { Stamp } from '../../sync/clock';

/** Changed rows per page before visit snapshots; a phone stores a page in one IndexedDB transaction. */
export const PULL_PAGE_SIZE = 500;
/** How far back a round stays on the phone: last week's visits answer the customer's questions. */
export const VISIT_HISTORY_DAYS = 14;

export type Puller = { id: string; role: UserRole; organisationId: string };

type Range = { after: number; upTo: number };

export async function pullChanges(user: Puller, cursor: number, pageSize = PULL_PAGE_SIZE, today = new Date()): Promise<PullResponse> {
  const committed = await committedChangeSeq(user.organisationId);
  if (cursor > committed) {
    throw new HttpError(409, 'The cursor is ahead of this server (its data was replaced). Pull again from cursor 0.');
  }
  const db = getDb();
  const visible = await visibleVisits(user, today);
  const visitIds = visible.map((v) => v.id);
  const upTo = await pageEnd(user, visible, { after: cursor, upTo: committed }, pageSize);
  const range = { after: cursor, upTo };
  const inRange = (column: Column) => and(gt(column, range.after), lte(column, range.upTo));

  const changedVisitRows = visitIds.length ? await db.select().from(s.visits).where(and(inArray(s.visits.id, visitIds), inRange(s.visits.changeSeq))) : [];
  const snapshotIds = changedVisitRows.filter((v) => v.status !== 'cancelled').map((v) => v.id);
  const removedVisitIds = new Set(changedVisitRows.filter((v) => v.status === 'cancelled').map((v) => v.id));
  if (user.role === 'technician') {
    const removals = await db
      .select({ visitId: s.roundRemovals.visitId })
      .from(s.roundRemovals)
      .where(and(eq(s.roundRemovals.technicianId, user.id), inRange(s.roundRemovals.changeSeq)));
    const stillMine = new Set(visitIds);
    for (const r of removals) if (!stillMine.has(r.visitId)) removedVisitIds.add(r.visitId);
  }

  // Records: everything of the visits that came into sight, and what changed of the others.
  const records = await visitRecords(visitIds, snapshotIds, range);
  const keptVisits = visible.filter((v) => snapshotIds.includes(v.id));
  const customerIds = visible.map((v) => v.customerId);
  const vehicleIds = visible.map((v) => v.vehicleId);
  const [customers, vehicles] = await Promise.all([
    customerIds.length
      ? db
          .select()
          .from(s.customers)
          .where(and(inArray(s.customers.id, customerIds), or(inRange(s.customers.changeSeq), inArray(s.customers.id, keptVisits.map((v) => v.customerId)))))
      : [],
    vehicleIds.length
      ? db
          .select()
          .from(s.vehicles)
          .where(and(inArray(s.vehicles.id, vehicleIds), or(inRange(s.vehicles.changeSeq), inArray(s.vehicles.id, keptVisits.map((v) => v.vehicleId)))))
      : [],
  ]);
  const newVehicles = vehicles.filter((v) => keptVisits.some((k) => k.vehicleId === v.id));
  const [parts, modelNotes, templateVersions] = await Promise.all([
    referencedOrChangedParts(user.organisationId, newVehicles, range),
    matchingOrChangedNotes(user.organisationId, newVehicles, range),
    versions([...new Set(keptVisits.map((v) => v.templateVersionId))]),
  ]);

  return {
    cursor: String(upTo),
    hasMore: upTo < committed,
    removedVisitIds: [...removedVisitIds],
    visits: changedVisitRows.filter((v) => v.status !== 'cancelled').map(pulledVisit),
    customers: customers.map((c) => ({ id: c.id, name: c.name, phone: c.phone, addressLines: c.addressLines, postcode: c.postcode })),
    vehicles: vehicles.map(pulledVehicle),
    parts: parts.map((p) => ({ id: p.id, partNumber: p.partNumber, description: p.description, kind: p.kind, unit: p.unit, oilGrade: p.oilGrade })),
    modelNotes: modelNotes.map((n) => ({ id: n.id, make: n.make, model: n.model, engine: n.engine, title: n.title, body: n.body })),
    templateVersions,
    ...records,
  };
}

async function visibleVisits(user: Puller, today: Date) {
  const since = new Date(today.getTime() - VISIT_HISTORY_DAYS * 86_400_000).toISOString().slice(0, 10);
  const conditions = [eq(s.visits.organisationId, user.organisationId), gte(s.visits.roundDate, since)];
  if (user.role === 'technician') conditions.push(eq(s.visits.technicianId, user.id));
  return getDb()
    .select({ id: s.visits.id, customerId: s.visits.customerId, vehicleId: s.visits.vehicleId, templateVersionId: s.visits.templateVersionId })
    .from(s.visits)
    .where(and(...conditions));
}

/** The change_seq this page ends on: the `pageSize`-th change this user may see, or the watermark. */
async function pageEnd(user: Puller, visible: Awaited<ReturnType<typeof visibleVisits>>, range: Range, pageSize: number): Promise<number> {
  if (range.after >= range.upTo) return range.upTo;
  const ids = sql.param(visible.map((v) => v.id));
  const customers = sql.param([...new Set(visible.map((v) => v.customerId))]);
  const vehicles = sql.param([...new Set(visible.map((v) => v.vehicleId))]);
  const window = sql`change_seq > ${range.after} and change_seq <= ${range.upTo}`;
  const perVisit = (table: string) => sql`select change_seq from ${sql.identifier(table)} where visit_id = any(${ids}::uuid[]) and ${window}`;
  const removals =
    user.role === 'technician' ? sql`union all select change_seq from round_removals where technician_id = ${user.id} and ${window}` : sql``;
  const result = await getDb().execute<{ seq: string }>(sql`
    select change_seq::text as seq from (
      select change_seq from visits where id = any(${ids}::uuid[]) and ${window}
      union all ${perVisit('check_results')}
      union all ${perVisit('reading_results')}
      union all ${perVisit('findings')}
      union all ${perVisit('visit_notes')}
      union all ${perVisit('photos')}
      union all ${perVisit('part_lines')}
      union all ${perVisit('sign_offs')}
      union all select change_seq from customers where id = any(${customers}::uuid[]) and ${window}
      union all select change_seq from vehicles where id = any(${vehicles}::uuid[]) and ${window}
      union all select change_seq from model_notes where organisation_id = ${user.organisationId} and ${window}
      union all select change_seq from parts where organisation_id = ${user.organisationId} and ${window}
      ${removals}
    ) changes order by change_seq limit ${pageSize}`);
  return result.rows.length < pageSize ? range.upTo : Number(result.rows[result.rows.length - 1]!.seq);
}

async function visitRecords(visitIds: string[], snapshotIds: string[], range: Range) {
  const empty = { checkResults: [], readingResults: [], findings: [], notes: [], photos: [], partLines: [], signOffs: [] };
  if (visitIds.length === 0) return empty;
  const db = getDb();
  const pick = (t: { visitId: Column; changeSeq: Column }) => {
    const changed = and(inArray(t.visitId, visitIds), gt(t.changeSeq, range.after), lte(t.changeSeq, range.upTo));
    return snapshotIds.length ? or(changed, inArray(t.visitId, snapshotIds)) : changed;
  };
  const [checks, readings, findings, notes, photos, lines, signOffs] = await Promise.all([
    db.select().from(s.checkResults).where(pick(s.checkResults)),
    db.select().from(s.readingResults).where(pick(s.readingResults)),
    db.select().from(s.findings).where(pick(s.findings)),
    db.select().from(s.visitNotes).where(pick(s.visitNotes)).orderBy(asc(s.visitNotes.createdAt)),
    db.select().from(s.photos).where(pick(s.photos)),
    db.select().from(s.partLines).where(pick(s.partLines)),
    db.select().from(s.signOffs).where(pick(s.signOffs)),
  ]);
  return {
    checkResults: checks.map((c) => ({ visitId: c.visitId, itemId: c.itemId, state: c.state, stamp: c.stamp })),
    readingResults: readings.map((r) => ({ visitId: r.visitId, itemId: r.itemId, value: r.value, textValue: r.textValue, unit: r.unit, stamp: r.stamp })),
    findings: findings.map((f) => ({
      id: f.id,
      visitId: f.visitId,
      itemId: f.itemId,
      title: f.title,
      detail: f.detail,
      severity: f.severity,
      severityStamp: f.severityStamp,
      stamp: f.stamp,
      severityLog: f.severityLog ?? logOfSingleEvent({ stamp: f.severityStamp as Stamp, severity: f.severity, opId: null }),
    })),
    notes: notes.map((n) => ({ id: n.id, visitId: n.visitId, body: n.body, authorId: n.authorId, stamp: n.stamp })),
    photos: photos.map((p) => ({
      id: p.id,
      visitId: p.visitId,
      findingId: p.findingId,
      itemId: p.itemId,
      caption: p.caption,
      sha256: p.sha256,
      contentType: p.contentType,
      url: photoUrl(p.sha256),
      thumbnailUrl: p.thumbnailKey ? `${photoUrl(p.sha256)}/thumbnail` : null,
      addStamp: p.addStamp,
      removed: p.removedStamp !== null,
    })),
    partLines: lines.map(({ updatedBy: _u, changeSeq: _s, ...line }) => line),
    signOffs: signOffs.map((so) => ({
      id: so.id,
      visitId: so.visitId,
      odometer: so.odometer,
      odometerUnit: so.odometerUnit,
      customerName: so.customerName,
      signatureSvg: so.signatureSvg,
      declaration: so.declaration,
      technicianId: so.technicianId,
      signedAt: so.signedAt.toISOString(),
      stamp: so.stamp,
      voided: so.voidedAt !== null,
    })),
  };
}

/** Served by our own endpoint to signed-in users allowed to see a visit with this photo. */
export function photoUrl(sha256: string): string {
  return `/api/photos/${sha256}`;
}

async function referencedOrChangedParts(organisationId: string, vehicles: (typeof s.vehicles.$inferSelect)[], range: Range) {
  const referenced = vehicles.flatMap((v) =>
    [v.oilFilterPartId, v.airFilterPartId, v.cabinFilterPartId, v.fuelFilterPartId, v.sparkPlugPartId].filter((id): id is string => id !== null),
  );
  const grades = vehicles.map((v) => v.oilGrade).filter((g): g is string => g !== null);
  const changed = and(gt(s.parts.changeSeq, range.after), lte(s.parts.changeSeq, range.upTo));
  const needed = [changed];
  if (referenced.length) needed.push(inArray(s.parts.id, referenced));
  if (grades.length) needed.push(and(eq(s.parts.kind, 'oil'), isNotNull(s.parts.oilGrade), inArray(s.parts.oilGrade, grades)));
  return getDb()
    .select()
    .from(s.parts)
    .where(and(eq(s.parts.organisationId, organisationId), or(...needed)));
}

async function matchingOrChangedNotes(organisationId: string, vehicles: (typeof s.vehicles.$inferSelect)[], range: Range) {
  const changed = and(gt(s.modelNotes.changeSeq, range.after), lte(s.modelNotes.changeSeq, range.upTo));
  const matches = vehicles.map((v) =>
    and(eq(s.modelNotes.make, v.make), eq(s.modelNotes.model, v.model), or(eq(s.modelNotes.engine, ''), eq(s.modelNotes.engine, v.engine))),
  );
  return getDb()
    .select()
    .from(s.modelNotes)
    .where(and(eq(s.modelNotes.organisationId, organisationId), or(changed, ...matches)));
}

async function versions(ids: string[]) {
  if (ids.length === 0) return [];
  const db = getDb();
  const [versionRows, sections, items] = await Promise.all([
    db
      .select({ id: s.templateVersions.id, templateId: s.templateVersions.templateId, version: s.templateVersions.version, name: s.checklistTemplates.name })
      .from(s.templateVersions)
      .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
      .where(inArray(s.templateVersions.id, ids)),
    db.select().from(s.templateSections).where(inArray(s.templateSections.versionId, ids)).orderBy(asc(s.templateSections.position)),
    db.select().from(s.templateItems).where(inArray(s.templateItems.versionId, ids)).orderBy(asc(s.templateItems.position)),
  ]);
  return versionRows.map((v) => ({
    ...v,
    sections: sections
      .filter((sec) => sec.versionId === v.id)
      .map((sec) => ({
        id: sec.id,
        position: sec.position,
        title: sec.title,
        items: items
          .filter((i) => i.sectionId === sec.id)
          .map((i) => ({
            id: i.id,
            sectionId: i.sectionId,
            position: i.position,
            kind: i.kind,
            label: i.label,
            unit: i.unit,
            expectedMin: i.expectedMin,
            expectedMax: i.expectedMax,
            rule: i.rule,
            partKind: i.partKind,
            caution: i.caution,
            hint: i.hint,
          })),
      })),
  }));
}

function pulledVisit(v: typeof s.visits.$inferSelect) {
  return {
    id: v.id,
    customerId: v.customerId,
    vehicleId: v.vehicleId,
    technicianId: v.technicianId,
    templateVersionId: v.templateVersionId,
    roundDate: v.roundDate,
    roundPosition: v.roundPosition,
    slotStart: v.slotStart.toISOString(),
    slotEnd: v.slotEnd.toISOString(),
    addressLines: v.addressLines,
    postcode: v.postcode,
    accessNotes: v.accessNotes,
    status: v.status,
  };
}

function pulledVehicle(v: typeof s.vehicles.$inferSelect) {
  const { organisationId: _o, createdAt: _c, updatedAt: _u, changeSeq: _s, ...rest } = v;
  return rest;
}
