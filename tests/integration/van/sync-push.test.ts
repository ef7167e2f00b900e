// Parts fitted come off the van when the phone pushes its part lines: through POST /api/sync/push,
// once per line however often it arrives, and by the difference when it changes.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';
import { pushOk } from '../../support/sync-client';
import { TestDevice } from '../../support/sync-ops';
import { bookVisit, createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let van: VanFixture;
let tech: Session;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Van sync');
  van = await createVanFixture(org);
  [tech, office] = await Promise.all([signIn(org.technician.email, FIXTURE_PASSWORD), signIn(org.office.email, FIXTURE_PASSWORD)]);
});
afterAll(async () => {
  await testPool().end();
});

async function levelOf(partId: string) {
  const { json } = await callJson(office, `/api/van/stock?technicianId=${org.technician.id}`);
  return (json.stock as { partId: string; level: number }[]).find((r) => r.partId === partId)?.level ?? 0;
}

function plugLine(device: TestDevice, visitId: string, lineId: string, quantity: number, removed = false) {
  return device.op(visitId, 'part_line', {
    lineId,
    itemId: van.items.plugs,
    partId: van.parts.sp,
    partNumber: 'T-SP1',
    description: 'Spark plug',
    quantity,
    unit: '{each}',
    removed,
  });
}

describe('van stock from pushed part lines', () => {
  it('takes fitted parts off the van once, follows changes, and gives them back on removal', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-06-01', status: 'in_progress' });
    await testDb().insert(s.vanStockMovements).values({ organisationId: org.organisationId, technicianId: org.technician.id, partId: van.parts.sp, quantity: 10, reason: 'restock' });
    const device = new TestDevice(`phone-${randomUUID().slice(0, 8)}`, Date.now() - 3_600_000);
    const lineId = randomUUID();

    const first = plugLine(device, visitId, lineId, 4);
    expect((await pushOk(tech, device.deviceId, [first])).get(first.opId)?.outcome).toBe('applied');
    expect(await levelOf(van.parts.sp)).toBe(6);

    // The same operation again (the phone never saw the answer): nothing changes.
    expect((await pushOk(tech, device.deviceId, [first])).get(first.opId)?.outcome).toBe('duplicate');
    expect(await levelOf(van.parts.sp)).toBe(6);

    // Corrected to 3 plugs: one goes back into the van.
    const corrected = plugLine(device, visitId, lineId, 3);
    expect((await pushOk(tech, device.deviceId, [corrected])).get(corrected.opId)?.outcome).toBe('applied');
    expect(await levelOf(van.parts.sp)).toBe(7);

    // Removed (tombstone): all three go back.
    const removed = plugLine(device, visitId, lineId, 3, true);
    await pushOk(tech, device.deviceId, [removed]);
    expect(await levelOf(van.parts.sp)).toBe(10);

    const movements = await testDb()
      .select({ quantity: s.vanStockMovements.quantity, reason: s.vanStockMovements.reason })
      .from(s.vanStockMovements)
      .where(and(eq(s.vanStockMovements.partLineId, lineId), eq(s.vanStockMovements.visitId, visitId)));
    expect(movements.map((m) => m.quantity).sort((a, b) => a - b)).toEqual([-4, 1, 3]);
    expect(movements.every((m) => m.reason === 'fitted')).toBe(true);
  });

  it('changes nothing for an older edit that loses to the line already stored', async () => {
    const visitId = await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-06-02', status: 'in_progress' });
    const before = await levelOf(van.parts.sp);
    const device = new TestDevice(`phone-${randomUUID().slice(0, 8)}`, Date.now() - 3_600_000);
    const lineId = randomUUID();
    const older = plugLine(device, visitId, lineId, 2);
    const newer = plugLine(device, visitId, lineId, 4);
    await pushOk(tech, device.deviceId, [newer]);
    const results = await pushOk(tech, device.deviceId, [older]);
    expect(results.get(older.opId)?.outcome).not.toBe('applied');
    expect(await levelOf(van.parts.sp)).toBe(before - 4);
  });
});
