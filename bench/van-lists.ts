// `npm run bench:van`: how long the pure van calculations take at the sizes the office meets:
// the order list for a month of rounds (31 days, 6 vans, 6 visits a day) and container packing
// for awkward sizes. Prints figures; it judges nothing.
import { performance } from 'node:perf_hooks';
import { packIntoContainers } from '../src/lib/trade/containers';
import { buildLoadList, type StockPart } from '../src/lib/trade/load-list';
import { buildOrderList } from '../src/lib/trade/order-list';
import type { PartNeed } from '../src/lib/trade/parts-needed';

function time(label: string, runs: number, work: () => unknown) {
  work();
  const start = performance.now();
  for (let i = 0; i < runs; i++) work();
  const each = (performance.now() - start) / runs;
  console.log(`${label.padEnd(58)} ${each < 1 ? `${(each * 1000).toFixed(1)} µs` : `${each.toFixed(2)} ms`} per run`);
}

const grades = ['0W-20', '5W-30', '5W-40', '0W-30', '10W-40'];
const parts: StockPart[] = [
  ...grades.map((g, i) => ({ id: `oil-${i}`, partNumber: `OIL-${g}`, description: g, kind: 'oil', unit: 'L', oilGrade: g })),
  ...Array.from({ length: 40 }, (_, i) => ({ id: `p-${i}`, partNumber: `P-${i}`, description: `part ${i}`, kind: 'oil_filter', unit: '{each}', oilGrade: null })),
];
const containerSizes = new Map(grades.map((_, i) => [`oil-${i}`, [1, 5]]));
let seed = 7;
const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
const visits: PartNeed[][] = Array.from({ length: 31 * 6 * 6 }, () => [
  { itemId: 'oil', partId: `oil-${Math.floor(random() * grades.length)}`, quantity: Math.round((3 + random() * 4) * 10) / 10 },
  ...Array.from({ length: 4 }, (_, k) => ({ itemId: `i${k}`, partId: `p-${Math.floor(random() * 40)}`, quantity: 1 + Math.floor(random() * 4) })),
]);
const onHand = new Map(parts.map((p) => [p.id, Math.floor(random() * 20)]));
const costs = new Map(parts.map((p) => [p.id, { id: p.id, supplier: `Supplier ${p.id.length % 3}`, costMinor: 500 }]));

console.log(`visits in the month: ${visits.length}; parts: ${parts.length}`);
time('load list for one round (6 visits)', 2000, () => buildLoadList({ visitNeeds: visits.slice(0, 6), parts, containerSizes, onHand }));
time(`order list for the month (${visits.length} visits)`, 50, () =>
  buildOrderList(buildLoadList({ visitNeeds: visits, parts, containerSizes, onHand }).lines, costs),
);
time('pack 1 234.5 L into 1 L and 5 L containers', 200, () => packIntoContainers(1234.5, [1, 5]));
time('pack 1 234.5 L into 0.946 L and 3.785 L containers (1 ml steps)', 5, () => packIntoContainers(1234.5, [0.946, 3.785]));
