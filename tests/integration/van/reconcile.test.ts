// Parts fitted on a visit come off the technician's van, exactly once, however often and in
// whatever state the part lines arrive. Part lines are written directly, as sync applies them.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import * as s from '../../../src/db/schema';
import { reconcileVanStockForVisit } from '../../../src/lib/server/van-stock-reconcile';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, type OrganisationFixture } from '../../support/fixtures';
import { bookVisit, createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let van: VanFixture;

beforeAll(async () => {
  org = await createOrganisation('Reconcile');
  van = await createVanFixture(org);
});
afterAll(async () => {
  await testPool().end();
});

const db = () => testDb();
const reconcile = (visitId: string) => db().transaction((tx) => reconcileVanStockForVisit(tx, visitId));

async function movementsOf(visitId: string) {
  return db()
    .select({ technicianId: s.vanStockMovements.technicianId, partId: s.vanStockMovements.partId, quantity: s.vanStockMovements.quantity, reason: s.vanStockMovements.reason, partLineId: s.vanStockMovements.partLineId, recordedBy: s.vanStockMovements.recordedBy })
    .from(s.vanStockMovements)
    .where(eq(s.vanStockMovements.visitId, visitId));
}

async function levelOf(technicianId: string, partId: string) {
  const rows = await db()
    .select({ quantity: s.vanStockMovements.quantity })
    .from(s.vanStockMovements)
    .where(and(eq(s.vanStockMovements.technicianId, technicianId), eq(s.vanStockMovements.partId, partId)));
  return Math.round(rows.reduce((sum, r) => sum + r.quantity, 0) * 1000) / 1000;
}

async function writeLine(visitId: string, line: Partial<typeof s.partLines.$inferInsert> & { id?: string }) {
  const id = line.id ?? randomUUID();
  const values = {
    id,
    visitId,
    itemId: null,
    partId: van.parts.of,
    partNumber: 'T-OF1',
    description: 'filter',
    quantity: 1,
    unit: '{each}',
    removed: false,
    stamp: `stamp-${Date.now()}`,
    updatedBy: org.technician.id,
    ...line,
  };
  await db().insert(s.partLines).values(values).onConflictDoUpdate({ target: s.partLines.id, set: values });
  return id;
}

describe('reconcileVanStockForVisit', () => {
  it('takes the fitted parts off the visit technician’s van, once, however often it runs', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-03-02' });
    const filterLine = await writeLine(visitId, {});
    await writeLine(visitId, { partId: van.parts.oil0w20, partNumber: 'T-0W20', quantity: 3.2, unit: 'L' });

    expect(await reconcile(visitId)).toEqual({ movementsWritten: 2 });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 0 });
    // The same line synced again (same values, new stamp) changes nothing either.
    await writeLine(visitId, { id: filterLine, stamp: 'stamp-again' });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 0 });

    const movements = await movementsOf(visitId);
    expect(movements).toHaveLength(2);
    expect(movements.every((m) => m.reason === 'fitted' && m.technicianId === org.technician.id && m.recordedBy === org.technician.id)).toBe(true);
    expect(await levelOf(org.technician.id, van.parts.oil0w20)).toBe(-3.2);
  });

  it('writes only the difference when a line changes, and gives the stock back when it is removed', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-03-03' });
    const plugs = await writeLine(visitId, { partId: van.parts.sp, partNumber: 'T-SP1', quantity: 4 });
    await reconcile(visitId);
    const before = await levelOf(org.technician.id, van.parts.sp);

    await writeLine(visitId, { id: plugs, partId: van.parts.sp, partNumber: 'T-SP1', quantity: 3 });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 1 });
    expect(await levelOf(org.technician.id, van.parts.sp)).toBe(before + 1);

    await writeLine(visitId, { id: plugs, partId: van.parts.sp, partNumber: 'T-SP1', quantity: 3, removed: true });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 1 });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 0 });
    expect(await levelOf(org.technician.id, van.parts.sp)).toBe(before + 4);
    expect((await movementsOf(visitId)).map((m) => m.quantity)).toEqual(expect.arrayContaining([-4, 1, 3]));
  });

  it('returns the old part and takes the new one when a line is corrected to another part', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-03-04' });
    const line = await writeLine(visitId, { partId: van.parts.af, partNumber: 'T-AF1' });
    await reconcile(visitId);
    await writeLine(visitId, { id: line, partId: van.parts.cf, partNumber: 'T-CF1' });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 2 });
    const net = new Map<string, number>();
    for (const m of await movementsOf(visitId)) net.set(m.partId, (net.get(m.partId) ?? 0) + m.quantity);
    expect(Object.fromEntries(net)).toEqual({ [van.parts.af]: 0, [van.parts.cf]: -1 });
  });

  it('leaves stock alone for lines with no catalogue part or in a unit other than the part’s', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.otherTechnician.id, vehicleId: van.vehicles.diesel, roundDate: '2026-03-05' });
    await writeLine(visitId, { partId: null, partNumber: 'LOCAL-BULB', description: 'Bulb bought on the way' });
    await writeLine(visitId, { partId: van.parts.oil5w30, partNumber: 'T-5W30', quantity: 2, unit: '{each}' });
    expect(await reconcile(visitId)).toEqual({ movementsWritten: 0 });
    expect(await movementsOf(visitId)).toEqual([]);
  });

  it('does not count twice when two pushes for one visit reconcile at the same moment', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.otherTechnician.id, vehicleId: van.vehicles.diesel, roundDate: '2026-03-06' });
    await writeLine(visitId, { partId: van.parts.ff, partNumber: 'T-FF1' });
    const results = await Promise.all([reconcile(visitId), reconcile(visitId), reconcile(visitId)]);
    expect(results.map((r) => r.movementsWritten).sort()).toEqual([0, 0, 1]);
    expect(await levelOf(org.otherTechnician.id, van.parts.ff)).toBe(-1);
  });

  it('does nothing for a visit that does not exist', async () => {
    expect(await reconcile(randomUUID())).toEqual({ movementsWritten: 0 });
  });
});
