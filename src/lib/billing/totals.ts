// Prices an invoice's lines with the trade's money calculation (lib/trade invoiceTotals): quantity
// x unit price less discount, tax per line, each rounded half up to the minor unit, and totals that
// are the sums of the rounded lines. Tax rates here are basis points (2000 = 20 %), as the
// organisation stores them.
import { invoiceTotals } from '../trade';

export type LineInput = { quantity: number; unitPriceMinor: number; discountMinor?: number; description?: string };
export type PricedLine = { netMinor: number; taxMinor: number };
export type InvoiceTotals = { lines: PricedLine[]; netMinor: number; taxMinor: number; totalMinor: number };

export function priceLines(lines: readonly LineInput[], taxRateBasisPoints: number, currency = 'GBP'): InvoiceTotals {
  if (!Number.isInteger(taxRateBasisPoints) || taxRateBasisPoints < 0 || taxRateBasisPoints > 10_000) {
    throw new Error(`tax rate must be whole basis points between 0 and 10000, not ${taxRateBasisPoints}`);
  }
  lines.forEach((l, i) => {
    // An invoice line for nothing is a mistake, not a free line (the database refuses it too).
    if (!(l.quantity > 0)) throw new Error(`Line ${i + 1}: the quantity must be above zero`);
  });
  const totals = invoiceTotals({
    lines: lines.map((l) => ({ description: l.description, quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, discountMinor: l.discountMinor ?? 0 })),
    taxRatePercent: taxRateBasisPoints / 100,
    currency,
  });
  return {
    lines: totals.lines.map((l) => ({ netMinor: l.netMinor, taxMinor: l.taxMinor })),
    netMinor: totals.netMinor,
    taxMinor: totals.taxMinor,
    totalMinor: totals.totalMinor,
  };
}
