import { describe, expect, it } from 'vitest';
import { priceLines } from '../../../src/lib/billing/totals';

describe('priceLines', () => {
  it('prices quantity x unit price less discount, with tax per line rounded half up', () => {
    // Worked example (our own): 3.2 L at 11.50 = 36.80, tax 20 % = 7.36; 1 x 11.00, tax 2.20.
    const totals = priceLines(
      [
        { quantity: 3.2, unitPriceMinor: 1150 },
        { quantity: 1, unitPriceMinor: 1100 },
      ],
      2000,
    );
    expect(totals).toEqual({ lines: [{ netMinor: 3680, taxMinor: 736 }, { netMinor: 1100, taxMinor: 220 }], netMinor: 4780, taxMinor: 956, totalMinor: 5736 });
  });

  it('rounds half up at exactly half a minor unit, and the lines always add up', () => {
    // 0.5 x 1.25 = 0.625 -> 0.63 (half up); tax 12.5 % of 0.63 = 0.07875 -> 0.08.
    const totals = priceLines([{ quantity: 0.5, unitPriceMinor: 125 }], 1250);
    expect(totals.lines[0]).toEqual({ netMinor: 63, taxMinor: 8 });
    // 2.675 in binary is 2.67499...; the line must still round as a person would: 268.
    expect(priceLines([{ quantity: 2.675, unitPriceMinor: 100 }], 0).netMinor).toBe(268);
    const many = priceLines(
      Array.from({ length: 17 }, (_, i) => ({ quantity: 1 + Math.round((i / 7) * 1000) / 1000, unitPriceMinor: 333 + i, discountMinor: i })),
      2000,
    );
    expect(many.netMinor).toBe(many.lines.reduce((n, l) => n + l.netMinor, 0));
    expect(many.totalMinor).toBe(many.netMinor + many.taxMinor);
  });

  it('refuses amounts that make no sense, saying which line', () => {
    expect(() => priceLines([{ quantity: 1.2345, unitPriceMinor: 100 }], 2000)).toThrow(/Line 1/);
    expect(() => priceLines([{ quantity: 0, unitPriceMinor: 100 }], 2000)).toThrow(/Line 1: the quantity must be above zero/);
    expect(() => priceLines([{ quantity: 1, unitPriceMinor: 10.5 }], 2000)).toThrow(/minor units|whole/i);
    expect(() => priceLines([{ quantity: 1, unitPriceMinor: 100, discountMinor: 101 }], 2000)).toThrow(/discount/i);
    expect(() => priceLines([], 20)).not.toThrow();
    expect(() => priceLines([], 10_001)).toThrow(/basis points/);
  });
});
