// Reading: the later stamp wins. When two devices changed it without seeing each other's value,
// the value that lost goes to the conflict list for the office, never dropped (PRODUCT.md).
import { asStanding, type StandingReading } from './standing';
import { hadSeen, seenByLater, type HistoryEntry } from './history';
import { isLater, unchanged, type ConflictSide, type Incoming, type Merged } from './merge-result';
import { deviceOf } from './stamp-bound';

export function mergeReading(
  standing: StandingReading | null,
  incoming: Incoming<'reading'>,
  history: readonly HistoryEntry[],
): Merged<StandingReading> {
  const { op } = incoming;
  const next = asStanding({
    value: op.payload.value,
    textValue: op.payload.textValue,
    unit: op.payload.unit,
    stamp: incoming.stamp,
    opId: op.opId,
    author: incoming.author,
  });
  if (!standing) return { outcome: 'applied', next, conflicts: [] };
  const entity = { kind: 'reading' as const, entityId: op.payload.itemId };
  if (isLater(incoming.stamp, standing.stamp)) {
    const concurrent = !hadSeen(op.seenStamp, op.deviceId, standing.stamp);
    return {
      outcome: 'applied',
      next,
      conflicts: concurrent ? [{ ...entity, proposed: readingSide(standing), standing: readingSide(next) }] : [],
    };
  }
  const alreadySeen = deviceOf(standing.stamp) === op.deviceId || seenByLater(history, incoming.stamp, op.deviceId);
  if (alreadySeen) return unchanged('superseded', 'a later reading that had seen this one stands');
  return unchanged('conflict', 'another device changed this reading at the same time; the office will decide', [
    { ...entity, proposed: readingSide(next), standing: readingSide(standing) },
  ]);
}

function readingSide(r: StandingReading): ConflictSide {
  return { value: { value: r.value, textValue: r.textValue, unit: r.unit }, stamp: r.stamp, opId: r.opId, author: r.author };
}
