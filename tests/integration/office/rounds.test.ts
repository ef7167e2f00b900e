// Rounds: booking with clash warnings, moving a visit to another technician (the old round gets
// a removal row for the phone), cancelling, and reordering. Dates are in March 2031, before
// British Summer Time starts, so local time in Europe/London is UTC.
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';
import { customerWithVehicle, publishedChecklist } from '../../support/office-fixtures';

let org: OrganisationFixture;
let office: Session;
let templateId: string;
let refs: { customerId: string; vehicleId: string };

beforeAll(async () => {
  org = await createOrganisation('Rounds');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  ({ templateId } = await publishedChecklist(org));
  const { customer, vehicle } = await customerWithVehicle(org);
  refs = { customerId: customer.id, vehicleId: vehicle.id };
});
afterAll(async () => {
  await testPool().end();
});

const booking = (over: Record<string, unknown> = {}) => ({
  ...refs,
  technicianId: org.technician.id,
  templateId,
  roundDate: '2031-03-04',
  start: '09:00',
  end: '11:00',
  addressLines: '1 Test Lane, Aldersby',
  postcode: 'qx1 1tt',
  accessNotes: 'Key under the mat',
  ...over,
});

const book = (over: Record<string, unknown> = {}) => callJson(office, '/api/office/visits', { body: booking(over) });

async function removalsOf(visitId: string) {
  return testDb().select().from(s.roundRemovals).where(eq(s.roundRemovals.visitId, visitId));
}

describe('booking', () => {
  it('books a visit in the business’s time zone, without clashes', async () => {
    const response = await book();
    expect(response.status).toBe(201);
    expect(response.json.clashes).toEqual([]);
    expect(response.json.visit).toMatchObject({
      status: 'booked',
      roundDate: '2031-03-04',
      slotStart: '2031-03-04T09:00:00.000Z',
      slotEnd: '2031-03-04T11:00:00.000Z',
      postcode: 'QX1 1TT',
      roundPosition: 0,
    });
  });

  it('warns of an overlap with the same technician, and of a slot outside working hours', async () => {
    const overlap = await book({ start: '10:00', end: '12:00' });
    expect(overlap.status).toBe(201);
    expect(overlap.json.clashes).toEqual([expect.objectContaining({ kind: 'overlap', message: expect.stringContaining('10:00–11:00') })]);
    const early = await book({ start: '07:00', end: '08:00' });
    expect(early.json.clashes).toEqual([expect.objectContaining({ kind: 'out_of_hours', message: expect.stringContaining('before working hours (08:00–18:00)') })]);
    // It went first in the round: the round follows slot times for new bookings.
    expect(early.json.visit.roundPosition).toBe(0);
  });

  it('does not call another technician’s visit at the same time a clash', async () => {
    const response = await book({ technicianId: org.otherTechnician.id });
    expect(response.json.clashes).toEqual([]);
  });

  it('refuses a vehicle of another customer, an office person as technician, and a slot that ends before it starts', async () => {
    const { vehicle } = await customerWithVehicle(org, 'Someone Else');
    const wrongVehicle = await book({ vehicleId: vehicle.id });
    expect(wrongVehicle.status).toBe(422);
    expect(wrongVehicle.json.error).toMatch(/another customer/);
    const notTechnician = await book({ technicianId: org.office.id });
    expect(notTechnician.status).toBe(422);
    const backwards = await book({ start: '11:00', end: '10:00' });
    expect(backwards.status).toBe(400);
    expect(backwards.json.details).toContain('end: must be at least 15 minutes after the start');
  });

  it('shows the week by technician with its clashes', async () => {
    const week = await callJson(office, '/api/office/rounds?week=2031-03-06');
    expect(week.status).toBe(200);
    expect(week.json.days[0]).toBe('2031-03-03');
    expect(week.json.technicians.map((t: { id: string }) => t.id).sort()).toEqual([org.technician.id, org.otherTechnician.id].sort());
    const tara = week.json.visits.filter((v: { technicianId: string }) => v.technicianId === org.technician.id);
    expect(tara.map((v: { start: number }) => v.start)).toEqual([7 * 60, 9 * 60, 10 * 60]);
    expect(tara.filter((v: { clashes: unknown[] }) => v.clashes.length > 0)).toHaveLength(3);
  });
});

describe('moving, cancelling and ordering', () => {
  it('moves a visit to another technician, leaving a removal for the first technician’s phone', async () => {
    const booked = (await book({ roundDate: '2031-03-11' })).json.visit;
    const moved = await callJson(office, `/api/office/visits/${booked.id}`, {
      method: 'PUT',
      body: { technicianId: org.otherTechnician.id, roundDate: '2031-03-12', start: '13:00', end: '14:30', addressLines: 'Car park, Unit 9', postcode: '', accessNotes: '' },
    });
    expect(moved.status).toBe(200);
    expect(moved.json.visit).toMatchObject({ technicianId: org.otherTechnician.id, roundDate: '2031-03-12', slotStart: '2031-03-12T13:00:00.000Z' });
    expect(Number(moved.json.visit.changeSeq)).toBeGreaterThan(Number(booked.changeSeq));
    const removals = await removalsOf(booked.id);
    expect(removals).toEqual([expect.objectContaining({ technicianId: org.technician.id })]);
    expect(removals[0]!.changeSeq).toBeGreaterThan(Number(booked.changeSeq));
  });

  it('moves a visit within one technician’s week without a removal', async () => {
    const booked = (await book({ roundDate: '2031-03-13' })).json.visit;
    const moved = await callJson(office, `/api/office/visits/${booked.id}`, {
      method: 'PUT',
      body: { technicianId: org.technician.id, roundDate: '2031-03-14', start: '09:00', end: '10:00', addressLines: '1 Test Lane', postcode: '', accessNotes: '' },
    });
    expect(moved.status).toBe(200);
    expect(await removalsOf(booked.id)).toEqual([]);
  });

  it('cancels a booked visit, which drops off the technician’s phone', async () => {
    const booked = (await book({ roundDate: '2031-03-18' })).json.visit;
    const cancelled = await callJson(office, `/api/office/visits/${booked.id}/cancel`, { body: {} });
    expect(cancelled.status).toBe(200);
    expect(cancelled.json.visit.status).toBe('cancelled');
    expect(await removalsOf(booked.id)).toHaveLength(1);
    expect((await callJson(office, `/api/office/visits/${booked.id}/cancel`, { body: {} })).status).toBe(409);
  });

  it('will not move or cancel a visit the technician has started', async () => {
    const booked = (await book({ roundDate: '2031-03-19' })).json.visit;
    await testDb().update(s.visits).set({ status: 'in_progress' }).where(eq(s.visits.id, booked.id));
    const move = await callJson(office, `/api/office/visits/${booked.id}`, {
      method: 'PUT',
      body: { technicianId: org.otherTechnician.id, roundDate: '2031-03-19', start: '09:00', end: '10:00', addressLines: 'x', postcode: '', accessNotes: '' },
    });
    expect(move.status).toBe(409);
    expect((await callJson(office, `/api/office/visits/${booked.id}/cancel`, { body: {} })).status).toBe(409);
    expect(await removalsOf(booked.id)).toEqual([]);
  });

  it('reorders a round, and refuses a list that is not exactly the round', async () => {
    const day = '2031-03-20';
    const a = (await book({ roundDate: day, start: '09:00', end: '10:00' })).json.visit;
    const b = (await book({ roundDate: day, start: '11:00', end: '12:00' })).json.visit;
    const c = (await book({ roundDate: day, start: '13:00', end: '14:00' })).json.visit;
    const stale = await callJson(office, '/api/office/rounds/order', { method: 'PUT', body: { technicianId: org.technician.id, roundDate: day, visitIds: [c.id, a.id] } });
    expect(stale.status).toBe(409);
    const ok = await callJson(office, '/api/office/rounds/order', { method: 'PUT', body: { technicianId: org.technician.id, roundDate: day, visitIds: [c.id, a.id, b.id] } });
    expect(ok.status).toBe(200);
    const rows = await testDb()
      .select({ id: s.visits.id, position: s.visits.roundPosition })
      .from(s.visits)
      .where(and(eq(s.visits.technicianId, org.technician.id), eq(s.visits.roundDate, day)));
    const position = Object.fromEntries(rows.map((r) => [r.id, r.position]));
    expect([position[c.id], position[a.id], position[b.id]]).toEqual([0, 1, 2]);
  });
});
