import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, callJson, signIn } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { newClientAddress } from '../../support/client-address';
import { testPool } from '../../support/database';

let org: OrganisationFixture;

beforeAll(async () => {
  org = await createOrganisation('Sign-in');
});
afterAll(async () => {
  await testPool().end();
});

describe('sign-in', () => {
  for (const role of ['owner', 'office', 'technician'] as const) {
    it(`signs in the ${role} and reports the role and organisation`, async () => {
      const session = await signIn(org[role].email, FIXTURE_PASSWORD);
      expect(session.user.role).toBe(role);
      expect(session.user.organisationId).toBe(org.organisationId);
      const me = await callJson(session, '/api/me');
      expect(me.status).toBe(200);
      expect(me.json.user).toMatchObject({ id: org[role].id, role, organisationId: org.organisationId });
    });
  }

  it('answers a wrong password with 401 and sets no session', async () => {
    const response = await call(null, '/api/auth/sign-in/email', {
      body: { email: org.office.email, password: 'not-the-password' },
      headers: { 'x-forwarded-for': newClientAddress() },
    });
    expect(response.status).toBe(401);
    expect(response.headers.getSetCookie().some((c) => c.startsWith('better-auth.session_token=') && !c.includes('Max-Age=0'))).toBe(false);
  });

  it('sets an HttpOnly, SameSite session cookie', async () => {
    const response = await call(null, '/api/auth/sign-in/email', {
      body: { email: org.office.email, password: FIXTURE_PASSWORD },
      headers: { 'x-forwarded-for': newClientAddress() },
    });
    const cookie = response.headers.getSetCookie().find((c) => c.startsWith('better-auth.session_token='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('limits sign-in attempts from one client to 10 a minute', async () => {
    const address = newClientAddress();
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 12; attempt += 1) {
      const response = await call(null, '/api/auth/sign-in/email', {
        body: { email: org.technician.email, password: 'wrong-password' },
        headers: { 'x-forwarded-for': address },
      });
      statuses.push(response.status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(10)).toEqual([429, 429]);
    // Another client is not affected.
    await expect(signIn(org.technician.email, FIXTURE_PASSWORD)).resolves.toBeTruthy();
  });

  it('signs out: the old cookie no longer works', async () => {
    const session = await signIn(org.technician.email, FIXTURE_PASSWORD);
    const out = await call(session, '/api/auth/sign-out', { body: {} });
    expect(out.status).toBe(200);
    expect((await call(session, '/api/me')).status).toBe(401);
  });
});
