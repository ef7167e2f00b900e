// Technicians' rounds: the week by technician and day, booking, moving, cancelling and ordering
// visits. Every change to a visit sets change_seq so the technician's next pull carries it, and
// a visit that leaves a technician's round leaves a round_removals row so it drops off their phone.
import { and, asc, eq, gte, lte, ne } from 'drizzle-orm';
import { getDb, type Executor } from '../../db/client';
import * as s from '../../db/schema';
import { findClashes, type Clash } from '../office/clashes';
import { localClock, localInstant, localToday, weekOf } from '../office/local-time';
import { placeInRound } from '../office/round-order';
import type { BookVisitInput, MoveVisitInput, ReorderRoundInput } from '../office/visit-input';
import { HttpError } from './http';
import { getOrganisation } from './organisation';
import { currentVersionId } from './templates';
import { withChangeFeedWrite } from './change-feed';

const plannedVisitColumns = {
  id: s.visits.id,
  technicianId: s.visits.technicianId,
  roundDate: s.visits.roundDate,
  roundPosition: s.visits.roundPosition,
  slotStart: s.visits.slotStart,
  slotEnd: s.visits.slotEnd,
  status: s.visits.status,
  addressLines: s.visits.addressLines,
  postcode: s.visits.postcode,
  accessNotes: s.visits.accessNotes,
  customerId: s.visits.customerId,
  customerName: s.customers.name,
  vehicleId: s.visits.vehicleId,
  registration: s.vehicles.registration,
  make: s.vehicles.make,
  model: s.vehicles.model,
  templateId: s.checklistTemplates.id,
  checklist: s.checklistTemplates.name,
  templateVersion: s.templateVersions.version,
};

export async function roundsWeek(organisationId: string, weekDate?: string) {
  const db = getDb();
  const org = await getOrganisation(organisationId);
  const today = localToday(org.timeZone);
  const days = weekOf(weekDate ?? today);
  const technicians = await db
    .select({ id: s.user.id, name: s.user.name })
    .from(s.user)
    .where(and(eq(s.user.organisationId, organisationId), eq(s.user.role, 'technician')))
    .orderBy(asc(s.user.name));
  const visits = await db
    .select(plannedVisitColumns)
    .from(s.visits)
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .innerJoin(s.templateVersions, eq(s.templateVersions.id, s.visits.templateVersionId))
    .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
    .where(
      and(
        eq(s.visits.organisationId, organisationId),
        gte(s.visits.roundDate, days[0]!),
        lte(s.visits.roundDate, days[6]!),
        ne(s.visits.status, 'cancelled'),
      ),
    )
    .orderBy(asc(s.visits.technicianId), asc(s.visits.roundDate), asc(s.visits.roundPosition), asc(s.visits.slotStart));
  const clashes = findClashes(visits, org);
  return {
    days,
    today,
    timeZone: org.timeZone,
    workday: { start: org.workdayStartMinute, end: org.workdayEndMinute },
    technicians,
    visits: visits.map((visit) => ({
      ...visit,
      start: localClock(visit.slotStart, org.timeZone).minute,
      end: localClock(visit.slotEnd, org.timeZone).minute,
      clashes: clashes.filter((c) => c.visitId === visit.id).map(({ kind, message }) => ({ kind, message })),
    })),
  };
}

export async function bookVisit(organisationId: string, input: BookVisitInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const org = await getOrganisation(organisationId, tx);
    const [vehicle] = await tx
      .select({ id: s.vehicles.id, customerId: s.vehicles.customerId })
      .from(s.vehicles)
      .where(and(eq(s.vehicles.id, input.vehicleId), eq(s.vehicles.organisationId, organisationId)));
    if (!vehicle) throw new HttpError(422, 'The vehicle is not on file in this business.', ['vehicleId: unknown vehicle']);
    if (vehicle.customerId !== input.customerId) {
      throw new HttpError(422, 'That vehicle belongs to another customer.', ['vehicleId: not this customer’s vehicle']);
    }
    await requireTechnician(tx, organisationId, input.technicianId);
    const templateVersionId = await currentVersionId(tx, organisationId, input.templateId);
    const slotStart = localInstant(input.roundDate, input.start, org.timeZone);
    const slotEnd = localInstant(input.roundDate, input.end, org.timeZone);
    const [visit] = await tx
      .insert(s.visits)
      .values({
        organisationId,
        customerId: input.customerId,
        vehicleId: input.vehicleId,
        technicianId: input.technicianId,
        templateVersionId,
        roundDate: input.roundDate,
        slotStart,
        slotEnd,
        addressLines: input.addressLines,
        postcode: input.postcode,
        accessNotes: input.accessNotes,
      })
      .returning();
    await placeVisit(tx, visit!);
    return { visit: visit!, clashes: await clashesOf(tx, org, visit!) };
  });
}

export async function moveVisit(organisationId: string, visitId: string, input: MoveVisitInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const org = await getOrganisation(organisationId, tx);
    const before = await lockVisit(tx, organisationId, visitId);
    if (before.status !== 'booked') {
      throw new HttpError(409, `This visit is ${before.status.replace('_', ' ')}: only a booked visit can be moved. Work recorded on the phone stays with its technician.`);
    }
    await requireTechnician(tx, organisationId, input.technicianId);
    if (before.technicianId !== input.technicianId) {
      await tx.insert(s.roundRemovals).values({ visitId, technicianId: before.technicianId });
    }
    const [visit] = await tx
      .update(s.visits)
      .set({
        technicianId: input.technicianId,
        roundDate: input.roundDate,
        slotStart: localInstant(input.roundDate, input.start, org.timeZone),
        slotEnd: localInstant(input.roundDate, input.end, org.timeZone),
        addressLines: input.addressLines,
        postcode: input.postcode,
        accessNotes: input.accessNotes,
        updatedAt: new Date(),
        changeSeq: s.nextChangeSeq,
      })
      .where(eq(s.visits.id, visitId))
      .returning();
    const sameRound = before.technicianId === visit!.technicianId && before.roundDate === visit!.roundDate;
    if (!sameRound || before.slotStart.getTime() !== visit!.slotStart.getTime()) await placeVisit(tx, visit!);
    return { visit: visit!, clashes: await clashesOf(tx, org, visit!) };
  });
}

export async function cancelVisit(organisationId: string, visitId: string) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const before = await lockVisit(tx, organisationId, visitId);
    if (before.status !== 'booked') {
      throw new HttpError(409, `This visit is ${before.status.replace('_', ' ')}: only a booked visit can be cancelled.`);
    }
    await tx.insert(s.roundRemovals).values({ visitId, technicianId: before.technicianId });
    const [visit] = await tx
      .update(s.visits)
      .set({ status: 'cancelled', updatedAt: new Date(), changeSeq: s.nextChangeSeq })
      .where(eq(s.visits.id, visitId))
      .returning();
    return visit!;
  });
}

/** Puts a round in the order the office chose; the list must be exactly the round's visits. */
export async function reorderRound(organisationId: string, input: ReorderRoundInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    await requireTechnician(tx, organisationId, input.technicianId);
    const round = await roundOf(tx, organisationId, input.technicianId, input.roundDate);
    const known = new Set(round.map((v) => v.id));
    const sent = new Set(input.visitIds);
    if (known.size !== sent.size || input.visitIds.length !== sent.size || [...sent].some((id) => !known.has(id))) {
      throw new HttpError(409, 'The round changed since you loaded it. Reload the week and try again.');
    }
    await renumber(tx, round, input.visitIds);
    return { visitIds: input.visitIds };
  });
}

async function lockVisit(tx: Executor, organisationId: string, visitId: string) {
  const [visit] = await tx
    .select()
    .from(s.visits)
    .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)))
    .for('update');
  if (!visit) throw new HttpError(404, 'No such visit in this business.');
  return visit;
}

async function requireTechnician(tx: Executor, organisationId: string, technicianId: string) {
  const [person] = await tx
    .select({ role: s.user.role })
    .from(s.user)
    .where(and(eq(s.user.id, technicianId), eq(s.user.organisationId, organisationId)));
  if (!person) throw new HttpError(422, 'That person is not in this business.', ['technicianId: unknown person']);
  if (person.role !== 'technician') throw new HttpError(422, 'Visits go to technicians; that person is not one.', ['technicianId: not a technician']);
}

async function roundOf(tx: Executor, organisationId: string, technicianId: string, roundDate: string) {
  return tx
    .select({ id: s.visits.id, slotStart: s.visits.slotStart, slotEnd: s.visits.slotEnd, roundPosition: s.visits.roundPosition, status: s.visits.status, technicianId: s.visits.technicianId })
    .from(s.visits)
    .where(
      and(
        eq(s.visits.organisationId, organisationId),
        eq(s.visits.technicianId, technicianId),
        eq(s.visits.roundDate, roundDate),
        ne(s.visits.status, 'cancelled'),
      ),
    )
    .for('update');
}

async function placeVisit(tx: Executor, visit: typeof s.visits.$inferSelect) {
  const round = await roundOf(tx, visit.organisationId, visit.technicianId, visit.roundDate);
  await renumber(tx, round, placeInRound(round, visit));
}

/** Positions 0..n-1 in `order`; only rows whose position changes are touched (and pulled again). */
async function renumber(tx: Executor, round: { id: string; roundPosition: number }[], order: string[]) {
  const moved = order
    .map((id, position) => ({ id, position, before: round.find((v) => v.id === id)?.roundPosition }))
    .filter((v) => v.before !== v.position);
  for (const { id, position } of moved) {
    await tx.update(s.visits).set({ roundPosition: position, changeSeq: s.nextChangeSeq }).where(eq(s.visits.id, id));
  }
}

async function clashesOf(tx: Executor, org: typeof s.organisations.$inferSelect, visit: typeof s.visits.$inferSelect): Promise<Clash[]> {
  const round = await roundOf(tx, org.id, visit.technicianId, visit.roundDate);
  return findClashes(round, org).filter((c) => c.visitId === visit.id);
}

