import { describe, expect, it } from 'vitest';
import { isLowStock, stockCorrections } from '../../../src/lib/trade/van-stock';
import { roundQuantity, sumQuantities } from '../../../src/lib/trade/quantity';

const tom = 'tech-tom';
const jess = 'tech-jess';

describe('stockCorrections (parts fitted on a visit against movements already written)', () => {
  it('takes stock for a new line', () => {
    expect(stockCorrections([{ technicianId: tom, partId: 'of', quantity: -1 }], [])).toEqual([{ technicianId: tom, partId: 'of', quantity: -1 }]);
  });

  it('writes nothing when the same line arrives again', () => {
    const line = { technicianId: tom, partId: 'oil', quantity: -4.8 };
    expect(stockCorrections([line], [line])).toEqual([]);
  });

  it('writes only the difference when a quantity changes (4 plugs, then 3)', () => {
    expect(stockCorrections([{ technicianId: tom, partId: 'sp', quantity: -3 }], [{ technicianId: tom, partId: 'sp', quantity: -4 }])).toEqual([
      { technicianId: tom, partId: 'sp', quantity: 1 },
    ]);
  });

  it('gives the stock back when the line is removed, and nothing more after', () => {
    const recorded = [
      { technicianId: tom, partId: 'oil', quantity: -3.2 },
      { technicianId: tom, partId: 'oil', quantity: -0.1 },
    ];
    expect(stockCorrections([], recorded)).toEqual([{ technicianId: tom, partId: 'oil', quantity: 3.3 }]);
    expect(stockCorrections([], [...recorded, { technicianId: tom, partId: 'oil', quantity: 3.3 }])).toEqual([]);
  });

  it('returns the old part and takes the new one when the line changes part or van', () => {
    expect(stockCorrections([{ technicianId: jess, partId: 'af-352', quantity: -1 }], [{ technicianId: tom, partId: 'af-331', quantity: -1 }])).toEqual([
      { technicianId: jess, partId: 'af-352', quantity: -1 },
      { technicianId: tom, partId: 'af-331', quantity: 1 },
    ]);
  });

  it('ignores float dust below a millilitre', () => {
    expect(stockCorrections([{ technicianId: tom, partId: 'oil', quantity: -(0.1 + 0.2) }], [{ technicianId: tom, partId: 'oil', quantity: -0.3 }])).toEqual([]);
  });
});

describe('quantities', () => {
  it('sum without float drift and never print -0', () => {
    expect(0.1 + 0.2).not.toBe(0.3);
    expect(sumQuantities([0.1, 0.2])).toBe(0.3);
    expect(Object.is(roundQuantity(-0.0001), 0)).toBe(true);
  });

  it('call stock low only below its minimum', () => {
    expect(isLowStock(1, 2)).toBe(true);
    expect(isLowStock(2, 2)).toBe(false);
    expect(isLowStock(-1, 0)).toBe(true);
    expect(isLowStock(0, null)).toBe(false);
  });
});
