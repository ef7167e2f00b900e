// An app update that raises the device schema keeps everything already on the phone: a later
// version adds tables (here a load list, as the van stock work will) and the outbox survives.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { DeviceDb } from '../../../src/lib/device/db';
import { storePulledPage } from '../../../src/lib/device/pull-store';
import { setCheck } from '../../../src/lib/device/visit-actions';
import { roundPage } from './pull-page';

class NextDeviceDb extends DeviceDb {
  constructor(name: string) {
    super(name);
    this.version(2).stores({ loadList: '[visitId+partId], visitId' });
  }
}

describe('device schema upgrade', () => {
  it('keeps the round, the results and the outbox when a new version opens the database', async () => {
    const name = `upgrade-${randomUUID()}`;
    const before = new DeviceDb(name);
    const { page, ids } = roundPage();
    await storePulledPage(before, page);
    const op = await setCheck(before, ids.visit, ids.check, 'done');
    before.close();

    const after = new NextDeviceDb(name);
    await after.open();
    expect(after.verno).toBe(2);
    expect(after.tables.map((t) => t.name)).toContain('loadList');
    expect((await after.checkResults.get([ids.visit, ids.check]))?.state).toBe('done');
    expect((await after.outbox.toArray()).map((e) => e.opId)).toEqual([op.opId]);
    const next = await setCheck(after, ids.visit, ids.check, 'skipped');
    expect(next.seenStamp).toBe(op.stamp);
    after.close();
    await after.delete();
  });
});
