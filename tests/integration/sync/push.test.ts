// POST /api/sync/push against the built server and PostgreSQL.
import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { decodeStamp, encodeStamp } from '../../../src/lib/sync/clock';
import { MAX_CLOCK_LEAD_MS } from '../../../src/lib/sync/stamp-bound';
import { MAX_BATCH_OPERATIONS } from '../../../src/lib/sync/push';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { call, signIn, type Session } from '../../support/http';
import { push, pushOk } from '../../support/sync-client';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../../support/visit-fixtures';

let org: OrganisationFixture;
let setup: VisitSetup;
let tech: Session;
let otherTech: Session;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Push');
  setup = await createVisitSetup(org);
  [tech, otherTech, office] = await Promise.all([
    signIn(org.technician.email, FIXTURE_PASSWORD),
    signIn(org.otherTechnician.email, FIXTURE_PASSWORD),
    signIn(org.office.email, FIXTURE_PASSWORD),
  ]);
});
afterAll(async () => {
  await testPool().end();
});

const device = (name: string, offsetMs = 0) => new TestDevice(`${name}-${randomUUID().slice(0, 8)}`, Date.now() - 3_600_000 + offsetMs);

async function recordedCount(visitId: string) {
  const [row] = await testDb().select({ n: sql<number>`count(*)::int` }).from(s.syncOperations).where(eq(s.syncOperations.visitId, visitId));
  return row!.n;
}

describe('push: outcomes', () => {
  it('applies a batch, moves the visit to in progress, and changes nothing when sent again', async () => {
    const visitId = await createVisit(org, setup);
    const phone = device('tara');
    const ops = [phone.check(visitId, setup.checklist.checks[0]!, 'done'), phone.reading(visitId, setup.checklist.readings[0]!, 4.6)];
    const first = await push(tech, phone.deviceId, ops);
    expect(first.status).toBe(200);
    expect(first.json.results.map((r) => r.outcome)).toEqual(['applied', 'applied']);
    expect(first.json.serverStamp >= ops[1]!.stamp).toBe(true);
    const [visit] = await testDb().select().from(s.visits).where(eq(s.visits.id, visitId));
    expect(visit!.status).toBe('in_progress');

    const again = await push(tech, phone.deviceId, [...ops, ops[0]]);
    expect(again.json.results.map((r) => r.outcome)).toEqual(['duplicate', 'duplicate', 'duplicate']);
    expect(await recordedCount(visitId)).toBe(2);
    const [reading] = await testDb().select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId));
    expect(reading).toMatchObject({ value: 4.6, opId: ops[1]!.opId });
  });

  it('supersedes an older check and keeps a concurrent reading for the office', async () => {
    const visitId = await createVisit(org, setup);
    const tara = device('tara');
    const theo = device('theo', 60_000);
    const [olderCheck, olderReading] = [tara.check(visitId, setup.checklist.checks[1]!, 'skipped'), tara.reading(visitId, setup.checklist.readings[1]!, 12.2, null, 'V')];
    await pushOk(office, theo.deviceId, [theo.check(visitId, setup.checklist.checks[1]!, 'done'), theo.reading(visitId, setup.checklist.readings[1]!, 12.6, null, 'V')]);
    const results = await pushOk(tech, tara.deviceId, [olderCheck, olderReading]);
    expect(results.get(olderCheck.opId)?.outcome).toBe('superseded');
    expect(results.get(olderReading.opId)?.outcome).toBe('conflict');
    const conflicts = await testDb().select().from(s.conflicts).where(eq(s.conflicts.visitId, visitId));
    expect(conflicts).toHaveLength(1);
    expect(conflicts[0]).toMatchObject({ reason: 'concurrent_edit', kind: 'reading', opId: olderReading.opId });
    expect((conflicts[0]!.proposed as { value: { value: number } }).value.value).toBe(12.2);
  });

  it('locks the visit at the first sign-off and keeps what arrives afterwards', async () => {
    const visitId = await createVisit(org, setup);
    const phone = device('tara');
    const signOff = phone.signOff(visitId);
    await pushOk(tech, phone.deviceId, [phone.check(visitId, setup.checklist.checks[0]!, 'done'), signOff]);
    const late = phone.note(visitId, 'Customer mentioned a squeak from the rear.');
    const results = await pushOk(tech, phone.deviceId, [late]);
    expect(results.get(late.opId)).toMatchObject({ outcome: 'locked' });
    const [visit] = await testDb().select().from(s.visits).where(eq(s.visits.id, visitId));
    expect(visit!.status).toBe('signed_off');
    const notes = await testDb().select().from(s.visitNotes).where(eq(s.visitNotes.visitId, visitId));
    expect(notes).toHaveLength(0);
    const [conflict] = await testDb().select().from(s.conflicts).where(eq(s.conflicts.opId, late.opId));
    expect(conflict).toMatchObject({ reason: 'visit_locked', kind: 'note' });
  });

  it('lets the office lower a severity only by saying so', async () => {
    const visitId = await createVisit(org, setup);
    const findingId = randomUUID();
    const phone = device('tara');
    const raised = phone.finding(visitId, findingId, 'now');
    await pushOk(tech, phone.deviceId, [raised]);
    const desk = device('desk', 120_000);
    await pushOk(office, desk.deviceId, [desk.finding(visitId, findingId, 'watch', { seen: raised.stamp })]);
    let [finding] = await testDb().select().from(s.findings).where(eq(s.findings.id, findingId));
    expect(finding!.severity).toBe('now');
    await pushOk(office, desk.deviceId, [desk.finding(visitId, findingId, 'watch', { seen: raised.stamp, downgrade: true })]);
    [finding] = await testDb().select().from(s.findings).where(eq(s.findings.id, findingId));
    expect(finding!.severity).toBe('watch');
    // A technician saying "downgrade" is not the office.
    const tryLower = phone.finding(visitId, findingId, 'ok', { downgrade: true });
    const results = await pushOk(tech, phone.deviceId, [tryLower]);
    expect(results.get(tryLower.opId)?.reason).toMatch(/only the office/);
    [finding] = await testDb().select().from(s.findings).where(eq(s.findings.id, findingId));
    expect(finding!.severity).toBe('watch');
  });

  it('bounds a stamp from a clock a year ahead to the server time plus the lead, keeping the operation', async () => {
    const visitId = await createVisit(org, setup);
    const itemId = setup.checklist.readings[2]!;
    const wrongClock = new TestDevice(`wrong-${randomUUID().slice(0, 8)}`, Date.now() + 365 * 86_400_000);
    const ahead = wrongClock.reading(visitId, itemId, -40, null, 'Cel');
    const before = Date.now();
    expect((await pushOk(tech, wrongClock.deviceId, [ahead])).get(ahead.opId)?.outcome).toBe('applied');
    const after = Date.now();
    const [op] = await testDb().select().from(s.syncOperations).where(eq(s.syncOperations.opId, ahead.opId));
    expect(op!.stamp).toBe(ahead.stamp);
    const boundedWall = decodeStamp(op!.effectiveStamp!).wallMs;
    expect(boundedWall).toBeGreaterThanOrEqual(before + MAX_CLOCK_LEAD_MS);
    expect(boundedWall).toBeLessThanOrEqual(after + MAX_CLOCK_LEAD_MS);
    const [reading] = await testDb().select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId));
    expect(reading!.stamp).toBe(op!.effectiveStamp);
    // The server's clock moved on receipt, but only as far as the bound.
    const [clock] = await testDb().select().from(s.syncClocks).where(eq(s.syncClocks.organisationId, org.organisationId));
    expect(decodeStamp(clock!.stamp).wallMs).toBeLessThanOrEqual(after + MAX_CLOCK_LEAD_MS);
  });
});

describe('push: what is refused', () => {
  it('rejects invalid operations one by one with their reasons and applies the rest', async () => {
    const visitId = await createVisit(org, setup);
    const phone = device('tara');
    const good = phone.check(visitId, setup.checklist.checks[0]!, 'done');
    const unknownKind = { ...phone.check(visitId, setup.checklist.checks[1]!, 'done'), kind: 'teleport' };
    const huge = phone.reading(visitId, setup.checklist.readings[0]!, 1e300);
    const longNote = phone.note(visitId, 'x'.repeat(5000));
    const wrongItem = phone.check(visitId, setup.checklist.readings[0]!, 'done');
    const otherOrgVisit = phone.check(randomUUID(), setup.checklist.checks[0]!, 'done');
    const response = await push(tech, phone.deviceId, [good, unknownKind, huge, longNote, wrongItem, otherOrgVisit]);
    expect(response.status).toBe(200);
    const [g, k, h, l, w, o] = response.json.results;
    expect(g!.outcome).toBe('applied');
    expect(k).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/kind/) });
    expect(h).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/payload.value/) });
    expect(l).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/at most 4000/) });
    expect(w).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/reading item, not a check item/) });
    expect(o).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/no such visit/) });
    expect(await recordedCount(visitId)).toBe(1);
  });

  it('keeps every refused operation as sent, once, for the office, but not a photo waiting for its bytes', async () => {
    const visitId = await createVisit(org, setup);
    const phone = device('tara');
    const wrongItem = phone.check(visitId, setup.checklist.checks[0]!, 'done');
    const refusedOne = { ...wrongItem, payload: { ...wrongItem.payload, itemId: setup.checklist.readings[0]! } };
    const unknownKind = { ...phone.check(visitId, setup.checklist.checks[1]!, 'done'), kind: 'teleport' };
    const photoFirst = phone.photoAdd(visitId, randomUUID(), 'a'.repeat(64));
    const kept = async () => testDb().select().from(s.refusedOperations).where(eq(s.refusedOperations.deviceId, phone.deviceId));

    const first = await push(tech, phone.deviceId, [refusedOne, unknownKind, photoFirst]);
    expect(first.json.results.map((r) => r.outcome)).toEqual(['rejected', 'rejected', 'rejected']);
    expect(first.json.results[2]!.reason).toMatch(/upload the photo's bytes first/);
    const rows = await kept();
    expect(rows.map((r) => r.opId).sort()).toEqual([refusedOne.opId, unknownKind.opId].sort());
    const row = rows.find((r) => r.opId === unknownKind.opId)!;
    expect(row).toMatchObject({ organisationId: org.organisationId, kind: 'teleport', visitId, reason: expect.stringMatching(/kind/) });
    expect(row.body).toEqual(JSON.parse(JSON.stringify(unknownKind)));

    // The phone retries what it still holds: the server keeps one copy of each.
    await push(tech, phone.deviceId, [refusedOne, unknownKind]);
    expect(await kept()).toHaveLength(2);
    // And the office sees them, named with the visit's plate.
    const page = await call(office, '/office/refused');
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(unknownKind.opId);
  });

  it('answers another technician’s visit with 403 and applies nothing of the batch', async () => {
    const mine = await createVisit(org, setup);
    const theirs = await createVisit(org, setup, { technicianId: org.otherTechnician.id });
    const phone = device('tara');
    const response = await push(tech, phone.deviceId, [phone.check(mine, setup.checklist.checks[0]!, 'done'), phone.check(theirs, setup.checklist.checks[0]!, 'done')]);
    expect(response.status).toBe(403);
    expect(response.json.error).toMatch(/another technician/);
    expect(await recordedCount(mine)).toBe(0);
    expect(await recordedCount(theirs)).toBe(0);
  });

  it('keeps work on a visit moved to another technician for the office', async () => {
    const visitId = await createVisit(org, setup, { technicianId: org.otherTechnician.id });
    await testDb().insert(s.roundRemovals).values({ visitId, technicianId: org.technician.id });
    const phone = device('tara');
    const op = phone.check(visitId, setup.checklist.checks[0]!, 'done');
    expect((await pushOk(tech, phone.deviceId, [op])).get(op.opId)?.outcome).toBe('locked');
    const [conflict] = await testDb().select().from(s.conflicts).where(eq(s.conflicts.opId, op.opId));
    expect(conflict?.reason).toBe('visit_reassigned');
    // The technician now on the visit pushes as usual.
    const theo = device('theo');
    expect((await pushOk(otherTech, theo.deviceId, [theo.check(visitId, setup.checklist.checks[0]!, 'skipped')])).size).toBe(1);
  });

  it('answers malformed JSON, a wrong content type and oversized batches clearly, changing nothing', async () => {
    const visitId = await createVisit(org, setup);
    const phone = device('tara');
    const malformed = await call(tech, '/api/sync/push', { body: '{"deviceId": "x", "operations": [', headers: { 'content-type': 'application/json' } });
    expect(malformed.status).toBe(400);
    expect((await malformed.json()).error).toMatch(/not valid JSON/);

    // (A form-like type such as text/plain meets Astro's cross-site check first, with a 403.)
    const xmlBody = await call(tech, '/api/sync/push', { body: '<ops/>', headers: { 'content-type': 'application/xml' } });
    expect(xmlBody.status).toBe(415);

    const many = Array.from({ length: MAX_BATCH_OPERATIONS + 1 }, () => phone.check(visitId, setup.checklist.checks[0]!, 'done'));
    const tooMany = await push(tech, phone.deviceId, many);
    expect(tooMany.status).toBe(413);

    const bulky = await push(tech, phone.deviceId, [{ ...phone.note(visitId, 'ok'), padding: 'x'.repeat(2_100_000) }]);
    expect(bulky.status).toBe(413);

    const shapeless = await push(tech, 'not a device id!', []);
    expect(shapeless.status).toBe(400);
    expect(await recordedCount(visitId)).toBe(0);
  });

  it('refuses a device-made id that already names a thing on another visit, leaving that thing alone', async () => {
    const [first, second] = [await createVisit(org, setup), await createVisit(org, setup)];
    const phone = device('tara');
    const findingId = randomUUID();
    await pushOk(tech, phone.deviceId, [phone.finding(first, findingId, 'soon', { title: 'Original' })]);
    const clash = phone.finding(second, findingId, 'ok', { title: 'Overwritten?' });
    expect((await pushOk(tech, phone.deviceId, [clash])).get(clash.opId)).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/another visit/) });
    const [finding] = await testDb().select().from(s.findings).where(eq(s.findings.id, findingId));
    expect(finding).toMatchObject({ visitId: first, title: 'Original', severity: 'soon' });
  });

  it('refuses an operation sent under another device’s name', async () => {
    const visitId = await createVisit(org, setup);
    const phone = device('tara');
    const op = phone.check(visitId, setup.checklist.checks[0]!, 'done');
    const forged = { ...op, stamp: encodeStamp({ wallMs: Date.now(), counter: 0, deviceId: 'someone-else' }) };
    const response = await push(tech, phone.deviceId, [forged]);
    expect(response.json.results[0]).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/another device/) });
  });

  it('answers anonymous pushes with 401', async () => {
    const response = await call(null, '/api/sync/push', { body: { deviceId: 'x', operations: [] } });
    expect(response.status).toBe(401);
  });
});
