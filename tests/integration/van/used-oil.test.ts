// Used oil: litres drained per visit (the used_oil reading), each van's running total since its
// last disposal, disposals recorded by the office, and the monthly report.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import * as s from '../../../src/db/schema';
import { callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { bookVisit, createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let van: VanFixture;
const as: Record<string, Session> = {};

async function drained(technicianId: string, roundDate: string, litres: number, unit = 'L') {
  const visitId = await bookVisit(org, van, { technicianId, vehicleId: van.vehicles.diesel, roundDate, status: 'signed_off' });
  await testDb().insert(s.readingResults).values({
    visitId,
    itemId: van.items.usedOil,
    value: litres,
    unit,
    stamp: 'stamp',
    opId: randomUUID(),
    updatedBy: technicianId,
  });
  return visitId;
}

beforeAll(async () => {
  org = await createOrganisation('Oil');
  van = await createVanFixture(org);
  // Slots end at 11:00 UTC on their day (see bookVisit).
  await drained(org.technician.id, '2026-01-28', 4.5);
  await drained(org.technician.id, '2026-01-30', 3.9);
  await drained(org.technician.id, '2026-02-03', 5.2);
  await drained(org.technician.id, '2026-02-04', 2.1);
  await drained(org.otherTechnician.id, '2026-02-04', 6);
  // A reading in another unit is not counted as litres.
  await drained(org.technician.id, '2026-02-04', 9, '[qt_us]');
  as.office = await signIn(org.office.email, FIXTURE_PASSWORD);
  as.technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const vanOf = (json: { vans: { technicianId: string }[] }, technicianId: string) => json.vans.find((v) => v.technicianId === technicianId) as Record<string, any>;

describe('used oil', () => {
  it('totals what each van drained while it has not been to a licensed site', async () => {
    const { status, json } = await callJson(as.office!, '/api/office/used-oil');
    expect(status).toBe(200);
    expect(vanOf(json, org.technician.id).heldL).toBe(15.7);
    expect(vanOf(json, org.otherTechnician.id).heldL).toBe(6);
    expect(vanOf(json, org.technician.id).lastDisposal).toBeNull();
  });

  it('starts the running total again after a disposal, and reports litres per month', async () => {
    const disposal = await callJson(as.office!, '/api/office/used-oil/disposals', {
      body: {
        technicianId: org.technician.id,
        disposedAt: '2026-01-31T16:00:00Z',
        siteName: 'Test Licensed Site',
        siteLicence: 'TEST-123',
        reference: 'WTN-1',
        litres: 8.5,
      },
    });
    expect(disposal.status).toBe(201);
    const { json } = await callJson(as.office!, '/api/office/used-oil');
    const tara = vanOf(json, org.technician.id);
    expect(tara.heldL).toBe(7.3);
    expect(tara.sinceLastDisposal.map((v: { litres: number }) => v.litres)).toEqual([5.2, 2.1]);
    expect(tara.lastDisposal).toMatchObject({ siteName: 'Test Licensed Site', litres: 8.5 });
    expect(json.disposals).toHaveLength(1);
    // Europe/London: January 4.5 + 3.9 collected and 8.5 disposed; February 5.2 + 2.1 + 6.
    expect(json.months).toEqual([
      { month: '2026-02', collectedL: 13.3, disposedL: 0 },
      { month: '2026-01', collectedL: 8.4, disposedL: 8.5 },
    ]);
    const own = await callJson(as.technician!, '/api/van/stock');
    expect(own.json.usedOilHeldL).toBe(7.3);
  });

  it('refuses a disposal without a site, in the future or for another van, and records nothing', async () => {
    const post = (body: Record<string, unknown>) =>
      callJson(as.office!, '/api/office/used-oil/disposals', {
        body: { technicianId: org.otherTechnician.id, disposedAt: '2026-02-05T10:00:00Z', siteName: 'Site', litres: 5, ...body },
      });
    expect((await post({ siteName: '  ' })).status).toBe(400);
    expect((await post({ litres: 0 })).status).toBe(400);
    expect((await post({ disposedAt: '2026-02-05' })).status).toBe(400);
    const future = await post({ disposedAt: new Date(Date.now() + 3 * 86_400_000).toISOString() });
    expect(future.status).toBe(422);
    expect((await post({ technicianId: org.office.id })).status).toBe(404);
    expect((await callJson(as.technician!, '/api/office/used-oil/disposals', { body: { technicianId: org.technician.id, disposedAt: '2026-02-05T10:00:00Z', siteName: 'x', litres: 1 } })).status).toBe(403);
    const rows = await testDb().select().from(s.usedOilDisposals).where(eq(s.usedOilDisposals.organisationId, org.organisationId));
    expect(rows).toHaveLength(1);
  });
});
