// The sync benchmark proper (started by bench/sync.mjs): N simulated devices, each a technician
// working through their visits, push every visit's operations as one batch through the real
// endpoint into PostgreSQL; then, in the same run, a baseline writes the same rows with plain
// multi-row INSERTs and no merge logic, with the same batches and the same concurrency. It prints
// operations per second, push latency (p50, p95) and the ratio of the two. Figures, not a test.
import { randomUUID } from 'node:crypto';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as s from '../src/db/schema';
import { entityIdOf, type Operation } from '../src/lib/sync/operations';
import type { TestDevice } from '../tests/support/sync-ops';
import { benchBusiness, benchSignIn, benchVisit, percentile, type BenchBusiness, type BenchTechnician } from './lib/sync-fixture';

const DEVICES = Number(process.env.BENCH_DEVICES ?? 8);
const VISITS = Number(process.env.BENCH_VISITS ?? 5);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const BASE = process.env.BENCH_BASE_URL!;
// One visit's work: a full checklist once through, a few findings and part lines, notes.
const CHECKS = 40;
const READINGS = 20;
const PARTS = 5;
const FINDINGS = 3;
const NOTES = 12;

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: DEVICES + 2 });
const db = drizzle(pool, { schema: s });

type Device = BenchTechnician;
type Fixture = BenchBusiness;

function visitWork(fx: Fixture, visitId: string, device: TestDevice): Operation[] {
  return [
    ...fx.checks.map((itemId) => device.check(visitId, itemId, 'done')),
    ...fx.readings.map((itemId, i) => device.reading(visitId, itemId, 3 + i / 10)),
    ...fx.parts.map((itemId) => device.partLine(visitId, randomUUID(), 1, { itemId })),
    ...Array.from({ length: FINDINGS }, (_, i) => device.finding(visitId, randomUUID(), (['watch', 'soon', 'now'] as const)[i]!)),
    ...Array.from({ length: NOTES }, (_, i) => device.note(visitId, `Bench note ${i}`)),
  ];
}

async function pushBatch(d: Device, ops: Operation[]) {
  const response = await fetch(`${BASE}/api/sync/push`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: BASE, cookie: d.cookie!, 'x-forwarded-for': d.address },
    body: JSON.stringify({ deviceId: d.device.deviceId, operations: ops }),
  });
  const body = (await response.json()) as { results: { outcome: string }[] };
  if (!response.ok || body.results.some((r) => r.outcome !== 'applied')) throw new Error(`push failed: ${response.status} ${JSON.stringify(body).slice(0, 300)}`);
}

/** The same rows the merge path writes for a batch, as plain multi-row INSERTs. */
async function insertBatch(d: Device, organisationId: string, ops: Operation[]) {
  const client = await pool.connect();
  try {
    await client.query('begin');
    const rows = <T>(list: T[], columns: number, values: (item: T) => unknown[]) => {
      const params = list.flatMap(values);
      const tuples = list.map((_, i) => `(${Array.from({ length: columns }, (_, j) => `$${i * columns + j + 1}`).join(', ')})`).join(', ');
      return { params, tuples };
    };
    const insert = async <T>(sql: string, list: T[], columns: number, values: (item: T) => unknown[]) => {
      if (list.length === 0) return;
      const { params, tuples } = rows(list, columns, values);
      await client.query(`${sql} values ${tuples}`, params);
    };
    await insert(
      'insert into sync_operations (op_id, organisation_id, visit_id, user_id, device_id, kind, entity_id, stamp, seen_stamp, payload, outcome)',
      ops,
      11,
      (o) => [o.opId, organisationId, o.visitId, d.userId, o.deviceId, o.kind, entityIdOf(o), o.stamp, o.seenStamp, JSON.stringify(o.payload), 'applied'],
    );
    const of = <K extends Operation['kind']>(kind: K) => ops.filter((o): o is Extract<Operation, { kind: K }> => o.kind === kind);
    await insert('insert into check_results (visit_id, item_id, state, stamp, op_id, updated_by)', of('check'), 6, (o) => [o.visitId, o.payload.itemId, o.payload.state, o.stamp, o.opId, d.userId]);
    await insert('insert into reading_results (visit_id, item_id, value, text_value, unit, stamp, op_id, updated_by)', of('reading'), 8, (o) => [
      o.visitId, o.payload.itemId, o.payload.value, o.payload.textValue, o.payload.unit, o.stamp, o.opId, d.userId,
    ]);
    await insert('insert into findings (id, visit_id, item_id, title, detail, severity, severity_stamp, stamp, created_by)', of('finding'), 9, (o) => [
      o.payload.findingId, o.visitId, o.payload.itemId, o.payload.title, o.payload.detail, o.payload.severity, o.stamp, o.stamp, d.userId,
    ]);
    await insert('insert into visit_notes (id, visit_id, body, author_id, stamp)', of('note'), 5, (o) => [o.payload.noteId, o.visitId, o.payload.body, d.userId, o.stamp]);
    await insert('insert into part_lines (id, visit_id, item_id, part_id, part_number, description, quantity, unit, removed, stamp, updated_by)', of('part_line'), 11, (o) => [
      o.payload.lineId, o.visitId, o.payload.itemId, o.payload.partId, o.payload.partNumber, o.payload.description, o.payload.quantity, o.payload.unit, o.payload.removed, o.stamp, d.userId,
    ]);
    await client.query('commit');
  } finally {
    client.release();
  }
}


async function measure(devices: Device[], work: Map<Device, Operation[][]>, send: (d: Device, ops: Operation[]) => Promise<void>) {
  const latencies: number[] = [];
  let operations = 0;
  const started = performance.now();
  await Promise.all(
    devices.map(async (d) => {
      for (const batch of work.get(d)!) {
        const t = performance.now();
        await send(d, batch);
        latencies.push(performance.now() - t);
        operations += batch.length;
      }
    }),
  );
  const seconds = (performance.now() - started) / 1000;
    return { opsPerSecond: operations / seconds, p50: percentile(latencies, 50), p95: percentile(latencies, 95), operations };
}

async function prepare(fx: Fixture, devices: Device[]) {
  const work = new Map<Device, Operation[][]>();
  for (const d of devices) {
    const batches: Operation[][] = [];
    for (let v = 0; v < VISITS; v++) batches.push(visitWork(fx, await benchVisit(db, fx, d.userId), d.device));
    work.set(d, batches);
  }
  return work;
}

const fx = await benchBusiness(db, { technicians: DEVICES, checks: CHECKS, readings: READINGS, parts: PARTS });
const devices = fx.technicians;
for (const d of devices) await benchSignIn(BASE, d);
const perVisit = CHECKS + READINGS + PARTS + FINDINGS + NOTES;
console.log(`sync benchmark: ${DEVICES} devices × ${VISITS} visits × ${perVisit} operations, one visit per push, best of ${ROUNDS} rounds`);
// A warm-up visit per device, so both sides start with warm caches and connections.
await measure(devices, await prepare(fx, devices).then((w) => new Map([...w].map(([d, b]) => [d, b.slice(0, 1)]))), pushBatch);

const best = { merge: { opsPerSecond: 0, p50: 0, p95: 0, operations: 0 }, base: { opsPerSecond: 0, p50: 0, p95: 0, operations: 0 } };
for (let round = 0; round < ROUNDS; round++) {
  const merge = await measure(devices, await prepare(fx, devices), pushBatch);
  const base = await measure(devices, await prepare(fx, devices), (d, ops) => insertBatch(d, fx.organisationId, ops));
  if (merge.opsPerSecond > best.merge.opsPerSecond) best.merge = merge;
  if (base.opsPerSecond > best.base.opsPerSecond) best.base = base;
  console.log(`  round ${round + 1}: merge ${merge.opsPerSecond.toFixed(0)} ops/s, baseline ${base.opsPerSecond.toFixed(0)} ops/s`);
}
const row = (label: string, r: typeof best.merge) =>
  `${label.padEnd(52)} ${r.opsPerSecond.toFixed(0).padStart(7)} ops/s   p50 ${r.p50.toFixed(1).padStart(6)} ms   p95 ${r.p95.toFixed(1).padStart(6)} ms`;
console.log(row('merge path (HTTP push, auth, merge, PostgreSQL)', best.merge));
console.log(row('baseline (multi-row INSERT, no merge, no HTTP)', best.base));
console.log(`ratio merge / baseline: ${(best.merge.opsPerSecond / best.base.opsPerSecond).toFixed(2)}`);
await pool.end();
