// The phone's device store and sync client against the real server and PostgreSQL: a visit
// recorded in the device database (fake-indexeddb in Node) reaches the tables the office reads,
// a photo upload that drops halfway is sent again whole, and an operation sent twice changes
// nothing the second time.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as s from '../../../src/db/schema';
import { DeviceDb } from '../../../src/lib/device/db';
import { sha256Hex } from '../../../src/lib/device/photo-prepare';
import { OfflineError, syncOnce, type PutBytes } from '../../../src/lib/device/sync-client';
import { addPhoto, recordReading, saveFinding, savePartLine, setCheck, signOff } from '../../../src/lib/device/visit-actions';
import { testDb } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { baseUrl, signIn, type Session, sessionFetch } from '../../support/http';
import { createRound, type RoundFixture } from '../../support/round-fixture';

let org: OrganisationFixture;
let round: RoundFixture;
let session: Session;
let db: DeviceDb;

beforeAll(async () => {
  org = await createOrganisation('Device sync');
  round = await createRound(org);
  session = await signIn(org.technician.email, FIXTURE_PASSWORD);
  db = new DeviceDb(`device-sync-${randomUUID()}`);
});

afterAll(async () => {
  db.close();
  await db.delete();
});

describe('a visit recorded on the phone', () => {
  it('pulls the round onto the phone', async () => {
    await syncOnce({ db, fetch: sessionFetch(session), baseUrl: baseUrl() });
    const visit = await db.visits.get(round.visitId);
    expect(visit).toMatchObject({ id: round.visitId, status: 'booked' });
    expect(await db.vehicles.get(round.vehicleId)).toMatchObject({ registration: round.registration, oilCapacityL: 3.2 });
    expect((await db.templateVersions.get(visit!.templateVersionId))?.sections.length).toBeGreaterThan(0);
    expect(await db.outbox.count()).toBe(0);
  });

  it('reaches the server: ticks, readings, a finding with a photo, a part, the sign-off', async () => {
    const visitId = round.visitId;
    await setCheck(db, visitId, round.items['raised-safely']!, 'done');
    await recordReading(db, visitId, round.items['oil-grade']!, { textValue: '0W-20' }, '{grade}');
    await recordReading(db, visitId, round.items['tread-fl']!, { value: 1.5 }, 'mm');
    const finding = await saveFinding(db, visitId, { itemId: round.items['tread-fl']!, title: 'Front left tyre below the legal limit', detail: '1.5 mm', severity: 'now' });
    const bytes = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 90, g: 90, b: 90 } } }).jpeg().toBuffer();
    const blob = new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' });
    const sha256 = await sha256Hex(blob);
    await addPhoto(db, visitId, { blob, sha256, contentType: 'image/jpeg', width: 64, height: 48 }, { findingId: finding.payload.findingId, caption: 'Tread' });
    await savePartLine(db, visitId, { itemId: round.items['oil-filter']!, partId: null, partNumber: 'T-OF-1', description: 'Oil filter', quantity: 1, unit: '{each}' });

    // The first upload dies halfway: the body stream fails after half the bytes.
    let dropped = false;
    const droppingPut: PutBytes = async (url, body, contentType) => {
      const half = new Uint8Array(await body.arrayBuffer()).slice(0, Math.floor(body.size / 2));
      const stream = new ReadableStream({
        start(controller) {
          controller.enqueue(half);
          controller.error(new Error('signal lost'));
        },
      });
      dropped = true;
      const response = await sessionFetch(session)(url, { method: 'PUT', body: stream, headers: { 'content-type': contentType }, duplex: 'half' } as RequestInit);
      return { status: response.status, body: await response.text() };
    };
    await expect(syncOnce({ db, fetch: sessionFetch(session), baseUrl: baseUrl(), putBytes: droppingPut })).rejects.toThrow(OfflineError);
    expect(dropped).toBe(true);
    expect(await db.outbox.where('state').equals('pending').count()).toBe(6);

    await signOff(db, visitId, {
      odometer: 31874,
      odometerUnit: '[mi_i]',
      customerName: round.customerName,
      signatureSvg: '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M1 8 9 2"/></svg>',
      declaration: 'Work recorded as done.',
    });
    const report = await syncOnce({ db, fetch: sessionFetch(session), baseUrl: baseUrl() });
    expect(report).toMatchObject({ pushed: 7, rejected: 0, photosUploaded: 1 });
    expect(await db.outbox.count()).toBe(0);

    const sdb = testDb();
    const check = await sdb.select().from(s.checkResults).where(and(eq(s.checkResults.visitId, visitId), eq(s.checkResults.itemId, round.items['raised-safely']!)));
    expect(check[0]?.state).toBe('done');
    const readings = await sdb.select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId));
    expect(readings.map((r) => r.textValue ?? r.value).sort()).toEqual([1.5, '0W-20'].sort());
    const [serverFinding] = await sdb.select().from(s.findings).where(eq(s.findings.id, finding.payload.findingId));
    expect(serverFinding).toMatchObject({ severity: 'now', visitId });
    const photos = await sdb.select().from(s.photos).where(eq(s.photos.visitId, visitId));
    expect(photos).toHaveLength(1);
    expect(photos[0]).toMatchObject({ sha256, sizeBytes: bytes.length, findingId: finding.payload.findingId });
    expect(await sdb.select().from(s.partLines).where(eq(s.partLines.visitId, visitId))).toHaveLength(1);
    const [signed] = await sdb.select().from(s.signOffs).where(eq(s.signOffs.visitId, visitId));
    expect(signed).toMatchObject({ odometer: 31874, technicianId: org.technician.id });
    const [visit] = await sdb.select().from(s.visits).where(eq(s.visits.id, visitId));
    expect(visit?.status).toBe('signed_off');
    // The phone now holds the server's view, photo marked as uploaded.
    expect((await db.photos.where('visitId').equals(visitId).first())?.uploaded).toBe(true);
    expect((await db.visits.get(visitId))?.status).toBe('signed_off');
  });

  it('changes nothing when an operation is sent a second time', async () => {
    const ops = await testDb().select().from(s.syncOperations).where(eq(s.syncOperations.visitId, round.visitId));
    const opsBefore = ops.length;
    const first = ops.find((o) => o.kind === 'check')!;
    const again = { opId: first.opId, visitId: first.visitId, deviceId: first.deviceId, stamp: first.stamp, seenStamp: first.seenStamp, kind: first.kind, payload: first.payload };
    const response = await sessionFetch(session)(`${baseUrl()}/api/sync/push`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ deviceId: first.deviceId, operations: [again] }),
    });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { results: { outcome: string }[] };
    expect(body.results[0]?.outcome).toBe('duplicate');
    const after = await testDb().select().from(s.syncOperations).where(eq(s.syncOperations.visitId, round.visitId));
    expect(after).toHaveLength(opsBefore);
  });
});
