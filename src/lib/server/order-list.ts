// The office's order list: next week's rounds less the stock in the vans, per supplier.
import { buildLoadList } from '../trade/load-list';
import { buildOrderList, type SupplierOrder } from '../trade/order-list';
import { describePacking } from '../trade/containers';
import { toCsv } from '../csv';
import { formatMajorAmount } from '../office/money-input';
import { needsInScope } from './load-list';
import { stockOnHandAcrossVans } from './van-stock';
import { getOrganisation } from './organisation';

export type OrderList = {
  from: string;
  to: string;
  currency: string;
  visitCount: number;
  suppliers: SupplierOrder[];
  totalCostMinor: number;
  gaps: string[];
};

export async function orderListFor(organisationId: string, from: string, to: string): Promise<OrderList> {
  const { currency } = await getOrganisation(organisationId);
  const { planned, visitNeeds, catalogue, gaps } = await needsInScope({ organisationId, from, to });
  const { lines } = buildLoadList({
    visitNeeds,
    parts: catalogue.parts,
    containerSizes: catalogue.containerSizes,
    onHand: await stockOnHandAcrossVans(organisationId),
  });
  const suppliers = buildOrderList(lines, new Map(catalogue.rows.map((r) => [r.id, r])));
  return {
    from,
    to,
    currency,
    visitCount: planned.length,
    suppliers,
    totalCostMinor: suppliers.reduce((sum, s) => sum + s.totalCostMinor, 0),
    gaps,
  };
}

const UNIT_WORDS: Record<string, string> = { L: 'L', '{each}': 'each' };

/** One row per part to order; quantities and costs as plain numbers a spreadsheet can sum. */
export function orderListCsv(list: OrderList): string {
  const header = [
    'Supplier',
    'Part number',
    'Description',
    'Oil grade',
    'Needed',
    'In vans',
    'Order quantity',
    'Unit',
    'Containers',
    `Unit cost (${list.currency})`,
    `Line cost (${list.currency})`,
  ];
  const rows = list.suppliers.flatMap((s) =>
    s.lines.map((l) => [
      s.supplier,
      l.part.partNumber,
      l.part.description,
      l.part.oilGrade ?? '',
      l.needed,
      l.onHand,
      l.pickQuantity,
      UNIT_WORDS[l.part.unit] ?? l.part.unit,
      l.pick ? describePacking(l.pick) : '',
      formatMajorAmount(l.unitCostMinor, list.currency),
      formatMajorAmount(l.costMinor, list.currency),
    ]),
  );
  return toCsv([header, ...rows]);
}
