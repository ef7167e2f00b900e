// Advised work: a finding the office prices, offered to the customer on the record's link, and
// booked as a visit in one step once approved.
import { and, asc, count, desc, eq, inArray, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import { lockChangeFeed } from './change-feed';
import { HttpError } from './http';
import { resolveRecordToken } from './record-links';
import { localInstant } from './local-date';

export type AdvisedPrice = { description: string; priceMinor: number; labourCentiHours: number };

/** Prices a finding (or changes the price while the customer has not answered). */
export async function priceFinding(organisationId: string, findingId: string, price: AdvisedPrice, userId: string) {
  return getDb().transaction(async (tx) => {
    const [finding] = await tx
      .select({ id: s.findings.id, visitId: s.findings.visitId, severity: s.findings.severity })
      .from(s.findings)
      .innerJoin(s.visits, eq(s.visits.id, s.findings.visitId))
      .where(and(eq(s.findings.id, findingId), eq(s.visits.organisationId, organisationId)));
    if (!finding) throw new HttpError(404, 'No such finding in your business.');
    const [existing] = await tx.select().from(s.advisedWork).where(eq(s.advisedWork.findingId, findingId)).for('update');
    if (existing && existing.decision !== 'pending') {
      throw new HttpError(409, `The customer has already ${existing.decision} this work; the price can no longer change.`);
    }
    if (existing) {
      await tx.update(s.advisedWork).set({ ...price, updatedAt: sql`now()` }).where(eq(s.advisedWork.id, existing.id));
      return existing.id;
    }
    const [row] = await tx
      .insert(s.advisedWork)
      .values({ organisationId, visitId: finding.visitId, findingId, ...price, createdBy: userId })
      .returning({ id: s.advisedWork.id });
    return row!.id;
  });
}

/**
 * Records the customer's answer. They may change their mind until the office books the work;
 * answering the same again changes nothing.
 */
export async function decideAdvisedWork(
  advisedId: string,
  decision: 'approved' | 'declined',
  by: { token: string } | { organisationId: string; userId: string },
) {
  const db = getDb();
  const scope = 'token' in by ? await resolveRecordToken(db, by.token) : null;
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(s.advisedWork).where(eq(s.advisedWork.id, advisedId)).for('update');
    const organisationId = scope ? scope.organisationId : (by as { organisationId: string }).organisationId;
    if (!row || row.organisationId !== organisationId || (scope && row.visitId !== scope.visitId)) {
      throw new HttpError(404, 'No such advised work on this record.');
    }
    if (row.bookedVisitId) throw new HttpError(409, 'This work is already booked. To change it, call the business.');
    if (row.decision === decision) return { decision, changed: false };
    await tx
      .update(s.advisedWork)
      .set({ decision, decidedAt: sql`now()`, decidedBy: scope ? 'customer' : (by as { userId: string }).userId, updatedAt: sql`now()` })
      .where(eq(s.advisedWork.id, advisedId));
    return { decision, changed: true };
  });
}

export type BookingRequest = { technicianId: string; date: string; start: string; durationMinutes: number };

/** Books approved work as a new visit for the same vehicle, customer and address, in one step. */
export async function bookAdvisedWork(organisationId: string, advisedId: string, booking: BookingRequest) {
  return getDb().transaction(async (tx) => {
    const [row] = await tx.select().from(s.advisedWork).where(and(eq(s.advisedWork.id, advisedId), eq(s.advisedWork.organisationId, organisationId))).for('update');
    if (!row) throw new HttpError(404, 'No such advised work in your business.');
    if (row.decision !== 'approved') throw new HttpError(409, `Only approved work can be booked; this is ${row.decision}.`);
    if (row.bookedVisitId) throw new HttpError(409, 'This work is already booked.', { visitId: row.bookedVisitId });
    const [technician] = await tx
      .select({ id: s.user.id })
      .from(s.user)
      .where(and(eq(s.user.id, booking.technicianId), eq(s.user.organisationId, organisationId), eq(s.user.role, 'technician')));
    if (!technician) throw new HttpError(422, 'Choose a technician of your business.');
    const [source] = await tx.select().from(s.visits).where(eq(s.visits.id, row.visitId));
    const [org] = await tx.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
    // The work is done against the current published version of the checklist the visit used.
    const [version] = await tx
      .select({ id: s.templateVersions.id })
      .from(s.templateVersions)
      .where(
        and(
          eq(s.templateVersions.status, 'published'),
          eq(s.templateVersions.templateId, sql`(select template_id from template_versions where id = ${source!.templateVersionId})`),
        ),
      )
      .orderBy(desc(s.templateVersions.version))
      .limit(1);
    const slotStart = localInstant(booking.date, booking.start, org!.timeZone);
    const slotEnd = new Date(slotStart.getTime() + booking.durationMinutes * 60_000);
    const [{ value: position }] = (await tx
      .select({ value: count() })
      .from(s.visits)
      .where(and(eq(s.visits.technicianId, booking.technicianId), eq(s.visits.roundDate, booking.date)))) as [{ value: number }];
    // A new visit on a technician's round: write it as a change-feed writer (change-feed.ts).
    await lockChangeFeed(tx, organisationId);
    const [visit] = await tx
      .insert(s.visits)
      .values({
        organisationId,
        customerId: source!.customerId,
        vehicleId: source!.vehicleId,
        technicianId: booking.technicianId,
        templateVersionId: version?.id ?? source!.templateVersionId,
        roundDate: booking.date,
        roundPosition: position,
        slotStart,
        slotEnd,
        addressLines: source!.addressLines,
        postcode: source!.postcode,
        accessNotes: [`Advised work approved by the customer: ${row.description}`, source!.accessNotes].filter(Boolean).join('\n'),
      })
      .returning({ id: s.visits.id });
    await tx.update(s.advisedWork).set({ bookedVisitId: visit!.id, updatedAt: sql`now()` }).where(eq(s.advisedWork.id, advisedId));
    return { visitId: visit!.id };
  });
}

/** Findings of signed-off visits with their advised work, for the office's list. */
export async function listAdvisedWork(organisationId: string, filter: { decision?: s.AdvisedDecision | 'unpriced' }) {
  const db = getDb();
  const rows = await db
    .select({
      findingId: s.findings.id,
      title: s.findings.title,
      detail: s.findings.detail,
      severity: s.findings.severity,
      visitId: s.visits.id,
      roundDate: s.visits.roundDate,
      customerName: s.customers.name,
      registration: s.vehicles.registration,
      advised: s.advisedWork,
    })
    .from(s.findings)
    .innerJoin(s.visits, eq(s.visits.id, s.findings.visitId))
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .leftJoin(s.advisedWork, eq(s.advisedWork.findingId, s.findings.id))
    .where(
      and(
        eq(s.visits.organisationId, organisationId),
        inArray(s.visits.status, ['signed_off', 'reviewed', 'invoiced', 'paid']),
        sql`${s.findings.severity} <> 'ok'`,
        filter.decision === 'unpriced' ? sql`${s.advisedWork.id} is null` : filter.decision ? eq(s.advisedWork.decision, filter.decision) : undefined,
      ),
    )
    .orderBy(desc(s.visits.roundDate), asc(s.findings.createdAt))
    .limit(300);
  return rows;
}
