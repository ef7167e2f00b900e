// `npm run bench:office`: how fast the office tables answer with many visits. Builds a scratch
// database beside the project's own, gives one business N visits (default 10 000), and times
// the queries behind the visits and customers tables (page 1, a deep page, each filter), in
// milliseconds, p50 and p95 of repeated runs, against a baseline: the same page of bare visit
// rows with no joins, counts or filters. Figures go to DEVELOPERS.md; nothing here asserts a time.
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { parseArgs } from 'node:util';
import pg from 'pg';
import { setup, root } from '../scripts/setup.mjs';
import { migrate } from '../scripts/lib/migrate.mjs';

const { values } = parseArgs({ options: { visits: { type: 'string', default: '10000' }, runs: { type: 'string', default: '30' }, keep: { type: 'boolean', default: false } } });
const VISITS = Number(values.visits);
const RUNS = Number(values.runs);

const { databaseUrl } = await setup({ install: false });
const scratchName = `bench_office_${Date.now().toString(36)}`;
const adminUrl = new URL(databaseUrl);
adminUrl.pathname = '/postgres';
const scratchUrl = new URL(databaseUrl);
scratchUrl.pathname = `/${scratchName}`;
const admin = new pg.Client({ connectionString: adminUrl.toString() });
await admin.connect();
await admin.query(`create database "${scratchName}"`);

try {
  await migrate(root, scratchUrl.toString());
  process.env.DATABASE_URL = scratchUrl.toString();
  const { getDb, getPool, closeDb } = await import('../src/db/client');
  const s = await import('../src/db/schema');
  const { createBulkVisits } = await import('../src/db/seed/bulk-visits');
  const { insertTemplate, writeDraftContent, publishVersion } = await import('../src/lib/server/templates');
  const { listVisits } = await import('../src/lib/server/visit-review');
  const { listCustomers } = await import('../src/lib/server/customers');
  const { visitsQuery } = await import('../src/lib/office/visit-input');
  const { tableQuery } = await import('../src/lib/office/table-query');
  const { CUSTOMER_SORTS } = await import('../src/lib/office/customer-input');

  const db = getDb();
  const organisationId = randomUUID();
  await db.insert(s.organisations).values({ id: organisationId, name: 'Bench Servicing', slug: `bench-${organisationId.slice(0, 8)}` });
  const people = ['office', 'technician', 'technician', 'technician'] as const;
  const ids = people.map(() => randomUUID());
  await db.insert(s.user).values(people.map((role, i) => ({ id: ids[i]!, name: `Bench ${role} ${i}`, email: `bench${i}.${organisationId}@bench.example`, role, organisationId })));
  await db.transaction(async (tx) => {
    const { version } = await insertTemplate(tx, organisationId, { name: 'Bench service', description: '', labourCentiHours: 200 });
    await writeDraftContent(tx, organisationId, version.id, {
      sections: [{ title: 'Checks', items: [{ kind: 'check', label: 'A check', unit: null, expectedMin: null, expectedMax: null, rule: null, partKind: null, caution: null, hint: null }] }],
    });
    await publishVersion(tx, organisationId, version.id, ids[0]!);
  });
  const started = performance.now();
  const made = await db.transaction((tx) => createBulkVisits(tx, organisationId, { count: VISITS, until: '2031-06-30' }));
  console.log(`[bench] ${made.visits} visits, ${made.customers} customers, ${made.findings} findings for one business in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  await getPool().query('analyze');

  const time = async (run: () => Promise<unknown>) => {
    await run();
    const samples: number[] = [];
    for (let i = 0; i < RUNS; i += 1) {
      const t = performance.now();
      await run();
      samples.push(performance.now() - t);
    }
    samples.sort((a, b) => a - b);
    const at = (q: number) => samples[Math.min(samples.length - 1, Math.floor(q * samples.length))]!;
    return { p50: at(0.5), p95: at(0.95) };
  };
  const visits = (query: Record<string, string>) => () => listVisits(organisationId, visitsQuery.parse(query));
  const customerQuery = tableQuery(CUSTOMER_SORTS, 'name');
  const baseline = await time(() =>
    getPool().query('select * from visits where organisation_id = $1 order by slot_start desc, id desc limit 50', [organisationId]),
  );
  const cases: [string, () => Promise<unknown>][] = [
    ['visits, page 1 by time', visits({ sort: 'slotStart', dir: 'desc' })],
    ['visits, page 100 by time', visits({ sort: 'slotStart', dir: 'desc', page: '100' })],
    ['visits, by customer name', visits({ sort: 'customer' })],
    ['visits, findings soon or now', visits({ attention: '1' })],
    ['visits, open conflicts', visits({ conflicts: '1' })],
    ['visits, one technician and month', visits({ technicianId: ids[1]!, from: '2031-05-01', to: '2031-05-31' })],
    ['visits, search "customer 12"', visits({ q: 'customer 12' })],
    ['customers, page 1 by name', () => listCustomers(organisationId, customerQuery.parse({}))],
    ['customers, by vehicles', () => listCustomers(organisationId, customerQuery.parse({ sort: 'vehicles', dir: 'desc' }))],
  ];
  console.log(`[bench] baseline (50 bare visit rows, no joins): p50 ${baseline.p50.toFixed(2)} ms, p95 ${baseline.p95.toFixed(2)} ms`);
  console.log('[bench] query                                  p50 ms   p95 ms   × baseline p50');
  for (const [name, run] of cases) {
    const { p50, p95 } = await time(run);
    console.log(`[bench] ${name.padEnd(38)} ${p50.toFixed(2).padStart(7)} ${p95.toFixed(2).padStart(8)} ${(p50 / baseline.p50).toFixed(1).padStart(10)}`);
  }
  await closeDb();
} finally {
  // --keep leaves the scratch database for EXPLAIN ANALYZE; drop it by hand afterwards.
  if (values.keep) console.log(`[bench] kept database ${scratchName}`);
  else await admin.query(`drop database if exists "${scratchName}" with (force)`);
  await admin.end();
}
