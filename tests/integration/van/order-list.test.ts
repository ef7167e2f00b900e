// The order list: next week's rounds less what every van holds, per supplier, as JSON and CSV.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { call, callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { bookVisit, createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let van: VanFixture;
const as: Record<string, Session> = {};

beforeAll(async () => {
  org = await createOrganisation('Order');
  van = await createVanFixture(org);
  // Monday to Wednesday: three petrol visits (3.2 L 0W-20, oil and air filter, four plugs each)
  // and one diesel (4.8 L 5W-30, oil, air and fuel filter), split over both vans.
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-05-04' });
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-05-05' });
  await bookVisit(org, van, { technicianId: org.otherTechnician.id, vehicleId: van.vehicles.petrol, roundDate: '2026-05-06' });
  await bookVisit(org, van, { technicianId: org.otherTechnician.id, vehicleId: van.vehicles.diesel, roundDate: '2026-05-06' });
  // Outside the week.
  await bookVisit(org, van, { technicianId: org.technician.id, vehicleId: van.vehicles.diesel, roundDate: '2026-05-11' });
  await testDb().insert(s.vanStockMovements).values([
    { organisationId: org.organisationId, technicianId: org.technician.id, partId: van.parts.of, quantity: 2, reason: 'restock' },
    { organisationId: org.organisationId, technicianId: org.otherTechnician.id, partId: van.parts.of, quantity: 1, reason: 'restock' },
    { organisationId: org.organisationId, technicianId: org.technician.id, partId: van.parts.oil0w20, quantity: 4, reason: 'restock' },
    // A van below zero lends nothing to the others.
    { organisationId: org.organisationId, technicianId: org.otherTechnician.id, partId: van.parts.oil0w20, quantity: -1, reason: 'count' },
    { organisationId: org.organisationId, technicianId: org.technician.id, partId: van.parts.af, quantity: 10, reason: 'restock' },
  ]);
  as.office = await signIn(org.office.email, FIXTURE_PASSWORD);
  as.technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const WEEK = 'from=2026-05-04&to=2026-05-10';

describe('GET /api/office/order-list', () => {
  it('orders what the week needs beyond the stock in the vans, per supplier, at cost', async () => {
    const { status, json } = await callJson(as.office!, `/api/office/order-list?${WEEK}`);
    expect(status).toBe(200);
    expect(json.visitCount).toBe(4);
    const summary = json.suppliers.map((sup: { supplier: string; lines: { part: { partNumber: string }; pickQuantity: number; costMinor: number }[]; totalCostMinor: number }) => ({
      supplier: sup.supplier,
      lines: sup.lines.map((l) => [l.part.partNumber, l.pickQuantity, l.costMinor]),
      total: sup.totalCostMinor,
    }));
    // 0W-20: 9.6 L − 4 L = 5.6 L → 5 L + 1 L = 6 L × 700. 5W-30: 4.8 L → 5 L × 600.
    // Oil filters: 4 − 3 = 1 × 450. Fuel filter: 1 × 1300. Plugs: 12 × 400. Air filters covered.
    expect(summary).toEqual([
      { supplier: 'Filters Test', lines: [['T-FF1', 1, 1300], ['T-OF1', 1, 450]], total: 1750 },
      { supplier: 'Oilery Test', lines: [['T-0W20', 6, 4200], ['T-5W30', 5, 3000]], total: 7200 },
      { supplier: 'Sparks Test', lines: [['T-SP1', 12, 4800]], total: 4800 },
    ]);
    expect(json.totalCostMinor).toBe(13750);
    expect(json.currency).toBe('GBP');
  });

  it('exports the same list as CSV with a header row', async () => {
    const response = await call(as.office!, `/api/office/order-list?${WEEK}&format=csv`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(response.headers.get('content-disposition')).toBe('attachment; filename="order-list-2026-05-04-to-2026-05-10.csv"');
    const rows = (await response.text()).trimEnd().split('\r\n');
    expect(rows[0]).toBe('Supplier,Part number,Description,Oil grade,Needed,In vans,Order quantity,Unit,Containers,Unit cost (GBP),Line cost (GBP)');
    expect(rows).toContain('Oilery Test,T-0W20,T-0W20 test part,0W-20,9.6,4,6,L,1 × 5 L + 1 × 1 L,7.00,42.00');
    expect(rows).toContain('Sparks Test,T-SP1,T-SP1 test part,,12,0,12,each,,4.00,48.00');
    expect(rows).toHaveLength(6);
  });

  it('refuses ranges it cannot plan and callers who are not the office', async () => {
    expect((await callJson(as.office!, '/api/office/order-list?from=2026-05-10&to=2026-05-04')).status).toBe(400);
    const long = await callJson(as.office!, '/api/office/order-list?from=2026-05-01&to=2026-07-01');
    expect(long.status).toBe(400);
    expect(long.json.error).toMatch(/31 days/);
    expect((await callJson(as.office!, `/api/office/order-list?${WEEK}&format=pdf`)).status).toBe(400);
    expect((await callJson(as.technician!, `/api/office/order-list?${WEEK}`)).status).toBe(403);
  });

  it('defaults to the seven days from tomorrow', async () => {
    const { json } = await callJson(as.office!, '/api/office/order-list');
    const days = (Date.parse(json.to) - Date.parse(json.from)) / 86_400_000;
    expect(days).toBe(6);
  });
});
