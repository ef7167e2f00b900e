// How the van screens write quantities and days, the same on the server and in the browser.
import { describePacking, type Packing } from '../../lib/trade/containers';

/** "3.2 L" for oil, "4" for counted parts. */
export function formatQuantity(quantity: number, unit: string): string {
  const number = Number.isInteger(quantity) ? String(quantity) : quantity.toFixed(3).replace(/0+$/, '').replace(/\.$/, '');
  return unit === 'L' ? `${number} L` : number;
}

/** "1 × 5 L + 3 × 1 L", or nothing for counted parts. */
export function formatPacking(packing: Packing | null): string {
  return packing && packing.containers.length > 0 ? describePacking(packing) : '';
}

/** "Tue 14 Apr 2026" for a yyyy-mm-dd date. */
export function formatDay(date: string): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(Date.UTC(y, m - 1, d)),
  );
}

/** "09:30" or "14 Apr, 09:30" in the given time zone. */
export function formatTime(instant: string, timeZone?: string, withDay = false): string {
  return new Intl.DateTimeFormat('en-GB', {
    ...(withDay ? { day: 'numeric', month: 'short' } : {}),
    hour: '2-digit',
    minute: '2-digit',
    timeZone,
  }).format(new Date(instant));
}
