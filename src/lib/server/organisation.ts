// The caller's business settings as the server services and pages need them.
import { eq } from 'drizzle-orm';
import { getDb, type Executor } from '../../db/client';
import * as s from '../../db/schema';
import { HttpError } from './http';

export async function getOrganisation(organisationId: string, db: Executor = getDb()) {
  const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
  if (!org) throw new HttpError(404, 'Your business is not on file any more. Sign in again.');
  return org;
}

/** What pages need for display (time zone, currency). */
export async function organisationSettings(organisationId: string) {
  const [org] = await getDb()
    .select({ name: s.organisations.name, timeZone: s.organisations.timeZone, currency: s.organisations.currency, reminderLeadDays: s.organisations.reminderLeadDays })
    .from(s.organisations)
    .where(eq(s.organisations.id, organisationId));
  if (!org) throw new Error(`organisation ${organisationId} not found`);
  return org;
}
