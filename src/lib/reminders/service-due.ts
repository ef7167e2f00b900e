// When a vehicle's next service falls due, and when to remind its keeper. Due by date or by
// distance, whichever comes first (PRODUCT.md; TRADE-REFERENCES.md section 10, common practice).
// The limits themselves come from the trade calculation (lib/trade nextServiceDue); here the distance
// limit becomes a date by estimating the vehicle's daily distance from its odometer history.
// Pure: dates are calendar days as 'yyyy-MM-dd' strings in the business's time zone.
import { addDays, differenceInCalendarDays, format, parseISO } from 'date-fns';
import { nextServiceDue } from '../trade';

export type OdometerReading = { date: string; odometer: number };

export type ServiceDueInput = {
  last: { date: string; odometer: number | null };
  /** The distance is in the odometer's unit. */
  interval: { months: number | null; distance: number | null; unit?: 'km' | '[mi_i]' };
  /** Readings in the same unit as the interval distance, any order; the last service counts too. */
  history: readonly OdometerReading[];
};

export type ServiceDue = {
  dueDate: string | null;
  dueOdometer: number | null;
  /** The date the distance limit is expected to be reached, from the estimated daily distance. */
  distanceDate: string | null;
  /** The earlier of dueDate and distanceDate, and which one it is. */
  date: string | null;
  trigger: 'date' | 'distance' | null;
  dailyDistance: number | null;
};

// Fewer days than this between the first and last reading says too little about how a car is used.
const MIN_HISTORY_DAYS = 30;

/** Average distance per day over the readings, or null without enough history. */
export function dailyDistance(history: readonly OdometerReading[]): number | null {
  const sorted = [...history].sort((a, b) => a.date.localeCompare(b.date));
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  if (!first || !last) return null;
  const days = differenceInCalendarDays(parseISO(last.date), parseISO(first.date));
  if (days < MIN_HISTORY_DAYS || last.odometer < first.odometer) return null;
  return (last.odometer - first.odometer) / days;
}

export function serviceDue(input: ServiceDueInput): ServiceDue {
  const { last, interval } = input;
  if (!interval.months && !interval.distance) {
    return { dueDate: null, dueOdometer: null, distanceDate: null, date: null, trigger: null, dailyDistance: null };
  }
  const limits = nextServiceDue({
    last: { date: last.date, odometer: last.odometer },
    interval: { months: interval.months, distance: interval.distance, unit: interval.unit ?? 'km' },
    today: last.date,
  });
  const dueDate = limits.dueDate;
  const dueOdometer = limits.dueOdometer;
  const perDay = dailyDistance([...input.history, ...(last.odometer !== null ? [{ date: last.date, odometer: last.odometer }] : [])]);
  let distanceDate: string | null = null;
  if (dueOdometer !== null && perDay !== null && perDay > 0) {
    const latest = [...input.history, { date: last.date, odometer: last.odometer ?? 0 }].sort((a, b) => a.date.localeCompare(b.date)).at(-1)!;
    const daysLeft = Math.ceil((dueOdometer - latest.odometer) / perDay);
    distanceDate = format(addDays(parseISO(latest.date), Math.max(0, daysLeft)), 'yyyy-MM-dd');
  }
  let date: string | null = dueDate;
  let trigger: ServiceDue['trigger'] = dueDate ? 'date' : null;
  if (distanceDate && (!date || distanceDate < date)) {
    date = distanceDate;
    trigger = 'distance';
  }
  return { dueDate, dueOdometer, distanceDate, date, trigger, dailyDistance: perDay };
}

/** Whether a reminder for a service due on `dueDate` should go out `today`, `leadDays` ahead. */
export function reminderIsDue(dueDate: string, today: string, leadDays: number): boolean {
  return differenceInCalendarDays(parseISO(dueDate), parseISO(today)) <= leadDays;
}
