// Stock quantities are litres or counts, carried as floating point because part lines arrive that
// way. Sums of floats drift (0.1 + 0.2 is not 0.3), so quantities are rounded to thousandths
// before they are stored, compared or shown: a millilitre of oil, far below what anyone can pour.
const PER_UNIT = 1000;

export function roundQuantity(quantity: number): number {
  // `+ 0` turns -0 into 0 so a fully reversed movement prints as 0, not -0.
  return Math.round(quantity * PER_UNIT) / PER_UNIT + 0;
}

export function sumQuantities(quantities: Iterable<number>): number {
  let thousandths = 0;
  for (const q of quantities) thousandths += Math.round(q * PER_UNIT);
  return thousandths / PER_UNIT + 0;
}

export function isZeroQuantity(quantity: number): boolean {
  return Math.round(quantity * PER_UNIT) === 0;
}
