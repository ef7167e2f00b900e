// Invoice totals in integer minor units. The rounding rule is ours, named in the code: each line
// rounded half up to the minor unit, totals are sums of rounded lines (common practice; HMRC
// accepts line-by-line VAT rounding). Expected values are worked by hand below each case.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatMoney, invoiceTotals, ROUNDING_RULE, roundHalfUp } from '../../../src/lib/trade';

describe('invoiceTotals', () => {
  it('quantity × price, labour hours × rate, 20 % tax per line (worked example)', () => {
    // Oil 4.5 L × £8.99 = 4045.5p → 4046p; tax 809.2p → 809p.
    // Labour 1.25 h × £65.00 = 8125p; tax 1625p.
    const t = invoiceTotals({
      lines: [{ description: 'Engine oil 5W-30', quantity: 4.5, unitPriceMinor: 899 }],
      labour: { description: 'Annual service', hours: 1.25, rateMinor: 6500 },
      taxRatePercent: 20,
      currency: 'GBP',
    });
    expect(t.lines.map((l) => [l.amountMinor, l.taxMinor, l.totalMinor])).toEqual([
      [4046, 809, 4855],
      [8125, 1625, 9750],
    ]);
    expect(t).toMatchObject({ subtotalMinor: 12171, discountMinor: 0, netMinor: 12171, taxMinor: 2434, totalMinor: 14605, rounding: ROUNDING_RULE, minorDigits: 2 });
  });

  it('rounds half up per line, not on the total: three lines of 0.5p tax each add 3p, where a total-level rule gives 2p', () => {
    // Each line: 1 × 5p at 10 % tax = 0.5p → 1p.
    const t = invoiceTotals({ lines: [1, 2, 3].map(() => ({ quantity: 1, unitPriceMinor: 5 })), taxRatePercent: 10, currency: 'GBP' });
    expect(t.lines.map((l) => l.taxMinor)).toEqual([1, 1, 1]);
    expect(t.taxMinor).toBe(3);
    // On the total, 15p × 10 % = 1.5p would round to 2p: the rule matters, and ours is per line.
  });

  it('the exact half goes up, just under goes down: 0.5p → 1p, 0.4999 → 0', () => {
    expect(invoiceTotals({ lines: [{ quantity: 0.5, unitPriceMinor: 1 }], taxRatePercent: 0, currency: 'GBP' }).lines[0]!.amountMinor).toBe(1);
    expect(invoiceTotals({ lines: [{ quantity: 0.499, unitPriceMinor: 1 }], taxRatePercent: 0, currency: 'GBP' }).lines[0]!.amountMinor).toBe(0);
    expect(roundHalfUp(5n, 2n)).toBe(3n);
    expect(roundHalfUp(7n, 4n)).toBe(2n);
  });

  it('discounts by percentage or amount come off the line before its tax', () => {
    // 2 × £12.50 = 2500p; 10 % off = 250p; net 2250p; tax 20 % = 450p.
    // Labour 0.5 h × £60 = 3000p; £5 off = 500p; net 2500p; tax 500p.
    const t = invoiceTotals({
      lines: [{ quantity: 2, unitPriceMinor: 1250, discountPercent: 10 }],
      labour: [{ hours: 0.5, rateMinor: 6000, discountMinor: 500 }],
      taxRatePercent: 20,
      currency: 'GBP',
    });
    expect(t).toMatchObject({ subtotalMinor: 5500, discountMinor: 750, netMinor: 4750, taxMinor: 950, totalMinor: 5700 });
  });

  it('a line may carry its own tax rate; totals by rate', () => {
    const t = invoiceTotals({
      lines: [
        { quantity: 1, unitPriceMinor: 1000 },
        { quantity: 1, unitPriceMinor: 1000, taxRatePercent: 0 },
      ],
      taxRatePercent: 20,
      currency: 'EUR',
    });
    expect(t.taxByRate).toEqual([
      { ratePercent: 20, netMinor: 1000, taxMinor: 200 },
      { ratePercent: 0, netMinor: 1000, taxMinor: 0 },
    ]);
  });

  it('currencies without minor units (JPY) and with three decimals of tax rate (8.875 %)', () => {
    expect(invoiceTotals({ lines: [{ quantity: 1, unitPriceMinor: 5000 }], taxRatePercent: 10, currency: 'JPY' }).minorDigits).toBe(0);
    // 10 000 cents × 8.875 % = 887.5 → 888.
    expect(invoiceTotals({ lines: [{ quantity: 1, unitPriceMinor: 10_000 }], taxRatePercent: 8.875, currency: 'USD' }).taxMinor).toBe(888);
  });

  it('an empty invoice totals zero', () => {
    expect(invoiceTotals({ lines: [], taxRatePercent: 20, currency: 'GBP' })).toMatchObject({ totalMinor: 0, lines: [] });
  });

  it('refuses negative amounts, fractions of a penny, oversized discounts and unknown currencies, naming the line', () => {
    const base = { taxRatePercent: 20, currency: 'GBP' };
    expect(() => invoiceTotals({ ...base, lines: [{ quantity: -1, unitPriceMinor: 100 }] })).toThrow(/Line 1: the quantity cannot be negative/);
    expect(() => invoiceTotals({ ...base, lines: [{ description: 'Wiper', quantity: 1, unitPriceMinor: -100 }] })).toThrow(/Line 1 \("Wiper"\): the unit price cannot be negative/);
    expect(() => invoiceTotals({ ...base, lines: [{ quantity: 1, unitPriceMinor: 99.5 }] })).toThrow(/whole minor units/);
    expect(() => invoiceTotals({ ...base, lines: [{ quantity: 1.0001, unitPriceMinor: 100 }] })).toThrow(/more than 3 decimal places/);
    expect(() => invoiceTotals({ ...base, lines: [{ quantity: 1, unitPriceMinor: 100, discountMinor: 101 }] })).toThrow(/discount \(101\) is larger than the line \(100\)/);
    expect(() => invoiceTotals({ ...base, lines: [{ quantity: 1, unitPriceMinor: 100, discountMinor: 1, discountPercent: 1 }] })).toThrow(/not both/);
    expect(() => invoiceTotals({ ...base, labour: { hours: 1, rateMinor: Number.NaN } })).toThrow(/Labour line 1: the hourly rate must be a number/);
    expect(() => invoiceTotals({ ...base, taxRatePercent: -5 })).toThrow(/tax rate must be between 0 and 100/);
    expect(() => invoiceTotals({ ...base, currency: 'pounds' })).toThrow(/not a currency/);
  });
});

describe('invoiceTotals: totals always add up (property test, fast-check)', () => {
  const line = fc.record({
    quantity: fc.integer({ min: 0, max: 50_000 }).map((n) => n / 1000),
    unitPriceMinor: fc.integer({ min: 0, max: 500_000 }),
    discountPercent: fc.option(fc.integer({ min: 0, max: 10_000 }).map((n) => n / 100), { nil: undefined }),
    taxRatePercent: fc.option(fc.constantFrom(0, 5, 17.5, 20, 8.875), { nil: undefined }),
  });
  const labour = fc.record({ hours: fc.integer({ min: 0, max: 2_000 }).map((n) => n / 100), rateMinor: fc.integer({ min: 0, max: 20_000 }) });

  it('Σ lines = totals; subtotal − discount = net; net + tax = total; every figure a non-negative integer', () => {
    fc.assert(
      fc.property(fc.array(line, { maxLength: 12 }), fc.array(labour, { maxLength: 4 }), fc.constantFrom(0, 5, 20, 21), (lines, labourLines, rate) => {
        const t = invoiceTotals({ lines, labour: labourLines, taxRatePercent: rate, currency: 'GBP' });
        const sum = (k: 'amountMinor' | 'discountMinor' | 'netMinor' | 'taxMinor' | 'totalMinor') => t.lines.reduce((a, l) => a + l[k], 0);
        expect(t.subtotalMinor).toBe(sum('amountMinor'));
        expect(t.discountMinor).toBe(sum('discountMinor'));
        expect(t.netMinor).toBe(sum('netMinor'));
        expect(t.taxMinor).toBe(sum('taxMinor'));
        expect(t.totalMinor).toBe(sum('totalMinor'));
        expect(t.subtotalMinor - t.discountMinor).toBe(t.netMinor);
        expect(t.netMinor + t.taxMinor).toBe(t.totalMinor);
        expect(t.taxByRate.reduce((a, r) => a + r.taxMinor, 0)).toBe(t.taxMinor);
        for (const l of t.lines) {
          for (const v of [l.amountMinor, l.discountMinor, l.netMinor, l.taxMinor, l.totalMinor]) {
            expect(Number.isInteger(v) && v >= 0).toBe(true);
          }
          // Each line is within half a minor unit of its exact value (the rounding is to nearest).
          expect(Math.abs(l.amountMinor - l.quantity * l.unitPriceMinor)).toBeLessThanOrEqual(0.5 + 1e-6);
        }
      }),
      { numRuns: 500, seed: 20250601 },
    );
  });
});

describe('formatMoney', () => {
  it('shows minor units in the currency\'s own digits', () => {
    expect(formatMoney(14605, 'GBP')).toBe('£146.05');
    expect(formatMoney(5000, 'JPY', 'en-GB')).toMatch(/5,000/);
  });
});
