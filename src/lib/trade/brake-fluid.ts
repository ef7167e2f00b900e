// Brake fluid boiling points: FMVSS No. 116 (49 CFR 571.116).
import { describe, finite } from './guard';
import type { Severity } from './severity';

export const BRAKE_FLUID_GRADES = ['DOT 3', 'DOT 4', 'DOT 5', 'DOT 5.1'] as const;
export type BrakeFluidGrade = (typeof BRAKE_FLUID_GRADES)[number];

export const BRAKE_FLUID_SOURCE = 'FMVSS No. 116 (49 CFR 571.116), S5.1.1 (dry ERBP) and S5.1.2 (wet ERBP, 3.7 % water)';

// 49 CFR 571.116 S5.1.1: equilibrium reflux boiling point (dry) not less than 205 °C (401 °F),
// 230 °C (446 °F), 260 °C (500 °F); S5.1.2: wet ERBP, the fluid humidified to about 3.7 % water,
// not less than 140 °C (284 °F), 155 °C (311 °F), 180 °C (356 °F) for DOT 3, DOT 4, DOT 5.
// (DOT 4 wet 311 °F is stated in NHTSA interpretation 12089.MLS; the rest agree across secondary
// copies of the regulation.) DOT 5.1 is a non-silicone fluid that meets the DOT 5 limits.
const MINIMUMS: Record<BrakeFluidGrade, { dryC: number; wetC: number; silicone: boolean }> = {
  'DOT 3': { dryC: 205, wetC: 140, silicone: false },
  'DOT 4': { dryC: 230, wetC: 155, silicone: false },
  'DOT 5': { dryC: 260, wetC: 180, silicone: true },
  'DOT 5.1': { dryC: 260, wetC: 180, silicone: false },
};

// The lowest wet boiling point FMVSS 116 accepts in any grade (DOT 3). Fluid that boils below it
// is worse than the poorest fluid the rule allows in service: we treat it as urgent (our rule).
const LOWEST_WET_MINIMUM_C = MINIMUMS['DOT 3'].wetC;

export type BrakeFluidMinimums = {
  grade: BrakeFluidGrade;
  dryMinC: number;
  wetMinC: number;
  dryMinF: number;
  wetMinF: number;
  /** DOT 5 is silicone based and must never be mixed with the glycol-based grades. */
  silicone: boolean;
  source: string;
};

/** "dot4", "DOT-4", "DOT 5.1" → the FMVSS 116 grade; throws for anything else. */
export function normaliseBrakeFluidGrade(text: string): BrakeFluidGrade {
  const m = typeof text === 'string' ? /^\s*DOT[\s-]*([345](?:\.1)?)\s*$/i.exec(text) : null;
  const grade = m ? (`DOT ${m[1]}` as BrakeFluidGrade) : null;
  if (!grade || !BRAKE_FLUID_GRADES.includes(grade)) {
    throw new Error(`${describe(text)} is not an FMVSS 116 brake fluid grade: use ${BRAKE_FLUID_GRADES.join(', ')}`);
  }
  return grade;
}

export function brakeFluidMinimums(grade: string): BrakeFluidMinimums {
  const g = normaliseBrakeFluidGrade(grade);
  const { dryC, wetC, silicone } = MINIMUMS[g];
  return { grade: g, dryMinC: dryC, wetMinC: wetC, dryMinF: (dryC * 9) / 5 + 32, wetMinF: (wetC * 9) / 5 + 32, silicone, source: BRAKE_FLUID_SOURCE };
}

export type BrakeFluidJudgement = {
  grade: BrakeFluidGrade;
  measuredC: number;
  /**
   * `as_new`: at or above the dry minimum. `in_service`: has taken up some water but still boils
   * at or above the wet minimum. `below_wet_minimum`: replace it.
   */
  status: 'as_new' | 'in_service' | 'below_wet_minimum';
  severity: Severity;
  message: string;
  minimums: BrakeFluidMinimums;
  source: string;
};

/** Judges a boiling point read with a brake fluid tester against the grade's FMVSS 116 minimums. */
export function judgeBrakeFluidBoilingPoint(grade: string, measuredC: number): BrakeFluidJudgement {
  const minimums = brakeFluidMinimums(grade);
  const t = finite('The measured boiling point (°C)', measuredC);
  if (t <= 0 || t > 400) throw new Error(`${t} °C is not a brake fluid boiling point: check the tester reading`);
  const base = { grade: minimums.grade, measuredC: t, minimums, source: BRAKE_FLUID_SOURCE };
  if (t >= minimums.dryMinC) {
    return { ...base, status: 'as_new', severity: 'ok', message: `${t} °C: at or above the ${minimums.grade} dry minimum of ${minimums.dryMinC} °C.` };
  }
  if (t >= minimums.wetMinC) {
    return {
      ...base,
      status: 'in_service',
      severity: 'ok',
      message: `${t} °C: the fluid has taken up some water but still boils above the ${minimums.grade} wet minimum of ${minimums.wetMinC} °C.`,
    };
  }
  const urgent = t < LOWEST_WET_MINIMUM_C;
  return {
    ...base,
    status: 'below_wet_minimum',
    severity: urgent ? 'now' : 'soon',
    message: urgent
      ? `${t} °C: below even the DOT 3 wet minimum of ${LOWEST_WET_MINIMUM_C} °C. The fluid can boil under hard braking: replace it before the car is used hard.`
      : `${t} °C: below the ${minimums.grade} wet minimum of ${minimums.wetMinC} °C. The fluid holds too much water: replace it.`,
  };
}
