// Service reminders: one e-mail per due service, however often the scan runs.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { format, subDays, subMonths } from 'date-fns';
import { callJson, signIn, type Session } from '../../support/http';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { testDb, testPool } from '../../support/database';
import { createSignedOffVisit } from '../../support/visit-fixtures';
import { messagesTo, readMail, waitForMail } from '../../support/mailbox';
import * as s from '../../../src/db/schema';

let org: OrganisationFixture;
let office: Session;

beforeAll(async () => {
  org = await createOrganisation('Reminders');
  office = await signIn(org.office.email, FIXTURE_PASSWORD);
  await testDb().update(s.organisations).set({ reminderLeadDays: 21 }).where(eq(s.organisations.id, org.organisationId));
});
afterAll(async () => {
  await testPool().end();
});

describe('service reminders', () => {
  it('reminds once when the date limit is within the lead time, and not again', async () => {
    // Serviced 11 months and 20 days ago with a 12-month interval: due in about 10 days (< 21).
    const signedAt = subDays(subMonths(new Date(), 11), 20);
    const due = await createSignedOffVisit(org, { signedAt, odometer: 30_000 });
    // Serviced a month ago: nothing due.
    const notDue = await createSignedOffVisit(org, { signedAt: subMonths(new Date(), 1), odometer: 12_000 });
    const first = await callJson(office, '/api/office/reminders/run', { body: {} });
    expect(first.status).toBe(200);
    expect(first.json.reminded.map((r: any) => r.vehicleId)).toEqual([due.vehicleId]);
    expect(first.json.reminded[0].trigger).toBe('date');
    const [entry] = await waitForMail(due.customerEmail);
    const mail = await readMail(entry!);
    expect(mail.subject).toContain(`${due.registration} is due a service by`);
    expect(mail.text).toContain('or at 40,000 mi, whichever comes first');

    const second = await callJson(office, '/api/office/reminders/run', { body: {} });
    expect(second.json.reminded).toEqual([]);
    expect(messagesTo(notDue.customerEmail)).toHaveLength(0);
    const rows = await testDb().select().from(s.serviceReminders).where(eq(s.serviceReminders.vehicleId, due.vehicleId));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.basisDate).toBe(format(signedAt, 'yyyy-MM-dd'));
  });

  it('reminds by distance when the odometer history says that limit comes first', async () => {
    // Previous service 90 days ago at 30 000 mi (on the vehicle's record), this one 60 days ago at
    // 45 000 mi: 500 mi a day, so 55 000 mi came about 20 days after it, long before the 12 months.
    const visit = await createSignedOffVisit(org, {
      signedAt: subDays(new Date(), 60),
      odometer: 45_000,
      lastServiceDate: format(subDays(new Date(), 90), 'yyyy-MM-dd'),
      lastServiceOdometer: 30_000,
    });
    const run = await callJson(office, '/api/office/reminders/run', { body: {} });
    const mine = run.json.reminded.find((r: any) => r.vehicleId === visit.vehicleId);
    expect(mine).toMatchObject({ trigger: 'distance' });
    const [entry] = await waitForMail(visit.customerEmail);
    const mail = await readMail(entry!);
    expect(mail.text).toContain('it will reach 55,000 mi around');
  });

  it('skips a vehicle that already has a visit booked', async () => {
    const visit = await createSignedOffVisit(org, { signedAt: subDays(subMonths(new Date(), 11), 25), odometer: 20_000 });
    await testDb().insert(s.visits).values({
      organisationId: org.organisationId,
      customerId: visit.customerId,
      vehicleId: visit.vehicleId,
      technicianId: org.technician.id,
      templateVersionId: visit.templateVersionId,
      roundDate: format(new Date(Date.now() + 5 * 86_400_000), 'yyyy-MM-dd'),
      slotStart: new Date(Date.now() + 5 * 86_400_000),
      slotEnd: new Date(Date.now() + 5 * 86_400_000 + 3_600_000),
      addressLines: 'x',
    });
    const run = await callJson(office, '/api/office/reminders/run', { body: {} });
    expect(run.json.reminded.map((r: any) => r.vehicleId)).not.toContain(visit.vehicleId);
  });
});
