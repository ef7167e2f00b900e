// The visits table and the review of one visit: what the technician recorded, as it synced in,
// with the history of operations and any conflicts, and "mark reviewed".
import { and, asc, count, desc, eq, exists, gte, ilike, inArray, isNull, lte, or, sql } from 'drizzle-orm';
import type { PgSelect } from 'drizzle-orm/pg-core';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import type { TablePage } from '../office/table-query';
import type { VisitsQuery } from '../office/visit-input';
import { HttpError } from './http';
import { matchingModelNotes } from './model-notes';
import { getOrganisation } from './organisation';
import { getVersionContent } from './templates';
import { withChangeFeedWrite } from './change-feed';
import { containsPattern, orderFor, pageWindow } from './table-sql';
import { photoView } from './photo-view';
import { judgeRecordedReading } from '../office/reading-judgement';

export type VisitRow = {
  id: string;
  roundDate: string;
  slotStart: Date;
  slotEnd: Date;
  status: s.VisitStatus;
  technicianId: string;
  technicianName: string;
  customerId: string;
  customerName: string;
  vehicleId: string;
  registration: string;
  vehicle: string;
  checklist: string;
  worstSeverity: s.Severity | null;
  findingCount: number;
  openConflicts: number;
};

// Severity rank in SQL, the same order as lib/sync's SEVERITY_RANK.
const worstSeverity = sql<s.Severity | null>`(
  select f.severity from ${s.findings} f where f.visit_id = ${s.visits.id}
  order by case f.severity when 'now' then 3 when 'soon' then 2 when 'watch' then 1 else 0 end desc limit 1)`;
const findingCount = sql<number>`(select count(*)::int from ${s.findings} f where f.visit_id = ${s.visits.id})`;
const openConflicts = sql<number>`(select count(*)::int from ${s.conflicts} c where c.visit_id = ${s.visits.id} and c.resolved_at is null)`;

export async function listVisits(organisationId: string, query: VisitsQuery): Promise<TablePage<VisitRow>> {
  const db = getDb();
  const pattern = query.q ? containsPattern(query.q) : undefined;
  const platePattern = query.q ? containsPattern(query.q.replace(/[\s-]+/g, '').toUpperCase()) : undefined;
  const where = and(
    eq(s.visits.organisationId, organisationId),
    query.from ? gte(s.visits.roundDate, query.from) : undefined,
    query.to ? lte(s.visits.roundDate, query.to) : undefined,
    query.technicianId ? eq(s.visits.technicianId, query.technicianId) : undefined,
    query.status ? eq(s.visits.status, query.status) : undefined,
    query.customerId ? eq(s.visits.customerId, query.customerId) : undefined,
    query.vehicleId ? eq(s.visits.vehicleId, query.vehicleId) : undefined,
    query.attention
      ? exists(
          db
            .select({ one: sql`1` })
            .from(s.findings)
            .where(and(eq(s.findings.visitId, s.visits.id), inArray(s.findings.severity, ['soon', 'now']))),
        )
      : undefined,
    query.conflicts
      ? exists(
          db
            .select({ one: sql`1` })
            .from(s.conflicts)
            .where(and(eq(s.conflicts.visitId, s.visits.id), isNull(s.conflicts.resolvedAt))),
        )
      : undefined,
    pattern ? or(ilike(s.customers.name, pattern), ilike(s.vehicles.registration, platePattern!), ilike(s.visits.postcode, pattern)) : undefined,
  );
  const sortColumn = {
    slotStart: s.visits.slotStart,
    technician: s.user.name,
    customer: s.customers.name,
    registration: s.vehicles.registration,
    status: s.visits.status,
  }[query.sort];
  const { limit, offset } = pageWindow(query);
  // Two steps: first the page's ids (sorting and filtering touch only the joined columns), then
  // the page's details. PostgreSQL evaluates a select list's subqueries for every row an OFFSET
  // skips, so computing the finding and conflict counts in one query made deep pages slow.
  // The joins serve only the search and the sorts by name; every visit has its customer, vehicle
  // and technician, so leaving them out changes no count.
  const needsJoins = Boolean(query.q) || query.sort !== 'slotStart' && query.sort !== 'status';
  const joined = <T extends PgSelect>(select: T) =>
    needsJoins
      ? select
          .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
          .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
          .innerJoin(s.user, eq(s.user.id, s.visits.technicianId))
      : select;
  const [page, [total]] = await Promise.all([
    joined(db.select({ id: s.visits.id }).from(s.visits).$dynamic())
      .where(where)
      .orderBy(...orderFor(sortColumn, query.dir, s.visits.id))
      .limit(limit)
      .offset(offset),
    joined(db.select({ n: count() }).from(s.visits).$dynamic()).where(where),
  ]);
  const ids = page.map((p) => p.id);
  const details = ids.length
    ? await db
        .select({
          id: s.visits.id,
          roundDate: s.visits.roundDate,
          slotStart: s.visits.slotStart,
          slotEnd: s.visits.slotEnd,
          status: s.visits.status,
          technicianId: s.visits.technicianId,
          technicianName: s.user.name,
          customerId: s.visits.customerId,
          customerName: s.customers.name,
          vehicleId: s.visits.vehicleId,
          registration: s.vehicles.registration,
          vehicle: sql<string>`${s.vehicles.make} || ' ' || ${s.vehicles.model}`,
          checklist: s.checklistTemplates.name,
          worstSeverity,
          findingCount,
          openConflicts,
        })
        .from(s.visits)
        .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
        .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
        .innerJoin(s.user, eq(s.user.id, s.visits.technicianId))
        .innerJoin(s.templateVersions, eq(s.templateVersions.id, s.visits.templateVersionId))
        .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
        .where(inArray(s.visits.id, ids))
    : [];
  const rows = ids.map((id) => details.find((d) => d.id === id)!);
  return { rows, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize };
}

// The history is for reading, not for export: the latest operations are enough on screen.
const OPERATIONS_SHOWN = 300;

/** Everything the office reviews about one visit. */
export async function visitDetail(organisationId: string, visitId: string) {
  const db = getDb();
  const [head] = await db
    .select({ visit: s.visits, customer: s.customers, vehicle: s.vehicles, technicianName: s.user.name })
    .from(s.visits)
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .innerJoin(s.user, eq(s.user.id, s.visits.technicianId))
    .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)));
  if (!head) throw new HttpError(404, 'No such visit in this business.');
  const { visit, customer, vehicle } = head;

  const [org, checklist, checks, readings, findings, photos, notes, partLines, signOffs, operations, operationTotal, conflicts, modelNotes, people] =
    await Promise.all([
      getOrganisation(organisationId),
      getVersionContent(organisationId, visit.templateVersionId),
      db.select().from(s.checkResults).where(eq(s.checkResults.visitId, visitId)),
      db.select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId)),
      db.select().from(s.findings).where(eq(s.findings.visitId, visitId)).orderBy(asc(s.findings.createdAt)),
      db.select().from(s.photos).where(and(eq(s.photos.visitId, visitId), isNull(s.photos.removedStamp))).orderBy(asc(s.photos.createdAt)),
      db.select().from(s.visitNotes).where(eq(s.visitNotes.visitId, visitId)).orderBy(asc(s.visitNotes.stamp)),
      db.select().from(s.partLines).where(eq(s.partLines.visitId, visitId)).orderBy(asc(s.partLines.stamp)),
      db.select().from(s.signOffs).where(eq(s.signOffs.visitId, visitId)).orderBy(desc(s.signOffs.signedAt)),
      db
        .select({
          opId: s.syncOperations.opId,
          kind: s.syncOperations.kind,
          entityId: s.syncOperations.entityId,
          deviceId: s.syncOperations.deviceId,
          userId: s.syncOperations.userId,
          stamp: s.syncOperations.stamp,
          outcome: s.syncOperations.outcome,
          reason: s.syncOperations.reason,
          receivedAt: s.syncOperations.receivedAt,
          payload: s.syncOperations.payload,
        })
        .from(s.syncOperations)
        .where(and(eq(s.syncOperations.visitId, visitId), eq(s.syncOperations.organisationId, organisationId)))
        .orderBy(desc(s.syncOperations.receivedAt), desc(s.syncOperations.stamp))
        .limit(OPERATIONS_SHOWN),
      db.select({ n: count() }).from(s.syncOperations).where(eq(s.syncOperations.visitId, visitId)),
      db.select().from(s.conflicts).where(eq(s.conflicts.visitId, visitId)).orderBy(asc(s.conflicts.createdAt)),
      matchingModelNotes(organisationId, vehicle),
      db.select({ id: s.user.id, name: s.user.name }).from(s.user).where(eq(s.user.organisationId, organisationId)),
    ]);
  const nameOf = (id: string | null) => (id ? (people.find((p) => p.id === id)?.name ?? 'someone no longer here') : null);

  const sections = checklist.sections.map((section) => ({
    id: section.id,
    title: section.title,
    items: section.items.map((item) => {
      const check = checks.find((c) => c.itemId === item.id) ?? null;
      const reading = readings.find((r) => r.itemId === item.id) ?? null;
      return {
        id: item.id,
        kind: item.kind,
        label: item.label,
        unit: item.unit,
        expectedMin: item.expectedMin,
        expectedMax: item.expectedMax,
        rule: item.rule,
        caution: item.caution,
        check: check ? { state: check.state, stamp: check.stamp } : null,
        reading: reading
          ? {
              value: reading.value,
              textValue: reading.textValue,
              unit: reading.unit,
              stamp: reading.stamp,
              judgement: judgeRecordedReading(item, reading, vehicle),
            }
          : null,
        partLines: partLines.filter((line) => line.itemId === item.id && !line.removed),
      };
    }),
  }));
  const liveSignOff = signOffs.find((so) => so.voidedAt === null) ?? null;
  const openConflicts = conflicts.filter((c) => c.resolvedAt === null).length;

  return {
    visit: {
      ...visit,
      technicianName: head.technicianName,
      reviewedByName: nameOf(visit.reviewedBy),
    },
    customer: { id: customer.id, name: customer.name, email: customer.email, phone: customer.phone },
    vehicle,
    distanceUnit: org.distanceUnit,
    modelNotes,
    checklist: { name: checklist.name, version: checklist.version, sections },
    findings: findings.map((finding) => ({
      ...finding,
      createdByName: nameOf(finding.createdBy),
      photos: photos.filter((p) => p.findingId === finding.id).map(photoView),
    })),
    otherPhotos: photos.filter((p) => !p.findingId || !findings.some((f) => f.id === p.findingId)).map(photoView),
    notes: notes.map((note) => ({ ...note, authorName: nameOf(note.authorId) })),
    partLines: partLines.filter((line) => !line.removed),
    removedPartLines: partLines.filter((line) => line.removed).length,
    signOff: liveSignOff ? { ...liveSignOff, technicianName: nameOf(liveSignOff.technicianId) } : null,
    voidedSignOffs: signOffs.filter((so) => so.voidedAt !== null).length,
    operations: {
      total: operationTotal[0]?.n ?? 0,
      shown: operations.map((op) => ({ ...op, userName: nameOf(op.userId) })),
    },
    conflicts: conflicts.map((c) => ({ ...c, resolvedByName: nameOf(c.resolvedBy) })),
    review: reviewVerdict(visit.status, openConflicts),
  };
}

export type VisitDetail = Awaited<ReturnType<typeof visitDetail>>;

/** Whether the visit may be marked reviewed now, and if not, why not. */
function reviewVerdict(status: s.VisitStatus, openConflicts: number): { allowed: boolean; reason: string | null } {
  if (status !== 'signed_off') {
    const why: Partial<Record<s.VisitStatus, string>> = {
      booked: 'The visit has not started yet.',
      in_progress: 'The technician has not signed the visit off yet.',
      reviewed: 'Already reviewed.',
      cancelled: 'The visit was cancelled.',
    };
    return { allowed: false, reason: why[status] ?? `The visit is already ${status}.` };
  }
  if (openConflicts > 0) {
    return { allowed: false, reason: `Resolve the ${openConflicts} open conflict${openConflicts === 1 ? '' : 's'} first.` };
  }
  return { allowed: true, reason: null };
}

/** Marks a signed-off visit reviewed. Refused while it has open conflicts. */
export async function markReviewed(organisationId: string, visitId: string, reviewerId: string) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const [visit] = await tx
      .select({ status: s.visits.status })
      .from(s.visits)
      .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)))
      .for('update');
    if (!visit) throw new HttpError(404, 'No such visit in this business.');
    const [open] = await tx
      .select({ n: count() })
      .from(s.conflicts)
      .where(and(eq(s.conflicts.visitId, visitId), isNull(s.conflicts.resolvedAt)));
    const verdict = reviewVerdict(visit.status, open?.n ?? 0);
    if (!verdict.allowed) throw new HttpError(409, `Cannot mark this visit reviewed: ${verdict.reason}`);
    const [row] = await tx
      .update(s.visits)
      .set({ status: 'reviewed', reviewedAt: new Date(), reviewedBy: reviewerId, updatedAt: new Date(), changeSeq: s.nextChangeSeq })
      .where(eq(s.visits.id, visitId))
      .returning();
    return row!;
  });
}

/** What a visit page needs for its title. */
export async function visitHeading(organisationId: string, visitId: string) {
  const [row] = await getDb()
    .select({ id: s.visits.id, registration: s.vehicles.registration, customerName: s.customers.name })
    .from(s.visits)
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)));
  if (!row) throw new HttpError(404, 'No such visit in this business.');
  return row;
}
