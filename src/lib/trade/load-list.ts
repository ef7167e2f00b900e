// The load list: what a van must carry for a set of visits, against what it holds. Used for a
// technician's round (what to pick from the store tonight) and, summed over every van, for the
// office's order list.
import { packIntoContainers, type Packing } from './containers';
import { roundQuantity, sumQuantities } from './quantity';
import type { PartNeed } from './parts-needed';

export type StockPart = {
  id: string;
  partNumber: string;
  description: string;
  kind: string;
  /** UCUM: 'L' for oil, '{each}' for counted parts. */
  unit: string;
  oilGrade: string | null;
};

export type LoadLine = {
  part: StockPart;
  /** In the part's unit, summed over the visits. */
  needed: number;
  /** Oil only: the needed litres as whole containers (null for counted parts or no sizes set). */
  neededInContainers: Packing | null;
  onHand: number;
  /** How much more the van must take: never negative. */
  shortfall: number;
  /** Oil only: the shortfall as whole containers to pick. */
  pick: Packing | null;
  /** What to pick, in the part's unit: whole containers for oil, whole parts otherwise. */
  pickQuantity: number;
  /** How many visits use this part. */
  visits: number;
};

export type GradeTotal = { oilGrade: string; needed: number; onHand: number; shortfall: number };

export type LoadList = { lines: LoadLine[]; grades: GradeTotal[] };

export type LoadListInput = {
  visitNeeds: readonly (readonly PartNeed[])[];
  parts: readonly StockPart[];
  containerSizes: ReadonlyMap<string, readonly number[]>;
  onHand: ReadonlyMap<string, number>;
};

function isOil(part: StockPart) {
  return part.unit === 'L';
}

/** The pick for a shortfall: whole containers of oil, whole parts of anything counted. */
function pickFor(part: StockPart, shortfall: number, sizes: readonly number[]) {
  if (!isOil(part)) return { pick: null, pickQuantity: Math.ceil(roundQuantity(shortfall)) };
  const pick = packIntoContainers(shortfall, sizes);
  // No container sizes set: loose litres, so the list still says how much is missing.
  return { pick, pickQuantity: pick ? pick.totalL : roundQuantity(shortfall) };
}

export function buildLoadList(input: LoadListInput): LoadList {
  const partsById = new Map(input.parts.map((p) => [p.id, p]));
  const needed = new Map<string, number[]>();
  const visits = new Map<string, number>();
  for (const needs of input.visitNeeds) {
    const seen = new Set<string>();
    for (const need of needs) {
      if (!partsById.has(need.partId)) throw new Error(`part ${need.partId} is not in the catalogue given`);
      needed.set(need.partId, [...(needed.get(need.partId) ?? []), need.quantity]);
      seen.add(need.partId);
    }
    for (const partId of seen) visits.set(partId, (visits.get(partId) ?? 0) + 1);
  }

  const lines: LoadLine[] = [...needed].map(([partId, quantities]) => {
    const part = partsById.get(partId)!;
    const total = sumQuantities(quantities);
    const onHand = roundQuantity(input.onHand.get(partId) ?? 0);
    const shortfall = roundQuantity(Math.max(0, total - Math.max(0, onHand)));
    const sizes = input.containerSizes.get(partId) ?? [];
    return {
      part,
      needed: total,
      neededInContainers: isOil(part) ? packIntoContainers(total, sizes) : null,
      onHand,
      shortfall,
      ...pickFor(part, shortfall, sizes),
      visits: visits.get(partId) ?? 0,
    };
  });
  // Oil first, by grade, then everything else by part number: the order a van is loaded.
  lines.sort(
    (a, b) =>
      Number(isOil(b.part)) - Number(isOil(a.part)) ||
      (a.part.oilGrade ?? '').localeCompare(b.part.oilGrade ?? '') ||
      a.part.partNumber.localeCompare(b.part.partNumber),
  );

  const grades = new Map<string, LoadLine[]>();
  for (const line of lines) {
    if (line.part.oilGrade) grades.set(line.part.oilGrade, [...(grades.get(line.part.oilGrade) ?? []), line]);
  }
  return {
    lines,
    grades: [...grades].map(([oilGrade, gradeLines]) => ({
      oilGrade,
      needed: sumQuantities(gradeLines.map((l) => l.needed)),
      onHand: sumQuantities(gradeLines.map((l) => Math.max(0, l.onHand))),
      shortfall: sumQuantities(gradeLines.map((l) => l.shortfall)),
    })),
  };
}
