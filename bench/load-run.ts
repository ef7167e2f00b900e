// The load benchmark proper (started by bench/load.mjs): BENCH_LOAD_DEVICES simulated phones
// (default 50; technicians of BENCH_LOAD_ORGS businesses, default 5) doing what phones do at the
// end of the day against the built server on loopback: push the outbox in batches of
// BENCH_LOAD_BATCH operations (the sync contract, lib/sync/push.ts), pull from the cursor until
// nothing more waits (lib/sync/pull.ts), repeat, for BENCH_LOAD_SECONDS (30). Our own loop over
// fetch rather than autocannon: each phone carries its session, clock, cursor and what the server
// acknowledged, and every answer is read.
//
// In the same run, two baselines: GET /api/health from the same number of loops (the server and
// HTTP alone, one `select 1`), and one phone alone (the same work with no one to contend with).
// Afterwards, nothing lost: every operation the server acknowledged is in sync_operations, and
// each visit's standing values are the last ones its phone sent.
import { randomUUID } from 'node:crypto';
import { loadavg } from 'node:os';
import { drizzle } from 'drizzle-orm/node-postgres';
import { inArray } from 'drizzle-orm';
import pg from 'pg';
import * as s from '../src/db/schema';
import type { Operation } from '../src/lib/sync/operations';
import { MAX_BATCH_OPERATIONS } from '../src/lib/sync/push';
import { benchBusiness, benchSignIn, benchVisit, percentile, type BenchBusiness, type BenchTechnician } from './lib/sync-fixture';

const BASE = process.env.BENCH_BASE_URL!;
const DEVICES = Number(process.env.BENCH_LOAD_DEVICES ?? 50);
const ORGS = Math.max(1, Math.min(DEVICES, Number(process.env.BENCH_LOAD_ORGS ?? 5)));
const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 30);
const BASELINE_SECONDS = Number(process.env.BENCH_LOAD_BASELINE_SECONDS ?? Math.max(3, Math.round(SECONDS / 5)));
const BATCH = Math.min(MAX_BATCH_OPERATIONS, Number(process.env.BENCH_LOAD_BATCH ?? 25));
const VISITS_PER_DEVICE = 3;
const REQUEST_TIMEOUT_MS = 30_000;
// A checklist of a common interim service's size: ticks, readings and parts.
const CHECKS = 30;
const READINGS = 12;
const PARTS = 4;

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
const db = drizzle(pool, { schema: s });

const ACKNOWLEDGED = new Set(['applied', 'duplicate', 'superseded', 'conflict', 'locked']);

type Phone = {
  tech: BenchTechnician;
  business: BenchBusiness;
  visits: string[];
  cursor: string;
  step: number;
  /** Op ids the server acknowledged (it holds them). */
  acknowledged: string[];
  /** The last value this phone sent per visit and item, and its notes per visit: what must stand. */
  lastCheck: Map<string, string>;
  lastReading: Map<string, number>;
  notes: Map<string, number>;
};

type Figures = { requests: number; operations: number; errors: number; rejected: number; push: number[]; pull: number[]; all: number[]; seconds: number };
const emptyFigures = (): Figures => ({ requests: 0, operations: 0, errors: 0, rejected: 0, push: [], pull: [], all: [], seconds: 0 });
const errorsSeen = new Map<string, number>();
function noteError(what: string) {
  errorsSeen.set(what, (errorsSeen.get(what) ?? 0) + 1);
}

/** The next batch of a day's work: ticks and re-ticks, readings, parts fitted, notes, a finding now and then. */
function nextBatch(phone: Phone): Operation[] {
  const { device } = phone.tech;
  const { checks, readings, parts } = phone.business;
  const ops: Operation[] = [];
  for (let i = 0; i < BATCH; i++) {
    const n = phone.step++;
    const visitId = phone.visits[Math.floor(n / 60) % phone.visits.length]!;
    const slot = n % 20;
    if (slot < 12) {
      const itemId = checks[n % checks.length]!;
      const state = (['done', 'skipped', 'not_yet'] as const)[Math.floor(n / checks.length) % 3]!;
      ops.push(device.check(visitId, itemId, state));
      phone.lastCheck.set(`${visitId}/${itemId}`, state);
    } else if (slot < 16) {
      const itemId = readings[n % readings.length]!;
      const value = Math.round((2 + (n % 70) / 10) * 10) / 10;
      ops.push(device.reading(visitId, itemId, value));
      phone.lastReading.set(`${visitId}/${itemId}`, value);
    } else if (slot < 18) {
      ops.push(device.note(visitId, `End of day note ${n}`));
      phone.notes.set(visitId, (phone.notes.get(visitId) ?? 0) + 1);
    } else if (slot === 18) {
      ops.push(device.partLine(visitId, randomUUID(), 1, { itemId: parts[n % parts.length]! }));
    } else {
      ops.push(device.finding(visitId, randomUUID(), (['watch', 'soon', 'now'] as const)[n % 3]!));
    }
  }
  return ops;
}

async function timed(figures: Figures, kind: 'push' | 'pull' | null, request: () => Promise<Response>): Promise<Response | null> {
  const started = performance.now();
  try {
    const response = await request();
    const elapsed = performance.now() - started;
    figures.requests += 1;
    figures.all.push(elapsed);
    if (kind) figures[kind].push(elapsed);
    if (!response.ok) {
      figures.errors += 1;
      noteError(`${kind ?? 'health'} ${response.status}: ${(await response.text()).slice(0, 120)}`);
      return null;
    }
    return response;
  } catch (error) {
    figures.requests += 1;
    figures.errors += 1;
    noteError(`${kind ?? 'health'}: ${error instanceof Error ? error.message : String(error)}`);
    return null;
  }
}

const headers = (t: BenchTechnician) => ({ origin: BASE, cookie: t.cookie!, 'x-forwarded-for': t.address });

async function pullAll(phone: Phone, figures: Figures) {
  for (;;) {
    const response = await timed(figures, 'pull', () =>
      fetch(`${BASE}/api/sync/pull?cursor=${phone.cursor}`, { headers: headers(phone.tech), signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS) }),
    );
    if (!response) return;
    const body = (await response.json()) as { cursor: string; hasMore: boolean };
    phone.cursor = body.cursor;
    if (!body.hasMore) return;
  }
}

async function pushOnce(phone: Phone, figures: Figures) {
  const operations = nextBatch(phone);
  const response = await timed(figures, 'push', () =>
    fetch(`${BASE}/api/sync/push`, {
      method: 'POST',
      headers: { ...headers(phone.tech), 'content-type': 'application/json' },
      body: JSON.stringify({ deviceId: phone.tech.device.deviceId, operations }),
      signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
    }),
  );
  if (!response) return;
  const body = (await response.json()) as { results: { opId: string; outcome: string; reason?: string }[] };
  for (const result of body.results) {
    if (ACKNOWLEDGED.has(result.outcome)) {
      phone.acknowledged.push(result.opId);
      figures.operations += 1;
    } else {
      figures.rejected += 1;
      noteError(`rejected: ${result.reason ?? ''}`.slice(0, 140));
    }
  }
}

async function endOfDay(phones: Phone[], seconds: number): Promise<Figures> {
  const figures = emptyFigures();
  const deadline = performance.now() + seconds * 1000;
  const started = performance.now();
  await Promise.all(
    phones.map(async (phone) => {
      while (performance.now() < deadline) {
        await pushOnce(phone, figures);
        await pullAll(phone, figures);
      }
    }),
  );
  figures.seconds = (performance.now() - started) / 1000;
  return figures;
}

async function health(loops: number, seconds: number): Promise<Figures> {
  const figures = emptyFigures();
  const deadline = performance.now() + seconds * 1000;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: loops }, async () => {
      while (performance.now() < deadline) {
        const response = await timed(figures, null, () => fetch(`${BASE}/api/health`, { signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS) }));
        await response?.arrayBuffer();
      }
    }),
  );
  figures.seconds = (performance.now() - started) / 1000;
  return figures;
}

async function phonesFor(count: number, label: string): Promise<Phone[]> {
  const phones: Phone[] = [];
  const perOrg = Math.ceil(count / ORGS);
  for (let o = 0; o * perOrg < count; o++) {
    const business = await benchBusiness(db, { technicians: Math.min(perOrg, count - o * perOrg), checks: CHECKS, readings: READINGS, parts: PARTS, label });
    for (const tech of business.technicians) {
      const visits: string[] = [];
      for (let v = 0; v < VISITS_PER_DEVICE; v++) visits.push(await benchVisit(db, business, tech.userId, v));
      await benchSignIn(BASE, tech);
      phones.push({ tech, business, visits, cursor: '0', step: 0, acknowledged: [], lastCheck: new Map(), lastReading: new Map(), notes: new Map() });
    }
  }
  // Each phone starts the evening with its round on it, as it would after the morning's pull.
  const warm = emptyFigures();
  await Promise.all(phones.map((p) => pullAll(p, warm)));
  if (warm.errors) throw new Error(`the first pull failed: ${[...errorsSeen.keys()].join('; ')}`);
  return phones;
}

/** Everything acknowledged is stored, and what stands is each phone's last change. */
async function verify(phones: Phone[]) {
  const problems: string[] = [];
  const ids = phones.flatMap((p) => p.acknowledged);
  let found = 0;
  for (let i = 0; i < ids.length; i += 5000) {
    const chunk = ids.slice(i, i + 5000);
    const rows = await db.select({ opId: s.syncOperations.opId }).from(s.syncOperations).where(inArray(s.syncOperations.opId, chunk));
    found += rows.length;
  }
  if (found !== ids.length) problems.push(`${ids.length - found} acknowledged operations are missing from sync_operations`);

  const visitIds = phones.flatMap((p) => p.visits);
  let checked = 0;
  for (let i = 0; i < visitIds.length; i += 500) {
    const chunk = visitIds.slice(i, i + 500);
    const [checks, readings, notes] = await Promise.all([
      db.select().from(s.checkResults).where(inArray(s.checkResults.visitId, chunk)),
      db.select().from(s.readingResults).where(inArray(s.readingResults.visitId, chunk)),
      db.select({ visitId: s.visitNotes.visitId }).from(s.visitNotes).where(inArray(s.visitNotes.visitId, chunk)),
    ]);
    const standingCheck = new Map(checks.map((c) => [`${c.visitId}/${c.itemId}`, c.state as string]));
    const standingReading = new Map(readings.map((r) => [`${r.visitId}/${r.itemId}`, r.value]));
    const noteCount = new Map<string, number>();
    for (const n of notes) noteCount.set(n.visitId, (noteCount.get(n.visitId) ?? 0) + 1);
    const inChunk = new Set(chunk);
    for (const phone of phones) {
      for (const [key, state] of phone.lastCheck) {
        if (!inChunk.has(key.split('/')[0]!)) continue;
        checked += 1;
        if (standingCheck.get(key) !== state) problems.push(`check ${key}: server has ${standingCheck.get(key)}, the phone last sent ${state}`);
      }
      for (const [key, value] of phone.lastReading) {
        if (!inChunk.has(key.split('/')[0]!)) continue;
        checked += 1;
        if (standingReading.get(key) !== value) problems.push(`reading ${key}: server has ${standingReading.get(key)}, the phone last sent ${value}`);
      }
      for (const [visitId, count] of phone.notes) {
        if (!inChunk.has(visitId)) continue;
        checked += 1;
        if ((noteCount.get(visitId) ?? 0) !== count) problems.push(`visit ${visitId}: ${noteCount.get(visitId) ?? 0} notes stored, the phone sent ${count}`);
      }
    }
  }
  return { acknowledged: ids.length, found, checked, problems };
}

const ms = (n: number) => (Number.isNaN(n) ? '–' : n.toFixed(0));
function row(label: string, f: Figures, withOps: boolean) {
  const cells = [
    label.padEnd(40),
    (withOps ? (f.operations / f.seconds).toFixed(0) : '–').padStart(8),
    (f.requests / f.seconds).toFixed(0).padStart(8),
    ms(percentile(f.all, 50)).padStart(7),
    ms(percentile(f.all, 99)).padStart(7),
    (withOps ? `${ms(percentile(f.push, 50))}/${ms(percentile(f.push, 99))}` : '–').padStart(11),
    (withOps ? `${ms(percentile(f.pull, 50))}/${ms(percentile(f.pull, 99))}` : '–').padStart(11),
    String(f.errors + f.rejected).padStart(7),
  ];
  console.log(cells.join(' '));
}

console.log(
  `load benchmark: ${DEVICES} phones in ${ORGS} businesses, ${VISITS_PER_DEVICE} visits each, push ${BATCH} operations then pull, repeat for ${SECONDS} s; baselines ${BASELINE_SECONDS} s each; loopback ${BASE}`,
);
const alone = await phonesFor(1, 'Alone');
const crowd = await phonesFor(DEVICES, 'Crowd');
const healthFigures = await health(DEVICES, BASELINE_SECONDS);
const aloneFigures = await endOfDay(alone, BASELINE_SECONDS);
const crowdFigures = await endOfDay(crowd, SECONDS);
const check = await verify([...alone, ...crowd]);

console.log('');
console.log(
  ['what'.padEnd(40), 'ops/s'.padStart(8), 'req/s'.padStart(8), 'p50 ms'.padStart(7), 'p99 ms'.padStart(7), 'push p50/99'.padStart(11), 'pull p50/99'.padStart(11), 'errors'.padStart(7)].join(' '),
);
row(`${DEVICES} phones, push ${BATCH} + pull, ${SECONDS} s`, crowdFigures, true);
row(`baseline: one phone alone, ${BASELINE_SECONDS} s`, aloneFigures, true);
row(`baseline: GET /api/health x ${DEVICES} loops`, healthFigures, false);
console.log(`\n(errors = failed requests + rejected operations; load average ${loadavg().map((l) => l.toFixed(1)).join(' ')})`);
if (errorsSeen.size) {
  console.log('errors seen:');
  for (const [what, count] of errorsSeen) console.log(`  ${count} × ${what}`);
}
if (check.problems.length === 0) {
  console.log(`nothing lost: all ${check.acknowledged} acknowledged operations are in sync_operations, and ${check.checked} standing values (checks, readings, note counts) are each phone's last change`);
} else {
  console.log(`LOST OR WRONG (${check.problems.length}):`);
  for (const p of check.problems.slice(0, 20)) console.log(`  ${p}`);
}
await pool.end();
process.exit(check.problems.length === 0 ? 0 : 1);
