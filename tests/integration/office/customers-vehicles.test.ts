// Customers and vehicles through the API: validation with clear messages, trade checks on the
// vehicle (VIN per 49 CFR 565.15, registration, SAE J300 oil grade), organisation walls, and
// server-side paging, sorting and search.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';

let org: OrganisationFixture;
let other: OrganisationFixture;
let office: Session;
let outsider: Session;

beforeAll(async () => {
  org = await createOrganisation('Customers');
  other = await createOrganisation('Other customers');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  outsider = await signIn(other.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const customer = (over: Record<string, unknown> = {}) => ({
  name: 'Morwen Ashdale',
  email: 'Morwen@Mail.example',
  phone: '07700 900555',
  addressLines: '7 Pennant Way, Aldersby',
  postcode: 'qx4 2pw',
  notes: '',
  ...over,
});

const vehicle = (customerId: string, over: Record<string, unknown> = {}) => ({
  customerId,
  registration: 'qz21 abc',
  vin: '',
  make: 'Halden',
  model: 'Rook',
  engine: '1.6 diesel',
  fuel: 'diesel',
  year: '2021',
  odometerUnit: '[mi_i]',
  oilGrade: 'sae 5w30',
  oilCapacityL: '4.8',
  oilFilterPartId: '',
  airFilterPartId: '',
  cabinFilterPartId: '',
  fuelFilterPartId: '',
  sparkPlugPartId: '',
  sparkPlugCount: '',
  plugThread: '',
  plugSeat: '',
  plugGapMm: '',
  plugTorqueNm: '',
  sumpPlugTorqueNm: '35',
  wheelNutTorqueNm: '120',
  brakeFluidGrade: 'DOT 4',
  tyrePressureFrontKpa: '250',
  tyrePressureRearKpa: '240',
  specialTools: '8 mm hex key for the sump plug\n\n',
  serviceIntervalMonths: '12',
  serviceIntervalDistance: '12000',
  lastServiceDate: '',
  lastServiceOdometer: '',
  ...over,
});

describe('customers', () => {
  it('adds a customer, tidying e-mail and postcode', async () => {
    const response = await callJson(office, '/api/office/customers', { body: customer() });
    expect(response.status).toBe(201);
    expect(response.json.customer).toMatchObject({ name: 'Morwen Ashdale', email: 'morwen@mail.example', postcode: 'QX4 2PW', organisationId: org.organisationId });
  });

  it('refuses a customer without a name or with a bad e-mail, field by field', async () => {
    const response = await callJson(office, '/api/office/customers', { body: customer({ name: '  ', email: 'not-an-address' }) });
    expect(response.status).toBe(400);
    expect(response.json.details).toEqual(expect.arrayContaining(['name: needs a name', 'email: is not an e-mail address']));
  });

  it('answers malformed JSON with 400 and a non-JSON body with 415', async () => {
    expect((await callJson(office, '/api/office/customers', { body: '{"name":' })).status).toBe(400);
    const wrongType = await callJson(office, '/api/office/customers', { body: '<name>x</name>', headers: { 'content-type': 'application/xml' } });
    expect(wrongType.status).toBe(415);
  });

  it('keeps each business to its own customers', async () => {
    const created = await callJson(office, '/api/office/customers', { body: customer({ name: 'Private Person' }) });
    const id = created.json.customer.id;
    expect((await callJson(outsider, `/api/office/customers/${id}`)).status).toBe(404);
    expect((await callJson(outsider, `/api/office/customers/${id}`, { method: 'PUT', body: customer({ name: 'Renamed' }) })).status).toBe(404);
    const list = await callJson(outsider, '/api/office/customers?q=Private');
    expect(list.json.total).toBe(0);
    const [row] = await testDb().select().from(s.customers).where(eq(s.customers.id, id));
    expect(row!.name).toBe('Private Person');
  });

  it('bumps change_seq on update so phones pull the new details', async () => {
    const created = await callJson(office, '/api/office/customers', { body: customer({ name: 'Seq Person' }) });
    const before = created.json.customer.changeSeq as number;
    const updated = await callJson(office, `/api/office/customers/${created.json.customer.id}`, { method: 'PUT', body: customer({ name: 'Seq Person', phone: '07700 900666' }) });
    expect(updated.status).toBe(200);
    expect(Number(updated.json.customer.changeSeq)).toBeGreaterThan(Number(before));
  });

  it('pages, sorts and searches on the server', async () => {
    for (const name of ['Zed Paging', 'Amy Paging', 'Mo Paging']) await callJson(office, '/api/office/customers', { body: customer({ name }) });
    const page1 = await callJson(office, '/api/office/customers?q=paging&sort=name&dir=desc&pageSize=2&page=1');
    expect(page1.status).toBe(200);
    expect(page1.json.total).toBe(3);
    expect(page1.json.rows.map((r: { name: string }) => r.name)).toEqual(['Zed Paging', 'Mo Paging']);
    const page2 = await callJson(office, '/api/office/customers?q=paging&sort=name&dir=desc&pageSize=2&page=2');
    expect(page2.json.rows.map((r: { name: string }) => r.name)).toEqual(['Amy Paging']);
    const bad = await callJson(office, '/api/office/customers?sort=password&pageSize=100000');
    expect(bad.status).toBe(400);
    expect(bad.json.details.join(' ')).toMatch(/sort|pageSize/);
  });

  it('treats % and _ in a search as plain characters', async () => {
    const response = await callJson(office, '/api/office/customers?q=%25');
    expect(response.status).toBe(200);
    expect(response.json.total).toBe(0);
  });
});

describe('vehicles', () => {
  let customerId: string;
  beforeAll(async () => {
    customerId = (await callJson(office, '/api/office/customers', { body: customer({ name: 'Vehicle Owner' }) })).json.customer.id;
  });

  it('refuses a VIN whose check digit is wrong (49 CFR 565.15 worked example, last digit changed)', async () => {
    // 1M8GDM9AXKP042788 is valid (check digit X); changing the last digit breaks it (TRADE-REFERENCES §8.1).
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { vin: '1M8GDM9AXKP042789' }) });
    expect(response.status).toBe(400);
    expect(response.json.details.join(' ')).toMatch(/^vin: .*check digit/);
    expect(await testDb().select().from(s.vehicles).where(eq(s.vehicles.customerId, customerId))).toEqual([]);
  });

  it('refuses a VIN with a letter VINs never use (ISO 3779: no I, O or Q)', async () => {
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { vin: '1G4AH59H4OG118341' }) });
    expect(response.status).toBe(400);
    expect(response.json.details.join(' ')).toMatch(/vin: .*never uses O/);
  });

  it('refuses an oil grade SAE J300 does not define', async () => {
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { oilGrade: '5W-35' }) });
    expect(response.status).toBe(400);
    expect(response.json.details.join(' ')).toMatch(/oilGrade: SAE J300 defines no 35 grade/);
  });

  it('adds a vehicle with a good VIN, normalising plate, VIN and oil grade', async () => {
    // 1G4AH59H45G118341: the worked example of 49 CFR 565.15 Table V (check digit 4).
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { vin: '1g4ah59h45g118341' }) });
    expect(response.status).toBe(201);
    expect(response.json.vehicle).toMatchObject({
      registration: 'QZ21ABC',
      vin: '1G4AH59H45G118341',
      oilGrade: '5W-30',
      oilCapacityL: 4.8,
      year: 2021,
      specialTools: ['8 mm hex key for the sump plug'],
      plugSeat: null,
    });
  });

  it('refuses a second vehicle with the same plate in one business (409)', async () => {
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { registration: 'QZ21-ABC' }) });
    expect(response.status).toBe(409);
    expect(response.json.error).toMatch(/QZ21ABC is already on file/);
  });

  it('refuses another business’s customer or parts (422)', async () => {
    const foreign = await callJson(outsider, '/api/office/customers', { body: customer({ name: 'Foreign Owner' }) });
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(foreign.json.customer.id, { registration: 'QF1' }) });
    expect(response.status).toBe(422);
    const [part] = await testDb()
      .insert(s.parts)
      .values({ organisationId: other.organisationId, partNumber: 'X-1', description: 'Their filter', kind: 'oil_filter', unit: '{each}' })
      .returning();
    const withPart = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { registration: 'QF2', oilFilterPartId: part!.id }) });
    expect(withPart.status).toBe(422);
    expect(withPart.json.details).toEqual(['oilFilterPartId: unknown part']);
  });

  it('refuses a part of the wrong kind in a slot', async () => {
    const [plug] = await testDb()
      .insert(s.parts)
      .values({ organisationId: org.organisationId, partNumber: 'SP-1', description: 'A plug', kind: 'spark_plug', unit: '{each}' })
      .returning();
    const response = await callJson(office, '/api/office/vehicles', { body: vehicle(customerId, { registration: 'QF3', airFilterPartId: plug!.id }) });
    expect(response.status).toBe(422);
    expect(response.json.error).toMatch(/air filter is a spark plug/);
  });

  it('finds a vehicle by its plate typed with spaces, and shows matching model notes', async () => {
    await callJson(office, '/api/office/model-notes', { body: { make: 'halden', model: 'ROOK', engine: '', title: 'Breather hose', body: 'Squeeze the elbow.' } });
    await callJson(office, '/api/office/model-notes', { body: { make: 'Halden', model: 'Rook', engine: '2.0 petrol', title: 'Other engine', body: 'Not this one.' } });
    const list = await callJson(office, '/api/office/vehicles?q=qz21%20abc');
    expect(list.json.total).toBe(1);
    const detail = await callJson(office, `/api/office/vehicles/${list.json.rows[0].id}`);
    expect(detail.json.vehicle.modelNotes.map((n: { title: string }) => n.title)).toEqual(['Breather hose']);
  });

  it('answers 404 for a malformed or foreign vehicle id', async () => {
    expect((await callJson(office, '/api/office/vehicles/not-a-uuid')).status).toBe(404);
    const list = await callJson(office, '/api/office/vehicles?q=QZ21ABC');
    expect((await callJson(outsider, `/api/office/vehicles/${list.json.rows[0].id}`)).status).toBe(404);
  });
});
