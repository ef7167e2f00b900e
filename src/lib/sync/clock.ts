// Hybrid logical clock (Kulkarni et al., "Logical Physical Clocks", 2014): wall-clock
// milliseconds, a counter for events within the same millisecond or when a peer's clock is
// ahead, and the device id as the final tie-break, so every stamp is unique and totally ordered
// even when a phone's clock is wrong.

export type Hlc = { readonly wallMs: number; readonly counter: number; readonly deviceId: string };

/** An encoded stamp: compares with plain string comparison in clock order. */
export type Stamp = string & { readonly __brand: 'Stamp' };

// 9 base-36 digits hold milliseconds until the year 5188; 4 hold 1.6 million events per ms.
const WALL_DIGITS = 9;
const COUNTER_DIGITS = 4;
const MAX_COUNTER = 36 ** COUNTER_DIGITS - 1;
const DEVICE_ID = /^[A-Za-z0-9_-]{1,64}$/;
const STAMP = /^([0-9a-z]{9})-([0-9a-z]{4})-([A-Za-z0-9_-]{1,64})$/;

export function encodeStamp(clock: Hlc): Stamp {
  if (!DEVICE_ID.test(clock.deviceId)) throw new Error(`device id "${clock.deviceId}" must be 1-64 letters, digits, - or _`);
  if (!Number.isSafeInteger(clock.wallMs) || clock.wallMs < 0) throw new Error(`wall clock ${clock.wallMs} is not a time`);
  if (!Number.isInteger(clock.counter) || clock.counter < 0 || clock.counter > MAX_COUNTER) {
    throw new Error(`clock counter ${clock.counter} is out of range`);
  }
  return `${clock.wallMs.toString(36).padStart(WALL_DIGITS, '0')}-${clock.counter
    .toString(36)
    .padStart(COUNTER_DIGITS, '0')}-${clock.deviceId}` as Stamp;
}

export function decodeStamp(stamp: string): Hlc {
  const match = STAMP.exec(stamp);
  if (!match) throw new Error(`"${stamp}" is not a clock stamp`);
  return { wallMs: parseInt(match[1]!, 36), counter: parseInt(match[2]!, 36), deviceId: match[3]! };
}

export function isStamp(value: unknown): value is Stamp {
  return typeof value === 'string' && STAMP.test(value);
}

export function compareStamps(a: Stamp, b: Stamp): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** A new local event (or a send): never goes backwards, whatever the wall clock does. */
export function tick(clock: Hlc, nowMs: number): Hlc {
  if (nowMs > clock.wallMs) return { wallMs: nowMs, counter: 0, deviceId: clock.deviceId };
  return bump(clock, clock.wallMs, clock.counter + 1);
}

/** Receiving a remote stamp: move past both it and our own clock. */
export function receive(clock: Hlc, remote: Hlc, nowMs: number): Hlc {
  const wallMs = Math.max(clock.wallMs, remote.wallMs, nowMs);
  if (wallMs === clock.wallMs && wallMs === remote.wallMs) {
    return bump(clock, wallMs, Math.max(clock.counter, remote.counter) + 1);
  }
  if (wallMs === clock.wallMs) return bump(clock, wallMs, clock.counter + 1);
  if (wallMs === remote.wallMs) return bump(clock, wallMs, remote.counter + 1);
  return { wallMs, counter: 0, deviceId: clock.deviceId };
}

function bump(clock: Hlc, wallMs: number, counter: number): Hlc {
  // Counter overflow within one millisecond: borrow the next millisecond rather than fail.
  if (counter > MAX_COUNTER) return { wallMs: wallMs + 1, counter: 0, deviceId: clock.deviceId };
  return { wallMs, counter, deviceId: clock.deviceId };
}
