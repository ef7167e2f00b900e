// The load list over real HTTP: the sums for a round, the comparison with the van, and who may
// see which van.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import * as s from '../../../src/db/schema';
import { seedId } from '../../../src/db/seed/ids';
import { callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { bookVisit, createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let other: OrganisationFixture;
let van: VanFixture;
const as: Record<string, Session> = {};
const DAY = '2026-04-14';

beforeAll(async () => {
  org = await createOrganisation('Load');
  other = await createOrganisation('Elsewhere');
  van = await createVanFixture(org);
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: DAY, position: 0 });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: DAY, position: 1 });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: DAY, position: 2 });
  // Neither a cancelled visit, nor another technician's, nor another day's belongs on this list.
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: DAY, status: 'cancelled' });
  await bookVisit(org, van, { technicianId: org.otherTechnician.id, vehicleId: van.vehicles.diesel, roundDate: DAY });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: '2026-04-15' });
  await testDb().insert(s.vanStockMovements).values([
    { organisationId: org.organisationId, technicianId: org.technician.id, partId: van.parts.oil0w20, quantity: 2.5, reason: 'restock' },
    { organisationId: org.organisationId, technicianId: org.technician.id, partId: van.parts.of, quantity: 5, reason: 'restock' },
  ]);
  as.technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  as.otherTechnician = await signIn(org.otherTechnician.email, FIXTURE_PASSWORD);
  as.office = await signIn(org.office.email, FIXTURE_PASSWORD);
  as.elsewhere = await signIn(other.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

type Line = { part: { partNumber: string }; needed: number; onHand: number; shortfall: number; pickQuantity: number; pick: unknown; neededInContainers: unknown };
const lineOf = (lines: Line[], partNumber: string) => lines.find((l) => l.part.partNumber === partNumber)!;

describe('GET /api/van/load-list', () => {
  it('sums the round’s parts by part and by grade, in containers, against the van', async () => {
    const { status, json } = await callJson(as.technician!, `/api/van/load-list?date=${DAY}`);
    expect(status).toBe(200);
    expect(json.visits.map((v: { registration: string }) => v.registration)).toEqual(['TP01ABC', 'TD02DEF', 'TP01ABC']);
    // Two petrol cars of 3.2 L 0W-20 and four plugs each; one diesel of 4.8 L 5W-30 and a fuel filter.
    const oil = lineOf(json.lines, 'T-0W20');
    expect(oil).toMatchObject({ needed: 6.4, onHand: 2.5, shortfall: 3.9, pickQuantity: 4 });
    expect(oil.neededInContainers).toEqual({ containers: [{ sizeL: 5, count: 1 }, { sizeL: 1, count: 2 }], totalL: 7 });
    expect(oil.pick).toEqual({ containers: [{ sizeL: 1, count: 4 }], totalL: 4 });
    expect(lineOf(json.lines, 'T-5W30')).toMatchObject({ needed: 4.8, onHand: 0, shortfall: 4.8, pickQuantity: 5 });
    expect(lineOf(json.lines, 'T-OF1')).toMatchObject({ needed: 3, onHand: 5, shortfall: 0, pickQuantity: 0 });
    expect(lineOf(json.lines, 'T-SP1')).toMatchObject({ needed: 8, shortfall: 8, pickQuantity: 8 });
    expect(lineOf(json.lines, 'T-FF1')).toMatchObject({ needed: 1, pickQuantity: 1 });
    expect(json.grades).toEqual([
      { oilGrade: '0W-20', needed: 6.4, onHand: 2.5, shortfall: 3.9 },
      { oilGrade: '5W-30', needed: 4.8, onHand: 0, shortfall: 4.8 },
    ]);
    expect(json.usedOil.expectedL).toBe(11.2);
    expect(json.gaps).toEqual([]);
  });

  it('shows the technician no money figures', async () => {
    const { json } = await callJson(as.technician!, `/api/van/load-list?date=${DAY}`);
    expect(JSON.stringify(json)).not.toMatch(/cost|price/i);
  });

  it('lets a technician see only their own van', async () => {
    const own = await callJson(as.otherTechnician!, `/api/van/load-list?date=${DAY}&technicianId=${org.otherTechnician.id}`);
    expect(own.status).toBe(200);
    expect(own.json.visits).toHaveLength(1);
    const theirs = await callJson(as.otherTechnician!, `/api/van/load-list?date=${DAY}&technicianId=${org.technician.id}`);
    expect(theirs.status).toBe(403);
    expect(theirs.json.error).toMatch(/own van/);
  });

  it('lets the office see any van of its business, and no other business’s', async () => {
    const ok = await callJson(as.office!, `/api/van/load-list?date=${DAY}&technicianId=${org.technician.id}`);
    expect(ok.status).toBe(200);
    expect(ok.json.technician.name).toBe(org.technician.name);
    expect((await callJson(as.office!, `/api/van/load-list?date=${DAY}`)).status).toBe(400);
    expect((await callJson(as.elsewhere!, `/api/van/load-list?date=${DAY}&technicianId=${org.technician.id}`)).status).toBe(404);
    expect((await callJson(as.office!, `/api/van/load-list?date=${DAY}&technicianId=${org.office.id}`)).status).toBe(404);
  });

  it('answers bad input with 400 and anonymous callers with 401', async () => {
    const bad = await callJson(as.technician!, '/api/van/load-list?date=14/04/2026');
    expect(bad.status).toBe(400);
    expect(bad.json.details.join(' ')).toMatch(/date/);
    expect((await callJson(null, `/api/van/load-list?date=${DAY}`)).status).toBe(401);
  });

  it('names what a vehicle’s spec lacks instead of guessing', async () => {
    const day = '2026-04-20';
    const [gappy] = await testDb()
      .insert(s.vehicles)
      .values({ organisationId: org.organisationId, customerId: van.customerId, registration: 'TG03GAP', make: 'Testmake', model: 'Gap', fuel: 'petrol', oilGrade: '10W-40', oilCapacityL: 4 })
      .returning({ id: s.vehicles.id });
    await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: gappy!.id, roundDate: day });
    const { json } = await callJson(as.technician!, `/api/van/load-list?date=${day}`);
    expect(json.lines).toEqual([]);
    expect(json.gaps).toEqual([
      'TG03GAP: no 10W-40 oil in the parts catalogue',
      'TG03GAP: the spec names no oil filter (Oil filter)',
      'TG03GAP: the spec names no air filter (Air filter)',
      'TG03GAP: the spec has no spark plug part or count',
    ]);
  });
});

describe('the demo round (seeded business, read only)', () => {
  it('totals Tom’s round of a Pippet, an Orla Van and an Ione by part and by grade, rounded to 1 L and 5 L containers', async () => {
    const db = testDb();
    const [tom] = await db.select({ id: s.user.id }).from(s.user).where(eq(s.user.email, 'tom@fenwright.example'));
    const [first] = await db
      .select({ roundDate: s.visits.roundDate })
      .from(s.visits)
      .where(and(eq(s.visits.technicianId, tom!.id), eq(s.visits.vehicleId, seedId('vehicle', 'v01'))));
    const session = await signIn('tom@fenwright.example', 'servicing-demo');
    const { status, json } = await callJson(session, `/api/van/load-list?date=${first!.roundDate}`);
    expect(status).toBe(200);
    expect(json.visits.map((v: { registration: string }) => v.registration)).toEqual(['QK19FEN', 'QL20VET', 'QE22STR']);
    // Specs from src/db/seed/scenario.ts: Pippet 3.2 L 0W-20, three M12 plugs; Orla Van 6.1 L
    // 5W-40, diesel fuel filter; Ione 4.2 L 0W-20, four M14 plugs. All three on the annual checklist.
    const needed = Object.fromEntries(json.lines.map((l: Line) => [l.part.partNumber, l.needed]));
    expect(needed).toEqual({
      'LUB-0W20': 7.4,
      'LUB-5W40': 6.1,
      'AF-331': 2,
      'AF-352': 1,
      'CF-410': 3,
      'FF-512': 1,
      'OF-118': 2,
      'OF-204': 1,
      'SP-12F-09': 3,
      'SP-14F-07': 4,
    });
    expect(lineOf(json.lines, 'LUB-0W20').neededInContainers).toEqual({ containers: [{ sizeL: 5, count: 1 }, { sizeL: 1, count: 3 }], totalL: 8 });
    expect(lineOf(json.lines, 'LUB-5W40').neededInContainers).toEqual({ containers: [{ sizeL: 5, count: 1 }, { sizeL: 1, count: 2 }], totalL: 7 });
    expect(json.grades.map((g: { oilGrade: string; needed: number }) => [g.oilGrade, g.needed])).toEqual([
      ['0W-20', 7.4],
      ['5W-40', 6.1],
    ]);
    for (const line of json.lines as Line[]) {
      expect(line.shortfall).toBeCloseTo(Math.max(0, line.needed - Math.max(0, line.onHand)), 6);
    }
  });
});
