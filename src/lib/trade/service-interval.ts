// When the next service is due: by date or by distance, whichever comes first.
import { convert } from './units';
import { describe, nonNegative, positive } from './guard';

export type DistanceUnit = 'km' | '[mi_i]';
export type ServiceDueStatus = 'ok' | 'due soon' | 'overdue';

// "Due soon" margins (common practice, in line with reminder habits of the trade): a month before
// the date, or the last tenth of the distance interval.
const SOON_DAYS = 30;
const SOON_FRACTION_OF_DISTANCE = 0.1;

export type NextServiceDue = {
  status: ServiceDueStatus;
  /** What makes it due (or due soon) first; null while neither is close. */
  dueBy: 'date' | 'distance' | null;
  dueDate: string | null;
  dueOdometer: number | null;
  /** Unit of `dueOdometer` and `distanceLeft`: the odometer's. */
  odometerUnit: DistanceUnit;
  daysLeft: number | null;
  distanceLeft: number | null;
  message: string;
};

type DateInput = string | Date;

export function nextServiceDue(input: {
  last: { date: DateInput; odometer?: number | null };
  interval: { months?: number | null; distance?: number | null; unit?: DistanceUnit | 'mi' };
  today: DateInput;
  odometerNow?: number | null;
  /** Unit of both odometer readings; defaults to the interval's unit. */
  odometerUnit?: DistanceUnit | 'mi';
}): NextServiceDue {
  const lastDate = parseDay('The last service date', input?.last?.date);
  const today = parseDay("Today's date", input.today);
  const months = input.interval?.months ?? null;
  const distance = input.interval?.distance ?? null;
  if (months === null && distance === null) throw new Error('A service interval needs months, a distance, or both');
  if (months !== null && (!Number.isInteger(months) || months <= 0)) throw new Error(`The interval in months must be a whole number above zero (got ${describe(months)})`);
  if (distance !== null) positive('The interval distance', distance);
  const intervalUnit = distanceUnit(input.interval.unit ?? 'km');
  const odometerUnit = distanceUnit(input.odometerUnit ?? intervalUnit);

  const dueDate = months === null ? null : addMonths(lastDate, months);
  const lastOdometer = input.last.odometer == null ? null : nonNegative('The odometer at the last service', input.last.odometer);
  const odometerNow = input.odometerNow == null ? null : nonNegative('The odometer now', input.odometerNow);
  if (lastOdometer !== null && odometerNow !== null && odometerNow < lastOdometer) {
    throw new Error(`The odometer now (${odometerNow}) is below the reading at the last service (${lastOdometer}): check both readings`);
  }
  const intervalInOdometerUnit = distance === null ? null : convert(distance, intervalUnit, odometerUnit);
  const dueOdometer = intervalInOdometerUnit === null || lastOdometer === null ? null : round2(lastOdometer + intervalInOdometerUnit);

  const daysLeft = dueDate === null ? null : daysBetween(today, dueDate);
  const distanceLeft = dueOdometer === null || odometerNow === null ? null : round2(dueOdometer - odometerNow);

  const dateOverdue = daysLeft !== null && daysLeft <= 0;
  const distanceOverdue = distanceLeft !== null && distanceLeft <= 0;
  const dateSoon = daysLeft !== null && daysLeft <= SOON_DAYS;
  const distanceSoon = distanceLeft !== null && intervalInOdometerUnit !== null && distanceLeft <= intervalInOdometerUnit * SOON_FRACTION_OF_DISTANCE;

  const unitLabel = odometerUnit === 'km' ? 'km' : 'mi';
  const dueDateText = dueDate === null ? null : formatDay(dueDate);
  const base = { dueDate: dueDateText, dueOdometer, odometerUnit, daysLeft, distanceLeft };
  if (dateOverdue || distanceOverdue) {
    // Whichever came first: compare how far past each limit the car is, in fractions of its interval.
    const dueBy = pickFirst(dateOverdue, distanceOverdue, daysLeft, months, distanceLeft, intervalInOdometerUnit);
    const message = dueBy === 'date' ? `Overdue by date: was due on ${dueDateText}.` : `Overdue by distance: was due at ${dueOdometer} ${unitLabel}.`;
    return { ...base, status: 'overdue', dueBy, message };
  }
  if (dateSoon || distanceSoon) {
    const dueBy = pickFirst(dateSoon, distanceSoon, daysLeft, months, distanceLeft, intervalInOdometerUnit);
    const message = dueBy === 'date' ? `Due soon: on ${dueDateText} (${daysLeft} days).` : `Due soon: at ${dueOdometer} ${unitLabel} (${distanceLeft} ${unitLabel} to go).`;
    return { ...base, status: 'due soon', dueBy, message };
  }
  const parts = [dueDateText && `on ${dueDateText}`, dueOdometer !== null && `at ${dueOdometer} ${unitLabel}`].filter(Boolean);
  return { ...base, status: 'ok', dueBy: null, message: `Next due ${parts.join(' or ')}, whichever comes first.` };
}

function pickFirst(
  byDate: boolean,
  byDistance: boolean,
  daysLeft: number | null,
  months: number | null,
  distanceLeft: number | null,
  intervalDistance: number | null,
): 'date' | 'distance' {
  if (byDate && !byDistance) return 'date';
  if (byDistance && !byDate) return 'distance';
  const dateShare = daysLeft! / (months! * 30.4375);
  const distanceShare = distanceLeft! / intervalDistance!;
  return dateShare <= distanceShare ? 'date' : 'distance';
}

function distanceUnit(u: string): DistanceUnit {
  if (u === 'km') return 'km';
  if (u === '[mi_i]' || u === 'mi') return '[mi_i]';
  throw new Error(`${describe(u)} is not a distance unit for intervals: use km or [mi_i] (miles)`);
}

// Calendar days in UTC: a service date is a day, not an instant, so no time zone may shift it.
function parseDay(name: string, value: unknown): Date {
  if (value instanceof Date && !Number.isNaN(value.getTime())) {
    return new Date(Date.UTC(value.getUTCFullYear(), value.getUTCMonth(), value.getUTCDate()));
  }
  if (typeof value === 'string') {
    const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(value.trim());
    if (m) {
      const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
      if (d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3])) return d;
    }
  }
  throw new Error(`${name} must be a date like 2025-03-15, not ${describe(value)}`);
}

/**
 * Calendar months later, clamped to the month's end: 2024-01-31 + 1 month is 2024-02-29 and
 * 2024-02-29 + 12 months is 2025-02-28 (the usual convention; a service is never pushed into the
 * month after).
 */
export function addMonths(day: Date, months: number): Date {
  const y = day.getUTCFullYear();
  const m = day.getUTCMonth() + months;
  const lastOfTarget = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  return new Date(Date.UTC(y, m, Math.min(day.getUTCDate(), lastOfTarget)));
}

function daysBetween(from: Date, to: Date): number {
  return Math.round((to.getTime() - from.getTime()) / 86_400_000);
}

function formatDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

function round2(n: number): number {
  return Math.round(n * 100) / 100;
}
