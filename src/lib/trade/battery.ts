// 12 V lead-acid batteries: state of charge at rest, charging voltage, and earth-side voltage drop.
import { finite, nonNegative, positive } from './guard';
import { interpolate, type TableRow } from './interpolate';
import type { Severity } from './severity';

export const BATTERY_SOC_SOURCE =
  'Battery Council International (BCI) open-circuit voltage table: 12 V flooded lead-acid, at rest, 80 °F (26.7 °C), SG 1.265 when full';

// BCI state-of-charge table (as reproduced with "[Source: BCI]" on battery makers' pages):
// open-circuit volts at rest → approximate state of charge. Between rows we read in a straight
// line, as the table is used in the trade.
const OCV_TABLE: readonly TableRow[] = [
  [11.89, 0],
  [12.06, 25],
  [12.24, 50],
  [12.45, 75],
  [12.65, 100],
];
const OCV_FULL = 12.65;
const OCV_FLAT = 11.89;

// Same BCI table: per 10 °F away from 80 °F the reading moves 0.024 V; the table's rule is to add
// above 80 °F and subtract below (e.g. 12.50 V at 60 °F reads as 12.452 V).
const REFERENCE_F = 80;
const VOLTS_PER_10F = 0.024;

export type BatteryStateOfCharge = {
  restingVolts: number;
  /** The reading corrected to 80 °F when the electrolyte temperature was given. */
  compensatedVolts: number;
  stateOfChargePercent: number;
  /** `above_table`: higher than a full battery shows (surface charge?); `discharged`: at or below the table's bottom row. */
  clamped: 'above_table' | 'discharged' | null;
  severity: Severity;
  message: string;
  source: string;
};

export function batteryStateOfCharge(restingVolts: number, options: { electrolyteC?: number | null } = {}): BatteryStateOfCharge {
  const v = positive('The resting voltage (V)', restingVolts);
  if (v > 16) throw new Error(`${v} V is not a 12 V battery at rest: check the meter range and the leads`);
  let compensated = v;
  if (options.electrolyteC != null) {
    const f = (finite('The electrolyte temperature (°C)', options.electrolyteC) * 9) / 5 + 32;
    compensated = v + ((f - REFERENCE_F) / 10) * VOLTS_PER_10F;
  }
  const clamped = compensated > OCV_FULL ? 'above_table' : compensated <= OCV_FLAT ? 'discharged' : null;
  const percent = clamped === 'above_table' ? 100 : clamped === 'discharged' ? 0 : interpolate(OCV_TABLE, compensated)!;
  const rounded = Math.round(percent * 10) / 10;
  let severity: Severity;
  let message: string;
  if (clamped === 'above_table' && compensated > 12.9) {
    severity = 'ok';
    message = `${v} V is more than a rested battery shows: surface charge or a charger still connected. Rest it and measure again.`;
  } else if (percent >= 75) {
    severity = 'ok';
    message = `About ${Math.round(percent)} % charged.`;
  } else if (percent >= 50) {
    severity = 'watch';
    message = `About ${Math.round(percent)} % charged: charge it and check the charging system.`;
  } else {
    severity = 'soon';
    message = clamped === 'discharged'
      ? 'Discharged: charge it fully, then load-test it before trusting it.'
      : `About ${Math.round(percent)} % charged: charge it fully, then load-test it.`;
  }
  return { restingVolts: v, compensatedVolts: compensated, stateOfChargePercent: rounded, clamped, severity, message, source: BATTERY_SOC_SOURCE };
}

// ---------------------------------------------------------------------------------------------
// Charging voltage with the engine at a fast idle, loads off. Makers' windows differ (13.0–15.0 V
// and 13.9–15.1 V are both published), so the window is a parameter; 13.5–14.8 V is the common
// default. Below about 13 V the alternator adds nothing over a resting battery; above 15 V the
// battery is being overcharged. All common practice.

export const CHARGING_SOURCE = 'Common practice (engine at fast idle, loads off); the vehicle maker’s window takes precedence';
const NOT_CHARGING_BELOW_V = 13.0;
const OVERCHARGE_ABOVE_V = 15.0;

export type ChargingJudgement = {
  volts: number;
  status: 'not_charging' | 'low' | 'ok' | 'high' | 'overcharging';
  severity: Severity;
  message: string;
  window: { minV: number; maxV: number };
  source: string;
};

export function judgeChargingVoltage(volts: number, window: { minV: number; maxV: number } = { minV: 13.5, maxV: 14.8 }): ChargingJudgement {
  const v = nonNegative('The charging voltage (V)', volts);
  const minV = positive('The lowest charging voltage (V)', window.minV);
  const maxV = positive('The highest charging voltage (V)', window.maxV);
  if (maxV <= minV) throw new Error('The charging window must run from a lower to a higher voltage');
  if (v > 20) throw new Error(`${v} V is not a 12 V charging voltage: check the meter`);
  const base = { volts: v, window: { minV, maxV }, source: CHARGING_SOURCE };
  if (v < Math.min(NOT_CHARGING_BELOW_V, minV)) {
    return { ...base, status: 'not_charging', severity: 'now', message: `${v} V with the engine running: the alternator is not charging. Check its belt, fuse and wiring.` };
  }
  if (v < minV) return { ...base, status: 'low', severity: 'soon', message: `${v} V is below ${minV} V: the battery will not fully charge. Test the alternator.` };
  if (v > Math.max(OVERCHARGE_ABOVE_V, maxV)) {
    return { ...base, status: 'overcharging', severity: 'now', message: `${v} V is overcharging: the battery can gas and boil. Check the regulator.` };
  }
  if (v > maxV) return { ...base, status: 'high', severity: 'watch', message: `${v} V is above ${maxV} V: watch for a failing regulator.` };
  return { ...base, status: 'ok', severity: 'ok', message: `${v} V: charging normally.` };
}

// ---------------------------------------------------------------------------------------------
// Voltage drop on the earth side while cranking (battery negative post to engine block). 0.2 V
// appears in several makers' procedures, 0.3 V in some testers' manuals: common practice, so the
// limit is a parameter.

export const EARTH_DROP_SOURCE = 'Common practice (battery negative post to engine, while cranking); the vehicle maker’s limit takes precedence';

export type EarthDropJudgement = {
  volts: number;
  limitV: number;
  status: 'ok' | 'too_high';
  severity: Severity;
  message: string;
  source: string;
};

export function judgeEarthVoltageDrop(volts: number, limitV = 0.2): EarthDropJudgement {
  const v = nonNegative('The earth-side voltage drop (V)', volts);
  const limit = positive('The voltage drop limit (V)', limitV);
  if (v > 13) throw new Error(`${v} V cannot be a voltage drop on a 12 V circuit: check the meter leads`);
  if (v <= limit) return { volts: v, limitV: limit, status: 'ok', severity: 'ok', message: `${v} V: within the ${limit} V limit.`, source: EARTH_DROP_SOURCE };
  return {
    volts: v,
    limitV: limit,
    status: 'too_high',
    severity: 'soon',
    message: `${v} V is more than the ${limit} V limit: clean and tighten the earth strap and its contact faces, then measure again.`,
    source: EARTH_DROP_SOURCE,
  };
}
