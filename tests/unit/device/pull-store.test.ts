// Pulled rows meet the phone's unsent changes: what the technician recorded stays on screen until
// the server has it; a removed visit with unsent changes is hidden, not deleted.
import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { DeviceDb } from '../../../src/lib/device/db';
import { storePulledPage, sweepGoneVisits } from '../../../src/lib/device/pull-store';
import { keepLocal, severityToShow } from '../../../src/lib/device/pull-merge';
import { saveFinding, setCheck, signOff } from '../../../src/lib/device/visit-actions';
import { encodeStamp } from '../../../src/lib/sync/clock';
import { emptyPage, roundPage, openDeviceWithRound, closeDevice } from './pull-page';

const serverStamp = (wallMs: number) => encodeStamp({ wallMs, counter: 0, deviceId: 'server' });
const LONG_AGO = serverStamp(1_000);
const FAR_FUTURE = serverStamp(Date.now() + 10 * 365 * 24 * 3600 * 1000);

let db: DeviceDb;
let ids: ReturnType<typeof roundPage>['ids'];

beforeEach(async () => {
  ({ db, ids } = await openDeviceWithRound('test'));
});

afterEach(() => closeDevice(db));

describe('keepLocal', () => {
  it('keeps the local value only while an unsent change is later than the pulled one', () => {
    expect(keepLocal(LONG_AGO, [FAR_FUTURE])).toBe(true);
    expect(keepLocal(FAR_FUTURE, [LONG_AGO])).toBe(false);
    expect(keepLocal(LONG_AGO, [])).toBe(false);
  });

  it('never shows a lower severity while a raise is unsent', () => {
    expect(severityToShow('now', 'soon', true)).toBe('now');
    expect(severityToShow('watch', 'soon', true)).toBe('soon');
    expect(severityToShow('now', 'watch', false)).toBe('watch');
  });
});

describe('storing a pulled page', () => {
  it('stores the round and advances the cursor with it', async () => {
    expect(await db.visits.count()).toBe(1);
    expect(await db.templateVersions.get(ids.version)).toBeDefined();
    expect(await db.meta.get('cursor')).toEqual({ key: 'cursor', value: '10' });
  });

  it('keeps an unsent local tick over an older pulled value', async () => {
    await setCheck(db, ids.visit, ids.check, 'done');
    await storePulledPage(db, { ...emptyPage('11'), checkResults: [{ visitId: ids.visit, itemId: ids.check, state: 'skipped', stamp: LONG_AGO }] });
    expect((await db.checkResults.get([ids.visit, ids.check]))?.state).toBe('done');
  });

  it('takes a pulled value that is later than the unsent one', async () => {
    await setCheck(db, ids.visit, ids.check, 'done');
    await storePulledPage(db, { ...emptyPage('11'), checkResults: [{ visitId: ids.visit, itemId: ids.check, state: 'skipped', stamp: FAR_FUTURE }] });
    expect(await db.checkResults.get([ids.visit, ids.check])).toMatchObject({ state: 'skipped', stamp: FAR_FUTURE });
  });

  it('takes the pulled value once the outbox holds nothing for it', async () => {
    await setCheck(db, ids.visit, ids.check, 'done');
    await db.outbox.clear();
    await storePulledPage(db, { ...emptyPage('11'), checkResults: [{ visitId: ids.visit, itemId: ids.check, state: 'skipped', stamp: LONG_AGO }] });
    expect((await db.checkResults.get([ids.visit, ids.check]))?.state).toBe('skipped');
  });

  it('does not let a pull lower a finding raised on the phone', async () => {
    const op = await saveFinding(db, ids.visit, { itemId: null, title: 'Brake hose chafing', detail: '', severity: 'now' });
    await storePulledPage(db, {
      ...emptyPage('11'),
      findings: [{ id: op.payload.findingId, visitId: ids.visit, itemId: null, title: 'Brake hose chafing (office)', detail: '', severity: 'soon', severityStamp: FAR_FUTURE, stamp: FAR_FUTURE }],
    });
    expect(await db.findings.get(op.payload.findingId)).toMatchObject({ title: 'Brake hose chafing (office)', severity: 'now' });
  });

  it('hides a removed visit that still has unsent changes, and drops it once they are sent', async () => {
    await setCheck(db, ids.visit, ids.check, 'done');
    await storePulledPage(db, { ...emptyPage('12'), removedVisitIds: [ids.visit] });
    expect((await db.visits.get(ids.visit))?.gone).toBe(true);
    expect(await db.checkResults.count()).toBe(1);
    await db.outbox.clear();
    await sweepGoneVisits(db);
    expect(await db.visits.get(ids.visit)).toBeUndefined();
    expect(await db.checkResults.count()).toBe(0);
  });

  it('deletes a removed visit with nothing unsent at once', async () => {
    await storePulledPage(db, { ...emptyPage('12'), removedVisitIds: [ids.visit] });
    expect(await db.visits.get(ids.visit)).toBeUndefined();
  });

  it('lifts the lock when the office voids the sign-off, but not while the sign-off is unsent', async () => {
    const signing = { odometer: 1, odometerUnit: 'km' as const, customerName: 'R', signatureSvg: '<svg xmlns="http://www.w3.org/2000/svg"/>', declaration: 'd' };
    const op = await signOff(db, ids.visit, signing);
    const pulled = { id: op.payload.signOffId, visitId: ids.visit, ...signing, technicianId: 't', signedAt: op.payload.signedAt, stamp: op.stamp, voided: true };
    await storePulledPage(db, { ...emptyPage('13'), signOffs: [pulled] });
    expect(await db.signOffs.get(ids.visit)).toBeDefined();
    await db.outbox.clear();
    await storePulledPage(db, { ...emptyPage('14'), signOffs: [pulled] });
    expect(await db.signOffs.get(ids.visit)).toBeUndefined();
    await setCheck(db, ids.visit, ids.check, 'done');
  });
});
