// Engine coolant: freezing point of glycol and water, for a refractometer or hydrometer reading,
// and the strength needed for a given protection.
import { finite } from './guard';
import { interpolate, interpolateInverse, type TableRow } from './interpolate';

export type Glycol = 'ethylene' | 'propylene';

export const COOLANT_SOURCES: Record<Glycol, string> = {
  ethylene:
    'Melinder, Properties of Secondary Working Fluids for Indirect Systems (IIR, 2010): ethylene glycol in water by mass; volume % converted with the densities at 20 °C',
  propylene: "Lange's Handbook of Chemistry, 15th ed., Table 5.13 (propylene glycol in water by volume)",
};

// Ethylene glycol (pure) in water, % by mass → freezing point °C: Melinder (2010) correlation as
// published for 0–60 % by mass, tabulated every 5 % (10 % at the bottom). Above about 68 % the
// freezing point rises again, and past 60 % the correlation is not valid, so the table stops.
const ETHYLENE_BY_MASS: readonly TableRow[] = [
  [0, 0],
  [10, -3.4],
  [20, -8.0],
  [25, -11.0],
  [30, -14.6],
  [35, -18.8],
  [40, -23.8],
  [45, -29.5],
  [50, -36.0],
  [55, -43.2],
  [60, -51.2],
];

const TABLE_END_MASS = ETHYLENE_BY_MASS.at(-1)![0];

// Propylene glycol (pure) in water, % by volume → freezing point °C: Lange's Handbook, 15th ed.,
// Table 5.13, p. 5.85 (°C column; signs checked against the °F column).
const PROPYLENE_BY_VOLUME: readonly TableRow[] = [
  [0, 0],
  [5, -1.1],
  [10, -2.2],
  [15, -3.9],
  [20, -6.7],
  [25, -8.9],
  [30, -12.8],
  [35, -16.1],
  [40, -20.6],
  [45, -26.7],
  [50, -33.3],
];

// Workshop strength is "by volume": glycol and water measured separately, before mixing (the
// solution shrinks a little on mixing, which the by-volume convention ignores). Densities at
// 20 °C, g/cm³: ethylene glycol 1.1135 and water 0.9982 (CRC Handbook values, from memory).
const ETHYLENE_DENSITY = 1.1135;
const WATER_DENSITY = 0.9982;

// ASTM D3306 (glycol-base coolant for light-duty engines): concentrate is used at 40 to 70 % by
// volume; beyond 70 % protection gets no better and the engine cools worse, so we refuse it.
const MAX_VOL_PERCENT = 70;
const MIN_WORKING_VOL_PERCENT = 40;

function massPercentFromVolume(volPercent: number): number {
  const g = volPercent * ETHYLENE_DENSITY;
  const w = (100 - volPercent) * WATER_DENSITY;
  return (100 * g) / (g + w);
}

function volumePercentFromMass(massPercent: number): number {
  const g = massPercent / ETHYLENE_DENSITY;
  const w = (100 - massPercent) / WATER_DENSITY;
  return (100 * g) / (g + w);
}

export type CoolantFreezePoint = {
  glycol: Glycol;
  glycolVolPercent: number;
  /** Ethylene glycol only: the same strength by mass, as the table is printed. */
  glycolMassPercent: number | null;
  /** null when the strength lies past the end of the published table (no value is extrapolated). */
  freezePointC: number | null;
  freezePointF: number | null;
  notes: string[];
  source: string;
};

const PURE_GLYCOL_NOTE =
  "The table is for pure glycol. Concentrates hold some water and inhibitors, so a label's own protection chart comes first when the maker gives one.";

/** Freezing point of a glycol–water coolant from its strength in % by volume. */
export function coolantFreezePoint(glycolVolPercent: number, glycol: Glycol = 'ethylene'): CoolantFreezePoint {
  const vol = checkedVolPercent(glycolVolPercent);
  const notes = [PURE_GLYCOL_NOTE];
  let massPercent: number | null = null;
  let freezePointC: number | null;
  if (glycol === 'ethylene') {
    massPercent = massPercentFromVolume(vol);
    // A strength given to 0.1 % by volume (as glycolForProtection rounds up) may land a hair past
    // the last row; within that reading resolution it is the last row.
    const lookup = massPercent > TABLE_END_MASS && massPercent <= TABLE_END_MASS + 0.1 ? TABLE_END_MASS : massPercent;
    freezePointC = interpolate(ETHYLENE_BY_MASS, lookup);
  } else {
    freezePointC = interpolate(PROPYLENE_BY_VOLUME, vol);
  }
  if (freezePointC === null) {
    const last = (glycol === 'ethylene' ? ETHYLENE_BY_MASS : PROPYLENE_BY_VOLUME).at(-1)!;
    notes.unshift(
      `Stronger than the table goes (protection colder than ${last[1]} °C). More glycol adds little protection and cools worse: dilute towards 50 %.`,
    );
  } else if (vol < MIN_WORKING_VOL_PERCENT) {
    notes.unshift(`Below ${MIN_WORKING_VOL_PERCENT} % the corrosion inhibitors are too weak (ASTM D3306 working range 40–70 %), whatever the frost protection.`);
  }
  const rounded = freezePointC === null ? null : round1(freezePointC);
  return {
    glycol,
    glycolVolPercent: vol,
    glycolMassPercent: massPercent === null ? null : round1(massPercent),
    freezePointC: rounded,
    freezePointF: freezePointC === null ? null : round1((freezePointC * 9) / 5 + 32),
    notes,
    source: COOLANT_SOURCES[glycol],
  };
}

export type GlycolForProtection = {
  glycol: Glycol;
  targetC: number;
  /** The least glycol, % by volume, that protects down to the target. */
  glycolVolPercent: number;
  glycolMassPercent: number | null;
  /** Litres of glycol for a system of the given capacity, when given. */
  glycolL: number | null;
  notes: string[];
  source: string;
};

/** The glycol strength (% by volume) that protects down to `targetC`. */
export function glycolForProtection(targetC: number, glycol: Glycol = 'ethylene', options: { systemCapacityL?: number | null } = {}): GlycolForProtection {
  const target = finite('The protection temperature (°C)', targetC);
  const table = glycol === 'ethylene' ? ETHYLENE_BY_MASS : PROPYLENE_BY_VOLUME;
  if (glycol !== 'ethylene' && glycol !== 'propylene') throw new Error('The glycol must be "ethylene" or "propylene"');
  if (target > 0) throw new Error(`${target} °C is above freezing: plain water would not freeze. Give a protection temperature at or below 0 °C`);
  const coldest = table.at(-1)![1];
  if (target < coldest) {
    throw new Error(`${target} °C is colder than the table reaches (${coldest} °C): no ${glycol} glycol strength we can vouch for protects that far`);
  }
  const x = interpolateInverse(table, target)!;
  const vol = glycol === 'ethylene' ? volumePercentFromMass(x) : x;
  const notes = [PURE_GLYCOL_NOTE];
  if (vol < MIN_WORKING_VOL_PERCENT) {
    notes.unshift(`Use at least ${MIN_WORKING_VOL_PERCENT} % anyway: below it the corrosion inhibitors are too weak (ASTM D3306).`);
  }
  let glycolL: number | null = null;
  if (options.systemCapacityL != null) {
    const cap = finite('The cooling system capacity (L)', options.systemCapacityL);
    if (cap <= 0 || cap > 100) throw new Error(`${cap} L is not a car's cooling system capacity`);
    glycolL = Math.ceil(cap * vol * 10) / 1000;
  }
  return {
    glycol,
    targetC: target,
    // Rounded up: the least strength that protects must not come out a shade too weak.
    glycolVolPercent: Math.ceil(vol * 10 - 1e-9) / 10,
    glycolMassPercent: glycol === 'ethylene' ? Math.ceil(x * 10 - 1e-9) / 10 : null,
    glycolL,
    notes,
    source: COOLANT_SOURCES[glycol],
  };
}

function checkedVolPercent(value: number): number {
  const vol = finite('The glycol strength (% by volume)', value);
  if (vol < 0 || vol > 100) throw new Error(`${vol} % is not a strength: it must be between 0 and 100 % by volume`);
  if (vol > MAX_VOL_PERCENT) {
    throw new Error(`${vol} % glycol is more than the ${MAX_VOL_PERCENT} % limit: protection gets worse, not better. Dilute the coolant`);
  }
  return vol;
}

function round1(n: number): number {
  return Math.round(n * 10) / 10;
}
