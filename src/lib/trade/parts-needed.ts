// Which parts a visit will use, read from the vehicle's spec and the part items of the visit's
// checklist: the spec names the filters and plugs by catalogue part, and the oil by grade and
// capacity. The load list sums these over a round; the order list over a week.
import { parseOilGrade } from './oil';

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

/**
 * Oil grade labels compared by their SAE J300 grade: "SAE 5W-30", "5w30" and "5W-30" are the same
 * oil. A label J300 does not define is compared as written (upper case, letters and digits only).
 */
export function oilGradeKey(label: string): string {
  try {
    return parseOilGrade(label).grade;
  } catch {
    return label.toUpperCase().replace(/[^0-9A-Z]/g, '');
  }
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
