// Oil comes in containers (a business might stock 1 L and 5 L of each grade), so litres needed
// become containers to load or to order.

export type ContainerCount = { sizeL: number; count: number };
export type Packing = { containers: ContainerCount[]; totalL: number };

// Container sizes are worked in millilitres so that sizes such as 0.946 L are exact integers.
const ML_PER_L = 1000;
// Above this many DP steps the input is not a van's oil (a million steps at 1 L granularity is
// a thousand cubic metres); refusing keeps a typo from stalling a request.
const MAX_STEPS = 2_000_000;

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/**
 * The containers that cover `litres` of one oil with the least oil left over in opened
 * containers and, among those, the fewest containers to carry. 12.8 L from 1 L and 5 L
 * containers is 2 × 5 L + 3 × 1 L (13 L); 8 L from 4 L and 5 L containers is 2 × 4 L.
 * Returns null when the business stocks no container sizes for the oil.
 */
export function packIntoContainers(litres: number, sizesL: readonly number[]): Packing | null {
  const sizes = [...new Set(sizesL.map((s) => Math.round(s * ML_PER_L)))].filter((s) => s > 0).sort((a, b) => b - a);
  if (sizes.length === 0) return null;
  const needMl = Math.max(0, Math.round(litres * ML_PER_L));
  if (needMl === 0) return { containers: [], totalL: 0 };

  const step = sizes.reduce(gcd);
  const units = sizes.map((s) => s / step);
  const target = Math.ceil(needMl / step);
  // Any size s reaches a total in [target, target + s), so the best total lies below this.
  const limit = target + Math.max(...units);
  if (limit > MAX_STEPS) throw new RangeError(`${litres} L is far more oil than a load or an order can hold`);

  // fewest[u]: fewest containers summing to exactly u steps; last[u]: the size used last.
  const fewest = new Array<number>(limit).fill(Infinity);
  const last = new Array<number>(limit).fill(-1);
  fewest[0] = 0;
  for (let u = 1; u < limit; u++) {
    for (let i = 0; i < units.length; i++) {
      const before = u - units[i]!;
      if (before >= 0 && fewest[before]! + 1 < fewest[u]!) {
        fewest[u] = fewest[before]! + 1;
        last[u] = i;
      }
    }
  }
  let total = target;
  while (fewest[total] === Infinity) total++;

  const counts = new Array<number>(sizes.length).fill(0);
  for (let u = total; u > 0; u -= units[last[u]!]!) counts[last[u]!]! += 1;
  return {
    containers: sizes.flatMap((size, i) => (counts[i]! > 0 ? [{ sizeL: size / ML_PER_L, count: counts[i]! }] : [])),
    totalL: (total * step) / ML_PER_L,
  };
}

/** "2 × 5 L + 3 × 1 L" */
export function describePacking(packing: Packing): string {
  if (packing.containers.length === 0) return 'none';
  return packing.containers.map((c) => `${c.count} × ${c.sizeL} L`).join(' + ');
}
