// The owner's screens: adding people and changing roles (a business keeps at least one owner),
// and business settings with money typed in major units.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';

let org: OrganisationFixture;
let owner: Session;

beforeAll(async () => {
  org = await createOrganisation('Owner screens');
  owner = await signIn(org.owner.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

const settings = (over: Record<string, unknown> = {}) => ({
  name: 'Owner Screens Servicing',
  addressLines: '2 Yard Lane',
  phone: '01632 960 000',
  email: '',
  currency: 'eur',
  labourRate: '58.5',
  taxPercent: '12.5',
  distanceUnit: 'km',
  timeZone: 'Europe/Dublin',
  workdayStart: '07:30',
  workdayEnd: '17:00',
  reminderLeadDays: '14',
  ...over,
});

describe('people', () => {
  it('adds a person who can then sign in with the role given', async () => {
    const email = `new.tech.${org.organisationId.slice(0, 8)}@test.example`;
    const response = await callJson(owner, '/api/office/people', { body: { name: 'Nia Newhand', email, role: 'technician', password: 'first-password-1' } });
    expect(response.status).toBe(201);
    const session = await signIn(email, 'first-password-1');
    expect(session.user).toMatchObject({ role: 'technician', organisationId: org.organisationId });
    const duplicate = await callJson(owner, '/api/office/people', { body: { name: 'Again', email: email.toUpperCase(), role: 'office', password: 'first-password-1' } });
    expect(duplicate.status).toBe(409);
  });

  it('refuses a short password', async () => {
    const response = await callJson(owner, '/api/office/people', { body: { name: 'Short', email: 'short@test.example', role: 'office', password: 'short' } });
    expect(response.status).toBe(400);
    expect(response.json.details).toEqual(['password: must be at least 10 characters']);
  });

  it('changes a role, but never leaves the business without an owner', async () => {
    const promoted = await callJson(owner, `/api/office/people/${org.office.id}`, { method: 'PUT', body: { role: 'owner' } });
    expect(promoted.json.person.role).toBe('owner');
    const demoted = await callJson(owner, `/api/office/people/${org.office.id}`, { method: 'PUT', body: { role: 'office' } });
    expect(demoted.json.person.role).toBe('office');
    const last = await callJson(owner, `/api/office/people/${org.owner.id}`, { method: 'PUT', body: { role: 'office' } });
    expect(last.status).toBe(409);
    const [me] = await testDb().select().from(s.user).where(eq(s.user.id, org.owner.id));
    expect(me!.role).toBe('owner');
  });

  it('cannot reach a person of another business', async () => {
    const elsewhere = await createOrganisation('Owner elsewhere');
    const response = await callJson(owner, `/api/office/people/${elsewhere.technician.id}`, { method: 'PUT', body: { role: 'owner' } });
    expect(response.status).toBe(404);
  });
});

describe('business settings', () => {
  it('saves rates typed in major units as minor units and basis points', async () => {
    const response = await callJson(owner, '/api/office/settings', { method: 'PUT', body: settings() });
    expect(response.status).toBe(200);
    expect(response.json.settings).toMatchObject({
      currency: 'EUR',
      labourRateMinorPerHour: 5850,
      taxRateBasisPoints: 1250,
      distanceUnit: 'km',
      timeZone: 'Europe/Dublin',
      workdayStartMinute: 450,
      workdayEndMinute: 1020,
      reminderLeadDays: 14,
    });
  });

  it('refuses bad values field by field, and changes nothing', async () => {
    const response = await callJson(owner, '/api/office/settings', {
      method: 'PUT',
      body: settings({ currency: 'EURO', taxPercent: '120', labourRate: '58.555', timeZone: 'Mars/Olympus', workdayEnd: '06:00' }),
    });
    expect(response.status).toBe(400);
    const details = (response.json.details as string[]).join('\n');
    expect(details).toMatch(/currency: /);
    expect(details).toMatch(/timeZone: is not a time zone/);
    const [row] = await testDb().select().from(s.organisations).where(eq(s.organisations.id, org.organisationId));
    expect(row!.currency).toBe('EUR');

    const second = await callJson(owner, '/api/office/settings', { method: 'PUT', body: settings({ taxPercent: '120', labourRate: '58.555', workdayEnd: '06:00' }) });
    expect(second.status).toBe(400);
    expect(second.json.details).toEqual(
      expect.arrayContaining(['labourRate: use an amount such as 62.50', 'taxPercent: at most 100 %', 'workdayEnd: must be after the start of the working day']),
    );
  });

  it('uses the currency’s own minor units (ISO 4217: the yen has none)', async () => {
    const response = await callJson(owner, '/api/office/settings', { method: 'PUT', body: settings({ currency: 'JPY', labourRate: '6200' }) });
    expect(response.json.settings.labourRateMinorPerHour).toBe(6200);
    const fraction = await callJson(owner, '/api/office/settings', { method: 'PUT', body: settings({ currency: 'JPY', labourRate: '62.5' }) });
    expect(fraction.status).toBe(400);
  });
});
