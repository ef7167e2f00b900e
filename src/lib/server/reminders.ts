// Service reminders: for each vehicle with a known last service and interval, the next service
// due (by date or estimated distance, whichever first), and one reminder e-mail per due service
// once it is within the business's lead time. Run daily by the worker, or by the office on demand.
import { and, eq, gte, inArray, isNotNull, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import { reminderIsDue, serviceDue } from '../reminders/service-due';
import { transactionWithJobs } from './jobs/transaction';
import { queueMessage } from './mail/outbox';
import { serviceReminderMail } from './mail/templates';
import { odometerHistory } from './odometer-history';
import { dayLabel, localDate } from './local-date';
import { formatQuantity } from '../billing/units';

export type ReminderScanResult = { organisationId: string; checked: number; reminded: { vehicleId: string; registration: string; dueDate: string; trigger: string }[] };

/** The service the next reminder counts from: the later of the vehicle's record and its last sign-off. */
async function lastService(vehicle: typeof s.vehicles.$inferSelect, timeZone: string) {
  const history = await odometerHistory(getDb(), vehicle.id, timeZone);
  const latest = [...history].sort((a, b) => a.date.localeCompare(b.date)).at(-1);
  if (!latest) return null;
  return { last: latest, history };
}

export async function scanReminders(organisationId: string, now = new Date()): Promise<ReminderScanResult> {
  const db = getDb();
  const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
  if (!org) return { organisationId, checked: 0, reminded: [] };
  const today = localDate(now, org.timeZone);
  const candidates = await db
    .select({ vehicle: s.vehicles, customer: s.customers })
    .from(s.vehicles)
    .innerJoin(s.customers, eq(s.customers.id, s.vehicles.customerId))
    .where(and(eq(s.vehicles.organisationId, organisationId), isNotNull(s.customers.email)));
  // A vehicle with a visit already booked needs no reminder.
  const booked = await db
    .selectDistinct({ vehicleId: s.visits.vehicleId })
    .from(s.visits)
    .where(and(eq(s.visits.organisationId, organisationId), inArray(s.visits.status, ['booked', 'in_progress']), gte(s.visits.roundDate, today)));
  const bookedIds = new Set(booked.map((b) => b.vehicleId));
  const result: ReminderScanResult = { organisationId, checked: 0, reminded: [] };
  for (const { vehicle, customer } of candidates) {
    if (!vehicle.serviceIntervalMonths && !vehicle.serviceIntervalDistance) continue;
    if (bookedIds.has(vehicle.id)) continue;
    const basis = await lastService(vehicle, org.timeZone);
    if (!basis) continue;
    result.checked += 1;
    const due = serviceDue({
      last: basis.last,
      interval: { months: vehicle.serviceIntervalMonths, distance: vehicle.serviceIntervalDistance, unit: vehicle.odometerUnit },
      history: basis.history,
    });
    if (!due.date || !due.trigger || !reminderIsDue(due.date, today, org.reminderLeadDays)) continue;
    const sent = await transactionWithJobs(async (tx, enqueue) => {
      const [reminder] = await tx
        .insert(s.serviceReminders)
        .values({
          organisationId,
          vehicleId: vehicle.id,
          basisDate: basis.last.date,
          basisOdometer: basis.last.odometer,
          dueDate: due.date!,
          dueOdometer: due.dueOdometer,
          trigger: due.trigger!,
        })
        .onConflictDoNothing()
        .returning({ id: s.serviceReminders.id });
      if (!reminder) return false;
      const unit = vehicle.odometerUnit;
      const messageId = await queueMessage(tx, enqueue, {
        organisationId,
        kind: 'service_reminder',
        idempotencyKey: `service_reminder:${reminder.id}`,
        to: { address: customer.email!, name: customer.name },
        mail: serviceReminderMail({
          business: org,
          customerName: customer.name,
          vehicle: `${vehicle.make} ${vehicle.model}`,
          registration: vehicle.registration,
          dueBy: dayLabel(due.date!, 'd MMMM yyyy'),
          dueDistance: due.dueOdometer !== null ? formatQuantity(due.dueOdometer, unit) : null,
          trigger: due.trigger!,
        }),
        customerId: customer.id,
        vehicleId: vehicle.id,
      });
      await tx.update(s.serviceReminders).set({ messageId }).where(eq(s.serviceReminders.id, reminder.id));
      return true;
    });
    if (sent) result.reminded.push({ vehicleId: vehicle.id, registration: vehicle.registration, dueDate: due.date, trigger: due.trigger });
  }
  return result;
}

export async function scanAllOrganisations(now = new Date()) {
  const orgs = await getDb().select({ id: s.organisations.id }).from(s.organisations);
  const results = [];
  for (const org of orgs) results.push(await scanReminders(org.id, now));
  return results;
}

/** Reminders sent lately, for the office. */
export async function recentReminders(organisationId: string) {
  return getDb()
    .select({
      id: s.serviceReminders.id,
      registration: s.vehicles.registration,
      dueDate: s.serviceReminders.dueDate,
      trigger: s.serviceReminders.trigger,
      createdAt: s.serviceReminders.createdAt,
      messageStatus: s.outgoingMessages.status,
    })
    .from(s.serviceReminders)
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.serviceReminders.vehicleId))
    .leftJoin(s.outgoingMessages, eq(s.outgoingMessages.id, s.serviceReminders.messageId))
    .where(eq(s.serviceReminders.organisationId, organisationId))
    .orderBy(sql`${s.serviceReminders.createdAt} desc`)
    .limit(100);
}
