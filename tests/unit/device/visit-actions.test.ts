// The device store: every action writes its state and its outbox operation together, the
// operations satisfy the sync contract, and what is recorded survives the database being closed.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { DeviceDb } from '../../../src/lib/device/db';
import {
  RecordingError,
  SEVERITY_RANK as DEVICE_SEVERITY_RANK,
  VisitLockedError,
  addNote,
  addPhoto,
  entityIdOf as deviceEntityIdOf,
  recordReading,
  removePhoto,
  saveFinding,
  savePartLine,
  setCheck,
  signOff,
} from '../../../src/lib/device/visit-actions';
import { compareStamps, isStamp, type Stamp } from '../../../src/lib/sync/clock';
import { SEVERITY_RANK, entityIdOf, operationSchema } from '../../../src/lib/sync/operations';
import { roundPage, openDeviceWithRound, closeDevice } from './pull-page';

const SIGNATURE = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M1 1L9 9"/></svg>';

let db: DeviceDb;
let ids: ReturnType<typeof roundPage>['ids'];

beforeEach(async () => {
  ({ db, ids } = await openDeviceWithRound('test'));
});

afterEach(() => closeDevice(db));

describe('recording a change', () => {
  it('writes the check and one valid outbox operation in the same step', async () => {
    const op = await setCheck(db, ids.visit, ids.check, 'done');
    expect(await db.checkResults.get([ids.visit, ids.check])).toMatchObject({ state: 'done', stamp: op.stamp });
    const outbox = await db.outbox.toArray();
    expect(outbox).toHaveLength(1);
    expect(outbox[0]).toMatchObject({ opId: op.opId, kind: 'check', entityId: ids.check, state: 'pending', visitId: ids.visit });
    expect(operationSchema.safeParse(outbox[0]!.op).success).toBe(true);
    expect(op.seenStamp).toBeNull();
  });

  it('sends the stamp of the value it replaced as seenStamp, and stamps only go up', async () => {
    const first = await setCheck(db, ids.visit, ids.check, 'done');
    const undo = await setCheck(db, ids.visit, ids.check, 'not_yet');
    expect(undo.seenStamp).toBe(first.stamp);
    expect(compareStamps(first.stamp, undo.stamp)).toBeLessThan(0);
    expect((await db.checkResults.get([ids.visit, ids.check]))?.state).toBe('not_yet');
    expect(await db.outbox.count()).toBe(2);
  });

  it('uses one device id in every stamp and envelope', async () => {
    const a = await setCheck(db, ids.visit, ids.check, 'done');
    const b = await recordReading(db, ids.visit, ids.tread, { value: 4.2 }, 'mm');
    expect(a.deviceId).toBe(b.deviceId);
    expect(a.stamp.endsWith(`-${a.deviceId}`)).toBe(true);
    expect(isStamp(b.stamp)).toBe(true);
  });

  it('records a numeric reading and a text reading', async () => {
    await recordReading(db, ids.visit, ids.tread, { value: 2.5 }, 'mm');
    await recordReading(db, ids.visit, ids.oilGrade, { textValue: ' 0W-20 ' }, '{grade}');
    expect(await db.readingResults.get([ids.visit, ids.tread])).toMatchObject({ value: 2.5, textValue: null, unit: 'mm' });
    // zod trims text at the boundary; the phone stores what the server will store.
    expect(await db.readingResults.get([ids.visit, ids.oilGrade])).toMatchObject({ value: null, textValue: '0W-20' });
  });

  it('writes nothing at all when the operation is not valid', async () => {
    const clockBefore = await db.meta.get('clock');
    await expect(saveFinding(db, ids.visit, { itemId: null, title: '   ', detail: '', severity: 'soon' })).rejects.toThrow(RecordingError);
    await expect(recordReading(db, ids.visit, ids.tread, { value: Number.NaN }, 'mm')).rejects.toThrow(/Not saved/);
    expect(await db.findings.count()).toBe(0);
    expect(await db.readingResults.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.meta.get('clock')).toEqual(clockBefore);
  });

  it('refuses a change to a visit that is not on the phone', async () => {
    await expect(setCheck(db, randomUUID(), ids.check, 'done')).rejects.toThrow(/not on this phone/);
  });
});

describe('findings, notes, photos and parts', () => {
  it('keeps a finding’s id across edits and never lowers its severity', async () => {
    const created = await saveFinding(db, ids.visit, { itemId: ids.tread, title: 'Front left tyre worn', detail: '2.5 mm', severity: 'soon' });
    const id = created.payload.findingId;
    const raised = await saveFinding(db, ids.visit, { findingId: id, itemId: ids.tread, title: 'Front left tyre worn', detail: 'cord showing', severity: 'now' });
    expect(raised.seenStamp).toBe(created.stamp);
    await expect(saveFinding(db, ids.visit, { findingId: id, itemId: ids.tread, title: 'x', detail: '', severity: 'watch' })).rejects.toThrow(/Only the office can lower/);
    expect(await db.findings.get(id)).toMatchObject({ severity: 'now', detail: 'cord showing' });
    expect(await db.outbox.count()).toBe(2);
  });

  it('adds notes as separate records', async () => {
    await addNote(db, ids.visit, 'Customer asked about the wipers.');
    await addNote(db, ids.visit, 'Keys left in the porch.');
    expect(await db.notes.where('visitId').equals(ids.visit).count()).toBe(2);
  });

  it('stores a photo’s bytes with its record and keeps them after a remove', async () => {
    const blob = new Blob([new Uint8Array([1, 2, 3, 4])], { type: 'image/jpeg' });
    const sha256 = 'a'.repeat(64);
    const add = await addPhoto(db, ids.visit, { blob, sha256, contentType: 'image/jpeg', width: 4, height: 1 }, { caption: 'Split hose' });
    expect(add.payload.sizeBytes).toBe(4);
    expect((await db.photoBlobs.get(sha256))?.blob.size).toBe(4);
    expect(await db.photos.get(add.payload.photoId)).toMatchObject({ uploaded: false, removed: false, caption: 'Split hose' });
    const remove = await removePhoto(db, ids.visit, add.payload.photoId);
    expect(remove.seenStamp).toBe(add.stamp);
    expect((await db.photos.get(add.payload.photoId))?.removed).toBe(true);
    expect(await db.photoBlobs.get(sha256)).toBeDefined();
  });

  it('removes a part line as a tombstone', async () => {
    const line = await savePartLine(db, ids.visit, { itemId: ids.oilFilter, partId: ids.filterPart, partNumber: 'OF-118', description: 'Oil filter', quantity: 1, unit: '{each}' });
    await savePartLine(db, ids.visit, { ...line.payload, removed: true });
    expect(await db.partLines.get(line.payload.lineId)).toMatchObject({ removed: true });
    expect(await db.partLines.count()).toBe(1);
  });
});

describe('sign-off', () => {
  const signing = { odometer: 31850, odometerUnit: '[mi_i]' as const, customerName: 'Rowan Pell', signatureSvg: SIGNATURE, declaration: 'Work done as recorded.' };

  it('locks the visit: every later change is refused and nothing is written', async () => {
    await setCheck(db, ids.visit, ids.check, 'done');
    const op = await signOff(db, ids.visit, signing, new Date('2026-03-02T10:20:00Z'));
    expect(op.payload.signedAt).toBe('2026-03-02T10:20:00.000Z');
    await expect(setCheck(db, ids.visit, ids.check, 'not_yet')).rejects.toThrow(VisitLockedError);
    await expect(signOff(db, ids.visit, signing)).rejects.toThrow(VisitLockedError);
    expect(await db.outbox.count()).toBe(2);
    expect((await db.checkResults.get([ids.visit, ids.check]))?.state).toBe('done');
  });

  it('refuses a signature that is not an SVG', async () => {
    await expect(signOff(db, ids.visit, { ...signing, signatureSvg: 'data:image/png;base64,AAAAAAAAAAAAAAAAAAAAAA' })).rejects.toThrow(/SVG/);
    expect(await db.signOffs.count()).toBe(0);
  });
});

describe('surviving the tab being closed', () => {
  it('finds state, outbox and clock again after the database is closed and reopened', async () => {
    const op = await setCheck(db, ids.visit, ids.check, 'done');
    const name = db.name;
    db.close();
    db = new DeviceDb(name);
    expect((await db.checkResults.get([ids.visit, ids.check]))?.state).toBe('done');
    expect((await db.outbox.toArray()).map((e) => e.opId)).toEqual([op.opId]);
    const next = await setCheck(db, ids.visit, ids.check, 'skipped');
    expect(compareStamps(op.stamp as Stamp, next.stamp)).toBeLessThan(0);
    expect(next.deviceId).toBe(op.deviceId);
  });
});

describe('copies kept out of the page bundle', () => {
  it('match lib/sync: severity ranks and entity ids', async () => {
    expect(DEVICE_SEVERITY_RANK).toEqual(SEVERITY_RANK);
    const ops = [
      await setCheck(db, ids.visit, ids.check, 'done'),
      await recordReading(db, ids.visit, ids.tread, { value: 3 }, 'mm'),
      await saveFinding(db, ids.visit, { itemId: null, title: 'Wiper split', detail: '', severity: 'watch' }),
      await addNote(db, ids.visit, 'n'),
      await savePartLine(db, ids.visit, { itemId: null, partId: null, partNumber: 'WB-1', description: 'Wiper', quantity: 1, unit: '{each}' }),
    ];
    for (const op of ops) expect(deviceEntityIdOf(op)).toBe(entityIdOf(op));
  });
});
