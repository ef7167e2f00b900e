// The owner's business settings.
import { eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import type { SettingsInput } from '../office/settings-input';
import { getOrganisation } from './organisation';

export async function getSettings(organisationId: string) {
  const org = await getOrganisation(organisationId);
  return settingsView(org);
}

export async function updateSettings(organisationId: string, input: SettingsInput) {
  const { workdayStart, workdayEnd, ...rest } = input;
  const [org] = await getDb()
    .update(s.organisations)
    .set({ ...rest, workdayStartMinute: workdayStart, workdayEndMinute: workdayEnd, updatedAt: new Date() })
    .where(eq(s.organisations.id, organisationId))
    .returning();
  return settingsView(org!);
}

function settingsView(org: typeof s.organisations.$inferSelect) {
  return {
    name: org.name,
    addressLines: org.addressLines,
    phone: org.phone,
    email: org.email,
    currency: org.currency,
    labourRateMinorPerHour: org.labourRateMinorPerHour,
    taxRateBasisPoints: org.taxRateBasisPoints,
    distanceUnit: org.distanceUnit,
    timeZone: org.timeZone,
    workdayStartMinute: org.workdayStartMinute,
    workdayEndMinute: org.workdayEndMinute,
    reminderLeadDays: org.reminderLeadDays,
  };
}

export type SettingsView = ReturnType<typeof settingsView>;
