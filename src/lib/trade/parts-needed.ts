// Which parts a visit will use, read from the vehicle's spec and the part items of the visit's
// checklist: the spec names the filters and plugs by catalogue part, and the oil by grade and
// capacity. The load list sums these over a round; the order list over a week.

export type VehicleForParts = {
  registration: string;
  fuel: string;
  oilGrade: string | null;
  oilCapacityL: number | null;
  oilFilterPartId: string | null;
  airFilterPartId: string | null;
  cabinFilterPartId: string | null;
  fuelFilterPartId: string | null;
  sparkPlugPartId: string | null;
  sparkPlugCount: number | null;
};

/** A checklist item of kind `part`; `partKind` says which slot of the spec supplies it. */
export type PartItem = { id: string; label: string; partKind: string | null };

export type CatalogueOil = { id: string; partNumber: string; oilGrade: string | null };

export type PartNeed = { itemId: string; partId: string; quantity: number };

export type PartsNeeded = { needs: PartNeed[]; gaps: string[] };

type FilterSlot = 'oilFilterPartId' | 'airFilterPartId' | 'cabinFilterPartId' | 'fuelFilterPartId';
const FILTER_SLOTS: Record<string, FilterSlot> = {
  oil_filter: 'oilFilterPartId',
  air_filter: 'airFilterPartId',
  cabin_filter: 'cabinFilterPartId',
  fuel_filter: 'fuelFilterPartId',
};

// A diesel (compression ignition) has no spark plugs; a battery-electric car has neither engine
// oil nor spark plugs nor an engine air filter. The diesel fuel filter is a service item on
// diesels (common practice); on a petrol car it is fitted only where the spec names one.
const SPARK_IGNITION = new Set(['petrol', 'hybrid', 'lpg']);
function slotExpected(partKind: string, fuel: string): boolean {
  switch (partKind) {
    case 'oil':
    case 'oil_filter':
    case 'air_filter':
      return fuel !== 'electric';
    case 'cabin_filter':
      return true;
    case 'fuel_filter':
      return fuel === 'diesel';
    case 'spark_plug':
      return SPARK_IGNITION.has(fuel);
    default:
      return false;
  }
}

// SAE J300 grade numbers (TRADE-REFERENCES.md §3, from J300's table): the W (winter) grades and
// the grades at 100 °C. Only the label is checked here, not whether a given oil meets it.
const W_GRADES = new Set([0, 5, 10, 15, 20, 25]);
const HOT_GRADES = new Set([8, 12, 16, 20, 30, 40, 50, 60]);

/** "sae 5w30" → "5W-30"; a mono grade "SAE 30" → "30"; null for a label J300 does not define. */
export function normaliseOilGrade(label: string): string | null {
  const multi = /^(?:SAE\s*)?(\d{1,2})\s*W\s*-?\s*(\d{1,2})$/i.exec(label.trim());
  if (multi) {
    const [cold, hot] = [Number(multi[1]), Number(multi[2])];
    return W_GRADES.has(cold) && HOT_GRADES.has(hot) ? `${cold}W-${hot}` : null;
  }
  const mono = /^(?:SAE\s*)?(\d{1,2})$/i.exec(label.trim());
  return mono && HOT_GRADES.has(Number(mono[1])) ? String(Number(mono[1])) : null;
}

/** Oil grade labels compared loosely: "SAE 5W-30", "5w30" and "5W-30" are the same oil. */
export function oilGradeKey(label: string): string {
  return label
    .toUpperCase()
    .replace(/^SAE\s*/, '')
    .replace(/[^0-9A-Z]/g, '');
}

/**
 * The parts one visit needs. Items whose kind has no slot in the spec (wipers, bulbs, grease,
 * sundries) are left out: the checklist cannot say which part or how many. A slot the vehicle's
 * fuel should have but the spec leaves empty becomes a gap the office must fill in.
 */
export function partsNeededForVisit(vehicle: VehicleForParts, items: readonly PartItem[], oils: readonly CatalogueOil[]): PartsNeeded {
  const needs: PartNeed[] = [];
  const gaps: string[] = [];
  const gap = (problem: string) => gaps.push(`${vehicle.registration}: ${problem}`);

  for (const item of items) {
    const kind = item.partKind;
    if (!kind) continue;
    if (kind === 'oil') {
      if (!slotExpected(kind, vehicle.fuel)) continue;
      if (!vehicle.oilGrade || !vehicle.oilCapacityL) {
        gap('the spec has no oil grade or capacity');
        continue;
      }
      const key = oilGradeKey(vehicle.oilGrade);
      const oil = oils.find((o) => o.oilGrade !== null && oilGradeKey(o.oilGrade) === key);
      if (!oil) {
        gap(`no ${vehicle.oilGrade} oil in the parts catalogue`);
        continue;
      }
      needs.push({ itemId: item.id, partId: oil.id, quantity: vehicle.oilCapacityL });
    } else if (kind === 'spark_plug') {
      if (vehicle.sparkPlugPartId && vehicle.sparkPlugCount) {
        needs.push({ itemId: item.id, partId: vehicle.sparkPlugPartId, quantity: vehicle.sparkPlugCount });
      } else if (slotExpected(kind, vehicle.fuel)) {
        gap('the spec has no spark plug part or count');
      }
    } else if (FILTER_SLOTS[kind]) {
      const partId = vehicle[FILTER_SLOTS[kind]];
      if (partId) needs.push({ itemId: item.id, partId, quantity: 1 });
      else if (slotExpected(kind, vehicle.fuel)) gap(`the spec names no ${kind.replace('_', ' ')} (${item.label})`);
    }
  }
  return { needs, gaps };
}
