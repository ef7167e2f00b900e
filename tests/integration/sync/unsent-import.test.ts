// POST /api/office/unsent-changes: a phone's file of unsent changes, imported by the office
// through the same push as a sync. Imported twice, or after the phone synced after all, nothing
// changes the second time.
import { createHash, randomUUID } from 'node:crypto';
import { eq, inArray, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { UNSENT_FILE_FORMAT, UNSENT_FILE_VERSION } from '../../../src/lib/sync/unsent-file';
import type { Operation } from '../../../src/lib/sync/operations';
import { testDb, testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { call, callJson, signIn, type Session } from '../../support/http';
import { pushOk } from '../../support/sync-client';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../../support/visit-fixtures';

let org: OrganisationFixture;
let setup: VisitSetup;
let tech: Session;
let office: Session;
let owner: Session;
let outsider: Session;

beforeAll(async () => {
  org = await createOrganisation('Unsent');
  const elsewhere = await createOrganisation('Elsewhere');
  setup = await createVisitSetup(org);
  [tech, office, owner, outsider] = await Promise.all([
    signIn(org.technician.email, FIXTURE_PASSWORD),
    signIn(org.office.email, FIXTURE_PASSWORD),
    signIn(org.owner.email, FIXTURE_PASSWORD),
    signIn(elsewhere.office.email, FIXTURE_PASSWORD),
  ]);
});
afterAll(async () => {
  await testPool().end();
});

function fileOf(phone: TestDevice, ops: Operation[], photos: { sha256: string; contentType: string; base64: string }[] = [], user = org.technician) {
  return {
    format: UNSENT_FILE_FORMAT,
    version: UNSENT_FILE_VERSION,
    createdAt: new Date().toISOString(),
    user: { id: user.id, name: user.name, email: user.email },
    deviceId: phone.deviceId,
    lastSyncedAt: new Date(Date.now() - 3 * 86_400_000).toISOString(),
    operations: ops.map((op) => ({ state: 'pending', reason: null, createdAt: new Date().toISOString(), op })),
    photos,
  };
}

const importFile = (session: Session, file: unknown) => callJson(session, '/api/office/unsent-changes', { body: file });

async function stored(opIds: string[]) {
  return testDb().select().from(s.syncOperations).where(inArray(s.syncOperations.opId, opIds));
}

describe('importing a file of unsent changes', () => {
  it('applies it as the technician, with its photo, and a second import changes nothing', async () => {
    const visitId = await createVisit(org, setup);
    const phone = new TestDevice(`lost-${randomUUID().slice(0, 8)}`, Date.now() - 3 * 86_400_000);
    const bytes = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 200, g: 40, b: 40 } } }).jpeg().toBuffer();
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    const findingId = randomUUID();
    const ops = [
      phone.check(visitId, setup.checklist.checks[0]!, 'done'),
      phone.reading(visitId, setup.checklist.readings[0]!, 3.1),
      phone.finding(visitId, findingId, 'soon', { title: 'Front pads near the wear indicator' }),
      phone.photoAdd(visitId, randomUUID(), sha256, { sizeBytes: bytes.byteLength }),
      phone.note(visitId, 'Customer asked about the wiper blades'),
    ];
    const file = fileOf(phone, ops, [{ sha256, contentType: 'image/jpeg', base64: bytes.toString('base64') }]);

    const first = await importFile(office, file);
    expect(first.status).toBe(200);
    expect(first.json).toMatchObject({ technician: { id: org.technician.id }, operations: 5, outcomes: { applied: 5 }, rejected: [], photos: { stored: 1, alreadyHeld: 0 } });
    const rows = await stored(ops.map((o) => o.opId));
    expect(rows).toHaveLength(5);
    // In the technician's name, as their own sync would have been.
    expect(new Set(rows.map((r) => r.userId))).toEqual(new Set([org.technician.id]));
    const [finding] = await testDb().select().from(s.findings).where(eq(s.findings.id, findingId));
    expect(finding).toMatchObject({ severity: 'soon', visitId });
    const [photo] = await testDb().select().from(s.photoObjects).where(eq(s.photoObjects.sha256, sha256));
    expect(photo).toMatchObject({ organisationId: org.organisationId, contentType: 'image/jpeg', width: 64, height: 48 });

    const operationsBefore = await testDb().select({ n: sql<number>`count(*)::int` }).from(s.syncOperations).where(eq(s.syncOperations.visitId, visitId));
    const again = await importFile(owner, file);
    expect(again.status).toBe(200);
    expect(again.json).toMatchObject({ outcomes: { duplicate: 5 }, rejected: [], photos: { stored: 0, alreadyHeld: 1 } });
    const operationsAfter = await testDb().select({ n: sql<number>`count(*)::int` }).from(s.syncOperations).where(eq(s.syncOperations.visitId, visitId));
    expect(operationsAfter).toEqual(operationsBefore);
  });

  it('skips what the phone managed to sync itself, and applies the rest', async () => {
    const visitId = await createVisit(org, setup);
    const phone = new TestDevice(`late-${randomUUID().slice(0, 8)}`, Date.now() - 86_400_000);
    const synced = phone.check(visitId, setup.checklist.checks[0]!, 'done');
    const unsynced = phone.check(visitId, setup.checklist.checks[1]!, 'skipped');
    await pushOk(tech, phone.deviceId, [synced]);
    const result = await importFile(office, fileOf(phone, [synced, unsynced]));
    expect(result.status).toBe(200);
    expect(result.json.outcomes).toEqual({ duplicate: 1, applied: 1 });
    const [row] = await testDb().select().from(s.checkResults).where(eq(s.checkResults.itemId, setup.checklist.checks[1]!));
    expect(row).toMatchObject({ visitId, state: 'skipped' });
  });

  it("reports what the push refuses, and a photo whose bytes are not what they claim", async () => {
    const visitId = await createVisit(org, setup);
    const phone = new TestDevice(`odd-${randomUUID().slice(0, 8)}`, Date.now() - 86_400_000);
    const fakeSha = 'e'.repeat(64);
    const ops = [phone.photoAdd(visitId, randomUUID(), fakeSha), phone.note(randomUUID(), 'A visit this business never had')];
    const result = await importFile(office, fileOf(phone, ops, [{ sha256: fakeSha, contentType: 'image/jpeg', base64: Buffer.from('not a picture').toString('base64') }]));
    expect(result.status).toBe(200);
    expect(result.json.outcomes).toEqual({ rejected: 2 });
    expect(result.json.photos.refused).toEqual([{ sha256: fakeSha, reason: expect.stringMatching(/not a JPEG, PNG or WebP/) }]);
    expect(result.json.rejected.map((r: { reason: string }) => r.reason)).toEqual([expect.stringMatching(/upload the photo's bytes first/), expect.stringMatching(/no such visit/)]);
    expect(await stored(ops.map((o) => o.opId))).toHaveLength(0);
  });
});

describe('who may import, and what', () => {
  it('is for the office and the owner, not technicians or anonymous callers', async () => {
    const file = fileOf(new TestDevice('who-1', Date.now()), []);
    expect((await importFile(tech, file)).status).toBe(403);
    expect((await call(null, '/api/office/unsent-changes', { body: file })).status).toBe(401);
  });

  it("does not import a file of someone outside the office's business", async () => {
    const visitId = await createVisit(org, setup);
    const phone = new TestDevice('who-2', Date.now());
    const op = phone.check(visitId, setup.checklist.checks[2]!, 'done');
    const answer = await importFile(outsider, fileOf(phone, [op]));
    expect(answer.status).toBe(404);
    expect(await stored([op.opId])).toHaveLength(0);
  });

  it("refuses a file saved by someone who is not a technician", async () => {
    const answer = await importFile(office, fileOf(new TestDevice('who-3', Date.now()), [], [], org.office));
    expect(answer.status).toBe(422);
    expect(answer.json.error).toMatch(/not a technician/);
  });

  it("refuses a file that names another technician's visit, and applies nothing of it", async () => {
    const theirs = await createVisit(org, setup, { technicianId: org.otherTechnician.id });
    const phone = new TestDevice('who-4', Date.now());
    const op = phone.check(theirs, setup.checklist.checks[0]!, 'done');
    const answer = await importFile(office, fileOf(phone, [op]));
    expect(answer.status).toBe(422);
    expect(answer.json.error).toMatch(/never on .*round/);
    expect(await stored([op.opId])).toHaveLength(0);
  });

  it('answers 400 with the reason for a file that is not one of ours, and 415 for a body that is not JSON', async () => {
    const bad = await importFile(office, { ...fileOf(new TestDevice('who-5', Date.now()), []), version: 9 });
    expect(bad.status).toBe(400);
    expect(bad.json.details.join(' ')).toMatch(/version/);
    const xml = await call(office, '/api/office/unsent-changes', { body: '<file/>', headers: { 'content-type': 'application/xml' } });
    expect(xml.status).toBe(415);
    // A form-like body from our own page is a 415 too (a cross-site one is refused first, with a 403).
    const text = await call(office, '/api/office/unsent-changes', { body: '{}', headers: { 'content-type': 'text/plain' } });
    expect(text.status).toBe(415);
  });
});
