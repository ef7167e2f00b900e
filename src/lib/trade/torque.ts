// Torque wrenches (ISO 6789) and spark-plug tightening guidance.
import { positive } from './guard';

export const TORQUE_WRENCH_SOURCE =
  'ISO 6789-1:2017 (range from the lowest marked value to the maximum; ±4 % above 10 N·m maximum, ±6 % at or below, for Type II classes A, D and G); bottom-fifth warning: common practice';

// ISO 6789-1:2017, clause 5.1.3: a setting wrench's range now runs from its lowest marked value to
// its maximum, and it is calibrated from that lowest value (as explained in a torque-tool maker's
// 2017 articles on the revision; the clause text itself was not available to us).
// Maximum permissible deviation of Type II classes A, D and G (the adjustable click wrench):
// ±4 % when the tool's maximum is above 10 N·m, ±6 % at or below. The threshold is the tool's
// maximum, not the set value (summary of ISO 6789 in a torque-tool maker's user manual; the
// table number was not verified).
const SMALL_TOOL_MAX_NM = 10;
const DEVIATION_PERCENT_LARGE = 4;
const DEVIATION_PERCENT_SMALL = 6;

// The withdrawn ISO 6789:2003 verified only 20 %, 60 % and 100 % of maximum, and the trade still
// treats the bottom of a click wrench's scale as its least repeatable part. We warn in the lowest
// fifth of the marked span (common practice, not a requirement of the 2017 edition).
const WEAKEST_PART_OF_SPAN = 0.2;

export type TorqueWrenchCheck = {
  targetNm: number;
  wrenchMinNm: number;
  wrenchMaxNm: number;
  /** Whether the target lies on the marked scale, ends included. */
  onScale: boolean;
  position: 'below_scale' | 'weakest_fifth' | 'on_scale' | 'above_scale';
  /** ISO 6789-1 maximum permissible deviation for this wrench, in percent. */
  permissibleDeviationPercent: number;
  /**
   * The torque actually applied when a wrench within tolerance clicks at the target. ISO 6789-2
   * relates the deviation to the reference reading, a = (set − reference) / reference, so the
   * band is target / (1 + a) … target / (1 − a): 25 N·m at ±4 % is 24.04 … 26.04 N·m.
   */
  appliedBandNm: { min: number; max: number };
  /** The top of the weakest fifth of the scale. */
  weakestFifthBelowNm: number;
  warnings: string[];
  source: string;
};

export function checkTorqueWrench(input: { targetNm: number; wrenchMinNm: number; wrenchMaxNm: number }): TorqueWrenchCheck {
  const targetNm = positive('The target torque (N·m)', input?.targetNm);
  const wrenchMinNm = positive("The wrench's lowest marked value (N·m)", input.wrenchMinNm);
  const wrenchMaxNm = positive("The wrench's maximum (N·m)", input.wrenchMaxNm);
  if (wrenchMaxNm <= wrenchMinNm) {
    throw new Error(`The wrench's maximum (${wrenchMaxNm} N·m) must be above its lowest marked value (${wrenchMinNm} N·m)`);
  }
  const permissibleDeviationPercent = wrenchMaxNm > SMALL_TOOL_MAX_NM ? DEVIATION_PERCENT_LARGE : DEVIATION_PERCENT_SMALL;
  const a = permissibleDeviationPercent / 100;
  const weakestFifthBelowNm = wrenchMinNm + WEAKEST_PART_OF_SPAN * (wrenchMaxNm - wrenchMinNm);
  const warnings: string[] = [];
  let position: TorqueWrenchCheck['position'];
  if (targetNm < wrenchMinNm) {
    position = 'below_scale';
    warnings.push(`${fmt(targetNm)} N·m is below this wrench's lowest marked value (${fmt(wrenchMinNm)} N·m): use a smaller wrench.`);
  } else if (targetNm > wrenchMaxNm) {
    position = 'above_scale';
    warnings.push(`${fmt(targetNm)} N·m is above this wrench's maximum (${fmt(wrenchMaxNm)} N·m): use a larger wrench.`);
  } else if (targetNm < weakestFifthBelowNm) {
    position = 'weakest_fifth';
    warnings.push(
      `${fmt(targetNm)} N·m is on the scale but in its bottom fifth (below ${fmt(weakestFifthBelowNm)} N·m), where click wrenches are least accurate: a smaller wrench is better.`,
    );
  } else {
    position = 'on_scale';
  }
  return {
    targetNm,
    wrenchMinNm,
    wrenchMaxNm,
    onScale: position === 'on_scale' || position === 'weakest_fifth',
    position,
    permissibleDeviationPercent,
    appliedBandNm: { min: targetNm / (1 + a), max: targetNm / (1 - a) },
    weakestFifthBelowNm,
    warnings,
    source: TORQUE_WRENCH_SOURCE,
  };
}

function fmt(n: number): string {
  return Number.isInteger(n) ? String(n) : n.toFixed(1);
}

// ---------------------------------------------------------------------------------------------
// Spark plugs. The figures are spark-plug makers' published installation guidance in N·m as
// their charts print them (dry threads, new gasket), not a standard: common practice. The
// vehicle maker's figure wins.

export const PLUG_THREADS = ['M8', 'M10', 'M12', 'M14', 'M18'] as const;
export type PlugThread = (typeof PLUG_THREADS)[number];
export type PlugSeat = 'flat' | 'taper';
export type CylinderHead = 'cast_iron' | 'aluminium';

export const SPARK_PLUG_SOURCE =
  "Spark-plug makers' installation guidance (dry threads, new gasket): common practice. The vehicle maker's figure takes precedence.";

type RangeNm = readonly [min: number, max: number];
// [cast-iron head, aluminium head]; null where the makers publish no figure. The charts give
// kgf·m with N·m beside it (e.g. 2.5–3.0 kgf·m printed as 25–29 N·m); we keep their N·m.
const FLAT_SEAT: Record<PlugThread, readonly [RangeNm, RangeNm | null]> = {
  M8: [[8, 10], null],
  M10: [[10, 15], [10, 12]],
  M12: [[15, 25], [15, 20]],
  M14: [[25, 34], [25, 29]],
  M18: [[34, 44], [34, 44]],
};
const TAPER_SEAT: Partial<Record<PlugThread, readonly [RangeNm, RangeNm]>> = {
  M14: [[15, 25], [10, 20]],
  M18: [[20, 29], [20, 29]],
};

// Turn-angle method when no torque wrench fits: after the plug seats finger-tight (makers' pages).
const ANGLE_NEW_GASKET_DEG = 180; // ½ turn for M14/M18; some makers allow up to ⅔ or ¾
const ANGLE_NEW_GASKET_SMALL_DEG = 90; // M10/M12: about ¼ to ⅓ turn (from memory; the maker's figure wins)
const ANGLE_REUSED_GASKET_DEG = 30; // 1/12 turn
const ANGLE_TAPER_DEG = 22.5; // 1/16 turn

export type SparkPlugTightening = {
  thread: PlugThread;
  seat: PlugSeat;
  head: CylinderHead;
  torqueNm: { min: number; max: number } | null;
  turnAngleDeg: number;
  notes: string[];
  source: string;
};

export function sparkPlugTightening(input: { thread: string; seat: PlugSeat; head: CylinderHead; reusedGasket?: boolean }): SparkPlugTightening {
  const thread = String(input?.thread ?? '').toUpperCase().replace(/\s+/g, '').replace(/X.*$/, '') as PlugThread;
  if (!PLUG_THREADS.includes(thread)) {
    throw new Error(`"${input?.thread}" is not a spark-plug thread we have guidance for: use ${PLUG_THREADS.join(', ')}`);
  }
  if (input.seat !== 'flat' && input.seat !== 'taper') throw new Error('The seat must be "flat" (with a gasket) or "taper"');
  if (input.head !== 'cast_iron' && input.head !== 'aluminium') throw new Error('The cylinder head must be "cast_iron" or "aluminium"');
  const pair = input.seat === 'flat' ? FLAT_SEAT[thread] : TAPER_SEAT[thread];
  const range = pair ? (input.head === 'cast_iron' ? pair[0] : pair[1]) : null;
  const notes = [
    'Thread the plug in by hand first; a cross-threaded plug ruins an aluminium head.',
    'Figures are for clean, dry threads. With anti-seize, makers reduce the torque by about a third; some advise against it on plated threads.',
  ];
  if (!range) notes.push(`No published figure for a ${input.seat} seat ${thread} plug in this head: use the vehicle maker's figure.`);
  let turnAngleDeg: number;
  if (input.seat === 'taper') turnAngleDeg = ANGLE_TAPER_DEG;
  else if (input.reusedGasket) turnAngleDeg = ANGLE_REUSED_GASKET_DEG;
  else turnAngleDeg = thread === 'M14' || thread === 'M18' ? ANGLE_NEW_GASKET_DEG : ANGLE_NEW_GASKET_SMALL_DEG;
  return {
    thread,
    seat: input.seat,
    head: input.head,
    torqueNm: range ? { min: range[0], max: range[1] } : null,
    turnAngleDeg,
    notes,
    source: SPARK_PLUG_SOURCE,
  };
}
