// The parts catalogue: the office adds parts and sets each oil's containers; the rules of oil
// (litres, a real SAE grade) hold at the boundary.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testPool } from '../../support/database';
import { createVanFixture, type VanFixture } from '../../support/van-fixtures';

let org: OrganisationFixture;
let other: OrganisationFixture;
let van: VanFixture;
const as: Record<string, Session> = {};

beforeAll(async () => {
  org = await createOrganisation('Catalogue');
  other = await createOrganisation('Elsewhere');
  van = await createVanFixture(org);
  as.office = await signIn(org.office.email, FIXTURE_PASSWORD);
  as.technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  as.elsewhere = await signIn(other.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const oil = { partNumber: 'T-10W40', description: 'Oil 10W-40', kind: 'oil', unit: 'L', oilGrade: 'sae 10w40', costMinor: 500, priceMinor: 900, supplier: 'Oilery Test' };

describe('parts catalogue', () => {
  it('adds an oil with its grade normalised, and sets its containers', async () => {
    const created = await callJson(as.office!, '/api/office/parts', { body: oil });
    expect(created.status).toBe(201);
    const id = created.json.part.id;
    const sizes = await callJson(as.office!, `/api/office/parts/${id}/containers`, { method: 'PUT', body: { sizesL: [5, 1, 1] } });
    expect(sizes.json).toEqual({ sizesL: [1, 5] });
    const { json } = await callJson(as.office!, '/api/office/parts');
    expect(json.parts.find((p: { id: string }) => p.id === id)).toMatchObject({ oilGrade: '10W-40', containerSizesL: [1, 5], active: true });
  });

  it('refuses what oil cannot be, a duplicate number, and another business’s part', async () => {
    expect((await callJson(as.office!, '/api/office/parts', { body: { ...oil, partNumber: 'X1', oilGrade: '5W-35' } })).status).toBe(422);
    expect((await callJson(as.office!, '/api/office/parts', { body: { ...oil, partNumber: 'X2', unit: '{each}' } })).status).toBe(422);
    expect((await callJson(as.office!, '/api/office/parts', { body: { ...oil, partNumber: 'X3', costMinor: 1.5 } })).status).toBe(400);
    const dup = await callJson(as.office!, '/api/office/parts', { body: { ...oil, partNumber: 'T-OF1', kind: 'oil_filter', unit: '{each}', oilGrade: null } });
    expect(dup.status).toBe(409);
    expect((await callJson(as.office!, `/api/office/parts/${van.parts.of}/containers`, { method: 'PUT', body: { sizesL: [1] } })).status).toBe(422);
    expect((await callJson(as.elsewhere!, `/api/office/parts/${van.parts.of}`, { method: 'PATCH', body: { costMinor: 1 } })).status).toBe(404);
    expect((await callJson(as.technician!, '/api/office/parts')).status).toBe(403);
  });

  it('changes prices and takes a part out of stock', async () => {
    const patched = await callJson(as.office!, `/api/office/parts/${van.parts.af}`, { method: 'PATCH', body: { costMinor: 777, active: false } });
    expect(patched.status).toBe(200);
    const { json } = await callJson(as.office!, '/api/office/parts');
    expect(json.parts.find((p: { id: string }) => p.id === van.parts.af)).toMatchObject({ costMinor: 777, active: false });
    // A part no longer stocked cannot be loaded into a van.
    const load = await callJson(as.office!, '/api/office/van-stock/movements', {
      body: { technicianId: org.technician.id, reason: 'restock', lines: [{ partId: van.parts.af, quantity: 1 }] },
    });
    expect(load.status).toBe(422);
    expect(load.json.error).toMatch(/no longer stocked/);
  });
});
