// Faults on the way of a push: the server killed in the middle of a batch, and PostgreSQL
// crashing between a push and its retry. Each test runs its own server process (and the second
// its own throwaway cluster), so the shared test server and database never notice.
import { randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import * as s from '../../src/db/schema';
import type { Operation } from '../../src/lib/sync/operations';
import { migrate } from '../../scripts/lib/migrate.mjs';
import { testDb, testPool } from '../support/database';
import { createOrganisation, FIXTURE_PASSWORD } from '../support/fixtures';
import { freePort, pushAt, signInAt, startApp, waitForStderr, type AppProcess } from '../support/app-process';
import { privateCluster, type PrivateCluster } from '../support/private-postgres';
import { TestDevice } from '../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../support/visit-fixtures';

const cleanups: (() => Promise<void> | void)[] = [];
afterAll(async () => {
  for (const cleanup of cleanups.reverse()) await cleanup();
  await testPool().end();
});

function workOfAVisit(visitId: string, setup: VisitSetup, device: TestDevice): Operation[] {
  const { checks, readings, parts } = setup.checklist;
  return [
    ...checks.map((itemId) => device.check(visitId, itemId, 'done')),
    ...readings.map((itemId, i) => device.reading(visitId, itemId, 4 + i)),
    device.finding(visitId, randomUUID(), 'soon', { title: 'Front pads at 3 mm' }),
    device.partLine(visitId, randomUUID(), 1, { itemId: parts[0]! }),
    ...Array.from({ length: 30 }, (_, i) => device.note(visitId, `Observation ${i}`)),
  ];
}

async function counts(db: ReturnType<typeof testDb>, visitId: string) {
  const one = async (table: typeof s.checkResults | typeof s.readingResults | typeof s.visitNotes) =>
    (await db.select({ n: sql<number>`count(*)::int` }).from(table).where(eq(table.visitId, visitId)))[0]!.n;
  const [ops] = await db.select({ n: sql<number>`count(*)::int` }).from(s.syncOperations).where(eq(s.syncOperations.visitId, visitId));
  const [visit] = await db.select({ status: s.visits.status }).from(s.visits).where(eq(s.visits.id, visitId));
  return { operations: ops!.n, checks: await one(s.checkResults), readings: await one(s.readingResults), notes: await one(s.visitNotes), status: visit!.status };
}

function withApplicationName(url: string, name: string) {
  const u = new URL(url);
  u.searchParams.set('application_name', name);
  return u.toString();
}

describe('server killed in the middle of a batch', () => {
  it('leaves nothing half-applied, and the retry applies the batch exactly once', { timeout: 120_000 }, async () => {
    const org = await createOrganisation('Crash');
    const setup = await createVisitSetup(org);
    const visitId = await createVisit(org, setup);
    const name = `tickover-fault-${randomUUID().slice(0, 8)}`;
    const databaseUrl = withApplicationName(process.env.DATABASE_URL!, name);

    const doomed = await startApp({ DATABASE_URL: databaseUrl, TICKOVER_FAULT_PAUSE_MID_BATCH_MS: '60000' }, await freePort());
    cleanups.push(doomed.stop);
    const session = await signInAt(doomed.baseUrl, org.technician.email, FIXTURE_PASSWORD);
    const phone = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 3_600_000);
    const batch = workOfAVisit(visitId, setup, phone);

    const inFlight = pushAt(session, phone.deviceId, batch).then(
      () => 'answered',
      () => 'connection lost',
    );
    await waitForStderr(doomed, 'fault injection: pausing in the middle of a batch');
    await doomed.stop();
    expect(await inFlight).toBe('connection lost');
    // The dead server's database sessions go with it (a real crash closes its sockets).
    await testPool().query('select pg_terminate_backend(pid) from pg_stat_activity where application_name = $1', [name]);

    expect(await counts(testDb(), visitId)).toEqual({ operations: 0, checks: 0, readings: 0, notes: 0, status: 'booked' });

    const revived = await startApp({ DATABASE_URL: process.env.DATABASE_URL! }, await freePort());
    cleanups.push(revived.stop);
    const retry = await pushAt({ ...session, baseUrl: revived.baseUrl }, phone.deviceId, batch);
    expect(retry.status).toBe(200);
    expect(new Set(retry.json.results.map((r) => r.outcome))).toEqual(new Set(['applied']));
    expect(await counts(testDb(), visitId)).toEqual({ operations: batch.length, checks: 3, readings: 3, notes: 30, status: 'in_progress' });

    const again = await pushAt({ ...session, baseUrl: revived.baseUrl }, phone.deviceId, batch);
    expect(new Set(again.json.results.map((r) => r.outcome))).toEqual(new Set(['duplicate']));
    expect((await counts(testDb(), visitId)).operations).toBe(batch.length);
  });
});

describe('PostgreSQL restarted between a push and its retry', () => {
  it('keeps every acknowledged operation through a crash, and the retry changes nothing', { timeout: 180_000 }, async () => {
    const cluster: PrivateCluster = await privateCluster(await freePort());
    cleanups.push(() => cluster.destroy());
    const databaseUrl = cluster.url('tickover_faults');
    await migrate(process.env.TICKOVER_ROOT ?? process.cwd(), databaseUrl);
    const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
    pool.on('error', () => undefined);
    cleanups.push(() => pool.end());
    const db = drizzle(pool, { schema: s });
    const org = await createOrganisation('Restart', db);
    const setup = await createVisitSetup(org, db);
    const visitId = await createVisit(org, setup, {}, db);

    const app: AppProcess = await startApp({ DATABASE_URL: databaseUrl }, await freePort());
    cleanups.push(app.stop);
    const session = await signInAt(app.baseUrl, org.technician.email, FIXTURE_PASSWORD);
    const phone = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 3_600_000);
    const [first, second] = [workOfAVisit(visitId, setup, phone).slice(0, 20), workOfAVisit(visitId, setup, phone).slice(20)];

    const acknowledged = await pushAt(session, phone.deviceId, first);
    expect(acknowledged.status).toBe(200);
    expect(new Set(acknowledged.json.results.map((r) => r.outcome))).toEqual(new Set(['applied']));

    // A crash, not a polite shutdown: whatever was acknowledged must already be on disk.
    cluster.stop('immediate');
    const whileDown = await pushAt(session, phone.deviceId, second).catch(() => ({ status: 599, json: { results: [] } }));
    expect(whileDown.status).toBeGreaterThanOrEqual(500);
    cluster.start();
    expect(app.child.exitCode).toBeNull();

    // The device retries both batches, as its outbox would, until the server answers. A dropped
    // connection counts as no answer (an idle keep-alive socket may have closed meanwhile).
    const retry = async (ops: Operation[]) => {
      for (let attempt = 0; attempt < 5; attempt++) {
        const response = await pushAt(session, phone.deviceId, ops).catch(() => null);
        if (response?.status === 200) return response.json.results.map((r) => r.outcome);
        await new Promise((r) => setTimeout(r, 200));
      }
      throw new Error(`the server did not recover: ${app.stderr()}`);
    };
    expect(new Set(await retry(first))).toEqual(new Set(['duplicate']));
    expect(new Set(await retry(second))).toEqual(new Set(['applied']));
    const recorded = await db.select({ opId: s.syncOperations.opId }).from(s.syncOperations).where(and(eq(s.syncOperations.visitId, visitId)));
    expect(recorded.map((r) => r.opId).sort()).toEqual([...first, ...second].map((o) => o.opId).sort());
    expect(await counts(db as unknown as ReturnType<typeof testDb>, visitId)).toMatchObject({ checks: 3, readings: 3 });
  });
});
