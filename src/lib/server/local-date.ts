// Calendar days in the business's own time zone: a visit at 00:30 BST is on the local day, not
// on the UTC day before it.
import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

export function localDate(instant: Date, timeZone: string, pattern = 'yyyy-MM-dd'): string {
  return format(new TZDate(instant.getTime(), timeZone), pattern);
}

/** The UTC instant of a local wall-clock time on a local day. */
export function localInstant(date: string, time: string, timeZone: string): Date {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const [hh, mm] = time.split(':').map(Number) as [number, number];
  return new Date(new TZDate(y, m - 1, d, hh, mm, timeZone).getTime());
}

/** A 'yyyy-MM-dd' day as people read it: "Tuesday 12 May 2026". */
export function dayLabel(date: string, pattern = 'EEEE d MMMM yyyy'): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return format(new Date(y, m - 1, d), pattern);
}
