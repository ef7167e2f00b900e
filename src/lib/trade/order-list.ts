// The office's order list: what to buy, per supplier, so the vans can cover the coming rounds.
// It is the load list of all those rounds against the stock in every van, priced at cost.
import type { LoadLine } from './load-list';

export type CostedPart = { id: string; supplier: string; costMinor: number };

export type OrderLine = LoadLine & { unitCostMinor: number; costMinor: number };
export type SupplierOrder = { supplier: string; lines: OrderLine[]; totalCostMinor: number };

// Parts with no supplier recorded still need buying; they are grouped under this heading.
export const NO_SUPPLIER = 'No supplier recorded';

/** Lines with a shortfall, grouped by supplier (alphabetical), costed at the part's cost. */
export function buildOrderList(lines: readonly LoadLine[], costs: ReadonlyMap<string, CostedPart>): SupplierOrder[] {
  const bySupplier = new Map<string, OrderLine[]>();
  for (const line of lines) {
    if (line.pickQuantity <= 0) continue;
    const costed = costs.get(line.part.id);
    const supplier = costed?.supplier.trim() || NO_SUPPLIER;
    const unitCostMinor = costed?.costMinor ?? 0;
    // Cost is per litre or per part; an order of whole containers is priced by its litres.
    const costMinor = Math.round(line.pickQuantity * unitCostMinor);
    bySupplier.set(supplier, [...(bySupplier.get(supplier) ?? []), { ...line, unitCostMinor, costMinor }]);
  }
  return [...bySupplier]
    .sort(([a], [b]) => (a === NO_SUPPLIER ? 1 : b === NO_SUPPLIER ? -1 : a.localeCompare(b)))
    .map(([supplier, orderLines]) => ({
      supplier,
      lines: orderLines,
      totalCostMinor: orderLines.reduce((sum, l) => sum + l.costMinor, 0),
    }));
}
