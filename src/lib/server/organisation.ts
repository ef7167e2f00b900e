// The caller's business settings that pages need for display (time zone, currency).
import { eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { organisations } from '../../db/schema';

export async function organisationSettings(organisationId: string) {
  const [org] = await getDb()
    .select({ name: organisations.name, timeZone: organisations.timeZone, currency: organisations.currency, reminderLeadDays: organisations.reminderLeadDays })
    .from(organisations)
    .where(eq(organisations.id, organisationId));
  if (!org) throw new Error(`organisation ${organisationId} not found`);
  return org;
}
