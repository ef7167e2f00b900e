import { describe, expect, it } from 'vitest';
import { buildLoadList, type StockPart } from '../../../src/lib/trade/load-list';
import { buildOrderList, NO_SUPPLIER } from '../../../src/lib/trade/order-list';

const part = (id: string, unit: 'L' | '{each}', oilGrade: string | null = null): StockPart => ({
  id,
  partNumber: id.toUpperCase(),
  description: id,
  kind: oilGrade ? 'oil' : 'oil_filter',
  unit,
  oilGrade,
});
const parts = [part('lub-0w20', 'L', '0W-20'), part('lub-5w40', 'L', '5W-40'), part('of-118', '{each}'), part('sp-12f', '{each}')];
const sizes = new Map([
  ['lub-0w20', [1, 5]],
  ['lub-5w40', [1, 5]],
]);

// The demo round worked by hand: a 3.2 L and a 4.2 L sump of 0W-20, a 6.1 L sump of 5W-40.
const round = [
  [
    { itemId: 'a', partId: 'lub-0w20', quantity: 3.2 },
    { itemId: 'b', partId: 'of-118', quantity: 1 },
    { itemId: 'c', partId: 'sp-12f', quantity: 3 },
  ],
  [{ itemId: 'a', partId: 'lub-5w40', quantity: 6.1 }],
  [
    { itemId: 'a', partId: 'lub-0w20', quantity: 4.2 },
    { itemId: 'b', partId: 'of-118', quantity: 1 },
  ],
];

describe('buildLoadList', () => {
  const list = buildLoadList({
    visitNeeds: round,
    parts,
    containerSizes: sizes,
    onHand: new Map([
      ['lub-0w20', 2.5],
      ['of-118', 5],
      ['sp-12f', -1],
    ]),
  });
  const line = (id: string) => list.lines.find((l) => l.part.id === id)!;

  it('sums each part over the visits, without float drift (3.2 + 4.2 = 7.4)', () => {
    expect(line('lub-0w20').needed).toBe(7.4);
    expect(line('of-118').needed).toBe(2);
    expect(line('of-118').visits).toBe(2);
    expect(line('sp-12f').needed).toBe(3);
  });

  it('rounds the litres needed up to containers (7.4 L is 1 × 5 L + 3 × 1 L)', () => {
    expect(line('lub-0w20').neededInContainers).toEqual({ containers: [{ sizeL: 5, count: 1 }, { sizeL: 1, count: 3 }], totalL: 8 });
    expect(line('of-118').neededInContainers).toBeNull();
  });

  it('picks the shortfall against the van: 7.4 − 2.5 = 4.9 L → 1 × 5 L; no filters; all plugs when the van is below zero', () => {
    expect(line('lub-0w20')).toMatchObject({ onHand: 2.5, shortfall: 4.9, pickQuantity: 5 });
    expect(line('lub-0w20').pick).toEqual({ containers: [{ sizeL: 5, count: 1 }], totalL: 5 });
    expect(line('lub-5w40')).toMatchObject({ onHand: 0, shortfall: 6.1, pickQuantity: 7 });
    expect(line('of-118')).toMatchObject({ onHand: 5, shortfall: 0, pickQuantity: 0, pick: null });
    expect(line('sp-12f')).toMatchObject({ onHand: -1, shortfall: 3, pickQuantity: 3 });
  });

  it('lists oil first by grade, then parts by number, and totals by grade', () => {
    expect(list.lines.map((l) => l.part.id)).toEqual(['lub-0w20', 'lub-5w40', 'of-118', 'sp-12f']);
    expect(list.grades).toEqual([
      { oilGrade: '0W-20', needed: 7.4, onHand: 2.5, shortfall: 4.9 },
      { oilGrade: '5W-40', needed: 6.1, onHand: 0, shortfall: 6.1 },
    ]);
  });

  it('falls back to loose litres when no container size is set', () => {
    const loose = buildLoadList({ visitNeeds: [round[1]!], parts, containerSizes: new Map(), onHand: new Map() });
    expect(loose.lines[0]).toMatchObject({ pick: null, pickQuantity: 6.1, neededInContainers: null });
  });

  it('refuses a need for a part it was not told about', () => {
    expect(() => buildLoadList({ visitNeeds: [[{ itemId: 'x', partId: 'nope', quantity: 1 }]], parts, containerSizes: sizes, onHand: new Map() })).toThrow(
      /not in the catalogue/,
    );
  });
});

describe('buildOrderList', () => {
  it('groups what must be bought by supplier, costs whole containers by the litre, and leaves out what the vans cover', () => {
    const { lines } = buildLoadList({ visitNeeds: round, parts, containerSizes: sizes, onHand: new Map([['of-118', 9]]) });
    const orders = buildOrderList(
      lines,
      new Map([
        ['lub-0w20', { id: 'lub-0w20', supplier: 'Brindle Lubricants', costMinor: 720 }],
        ['lub-5w40', { id: 'lub-5w40', supplier: 'Brindle Lubricants', costMinor: 660 }],
        ['of-118', { id: 'of-118', supplier: 'Aldersby Motor Factors', costMinor: 480 }],
        ['sp-12f', { id: 'sp-12f', supplier: '  ', costMinor: 520 }],
      ]),
    );
    expect(orders.map((o) => o.supplier)).toEqual(['Brindle Lubricants', NO_SUPPLIER]);
    const oil = orders[0]!;
    // 0W-20: 7.4 L → 8 L of containers × 720 = 5760; 5W-40: 6.1 L → 7 L × 660 = 4620.
    expect(oil.lines.map((l) => [l.part.id, l.pickQuantity, l.costMinor])).toEqual([
      ['lub-0w20', 8, 5760],
      ['lub-5w40', 7, 4620],
    ]);
    expect(oil.totalCostMinor).toBe(10380);
    expect(orders[1]!.lines.map((l) => [l.part.id, l.pickQuantity, l.costMinor])).toEqual([['sp-12f', 3, 1560]]);
  });
});
