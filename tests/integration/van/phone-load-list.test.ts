// The load list on the phone against the real server: the sync client pulls the round and keeps
// the next round's load list in the device database (fake-indexeddb in Node); the office loads
// the van and the list fetched again shows nothing left to pick; the copy stays readable when
// the server cannot be reached.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DeviceDb } from '../../../src/lib/device/db';
import { phoneDay } from '../../../src/lib/device/load-list-days';
import { fetchLoadList } from '../../../src/lib/device/load-lists';
import { OfflineError } from '../../../src/lib/device/http';
import { syncOnce } from '../../../src/lib/device/sync-client';
import { baseUrl, callJson, signIn, type Session, sessionFetch } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testPool } from '../../support/database';
import { bookVisit, createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let van: VanFixture;
let technician: Session;
let office: Session;
let db: DeviceDb;
// The phone's next round: tomorrow on its clock (this process's time zone).
const NEXT = phoneDay(new Date(), 1);

beforeAll(async () => {
  org = await createOrganisation('Phone load');
  van = await createVanFixture(org);
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: NEXT, position: 0 });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: NEXT, position: 1 });
  // Another technician's round is not on this phone, nor in its list.
  await bookVisit(org, van, { technicianId: org.otherTechnician.id, vehicleId: van.vehicles.petrol, roundDate: NEXT });
  technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  db = new DeviceDb(`phone-load-${randomUUID()}`);
});

afterAll(async () => {
  db.close();
  await db.delete();
  await testPool().end();
});

const pickOf = async (partNumber: string) => (await db.loadLists.get(NEXT))?.list.lines.find((l) => l.part.partNumber === partNumber);

describe('the load list on the phone', () => {
  it('is kept on the phone when the round is pulled', async () => {
    const report = await syncOnce({ db, fetch: sessionFetch(technician), baseUrl: baseUrl() });
    expect(await db.visits.where('roundDate').equals(NEXT).count()).toBe(2);
    expect(report.loadListsSaved).toBe(2);
    const copy = await db.loadLists.get(NEXT);
    expect(copy?.list.technician.id).toBe(org.technician.id);
    expect(copy?.list.visits.map((v) => v.registration)).toEqual(['TP01ABC', 'TD02DEF']);
    // 3.2 L of 0W-20 for the petrol car and 4.8 L of 5W-30 for the diesel, from an empty van,
    // in the 1 L and 5 L containers the fixture stocks.
    expect((await pickOf('T-0W20'))?.pick).toEqual({ containers: [{ sizeL: 1, count: 4 }], totalL: 4 });
    expect((await pickOf('T-5W30'))?.pick).toEqual({ containers: [{ sizeL: 5, count: 1 }], totalL: 5 });
    expect((await pickOf('T-SP1'))?.pickQuantity).toBe(4);
    expect(Date.parse(copy!.fetchedAt)).toBeGreaterThan(Date.now() - 600_000);
  });

  it('shows the office’s restock once fetched again, and keeps the copy when the server is out of reach', async () => {
    const restock = await callJson(office, '/api/office/van-stock/movements', {
      body: { technicianId: org.technician.id, reason: 'restock', lines: [{ partId: van.parts.oil0w20, quantity: 4 }, { partId: van.parts.sp, quantity: 4 }] },
    });
    expect(restock.status).toBe(201);
    const before = await db.loadLists.get(NEXT);
    const fresh = await fetchLoadList({ db, fetch: sessionFetch(technician), baseUrl: baseUrl() }, NEXT);
    expect(fresh.fetchedAt >= before!.fetchedAt).toBe(true);
    expect(await pickOf('T-0W20')).toMatchObject({ onHand: 4, shortfall: 0, pickQuantity: 0 });
    expect(await pickOf('T-SP1')).toMatchObject({ onHand: 4, pickQuantity: 0 });
    expect((await pickOf('T-5W30'))?.pickQuantity).toBe(5);

    const noSignal = (() => Promise.reject(new TypeError('Failed to fetch'))) as typeof fetch;
    await expect(fetchLoadList({ db, fetch: noSignal, baseUrl: baseUrl() }, NEXT)).rejects.toThrow(OfflineError);
    expect(await db.loadLists.get(NEXT)).toEqual(fresh);
  });
});
