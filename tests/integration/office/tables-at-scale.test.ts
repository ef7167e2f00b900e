// The office tables with thousands of rows: paging, sorting and filtering happen in PostgreSQL,
// so every page is complete and in order, and totals are exact. (How fast: bench/office-tables.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBulkVisits } from '../../../src/db/seed/bulk-visits';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { callJson, signIn, type Session } from '../../support/http';
import { publishedChecklist } from '../../support/office-fixtures';

const VISITS = 3000;
let org: OrganisationFixture;
let office: Session;
let made: Awaited<ReturnType<typeof createBulkVisits>>;

beforeAll(async () => {
  org = await createOrganisation('Scale');
  await publishedChecklist(org);
  made = await testDb().transaction((tx) => createBulkVisits(tx, org.organisationId, { count: VISITS, until: '2031-06-30' }));
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
}, 120_000);
afterAll(async () => {
  await testPool().end();
});

describe('tables at scale', () => {
  it('counts every visit and pages through them without repeating or skipping one', async () => {
    const seen = new Set<string>();
    let total = 0;
    for (let page = 1; ; page += 1) {
      const response = await callJson(office, `/api/office/visits?pageSize=200&page=${page}&sort=customer`);
      expect(response.status).toBe(200);
      total = response.json.total;
      for (const row of response.json.rows) seen.add(row.id);
      if (response.json.rows.length < 200) break;
    }
    expect(total).toBe(VISITS);
    expect(seen.size).toBe(VISITS);
  });

  it('sorts across pages, not just within one', async () => {
    const first = await callJson(office, '/api/office/visits?pageSize=50&page=1&sort=slotStart&dir=desc');
    const last = await callJson(office, `/api/office/visits?pageSize=50&page=${VISITS / 50}&sort=slotStart&dir=desc`);
    expect(first.json.rows[0].roundDate).toBe(made.lastDay);
    expect(last.json.rows.at(-1).roundDate >= made.firstDay).toBe(true);
    expect(first.json.rows[0].slotStart > last.json.rows.at(-1).slotStart).toBe(true);
  });

  it('filters with exact totals', async () => {
    const attention = await callJson(office, '/api/office/visits?attention=1&pageSize=10');
    // createBulkVisits gives every seventh visit a finding, cycling watch, soon, now, ok.
    const withFinding = Math.ceil(VISITS / 7);
    const soonOrNow = Array.from({ length: withFinding }, (_, i) => i % 4).filter((k) => k === 1 || k === 2).length;
    expect(attention.json.total).toBe(soonOrNow);
    const signedOff = await callJson(office, '/api/office/visits?status=signed_off&pageSize=10');
    expect(signedOff.json.total).toBe(VISITS / 5);
    const customers = await callJson(office, '/api/office/customers?q=Bulk%20customer&pageSize=10&sort=vehicles&dir=desc');
    expect(customers.json.total).toBe(made.customers);
    expect(customers.json.rows[0].vehicleCount).toBe(1);
  });
});
