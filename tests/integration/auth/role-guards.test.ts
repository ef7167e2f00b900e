import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testPool } from '../../support/database';

let org: OrganisationFixture;
let other: OrganisationFixture;
const sessions: Record<string, Session> = {};

beforeAll(async () => {
  org = await createOrganisation('Guards');
  other = await createOrganisation('Elsewhere');
  for (const role of ['owner', 'office', 'technician'] as const) {
    sessions[role] = await signIn(org[role].email, FIXTURE_PASSWORD);
  }
});
afterAll(async () => {
  await testPool().end();
});

describe('API role guards', () => {
  it('answers anonymous calls with 401 and a message', async () => {
    const response = await callJson(null, '/api/office/team');
    expect(response.status).toBe(401);
    expect(response.json.error).toMatch(/sign in/i);
  });

  it('answers a technician on an office route with 403', async () => {
    const response = await callJson(sessions.technician!, '/api/office/team');
    expect(response.status).toBe(403);
    expect(response.json.error).toMatch(/office or owner/);
  });

  it('lets office and owner read their own team, and only their own', async () => {
    for (const role of ['office', 'owner'] as const) {
      const response = await callJson(sessions[role]!, '/api/office/team');
      expect(response.status).toBe(200);
      const emails = response.json.team.map((p: { email: string }) => p.email).sort();
      expect(emails).toEqual([org.owner.email, org.office.email, org.technician.email, org.otherTechnician.email].sort());
      expect(emails).not.toContain(other.office.email);
    }
  });
});

describe('page guards', () => {
  it('sends anonymous visitors to sign-in, remembering where they were going', async () => {
    const response = await call(null, '/office/visits?status=booked');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/sign-in?next=%2Foffice%2Fvisits%3Fstatus%3Dbooked');
  });

  it('sends a technician away from office pages to their round', async () => {
    const response = await call(sessions.technician!, '/office');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/round');
  });

  it('sends office users from the root to the console', async () => {
    const response = await call(sessions.office!, '/');
    expect(response.headers.get('location')).toBe('/office');
  });

  it('serves the office console to the office with security headers', async () => {
    const response = await call(sessions.office!, '/office');
    expect(response.status).toBe(200);
    expect(response.headers.get('x-frame-options')).toBe('DENY');
    expect(response.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
  });
});
