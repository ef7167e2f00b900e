// Engine oil: SAE J300 viscosity grades, and measuring a refill with a jug.
import { describe, nonNegative, positive } from './guard';

export const OIL_GRADE_SOURCE = 'SAE J300 (limits unchanged from the 2015 edition to J300_202405)';

// SAE J300, low-temperature (W) grades: maximum cranking viscosity (CCS, ASTM D5293) and maximum
// pumping viscosity (MRV, ASTM D4684, no yield stress), each at its temperature, and the minimum
// kinematic viscosity at 100 °C. Table as reproduced for J300 (2015-01) and unchanged in 2024.
type WinterLimits = { crankingMaxMPas: number; crankingAtC: number; pumpingMaxMPas: number; pumpingAtC: number; kv100MinMm2s: number };
const WINTER: Record<number, WinterLimits> = {
  0: { crankingMaxMPas: 6200, crankingAtC: -35, pumpingMaxMPas: 60000, pumpingAtC: -40, kv100MinMm2s: 3.8 },
  5: { crankingMaxMPas: 6600, crankingAtC: -30, pumpingMaxMPas: 60000, pumpingAtC: -35, kv100MinMm2s: 3.8 },
  10: { crankingMaxMPas: 7000, crankingAtC: -25, pumpingMaxMPas: 60000, pumpingAtC: -30, kv100MinMm2s: 4.1 },
  15: { crankingMaxMPas: 7000, crankingAtC: -20, pumpingMaxMPas: 60000, pumpingAtC: -25, kv100MinMm2s: 5.6 },
  20: { crankingMaxMPas: 9500, crankingAtC: -15, pumpingMaxMPas: 60000, pumpingAtC: -20, kv100MinMm2s: 5.6 },
  25: { crankingMaxMPas: 13000, crankingAtC: -10, pumpingMaxMPas: 60000, pumpingAtC: -15, kv100MinMm2s: 9.3 },
};

// SAE J300, high-temperature grades: kinematic viscosity at 100 °C, minimum and (strictly) below
// the maximum, and minimum high-temperature high-shear viscosity at 150 °C (HTHS).
// SAE 16 (2013), 8 and 12 (2015) are the newer low-viscosity grades.
type SummerLimits = { kv100MinMm2s: number; kv100BelowMm2s: number; hthsMinMPas: number };
const SUMMER: Record<number, SummerLimits> = {
  8: { kv100MinMm2s: 4.0, kv100BelowMm2s: 6.1, hthsMinMPas: 1.7 },
  12: { kv100MinMm2s: 5.0, kv100BelowMm2s: 7.1, hthsMinMPas: 2.0 },
  16: { kv100MinMm2s: 6.1, kv100BelowMm2s: 8.2, hthsMinMPas: 2.3 },
  20: { kv100MinMm2s: 6.9, kv100BelowMm2s: 9.3, hthsMinMPas: 2.6 },
  30: { kv100MinMm2s: 9.3, kv100BelowMm2s: 12.5, hthsMinMPas: 2.9 },
  40: { kv100MinMm2s: 12.5, kv100BelowMm2s: 16.3, hthsMinMPas: 3.7 },
  50: { kv100MinMm2s: 16.3, kv100BelowMm2s: 21.9, hthsMinMPas: 3.7 },
  60: { kv100MinMm2s: 21.9, kv100BelowMm2s: 26.1, hthsMinMPas: 3.7 },
};
// J300 (since 2007): 0W-40, 5W-40 and 10W-40 need only 3.5 mPa·s HTHS; other SAE 40 oils 3.7.
const HTHS_LIGHT_40 = 3.5;

const WINTER_NUMBERS = Object.keys(WINTER).map(Number);
const SUMMER_NUMBERS = Object.keys(SUMMER).map(Number);

export type OilGrade = {
  /** Normalised label: `5W-30`, `20W`, `30`. */
  grade: string;
  kind: 'multigrade' | 'winter' | 'summer';
  winter: number | null;
  summer: number | null;
  limits: {
    kv100MinMm2s: number;
    /** Kinematic viscosity at 100 °C must be strictly below this; null for a winter-only grade. */
    kv100BelowMm2s: number | null;
    hthsMinMPas: number | null;
    crankingMaxMPas: number | null;
    crankingAtC: number | null;
    pumpingMaxMPas: number | null;
    pumpingAtC: number | null;
  };
  source: string;
};

const list = (ns: number[], suffix = '') => ns.map((n) => `${n}${suffix}`).join(', ');

/**
 * Reads an oil grade as printed on a container ("SAE 5W-30", "5w30", "5W–30") and returns the
 * grade with its SAE J300 limits; throws with the reason when J300 defines no such grade.
 */
export function parseOilGrade(text: string): OilGrade {
  if (typeof text !== 'string') throw new Error(`An oil grade must be text such as 5W-30, not ${describe(text)}`);
  const compact = text
    .toUpperCase()
    .replace(/^\s*SAE/, '')
    .replace(/[\s\u2010-\u2015\u2212_/-]+/g, '');
  const match = /^(\d{1,2})(W)?(\d{1,2})?$/.exec(compact);
  if (!match || (match[3] !== undefined && !match[2])) {
    throw new Error(`"${text.trim()}" is not an SAE J300 grade: write it like 5W-30, 10W-40, 20W or 30`);
  }
  const first = Number(match[1]);
  const isWinter = match[2] === 'W';
  const second = match[3] === undefined ? null : Number(match[3]);

  if (isWinter && !WINTER_NUMBERS.includes(first)) {
    throw new Error(`SAE J300 defines no ${first}W grade: the W grades are ${list(WINTER_NUMBERS, 'W')}`);
  }
  const summer = isWinter ? second : first;
  if (summer !== null && !SUMMER_NUMBERS.includes(summer)) {
    throw new Error(`SAE J300 defines no ${summer} grade: the high-temperature grades are ${list(SUMMER_NUMBERS)}`);
  }
  const w = isWinter ? WINTER[first]! : null;
  const s = summer !== null ? SUMMER[summer]! : null;
  // A multigrade must meet both: the W grade's minimum viscosity at 100 °C and the summer grade's
  // range. 25W needs at least 9.3 mm²/s, which SAE 20 and lighter must stay below.
  if (w && s && w.kv100MinMm2s >= s.kv100BelowMm2s) {
    throw new Error(
      `${first}W-${summer} cannot exist under SAE J300: ${first}W needs at least ${w.kv100MinMm2s} mm²/s at 100 °C, SAE ${summer} must stay below ${s.kv100BelowMm2s}`,
    );
  }
  const kind: OilGrade['kind'] = w && s ? 'multigrade' : w ? 'winter' : 'summer';
  const grade = kind === 'multigrade' ? `${first}W-${summer}` : kind === 'winter' ? `${first}W` : `${summer}`;
  let hthsMinMPas = s?.hthsMinMPas ?? null;
  if (summer === 40 && isWinter && first <= 10) hthsMinMPas = HTHS_LIGHT_40;
  return {
    grade,
    kind,
    winter: isWinter ? first : null,
    summer,
    limits: {
      kv100MinMm2s: Math.max(w?.kv100MinMm2s ?? 0, s?.kv100MinMm2s ?? 0),
      kv100BelowMm2s: s?.kv100BelowMm2s ?? null,
      hthsMinMPas,
      crankingMaxMPas: w?.crankingMaxMPas ?? null,
      crankingAtC: w?.crankingAtC ?? null,
      pumpingMaxMPas: w?.pumpingMaxMPas ?? null,
      pumpingAtC: w?.pumpingAtC ?? null,
    },
    source: OIL_GRADE_SOURCE,
  };
}

// ---------------------------------------------------------------------------------------------

export type OilFillPlan = {
  capacityL: number;
  jugL: number;
  /** Each pour in litres: full jugs, then what is left (2.8 L with a 1 L jug: 1, 1, 0.8). */
  pours: number[];
  fullJugs: number;
  lastPourL: number;
  /** Litres to bring the level from where it reads up to the upper mark, when the marks are given. */
  topUpL: number | null;
  advice: string[];
};

// Oil is measured to the millilitre: a jug's scale is never finer, and whole millilitres keep the
// pours free of binary rounding (2.8 − 1 − 1 is 0.7999… in floating point).
const ML_PER_L = 1000;

/**
 * How to measure a refill with a jug. `dipstickSpanL` is the volume between the dipstick's lower
 * and upper marks (from the vehicle data); `levelBetweenMarks` is where the oil reads, 0 at the
 * lower mark and 1 at the upper one.
 */
export function oilFillPlan(input: { capacityL: number; jugL: number; dipstickSpanL?: number | null; levelBetweenMarks?: number | null }): OilFillPlan {
  const capacityMl = Math.round(positive('The oil capacity (L)', input?.capacityL) * ML_PER_L);
  const jugMl = Math.round(positive('The jug size (L)', input.jugL) * ML_PER_L);
  if (capacityMl === 0 || jugMl === 0) throw new Error('Capacity and jug must each be at least 1 mL');
  if (capacityMl > 50 * ML_PER_L) throw new Error(`${input.capacityL} L is more than any car engine holds: check the capacity`);
  const fullJugs = Math.floor(capacityMl / jugMl);
  const restMl = capacityMl - fullJugs * jugMl;
  const pours = [...Array<number>(fullJugs).fill(jugMl / ML_PER_L), ...(restMl > 0 ? [restMl / ML_PER_L] : [])];

  let topUpL: number | null = null;
  const advice = [
    'Pour the last part slowly, wait a few minutes for the oil to settle, then read the dipstick with the car level.',
    'Never fill above the upper mark: too much oil is as harmful as too little.',
  ];
  if (input.dipstickSpanL != null) {
    const spanMl = Math.round(positive('The volume between the dipstick marks (L)', input.dipstickSpanL) * ML_PER_L);
    const level = input.levelBetweenMarks == null ? 0 : nonNegative('The level between the marks', input.levelBetweenMarks);
    if (level > 1) throw new Error('The level between the marks runs from 0 (lower mark) to 1 (upper mark)');
    topUpL = Math.round(spanMl * (1 - level)) / ML_PER_L;
  }
  return { capacityL: capacityMl / ML_PER_L, jugL: jugMl / ML_PER_L, pours, fullJugs, lastPourL: pours[pours.length - 1] ?? 0, topUpL, advice };
}
