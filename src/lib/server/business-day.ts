// Calendar days as the business lives them: a round date is a local date in the business's
// time zone, whatever zone the server runs in.
import { addDays, format } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { organisations } from '../../db/schema';

/** The local date (yyyy-MM-dd) `offset` days from `now` in `timeZone`. */
export function businessDate(timeZone: string, offset = 0, now = new Date()): string {
  return format(addDays(new TZDate(now.getTime(), timeZone), offset), 'yyyy-MM-dd');
}

/** The local date `days` after `date` (both yyyy-MM-dd). */
export function addBusinessDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** The business's calendar and money settings. */
export async function organisationSettings(organisationId: string): Promise<{ timeZone: string; currency: string }> {
  const [row] = await getDb()
    .select({ timeZone: organisations.timeZone, currency: organisations.currency })
    .from(organisations)
    .where(eq(organisations.id, organisationId));
  if (!row) throw new Error(`organisation ${organisationId} does not exist`);
  return row;
}

/** The time zone the business keeps its calendar in. */
export async function organisationTimeZone(organisationId: string): Promise<string> {
  return (await organisationSettings(organisationId)).timeZone;
}
