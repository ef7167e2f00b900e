// The device's hybrid logical clock, kept in the device database so that it survives restarts
// and advances inside the same transaction as the change it stamps.
import { decodeStamp, encodeStamp, isStamp, receive, tick, type Hlc, type Stamp } from '../sync/clock';
import type { DeviceDb } from './db';

// 16 random base64url characters: 96 bits, so two phones never share an id by chance.
const DEVICE_ID_BYTES = 12;

function newDeviceId(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(DEVICE_ID_BYTES));
  let binary = '';
  for (const b of bytes) binary += String.fromCharCode(b);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

async function currentClock(db: DeviceDb): Promise<Hlc> {
  const row = await db.meta.get('clock');
  if (row?.key === 'clock') return row.value;
  return { wallMs: 0, counter: 0, deviceId: newDeviceId() };
}

export async function deviceIdOf(db: DeviceDb): Promise<string> {
  return db.transaction('rw', db.meta, async () => {
    const clock = await currentClock(db);
    await db.meta.put({ key: 'clock', value: clock });
    return clock.deviceId;
  });
}

/** A fresh stamp for one local change. Call inside the transaction that records the change. */
export async function nextStamp(db: DeviceDb, nowMs = Date.now()): Promise<{ stamp: Stamp; deviceId: string }> {
  const clock = tick(await currentClock(db), nowMs);
  await db.meta.put({ key: 'clock', value: clock });
  return { stamp: encodeStamp(clock), deviceId: clock.deviceId };
}

/** After a push: move the clock past the server's, so later local stamps sort after what it saw. */
export async function receiveServerStamp(db: DeviceDb, serverStamp: string, nowMs = Date.now()): Promise<void> {
  if (!isStamp(serverStamp)) return;
  await db.transaction('rw', db.meta, async () => {
    const clock = receive(await currentClock(db), decodeStamp(serverStamp), nowMs);
    await db.meta.put({ key: 'clock', value: clock });
  });
}
