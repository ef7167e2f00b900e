// Van stock is the sum of its movements, so every level can be explained line by line. Stock
// taken by parts fitted on a visit is kept equal to the visit's part lines: whatever the lines
// say now, minus what movements already recorded for them, is the one correction to write.
import { isZeroQuantity, roundQuantity } from './quantity';

/** A signed quantity of one part in one technician's van. */
export type Holding = { technicianId: string; partId: string; quantity: number };

const keyOf = (h: Holding) => `${h.technicianId}\u0000${h.partId}`;

function totals(holdings: readonly Holding[]) {
  const map = new Map<string, Holding>();
  for (const h of holdings) {
    const before = map.get(keyOf(h));
    map.set(keyOf(h), { ...h, quantity: (before?.quantity ?? 0) + h.quantity });
  }
  return map;
}

/**
 * The movements that bring `recorded` to `wanted`, one per van and part that differs. A line
 * synced twice gives no correction; a quantity changed from 4 to 3 gives +1; a removed line gives
 * back what it took; a line moved to another part returns the old part and takes the new one.
 */
export function stockCorrections(wanted: readonly Holding[], recorded: readonly Holding[]): Holding[] {
  const want = totals(wanted);
  const have = totals(recorded);
  const corrections: Holding[] = [];
  for (const key of new Set([...want.keys(), ...have.keys()])) {
    const base = want.get(key) ?? have.get(key)!;
    const difference = (want.get(key)?.quantity ?? 0) - (have.get(key)?.quantity ?? 0);
    if (!isZeroQuantity(difference)) {
      corrections.push({ technicianId: base.technicianId, partId: base.partId, quantity: roundQuantity(difference) });
    }
  }
  return corrections;
}

/** Below its minimum (a level equal to the minimum is still enough). */
export function isLowStock(level: number, minimum: number | null): boolean {
  return minimum !== null && roundQuantity(level) < roundQuantity(minimum);
}
