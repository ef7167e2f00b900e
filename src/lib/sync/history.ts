// What the server remembers of earlier operations on one thing, and the two questions the merge
// rules ask of it: had the writer of a change seen the standing value, and has anyone since
// seen a value that lost. A device "saw" a value when it pulled it (its seen stamp) or when it
// wrote it itself (a device's own changes are in its own order).
import { compareStamps, type Stamp } from './clock';
import type { OperationKind } from './operations';
import { deviceOf } from './stamp-bound';

export type HistoryEntry = {
  opId: string;
  kind: OperationKind;
  entityId: string;
  /** The stamp the operation merged with. */
  stamp: Stamp;
  seenStamp: Stamp | null;
  deviceId: string;
};

/**
 * Whether the device that sent a change had seen the value standing when it arrived. Exactly
 * that value: a device that saw an older one did not see this one.
 */
export function hadSeen(seenStamp: Stamp | null, deviceId: string, standingStamp: Stamp): boolean {
  return deviceOf(standingStamp) === deviceId || seenStamp === standingStamp;
}

/** Whether a later change to the same thing was made by someone who had seen `stamp`. */
export function seenByLater(history: readonly HistoryEntry[], stamp: Stamp, deviceId: string): boolean {
  return history.some((h) => h.seenStamp === stamp || (h.deviceId === deviceId && compareStamps(h.stamp, stamp) > 0));
}
