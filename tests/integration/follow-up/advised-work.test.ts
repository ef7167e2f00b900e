// Advised work: the office prices a finding, the customer approves it on the link, and the office
// books it as a visit in one step.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { call, callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { createSignedOffVisit, type VisitFixture } from '../../support/visit-fixtures';
import * as s from '../../../src/db/schema';

let org: OrganisationFixture;
let office: Session;
let technician: Session;
let visit: VisitFixture;
let token: string;
let advisedId: string;

beforeAll(async () => {
  org = await createOrganisation('Advised');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  visit = await createSignedOffVisit(org);
  const sent = await callJson(office, `/api/office/visits/${visit.visitId}/record/send`, { body: {} });
  token = new URL(sent.json.url).pathname.split('/')[2]!;
});
afterAll(async () => {
  await testPool().end();
});

const decide = (t: string, id: string, decision: string) => callJson(null, `/api/public/record/${t}/advised/${id}`, { body: { decision } });

describe('advised work', () => {
  it('is priced by the office only, never by a technician', async () => {
    const price = { description: 'Coolant drain and refill', priceMinor: 8500, labourCentiHours: 75 };
    expect((await callJson(technician, `/api/office/findings/${visit.findingIds.soon}/advised`, { method: 'PUT', body: price })).status).toBe(403);
    expect((await callJson(office, `/api/office/findings/${visit.findingIds.soon}/advised`, { method: 'PUT', body: { ...price, priceMinor: -5 } })).status).toBe(400);
    const priced = await callJson(office, `/api/office/findings/${visit.findingIds.soon}/advised`, { method: 'PUT', body: price });
    expect(priced.status).toBe(200);
    advisedId = priced.json.advisedWorkId;
    const page = await (await call(null, `/record/${token}`)).text();
    // 85.00 net + 20 % tax.
    expect(page).toContain('Price £102.00 including tax');
  });

  it('is approved by the customer on the link, and only on that link', async () => {
    const otherVisit = await createSignedOffVisit(org);
    const otherToken = new URL((await callJson(office, `/api/office/visits/${otherVisit.visitId}/record/send`, { body: {} })).json.url).pathname.split('/')[2]!;
    expect((await decide(otherToken, advisedId, 'approved')).status).toBe(404);
    expect((await decide(token, advisedId, 'maybe')).status).toBe(400);
    const approved = await decide(token, advisedId, 'approved');
    expect(approved.status).toBe(200);
    expect(approved.json).toEqual({ decision: 'approved', changed: true });
    expect((await decide(token, advisedId, 'approved')).json.changed).toBe(false);
    const [row] = await testDb().select().from(s.advisedWork).where(eq(s.advisedWork.id, advisedId));
    expect(row).toMatchObject({ decision: 'approved', decidedBy: 'customer' });
    const listed = await callJson(office, '/api/office/advised-work?decision=approved');
    expect(listed.json.items.map((i: any) => i.findingId)).toContain(visit.findingIds.soon);
    const repriced = await callJson(office, `/api/office/findings/${visit.findingIds.soon}/advised`, {
      method: 'PUT',
      body: { description: 'Coolant', priceMinor: 1, labourCentiHours: 0 },
    });
    expect(repriced.status).toBe(409);
  });

  it('is booked as a visit for the same vehicle in one step, once', async () => {
    const booking = { technicianId: org.otherTechnician.id, date: '2030-03-12', start: '10:30', durationMinutes: 90 };
    expect((await callJson(office, `/api/office/advised-work/${advisedId}/book`, { body: { ...booking, technicianId: org.office.id } })).status).toBe(422);
    const booked = await callJson(office, `/api/office/advised-work/${advisedId}/book`, { body: booking });
    expect(booked.status).toBe(201);
    const [newVisit] = await testDb().select().from(s.visits).where(eq(s.visits.id, booked.json.visitId));
    expect(newVisit).toMatchObject({ vehicleId: visit.vehicleId, customerId: visit.customerId, technicianId: org.otherTechnician.id, roundDate: '2030-03-12', status: 'booked' });
    expect(newVisit!.accessNotes).toContain('Coolant drain and refill');
    expect(newVisit!.slotEnd.getTime() - newVisit!.slotStart.getTime()).toBe(90 * 60_000);
    expect((await callJson(office, `/api/office/advised-work/${advisedId}/book`, { body: booking })).status).toBe(409);
    expect((await decide(token, advisedId, 'declined')).status).toBe(409);
  });

  it('can be declined, and declined work cannot be booked', async () => {
    const priced = await callJson(office, `/api/office/findings/${visit.findingIds.watch}/advised`, {
      method: 'PUT',
      body: { description: 'Breather elbow', priceMinor: 4200, labourCentiHours: 30 },
    });
    expect((await decide(token, priced.json.advisedWorkId, 'declined')).status).toBe(200);
    const booked = await callJson(office, `/api/office/advised-work/${priced.json.advisedWorkId}/book`, {
      body: { technicianId: org.technician.id, date: '2030-03-12', start: '09:00' },
    });
    expect(booked.status).toBe(409);
  });
});
