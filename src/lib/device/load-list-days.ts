// Which rounds' load lists the phone keeps, by the phone's own calendar. Apart from
// load-lists.ts so the load list screen reads its days without loading the answer's schema.
import type { DeviceDb } from './db';

/** A calendar day (YYYY-MM-DD) on this phone's clock. */
export function phoneDay(now: Date, offsetDays = 0): string {
  const day = new Date(now.getFullYear(), now.getMonth(), now.getDate() + offsetDays, 12);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${day.getFullYear()}-${pad(day.getMonth() + 1)}-${pad(day.getDate())}`;
}

/**
 * The rounds whose load list the phone keeps: today's, and the next round after today on the
 * phone (tomorrow when none is booked yet, so an empty list still says "nothing to load").
 */
export function loadListDates(roundDates: Iterable<string>, today: string, tomorrow: string): { today: string; next: string } {
  let next: string | null = null;
  for (const date of roundDates) if (date > today && (next === null || date < next)) next = date;
  return { today, next: next ?? tomorrow };
}

export async function datesToKeep(db: DeviceDb, now: Date) {
  const visits = await db.visits.toArray();
  return loadListDates(
    visits.filter((v) => !v.gone).map((v) => v.roundDate),
    phoneDay(now),
    phoneDay(now, 1),
  );
}
