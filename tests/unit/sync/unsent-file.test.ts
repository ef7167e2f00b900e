// The file a phone saves when it cannot reach the server: its schema (what the office import
// accepts), and the phone's side: what goes into it, and when This phone urges saving one.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { UNSENT_FILE_FORMAT, UNSENT_FILE_VERSION, unsentFileName, unsentFileSchema } from '../../../src/lib/sync/unsent-file';
import { collectUnsent } from '../../../src/lib/device/unsent-export';
import { daysSinceSync, shouldUrgeUnsentFile, UNSENT_FILE_URGE_AFTER_MS } from '../../../src/lib/device/unsent-urge';
import { addNote, addPhoto, setCheck } from '../../../src/lib/device/visit-actions';
import type { DeviceDb } from '../../../src/lib/device/db';
import { TestDevice } from '../../support/sync-ops';
import { closeDevice, openDeviceWithRound } from '../device/pull-page';

const USER = { id: 'user-1', name: 'Tara Tech', email: 'tara@test.example' };

function validFile() {
  const phone = new TestDevice('phone-a', Date.parse('2025-03-03T09:00:00Z'));
  const visitId = randomUUID();
  return {
    format: UNSENT_FILE_FORMAT,
    version: UNSENT_FILE_VERSION,
    createdAt: '2025-03-05T17:30:00.000Z',
    user: USER,
    deviceId: 'phone-a',
    lastSyncedAt: '2025-03-03T08:10:00.000Z',
    operations: [
      { state: 'pending', reason: null, createdAt: '2025-03-03T09:00:01.000Z', op: phone.check(visitId, randomUUID(), 'done') },
      { state: 'rejected', reason: 'visit x: no such visit', createdAt: '2025-03-03T09:00:02.000Z', op: phone.note(visitId, 'Wipers split') },
    ],
    photos: [{ sha256: 'a'.repeat(64), contentType: 'image/jpeg', base64: Buffer.from([0xff, 0xd8, 0xff, 0xe0]).toString('base64') }],
  };
}

describe('the file format', () => {
  it('accepts a file as the phone writes it', () => {
    const parsed = unsentFileSchema.parse(validFile());
    expect(parsed.operations.map((e) => e.op.kind)).toEqual(['check', 'note']);
    expect(parsed.operations[1]!.reason).toBe('visit x: no such visit');
  });

  it('refuses another format or another version, saying which', () => {
    const other = unsentFileSchema.safeParse({ ...validFile(), format: 'some-backup' });
    expect(other.success).toBe(false);
    expect(other.error!.issues[0]!.message).toMatch(/not a file of unsent changes/);
    const later = unsentFileSchema.safeParse({ ...validFile(), version: 2 });
    expect(later.success).toBe(false);
    expect(later.error!.issues[0]!.message).toMatch(/another version of the app/);
  });

  it('refuses an operation that breaks the sync contract', () => {
    const file = validFile();
    (file.operations[0]!.op as { payload: { state: string } }).payload.state = 'maybe';
    expect(unsentFileSchema.safeParse(file).success).toBe(false);
  });

  it("refuses an operation of another device, and the same operation twice", () => {
    const stranger = validFile();
    stranger.operations[0]!.op = new TestDevice('phone-b', Date.now()).check(randomUUID(), randomUUID(), 'done');
    const a = unsentFileSchema.safeParse(stranger);
    expect(a.success).toBe(false);
    expect(a.error!.issues[0]!.message).toMatch(/differs from the file's device phone-a/);

    const twice = validFile();
    twice.operations[1] = { ...twice.operations[0]! };
    const b = unsentFileSchema.safeParse(twice);
    expect(b.success).toBe(false);
    expect(b.error!.issues[0]!.message).toBe('appears twice in the file');
  });

  it('refuses photo bytes that are not base64 and a hash that is not SHA-256 hex', () => {
    const bad = validFile();
    bad.photos[0]!.base64 = 'not base64!';
    expect(unsentFileSchema.safeParse(bad).success).toBe(false);
    const hash = validFile();
    hash.photos[0]!.sha256 = 'A'.repeat(64);
    expect(unsentFileSchema.safeParse(hash).success).toBe(false);
  });

  it('names the file after the technician and the moment, safe for any file system', () => {
    expect(unsentFileName('Tara O’Tech', '2025-03-05T17:30:09.123Z')).toBe('tickover-unsent-tara-o-tech-2025-03-05-17-30-09.json');
    expect(unsentFileName('—', '2025-03-05T17:30:09.123Z')).toBe('tickover-unsent-technician-2025-03-05-17-30-09.json');
  });
});

describe('when This phone urges saving a file', () => {
  const now = Date.parse('2025-03-05T12:00:00Z');
  it('only with unsent work, and from two days without reaching the server', () => {
    expect(shouldUrgeUnsentFile(0, '2025-02-01T12:00:00Z', now)).toBe(false);
    expect(shouldUrgeUnsentFile(3, new Date(now - UNSENT_FILE_URGE_AFTER_MS + 60_000).toISOString(), now)).toBe(false);
    expect(shouldUrgeUnsentFile(3, new Date(now - UNSENT_FILE_URGE_AFTER_MS).toISOString(), now)).toBe(true);
    expect(shouldUrgeUnsentFile(1, null, now)).toBe(true);
  });

  it('counts whole days', () => {
    expect(daysSinceSync('2025-03-02T13:00:00Z', now)).toBe(2);
    expect(daysSinceSync(null, now)).toBeNull();
  });
});

describe("the phone's file", () => {
  let db: DeviceDb;
  let ids: Awaited<ReturnType<typeof openDeviceWithRound>>['ids'];
  beforeEach(async () => {
    ({ db, ids } = await openDeviceWithRound('unsent'));
  });
  afterEach(() => closeDevice(db));

  it('holds every outbox entry in order, and the bytes of photos the server has not got', async () => {
    const check = await setCheck(db, ids.visit, ids.check, 'done');
    const note = await addNote(db, ids.visit, 'Nearside wiper blade split');
    const bytes = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3]);
    const kept = await addPhoto(db, ids.visit, { blob: new Blob([bytes], { type: 'image/jpeg' }), sha256: 'c'.repeat(64), contentType: 'image/jpeg', width: 4, height: 3 });
    const sent = await addPhoto(db, ids.visit, { blob: new Blob([new Uint8Array([9])], { type: 'image/jpeg' }), sha256: 'd'.repeat(64), contentType: 'image/jpeg', width: 1, height: 1 });
    // The second photo's bytes reached the server already; only its operation waits.
    await db.photos.update(sent.payload.photoId, { uploaded: true });
    await db.outbox.where('opId').equals(note.opId).modify({ state: 'rejected', reason: 'kept for the test' });
    await db.meta.put({ key: 'lastSyncedAt', value: '2025-03-03T08:10:00.000Z' });

    const file = await collectUnsent(db, USER, new Date('2025-03-05T17:30:00Z'));
    const parsed = unsentFileSchema.parse(JSON.parse(JSON.stringify(file)));
    expect(parsed.operations.map((e) => e.op.opId)).toEqual([check.opId, note.opId, kept.opId, sent.opId]);
    expect(parsed.operations[1]).toMatchObject({ state: 'rejected', reason: 'kept for the test' });
    expect(parsed.deviceId).toBe(check.deviceId);
    expect(parsed.lastSyncedAt).toBe('2025-03-03T08:10:00.000Z');
    expect(parsed.user).toEqual(USER);
    expect(parsed.photos).toEqual([{ sha256: 'c'.repeat(64), contentType: 'image/jpeg', base64: Buffer.from(bytes).toString('base64') }]);
    // Saving a file sends nothing and removes nothing: the outbox still drains by sync.
    expect(await db.outbox.count()).toBe(4);
  });

  it('is a valid, empty file when nothing waits', async () => {
    const file = await collectUnsent(db, USER);
    expect(unsentFileSchema.parse(file).operations).toEqual([]);
  });
});
