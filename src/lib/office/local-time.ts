// The business's clock. Slots are stored as UTC instants; the office books and reads them in the
// organisation's own time zone, whatever time zone the browser or the server runs in.
import { TZDate } from '@date-fns/tz';
import { addDays, format, startOfISOWeek } from 'date-fns';

/** The instant of `minute` minutes after local midnight of `date` (yyyy-MM-dd) in `timeZone`. */
export function localInstant(date: string, minute: number, timeZone: string): Date {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(new TZDate(y, m - 1, d, Math.floor(minute / 60), minute % 60, timeZone).getTime());
}

/** The local calendar day and minutes after local midnight of an instant in `timeZone`. */
export function localClock(instant: Date, timeZone: string): { date: string; minute: number } {
  const local = new TZDate(instant.getTime(), timeZone);
  return { date: format(local, 'yyyy-MM-dd'), minute: local.getHours() * 60 + local.getMinutes() };
}

/** Today's calendar day in `timeZone`. */
export function localToday(timeZone: string, now = new Date()): string {
  return localClock(now, timeZone).date;
}

/** The Monday of the ISO week holding `date`, and the seven days from it. */
export function weekOf(date: string): string[] {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const monday = startOfISOWeek(new Date(Date.UTC(y, m - 1, d, 12)));
  return Array.from({ length: 7 }, (_, i) => format(addDays(monday, i), 'yyyy-MM-dd'));
}

/** `date` moved by `days` calendar days. */
export function shiftDate(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return format(addDays(new Date(y, m - 1, d, 12), days), 'yyyy-MM-dd');
}

export function isValidTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone });
    return true;
  } catch {
    return false;
  }
}
