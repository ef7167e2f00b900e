// An app update that raises the device schema keeps everything already on the phone: a phone
// still at version 1 (the first release) opens at version 2, which adds the van's load lists,
// with its round, its results and its outbox intact.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import Dexie from 'dexie';
import { describe, expect, it } from 'vitest';
import { DeviceDb, SCHEMA_V1 } from '../../../src/lib/device/db';
import { storePulledPage } from '../../../src/lib/device/pull-store';
import { setCheck } from '../../../src/lib/device/visit-actions';
import { roundPage } from './pull-page';

/** A phone that installed the first release: the schema exactly as version 1 declared it. */
function firstReleaseDb(name: string): DeviceDb {
  const db = new Dexie(name);
  db.version(1).stores(SCHEMA_V1);
  return db as unknown as DeviceDb;
}

describe('device schema upgrade', () => {
  it('keeps the round, the results and the outbox when version 2 opens a version 1 database', async () => {
    const name = `upgrade-${randomUUID()}`;
    const before = firstReleaseDb(name);
    const { page, ids } = roundPage();
    await storePulledPage(before, page);
    const op = await setCheck(before, ids.visit, ids.check, 'done');
    expect(before.tables.map((t) => t.name)).not.toContain('loadLists');
    before.close();

    const after = new DeviceDb(name);
    await after.open();
    expect(after.verno).toBe(2);
    expect(after.tables.map((t) => t.name)).toContain('loadLists');
    expect((await after.checkResults.get([ids.visit, ids.check]))?.state).toBe('done');
    expect((await after.outbox.toArray()).map((e) => e.opId)).toEqual([op.opId]);
    const next = await setCheck(after, ids.visit, ids.check, 'skipped');
    expect(next.seenStamp).toBe(op.stamp);
    expect(await after.loadLists.count()).toBe(0);
    after.close();
    await after.delete();
  });
});
