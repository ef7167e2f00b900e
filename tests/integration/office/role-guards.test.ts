// Every office route refuses technicians (403) and anonymous callers (401), and the owner's
// routes refuse the office (403); none of these change anything. The routes are read from
// src/pages/api/office, so a new route is covered the day it is added.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { randomUUID } from 'node:crypto';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';

const root = join(__dirname, '..', '..', '..');
const officeApi = join(root, 'src', 'pages', 'api', 'office');

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? routeFiles(path) : /\.(ts|js)$/.test(name) ? [path] : [];
  });
}

const routes = routeFiles(officeApi).flatMap((file) => {
  const path = `/api/office/${relative(officeApi, file)}`
    .replace(/\.(ts|js)$/, '')
    .replace(/\/index$/, '')
    .replace(/\[[^\]]+\]/g, () => randomUUID());
  const methods = [...readFileSync(file, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]!);
  return methods.map((method) => ({ method, path }));
});

let org: OrganisationFixture;
const sessions: Partial<Record<'technician' | 'office' | 'owner', Session>> = {};

beforeAll(async () => {
  org = await createOrganisation('Office guards');
  sessions.technician = await signIn(org.technician.email, FIXTURE_PASSWORD);
  sessions.office = await signIn(org.office.email, FIXTURE_PASSWORD);
});
afterAll(async () => {
  await testPool().end();
});

async function rowsOfOrganisation() {
  const db = testDb();
  const [customers] = await db.select({ n: count() }).from(s.customers).where(eq(s.customers.organisationId, org.organisationId));
  const [people] = await db.select({ n: count() }).from(s.user).where(eq(s.user.organisationId, org.organisationId));
  const [orgRow] = await db.select().from(s.organisations).where(eq(s.organisations.id, org.organisationId));
  return { customers: customers!.n, people: people!.n, name: orgRow!.name };
}

const body = { name: 'Intruder', email: 'intruder@test.example', role: 'owner', password: 'long-enough-1' };

describe('office routes', () => {
  it('finds the office routes to check', () => {
    expect(routes.length).toBeGreaterThan(25);
    expect(routes).toContainEqual({ method: 'POST', path: '/api/office/visits' });
  });

  it('answer a technician with 403 and change nothing', async () => {
    const before = await rowsOfOrganisation();
    const refused: string[] = [];
    for (const { method, path } of routes) {
      const response = await callJson(sessions.technician!, path, { method, body: method === 'GET' ? undefined : body });
      if (response.status !== 403) refused.push(`${method} ${path}: ${response.status}`);
      else if (!/office|owner/.test(String(response.json.error))) refused.push(`${method} ${path}: 403 without saying why`);
    }
    expect(refused).toEqual([]);
    expect(await rowsOfOrganisation()).toEqual(before);
  });

  it('answer an anonymous caller with 401', async () => {
    const admitted: string[] = [];
    for (const { method, path } of routes) {
      const response = await callJson(null, path, { method, body: method === 'GET' ? undefined : body });
      if (response.status !== 401) admitted.push(`${method} ${path}: ${response.status}`);
    }
    expect(admitted).toEqual([]);
  });

  it('keep people and business settings from the office (owner only)', async () => {
    const before = await rowsOfOrganisation();
    const office = sessions.office!;
    expect((await callJson(office, '/api/office/people')).status).toBe(403);
    expect((await callJson(office, '/api/office/people', { body })).status).toBe(403);
    expect((await callJson(office, `/api/office/people/${org.technician.id}`, { method: 'PUT', body: { role: 'owner' } })).status).toBe(403);
    expect((await callJson(office, '/api/office/settings', { method: 'PUT', body: { name: 'Taken over' } })).status).toBe(403);
    // Reading the settings is allowed: the office plans in the business's time zone and hours.
    expect((await callJson(office, '/api/office/settings')).status).toBe(200);
    expect(await rowsOfOrganisation()).toEqual(before);
  });
});
