// A stamp far ahead of the server's clock comes from a phone with a wrong date or time. Taken as
// it is, it would win every "later stamp wins" merge until real time caught up (for ever, for a
// phone set to 2099), and the server clock would carry the error to every device it answers.
// So on receipt such a stamp is bounded to the server's time plus a small lead; the operation is
// kept and applied with the bounded stamp, and the original stays in the history.
import { decodeStamp, encodeStamp, tick, type Stamp } from './clock';

/**
 * How far ahead of the server a device's clock may run before we bound it. Phones that set
 * their time from the network are within a second or two; a clock set by hand drifts by
 * minutes; hours or more is a wrong date or time zone, not drift. Five minutes tolerates the
 * drift and limits a wrong clock's head start to five minutes.
 */
export const MAX_CLOCK_LEAD_MS = 5 * 60_000;

export type BoundedStamp = { stamp: Stamp; bounded: boolean };

/**
 * The stamp an operation is merged with. `lastBounded` is the last bounded stamp given to the
 * same device: bounded stamps of one device keep the order the device gave them (they would all
 * sit at the ceiling otherwise and tie).
 */
export function boundStamp(stamp: Stamp, serverNowMs: number, lastBounded: Stamp | null): BoundedStamp {
  const clock = decodeStamp(stamp);
  const ceiling = serverNowMs + MAX_CLOCK_LEAD_MS;
  if (clock.wallMs <= ceiling) return { stamp, bounded: false };
  const atCeiling = { wallMs: ceiling, counter: 0, deviceId: clock.deviceId };
  const previous = lastBounded ? decodeStamp(lastBounded) : null;
  const next = previous && previous.deviceId === clock.deviceId ? tick(previous, ceiling) : atCeiling;
  return { stamp: encodeStamp(next), bounded: true };
}

/** The device that made a stamp: the last part of the encoding. */
export function deviceOf(stamp: Stamp): string {
  return decodeStamp(stamp).deviceId;
}

/**
 * A device names the value it last saw by its stamp; for its own change that is the stamp it
 * made, which the server may have bounded. Translating it to the bounded stamp keeps every
 * comparison on the stamps the server holds. `boundedEarlier` finds the bounded stamp the server
 * gave one of this device's own earlier operations, by its original stamp.
 */
export function normaliseSeen(
  seenStamp: Stamp | null,
  deviceId: string,
  boundedEarlier: (original: Stamp) => Stamp | undefined,
): Stamp | null {
  if (seenStamp === null || deviceOf(seenStamp) !== deviceId) return seenStamp;
  return boundedEarlier(seenStamp) ?? seenStamp;
}
