// How the console writes dates, times and statuses. Times are shown in the business's time
// zone (passed down from the server), never the browser's.
import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import type { VisitStatus } from '../../lib/words';

export function dayLabel(date: string, pattern = 'EEE d MMM'): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return format(new Date(y, m - 1, d, 12), pattern);
}

export function clockLabel(instant: string | Date, timeZone: string): string {
  return format(new TZDate(new Date(instant).getTime(), timeZone), 'HH:mm');
}

export function dateTimeLabel(instant: string | Date, timeZone: string): string {
  return format(new TZDate(new Date(instant).getTime(), timeZone), 'EEE d MMM yyyy, HH:mm');
}

export const STATUS_LABEL: Record<VisitStatus, string> = {
  booked: 'Booked',
  in_progress: 'In progress',
  signed_off: 'Signed off',
  reviewed: 'Reviewed',
  invoiced: 'Invoiced',
  paid: 'Paid',
  cancelled: 'Cancelled',
};

export function distanceLabel(unit: string): string {
  return unit === 'km' ? 'km' : 'miles';
}
