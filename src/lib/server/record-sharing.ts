// Sharing a visit's service record with its customer: the link (reused while it has a good while
// left to run) and the "record ready" e-mail.
import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../../db/client';
import * as s from '../../db/schema';
import { createRecordLink, recordUrl, revokeRecordLinks, signRecordToken } from './record-links';
import { HttpError } from './http';
import { transactionWithJobs } from './jobs/transaction';
import { queueMessage } from './mail/outbox';
import { recordReadyMail } from './mail/templates';
import { loadServiceRecord } from './service-record';
import { dayLabel, localDate } from './local-date';

// A link with less than this left is replaced, so a customer never gets one about to lapse.
const MIN_DAYS_LEFT = 30;

export async function currentRecordLink(db: Executor, input: { organisationId: string; visitId: string; createdBy: string | null }) {
  const [existing] = await db
    .select()
    .from(s.recordLinks)
    .where(
      and(
        eq(s.recordLinks.visitId, input.visitId),
        eq(s.recordLinks.organisationId, input.organisationId),
        isNull(s.recordLinks.revokedAt),
        gt(s.recordLinks.expiresAt, sql`now() + make_interval(days => ${MIN_DAYS_LEFT})`),
      ),
    )
    .orderBy(desc(s.recordLinks.expiresAt))
    .limit(1);
  if (existing) {
    const token = signRecordToken(existing.id, existing.expiresAt);
    return { link: existing, token, url: recordUrl(token) };
  }
  return createRecordLink(db, input);
}

const SHAREABLE: readonly s.VisitStatus[] = ['signed_off', 'reviewed', 'invoiced', 'paid'];

/**
 * Queues the "record ready" e-mail. The first send of a visit's record has a fixed key, so a double
 * click sends one; `again` sends another copy on purpose (a customer who lost the first).
 */
export async function sendRecord(organisationId: string, visitId: string, userId: string, { again = false } = {}) {
  return transactionWithJobs(async (db, enqueue) => {
    const record = await loadServiceRecord(db, organisationId, visitId);
    if (!record) throw new HttpError(404, 'No such visit in your business.');
    if (!SHAREABLE.includes(record.visit.status)) {
      throw new HttpError(409, `The record can be sent once the visit is signed off; this one is ${record.visit.status.replace('_', ' ')}.`);
    }
    if (!record.customer.email) throw new HttpError(422, `${record.customer.name} has no e-mail address. Add one to the customer first.`);
    const earlier = await db
      .select({ id: s.outgoingMessages.id, createdAt: s.outgoingMessages.createdAt })
      .from(s.outgoingMessages)
      .where(and(eq(s.outgoingMessages.visitId, visitId), eq(s.outgoingMessages.kind, 'record_ready')));
    if (earlier.length > 0 && !again) {
      throw new HttpError(409, 'The record was already sent to this customer. Choose “Send again” to send another copy.', { sentAt: earlier[0]!.createdAt });
    }
    const link = await currentRecordLink(db, { organisationId, visitId, createdBy: userId });
    const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
    const messageId = await queueMessage(db, enqueue, {
      organisationId,
      kind: 'record_ready',
      idempotencyKey: earlier.length === 0 ? `record_ready:${visitId}` : `record_ready:${visitId}:${earlier.length + 1}`,
      to: { address: record.customer.email, name: record.customer.name },
      mail: recordReadyMail({
        business: org!,
        customerName: record.customer.name,
        vehicle: `${record.vehicle.make} ${record.vehicle.model}`,
        registration: record.vehicle.registration,
        visitDate: dayLabel(record.visit.date, 'EEEE d MMMM yyyy'),
        findings: record.findings.map((f) => ({ severity: f.severity, title: f.title })),
        url: link.url,
        linkExpires: dayLabel(localDate(link.link.expiresAt, org!.timeZone), 'd MMMM yyyy'),
      }),
      customerId: record.customer.id,
      visitId,
      vehicleId: record.vehicle.id,
      createdBy: userId,
    });
    if (!messageId) throw new HttpError(409, 'The record is already on its way to this customer.');
    return { messageId, url: link.url };
  });
}

/** Withdraws every link to a visit's record; a visit of another business is a 404, like elsewhere. */
export async function withdrawRecordLinks(organisationId: string, visitId: string) {
  const db = getDb();
  const [visit] = await db
    .select({ id: s.visits.id })
    .from(s.visits)
    .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)));
  if (!visit) throw new HttpError(404, 'No such visit in your business.');
  return revokeRecordLinks(db, organisationId, visitId);
}
