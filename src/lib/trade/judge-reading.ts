// The one judgement of a reading, shared by the phone's number pad (as the value is typed) and
// the office review. Each template item names a rule; the rule knows the trade, the item's
// expected range is the office's own limit, and the worse of the two decides.
import { parseTypedNumber } from './guard';
import { batteryStateOfCharge, judgeChargingVoltage, judgeEarthVoltageDrop } from './battery';
import { brakeFluidMinimums, judgeBrakeFluidBoilingPoint, normaliseBrakeFluidGrade } from './brake-fluid';
import { parseOilGrade, OIL_GRADE_SOURCE } from './oil';
import { worseSeverity, type Severity } from './severity';
import { checkTorqueWrench } from './torque';
import { judgeTreadDepth, judgeTyrePressure } from './tyres';
import { convert, isKnownUnit, unit as unitOf } from './units';

export type ReadingRule =
  | 'used_oil'
  | 'torque_wrench'
  | 'oil_grade'
  | 'plug_gap'
  | 'coolant_protection'
  | 'brake_fluid_boiling'
  | 'battery_rest'
  | 'charging_voltage'
  | 'earth_drop'
  | 'tread_depth'
  | 'tyre_pressure'
  | 'brake_pad';

export type ReadingContext = {
  rule: string | null;
  unit: string;
  expectedMin: number | null;
  expectedMax: number | null;
  vehicle?: {
    oilGrade?: string | null;
    oilCapacityL?: number | null;
    brakeFluidGrade?: string | null;
    plugGapMm?: number | null;
    plugTorqueNm?: number | null;
    sumpPlugTorqueNm?: number | null;
    wheelNutTorqueNm?: number | null;
    tyrePressureFrontKpa?: number | null;
    tyrePressureRearKpa?: number | null;
  };
  wrench?: { minNm: number; maxNm: number } | null;
  region?: 'EU' | 'UK' | 'US';
  /**
   * Optional: which axle a tyre pressure belongs to. Without it, a pressure is compared with the
   * nearer of the vehicle's front and rear figures.
   */
  axle?: 'front' | 'rear' | null;
};

export type ReadingJudgement = {
  verdict: 'ok' | 'attention' | 'out_of_range' | 'invalid';
  messages: string[];
  suggestedSeverity: Severity | null;
  source: string | null;
};

type Verdict = ReadingJudgement['verdict'];
const VERDICT_ORDER: Verdict[] = ['ok', 'attention', 'out_of_range', 'invalid'];

/** The unit each rule reasons in; a reading in another unit of the same kind is converted first. */
const RULE_UNITS: Record<ReadingRule, string> = {
  used_oil: 'L',
  torque_wrench: 'N.m',
  oil_grade: '{grade}',
  plug_gap: 'mm',
  coolant_protection: 'Cel',
  brake_fluid_boiling: 'Cel',
  battery_rest: 'V',
  charging_voltage: 'V',
  earth_drop: 'V',
  tread_depth: 'mm',
  tyre_pressure: 'kPa',
  brake_pad: 'mm',
};

// Rules whose quantity cannot be below zero (a length, a volume, a voltage reading, a pressure).
const NEVER_NEGATIVE: ReadonlySet<string> = new Set(['used_oil', 'torque_wrench', 'plug_gap', 'battery_rest', 'charging_voltage', 'earth_drop', 'tread_depth', 'tyre_pressure', 'brake_pad']);

type Finding = { verdict: Verdict; message?: string; severity?: Severity | null; source?: string | null };

function isRule(rule: string | null): rule is ReadingRule {
  return rule !== null && Object.hasOwn(RULE_UNITS, rule);
}

export function judgeReading(reading: { value: number | string }, context: ReadingContext): ReadingJudgement {
  const rule = isRule(context.rule) ? context.rule : null;
  if (rule === 'oil_grade' || (rule === null && context.unit === '{grade}')) {
    return rule === 'oil_grade' ? judgeOilGrade(reading.value, context) : judgeText(reading.value);
  }

  const value = typeof reading.value === 'number' ? reading.value : parseTypedNumber(String(reading.value ?? ''));
  if (value === null || !Number.isFinite(value)) return invalid(`"${String(reading.value)}" is not a number.`);

  // Bring the reading and the expected range into the rule's unit.
  let v = value;
  let min = context.expectedMin;
  let max = context.expectedMax;
  if (rule) {
    const ruleUnit = RULE_UNITS[rule];
    if (context.unit !== ruleUnit) {
      if (!isKnownUnit(context.unit) || unitOf(context.unit).dimension !== unitOf(ruleUnit).dimension) {
        return invalid(`This item is recorded in "${context.unit}", which does not fit a ${rule.replace(/_/g, ' ')} reading (${ruleUnit}). The checklist item needs fixing.`);
      }
      v = convert(value, context.unit, ruleUnit);
      min = min === null ? null : convert(min, context.unit, ruleUnit);
      max = max === null ? null : convert(max, context.unit, ruleUnit);
    }
    if (NEVER_NEGATIVE.has(rule) && v < 0) return invalid('This reading cannot be negative.');
  }

  const findings: Finding[] = [];
  if (rule) {
    try {
      findings.push(...RULES[rule](v, context, { min, max }));
    } catch (error) {
      return invalid(error instanceof Error ? error.message : String(error));
    }
  }
  findings.push(...rangeFindings(v, min, max, rule === null ? context.unit : RULE_UNITS[rule], findings.length > 0));
  return combine(findings);
}

function rangeFindings(v: number, min: number | null, max: number | null, unitCode: string, ruleSpoke: boolean): Finding[] {
  const label = isKnownUnit(unitCode) ? unitOf(unitCode).label : unitCode;
  const out: Finding[] = [];
  // When a trade rule has judged the value, the range only adds a note if the rule let it pass.
  const severity = ruleSpoke ? null : 'watch';
  if (min !== null && v < min) out.push({ verdict: 'out_of_range', message: `Below the expected ${fmt(min)} ${label}.`, severity });
  if (max !== null && v > max) out.push({ verdict: 'out_of_range', message: `Above the expected ${fmt(max)} ${label}.`, severity });
  return out;
}

function combine(findings: Finding[]): ReadingJudgement {
  let verdict: Verdict = 'ok';
  let severity: Severity | null = null;
  let source: string | null = null;
  const messages: string[] = [];
  for (const f of findings) {
    if (VERDICT_ORDER.indexOf(f.verdict) > VERDICT_ORDER.indexOf(verdict)) verdict = f.verdict;
    severity = worseSeverity(severity, f.severity ?? null);
    source ??= f.source ?? null;
    if (f.message && !messages.includes(f.message)) messages.push(f.message);
  }
  if (verdict === 'ok' && severity === null) severity = 'ok';
  return { verdict, messages, suggestedSeverity: severity, source };
}

function invalid(message: string, source: string | null = null): ReadingJudgement {
  return { verdict: 'invalid', messages: [message], suggestedSeverity: null, source };
}

function verdictFor(severity: Severity, outOfRange: boolean): Verdict {
  if (outOfRange) return 'out_of_range';
  return severity === 'ok' ? 'ok' : 'attention';
}

function judgeText(value: number | string): ReadingJudgement {
  const text = String(value ?? '').trim();
  return text ? { verdict: 'ok', messages: [], suggestedSeverity: 'ok', source: null } : invalid('Nothing entered.');
}

function judgeOilGrade(value: number | string, context: ReadingContext): ReadingJudgement {
  let grade: string;
  try {
    grade = parseOilGrade(String(value ?? '')).grade;
  } catch (error) {
    return invalid(error instanceof Error ? error.message : String(error), OIL_GRADE_SOURCE);
  }
  const spec = context.vehicle?.oilGrade;
  if (spec) {
    let specGrade: string | null = null;
    try {
      specGrade = parseOilGrade(spec).grade;
    } catch {
      // A vehicle record with an unreadable grade is the office's to fix; judge the reading alone.
    }
    if (specGrade && specGrade !== grade) {
      return {
        verdict: 'attention',
        messages: [`${grade} is not the ${specGrade} this vehicle's data asks for.`],
        suggestedSeverity: 'watch',
        source: OIL_GRADE_SOURCE,
      };
    }
  }
  return { verdict: 'ok', messages: [], suggestedSeverity: 'ok', source: OIL_GRADE_SOURCE };
}

type Range = { min: number | null; max: number | null };
type RuleJudge = (v: number, context: ReadingContext, range: Range) => Finding[];

// Used oil against the capacity (common practice): a good drain gives back most of the fill;
// much less points at consumption, a leak or a poor drain, more than the fill at fuel or coolant
// in the oil.
const USED_OIL_LOW_SHARE = 0.75;
const USED_OIL_HIGH_SHARE = 1.1;
const PLUG_GAP_TOLERANCE_MM = 0.1;
// Brake pad friction material (common practice; the seed's hint says the same).
const PAD_NOW_BELOW_MM = 2;
const PAD_SOON_BELOW_MM = 3;

const RULES: Record<Exclude<ReadingRule, 'oil_grade'>, RuleJudge> = {
  used_oil(v, context) {
    const capacity = context.vehicle?.oilCapacityL;
    if (!capacity || capacity <= 0) return [];
    const source = 'Drained against the oil capacity: common practice';
    if (v < capacity * USED_OIL_LOW_SHARE) {
      return [{ verdict: 'attention', severity: 'watch', source, message: `${fmt(v)} L is much less than the ${fmt(capacity)} L capacity: the engine may burn or leak oil, or it did not all drain.` }];
    }
    if (v > capacity * USED_OIL_HIGH_SHARE) {
      return [{ verdict: 'attention', severity: 'soon', source, message: `${fmt(v)} L is more than the ${fmt(capacity)} L capacity: check the oil for fuel or coolant.` }];
    }
    return [];
  },

  torque_wrench(v, context) {
    const out: Finding[] = [];
    if (context.wrench) {
      const check = checkTorqueWrench({ targetNm: v, wrenchMinNm: context.wrench.minNm, wrenchMaxNm: context.wrench.maxNm });
      const severity: Severity = check.onScale ? (check.position === 'weakest_fifth' ? 'watch' : 'ok') : 'soon';
      out.push({ verdict: check.onScale ? verdictFor(severity, false) : 'out_of_range', severity, source: check.source, message: check.warnings[0] });
    }
    return out;
  },

  plug_gap(v, context) {
    const spec = context.vehicle?.plugGapMm;
    if (!spec) return [];
    if (Math.abs(v - spec) > PLUG_GAP_TOLERANCE_MM + 1e-9) {
      return [{ verdict: 'attention', severity: 'soon', source: "Vehicle data; ±0.1 mm: common practice", message: `${fmt(v)} mm is not the ${fmt(spec)} mm this engine's plugs are set to: re-gap them (unless the plug must not be re-gapped).` }];
    }
    return [];
  },

  coolant_protection(v, _context, range) {
    // The reading is the protection temperature from a refractometer; the item's upper limit is
    // the business's winter target (−25 °C in the demo checklists).
    const target = range.max;
    const source = 'Refractometer protection against the winter target: common practice';
    if (target !== null && v > target) {
      return [{ verdict: 'out_of_range', severity: 'soon', source, message: `Protects only to ${fmt(v)} °C, warmer than the ${fmt(target)} °C target: strengthen the coolant before frost.` }];
    }
    if (range.min !== null && v < range.min) {
      return [{ verdict: 'attention', severity: 'watch', source, message: `Protection to ${fmt(v)} °C means too much glycol: it cools worse and protects no better. Dilute towards 50 %.` }];
    }
    return [{ verdict: 'ok', severity: 'ok', source }];
  },

  brake_fluid_boiling(v, context) {
    let grade = context.vehicle?.brakeFluidGrade ?? null;
    try {
      grade = grade ? normaliseBrakeFluidGrade(grade) : null;
    } catch {
      grade = null;
    }
    // Unknown grade: judge against DOT 3, the least any brake fluid may be.
    const judged = judgeBrakeFluidBoilingPoint(grade ?? 'DOT 3', v);
    const message = grade ? judged.message : `${judged.message} (Fluid grade unknown: judged against DOT 3, ${brakeFluidMinimums('DOT 3').wetMinC} °C wet.)`;
    const outOfRange = judged.status === 'below_wet_minimum';
    return [{ verdict: verdictFor(judged.severity, outOfRange), severity: judged.severity, source: judged.source, message: judged.status === 'as_new' ? undefined : message }];
  },

  battery_rest(v) {
    const soc = batteryStateOfCharge(v);
    const outOfRange = soc.stateOfChargePercent < 50;
    const attention = soc.severity !== 'ok' || soc.compensatedVolts > 12.9;
    return [{ verdict: outOfRange ? 'out_of_range' : attention ? 'attention' : 'ok', severity: soc.severity, source: soc.source, message: soc.message }];
  },

  charging_voltage(v, _context, range) {
    const window = range.min !== null && range.max !== null && range.max > range.min ? { minV: range.min, maxV: range.max } : undefined;
    const judged = judgeChargingVoltage(v, window);
    const outOfRange = judged.status === 'not_charging' || judged.status === 'overcharging' || judged.status === 'low';
    return [{ verdict: verdictFor(judged.severity, outOfRange), severity: judged.severity, source: judged.source, message: judged.status === 'ok' ? undefined : judged.message }];
  },

  earth_drop(v, _context, range) {
    const judged = judgeEarthVoltageDrop(v, range.max !== null && range.max > 0 ? range.max : undefined);
    return [{ verdict: judged.status === 'ok' ? 'ok' : 'out_of_range', severity: judged.severity, source: judged.source, message: judged.status === 'ok' ? undefined : judged.message }];
  },

  tread_depth(v, context) {
    const judged = judgeTreadDepth({ depthMm: v, region: context.region ?? 'UK' });
    return [{ verdict: verdictFor(judged.severity, !judged.legal), severity: judged.severity, source: judged.source, message: judged.status === 'ok' ? undefined : judged.message }];
  },

  tyre_pressure(v, context) {
    const front = context.vehicle?.tyrePressureFrontKpa ?? null;
    const rear = context.vehicle?.tyrePressureRearKpa ?? null;
    let spec: number | null = context.axle === 'front' ? front : context.axle === 'rear' ? rear : null;
    if (spec === null && !context.axle) {
      const known = [front, rear].filter((x): x is number => x !== null && x > 0);
      spec = known.sort((a, b) => Math.abs(a - v) - Math.abs(b - v))[0] ?? null;
    }
    if (!spec) return [];
    const judged = judgeTyrePressure(v, spec);
    return [{ verdict: verdictFor(judged.severity, judged.status === 'seriously_under'), severity: judged.severity, source: judged.source, message: judged.status === 'ok' ? undefined : judged.message }];
  },

  brake_pad(v) {
    const source = 'Friction material thickness: common practice';
    if (v < PAD_NOW_BELOW_MM) return [{ verdict: 'out_of_range', severity: 'now', source, message: `${fmt(v)} mm of friction material: replace the pads before the car is used.` }];
    if (v < PAD_SOON_BELOW_MM) return [{ verdict: 'out_of_range', severity: 'soon', source, message: `${fmt(v)} mm of friction material: replace the pads soon.` }];
    return [{ verdict: 'ok', severity: 'ok', source }];
  },
};

function fmt(n: number): string {
  return String(Math.round(n * 100) / 100);
}
