// Prices an invoice's lines: quantity x unit price less discount, tax per line, and totals.
// Rounding: each line's net and tax are rounded half up to the minor unit, and the totals are the
// sums of the rounded lines, so the printed lines always add up to the printed totals. Common
// practice for line-level tax on invoices; that HMRC VAT Notice 700 (section 17) allows rounding per
// line is from memory, not checked against the text. Tax rates are basis points (2000 = 20 %).

export type LineInput = { quantity: number; unitPriceMinor: number; discountMinor?: number };
export type PricedLine = { netMinor: number; taxMinor: number };
export type InvoiceTotals = { lines: PricedLine[]; netMinor: number; taxMinor: number; totalMinor: number };

/** Half up for the non-negative amounts an invoice holds. */
function roundHalfUp(value: number): number {
  // Guard against binary fractions such as 2.675 * 100 = 267.49999...
  return Math.floor(value + 0.5 + 1e-9);
}

export function priceLines(lines: readonly LineInput[], taxRateBasisPoints: number): InvoiceTotals {
  if (!Number.isInteger(taxRateBasisPoints) || taxRateBasisPoints < 0 || taxRateBasisPoints > 10_000) {
    throw new Error(`tax rate must be whole basis points between 0 and 10000, not ${taxRateBasisPoints}`);
  }
  const priced = lines.map((line, index) => {
    if (!(line.quantity > 0) || !Number.isFinite(line.quantity)) throw new Error(`line ${index + 1}: quantity must be above zero`);
    if (!Number.isInteger(line.unitPriceMinor) || line.unitPriceMinor < 0) throw new Error(`line ${index + 1}: unit price must be whole minor units, not negative`);
    const discount = line.discountMinor ?? 0;
    if (!Number.isInteger(discount) || discount < 0) throw new Error(`line ${index + 1}: discount must be whole minor units, not negative`);
    const gross = roundHalfUp(line.quantity * line.unitPriceMinor);
    if (discount > gross) throw new Error(`line ${index + 1}: the discount is larger than the line`);
    const netMinor = gross - discount;
    const taxMinor = roundHalfUp((netMinor * taxRateBasisPoints) / 10_000);
    return { netMinor, taxMinor };
  });
  const netMinor = priced.reduce((sum, l) => sum + l.netMinor, 0);
  const taxMinor = priced.reduce((sum, l) => sum + l.taxMinor, 0);
  return { lines: priced, netMinor, taxMinor, totalMinor: netMinor + taxMinor };
}
