// Van stock over real HTTP: restock, returns, counts and minimums by the office; every change a
// movement that explains the level; technicians read their own van only.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import * as s from '../../../src/db/schema';
import { call, callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let other: OrganisationFixture;
let van: VanFixture;
let otherVan: VanFixture;
const as: Record<string, Session> = {};

beforeAll(async () => {
  org = await createOrganisation('Stock');
  other = await createOrganisation('Elsewhere');
  van = await createVanFixture(org);
  otherVan = await createVanFixture(other);
  for (const role of ['office', 'technician', 'otherTechnician', 'owner'] as const) as[role] = await signIn(org[role].email, FIXTURE_PASSWORD);
  as.elsewhere = await signIn(other.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const stockOf = async (session: Session, technicianId: string) => (await callJson(session, `/api/van/stock?technicianId=${technicianId}`)).json;
const rowOf = (stock: { stock: { partId: string }[] }, partId: string) => stock.stock.find((r) => r.partId === partId) as Record<string, unknown> | undefined;
const movementCount = async () => (await testDb().select().from(s.vanStockMovements).where(eq(s.vanStockMovements.organisationId, org.organisationId))).length;

describe('restocking a van', () => {
  it('records one movement per line, with who and why, and the level follows', async () => {
    const response = await callJson(as.office!, '/api/office/van-stock/movements', {
      body: {
        technicianId: org.technician.id,
        reason: 'restock',
        lines: [
          { partId: van.parts.oil5w30, quantity: 10 },
          { partId: van.parts.of, quantity: 6 },
        ],
        note: 'Monday load',
      },
    });
    expect(response.status).toBe(201);
    expect(response.json.movements).toHaveLength(2);
    const stock = await stockOf(as.office!, org.technician.id);
    expect(rowOf(stock, van.parts.oil5w30)).toMatchObject({ level: 10, unit: 'L', minimum: null, low: false });
    expect(rowOf(stock, van.parts.of)).toMatchObject({ level: 6 });

    const back = await callJson(as.office!, '/api/office/van-stock/movements', {
      body: { technicianId: org.technician.id, reason: 'returned', lines: [{ partId: van.parts.of, quantity: 2 }] },
    });
    expect(back.status).toBe(201);
    const { json } = await callJson(as.office!, `/api/van/movements?technicianId=${org.technician.id}&partId=${van.parts.of}`);
    expect(json.movements.map((m: Record<string, unknown>) => [m.reason, m.quantity, m.levelAfter, m.recordedBy])).toEqual([
      ['returned', -2, 4, org.office.name],
      ['restock', 6, 6, org.office.name],
    ]);
  });

  it('refuses bad input and changes nothing', async () => {
    const before = await movementCount();
    const post = (body: unknown, headers?: Record<string, string>) => callJson(as.office!, '/api/office/van-stock/movements', { body, headers });
    const base = { technicianId: org.technician.id, reason: 'restock' };
    expect((await post({ ...base, lines: [] })).status).toBe(400);
    expect((await post({ ...base, lines: [{ partId: van.parts.of, quantity: -1 }] })).status).toBe(400);
    expect((await post({ ...base, lines: [{ partId: van.parts.of, quantity: 1 }, { partId: van.parts.of, quantity: 2 }] })).status).toBe(400);
    const fraction = await post({ ...base, lines: [{ partId: van.parts.oil5w30, quantity: 1 }, { partId: van.parts.of, quantity: 1.5 }] });
    expect(fraction.status).toBe(422);
    expect(fraction.json.error).toMatch(/whole/);
    const foreign = await post({ ...base, lines: [{ partId: otherVan.parts.of, quantity: 1 }] });
    expect(foreign.status).toBe(404);
    expect((await post({ ...base, technicianId: other.technician.id, lines: [{ partId: van.parts.of, quantity: 1 }] })).status).toBe(404);
    expect((await post({ ...base, technicianId: org.office.id, lines: [{ partId: van.parts.of, quantity: 1 }] })).status).toBe(404);
    expect((await post('{"technicianId":', {})).status).toBe(400);
    expect((await post({ ...base, lines: [{ partId: van.parts.of, quantity: 1 }] }, { 'content-type': 'application/xml' })).status).toBe(415);
    expect(await movementCount()).toBe(before);
  });

  it('is for the office only', async () => {
    const body = { technicianId: org.technician.id, reason: 'restock', lines: [{ partId: van.parts.of, quantity: 50 }] };
    const response = await callJson(as.technician!, '/api/office/van-stock/movements', { body });
    expect(response.status).toBe(403);
    expect((await callJson(null, '/api/office/van-stock/movements', { body })).status).toBe(401);
    expect((await callJson(as.elsewhere!, '/api/office/van-stock/movements', { body })).status).toBe(404);
  });
});

describe('stock counts and minimums', () => {
  it('writes the difference a count finds, and nothing when it agrees', async () => {
    const technicianId = org.otherTechnician.id;
    await callJson(as.owner!, '/api/office/van-stock/movements', { body: { technicianId, reason: 'restock', lines: [{ partId: van.parts.sp, quantity: 8 }] } });
    const count = await callJson(as.office!, '/api/office/van-stock/count', { body: { technicianId, partId: van.parts.sp, counted: 6, note: 'Two missing' } });
    expect(count.status).toBe(200);
    expect(count.json).toMatchObject({ levelBefore: 8, difference: -2 });
    const again = await callJson(as.office!, '/api/office/van-stock/count', { body: { technicianId, partId: van.parts.sp, counted: 6 } });
    expect(again.json).toMatchObject({ levelBefore: 6, difference: 0, movementId: null });
    expect(rowOf(await stockOf(as.office!, technicianId), van.parts.sp)).toMatchObject({ level: 6 });
  });

  it('warns when a van falls below the minimum the office set, and not at it', async () => {
    const technicianId = org.otherTechnician.id;
    const set = await callJson(as.office!, '/api/office/van-stock/minimums', { method: 'PUT', body: { technicianId, partId: van.parts.sp, minimum: 6 } });
    expect(set.status).toBe(200);
    expect(rowOf(await stockOf(as.office!, technicianId), van.parts.sp)).toMatchObject({ level: 6, minimum: 6, low: false });
    await callJson(as.office!, '/api/office/van-stock/minimums', { method: 'PUT', body: { technicianId, partId: van.parts.sp, minimum: 7 } });
    expect(rowOf(await stockOf(as.office!, technicianId), van.parts.sp)).toMatchObject({ minimum: 7, low: true });
    // A minimum on a part the van never held still shows, as low.
    await callJson(as.office!, '/api/office/van-stock/minimums', { method: 'PUT', body: { technicianId, partId: van.parts.cf, minimum: 1 } });
    expect(rowOf(await stockOf(as.office!, technicianId), van.parts.cf)).toMatchObject({ level: 0, low: true });
    await callJson(as.office!, '/api/office/van-stock/minimums', { method: 'PUT', body: { technicianId, partId: van.parts.cf, minimum: null } });
    expect(rowOf(await stockOf(as.office!, technicianId), van.parts.cf)).toBeUndefined();
    const bad = await callJson(as.office!, '/api/office/van-stock/minimums', { method: 'PUT', body: { technicianId, partId: van.parts.cf, minimum: -1 } });
    expect(bad.status).toBe(400);
  });
});

describe('reading van stock', () => {
  it('shows a technician their own van, with used oil, and no one else’s', async () => {
    const own = await callJson(as.technician!, '/api/van/stock');
    expect(own.status).toBe(200);
    expect(own.json.technician.id).toBe(org.technician.id);
    expect(own.json).toHaveProperty('usedOilHeldL', 0);
    expect((await callJson(as.technician!, `/api/van/stock?technicianId=${org.otherTechnician.id}`)).status).toBe(403);
    expect((await callJson(as.technician!, `/api/van/movements?technicianId=${org.otherTechnician.id}`)).status).toBe(403);
    expect((await callJson(as.elsewhere!, `/api/van/stock?technicianId=${org.technician.id}`)).status).toBe(404);
    expect((await callJson(as.office!, `/api/van/movements?technicianId=${org.technician.id}&partId=${randomUUID()}`)).json.movements).toEqual([]);
    expect((await callJson(as.office!, `/api/van/movements?technicianId=${org.technician.id}&partId=nope`)).status).toBe(400);
  });

  it('serves the office pages to the office and sends technicians away', async () => {
    for (const path of [`/office/vans?technician=${org.technician.id}`, '/office/vans/load-list', '/office/vans/order-list', '/office/vans/used-oil', '/office/vans/parts']) {
      const response = await call(as.office!, path);
      expect(response.status, path).toBe(200);
      expect(await response.text()).not.toContain(other.technician.id);
    }
    expect((await call(as.office!, `/office/vans/load-list?technician=${other.technician.id}`)).status).toBe(404);
    expect((await call(as.technician!, '/office/vans')).status).toBe(303);
  });
});
