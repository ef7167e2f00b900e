import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { describePacking, packIntoContainers } from '../../../src/lib/trade/containers';

// Worked examples, derived by hand: the least oil left over first, then the fewest containers.
describe('packIntoContainers', () => {
  it('covers 12.8 L with 1 L and 5 L containers as 2 × 5 L + 3 × 1 L (13 L)', () => {
    const packing = packIntoContainers(12.8, [1, 5]);
    expect(packing).toEqual({ containers: [{ sizeL: 5, count: 2 }, { sizeL: 1, count: 3 }], totalL: 13 });
    expect(describePacking(packing!)).toBe('2 × 5 L + 3 × 1 L');
  });

  it('prefers less left over to fewer containers: 8 L from 4 L and 5 L is 2 × 4 L, not 2 × 5 L', () => {
    expect(packIntoContainers(8, [5, 4])).toEqual({ containers: [{ sizeL: 4, count: 2 }], totalL: 8 });
  });

  it('prefers fewer containers when the oil left over is the same: 4.2 L is 1 × 5 L, not 4 L + 1 L', () => {
    expect(packIntoContainers(4.2, [1, 4, 5])).toEqual({ containers: [{ sizeL: 5, count: 1 }], totalL: 5 });
  });

  it('opens a whole container when only one size is stocked', () => {
    expect(packIntoContainers(3.2, [5])).toEqual({ containers: [{ sizeL: 5, count: 1 }], totalL: 5 });
  });

  it('handles sizes that are not whole litres, such as a US quart (0.946 352 946 L, NIST Handbook 44 App. C)', () => {
    // 4.5 L: 5 quarts of 0.946 L hold 4.73 L; a 3.785 L gallon plus a quart hold 4.731 L.
    expect(packIntoContainers(4.5, [0.946, 3.785])).toEqual({ containers: [{ sizeL: 0.946, count: 5 }], totalL: 4.73 });
  });

  it('needs nothing for nothing, and says so when the business stocks no sizes', () => {
    expect(packIntoContainers(0, [1, 5])).toEqual({ containers: [], totalL: 0 });
    expect(packIntoContainers(3, [])).toBeNull();
  });

  it('refuses an absurd quantity instead of stalling', () => {
    expect(() => packIntoContainers(5_000_000, [1, 5])).toThrow(RangeError);
  });

  it('always covers the need and matches an exhaustive search on small cases', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 200 }).map((tenths) => tenths / 10),
        fc.uniqueArray(fc.constantFrom(0.5, 1, 2, 4, 5), { minLength: 1, maxLength: 3 }),
        (litres, sizes) => {
          const packing = packIntoContainers(litres, sizes)!;
          const counted = packing.containers.reduce((sum, c) => sum + c.sizeL * c.count, 0);
          expect(counted).toBeCloseTo(packing.totalL, 9);
          expect(packing.totalL).toBeGreaterThanOrEqual(litres - 1e-9);
          // Exhaustive oracle: every combination of up to 60 of each size.
          let best = { total: Infinity, count: Infinity };
          const search = (i: number, total: number, count: number) => {
            if (total >= litres - 1e-9) {
              if (total < best.total - 1e-9 || (Math.abs(total - best.total) < 1e-9 && count < best.count)) best = { total, count };
              return;
            }
            if (i === sizes.length) return;
            for (let n = 0; n <= 60; n++) search(i + 1, total + n * sizes[i]!, count + n);
          };
          search(0, 0, 0);
          expect(packing.totalL).toBeCloseTo(best.total, 9);
          expect(packing.containers.reduce((sum, c) => sum + c.count, 0)).toBe(best.count);
        },
      ),
      { seed: 20260104, numRuns: 100 },
    );
  });
});
