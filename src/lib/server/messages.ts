// The office's view of what was sent, and a deliberate second send of a message that failed or
// whose fate is uncertain.
import { and, desc, eq, like, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import { HttpError } from './http';
import { transactionWithJobs } from './jobs/transaction';
import { queueMessage } from './mail/outbox';

export type MessageFilter = { kind?: s.MessageKind; status?: s.MessageStatus; page: number; pageSize: number };

export async function listMessages(organisationId: string, filter: MessageFilter) {
  const rows = await getDb()
    .select({
      id: s.outgoingMessages.id,
      kind: s.outgoingMessages.kind,
      toAddress: s.outgoingMessages.toAddress,
      toName: s.outgoingMessages.toName,
      subject: s.outgoingMessages.subject,
      status: s.outgoingMessages.status,
      attempts: s.outgoingMessages.attempts,
      lastError: s.outgoingMessages.lastError,
      createdAt: s.outgoingMessages.createdAt,
      sentAt: s.outgoingMessages.sentAt,
      visitId: s.outgoingMessages.visitId,
      invoiceId: s.outgoingMessages.invoiceId,
    })
    .from(s.outgoingMessages)
    .where(
      and(
        eq(s.outgoingMessages.organisationId, organisationId),
        filter.kind ? eq(s.outgoingMessages.kind, filter.kind) : undefined,
        filter.status ? eq(s.outgoingMessages.status, filter.status) : undefined,
      ),
    )
    .orderBy(desc(s.outgoingMessages.createdAt))
    .limit(filter.pageSize + 1)
    .offset(filter.page * filter.pageSize);
  return { messages: rows.slice(0, filter.pageSize), hasMore: rows.length > filter.pageSize };
}

export async function messageDetail(organisationId: string, messageId: string) {
  const [message] = await getDb()
    .select()
    .from(s.outgoingMessages)
    .where(and(eq(s.outgoingMessages.id, messageId), eq(s.outgoingMessages.organisationId, organisationId)));
  if (!message) throw new HttpError(404, 'No such message in your business.');
  return message;
}

const RESENDABLE: readonly s.MessageStatus[] = ['failed', 'uncertain'];

/** A new copy of a failed or uncertain message, queued on a person's decision. */
export async function resendMessage(organisationId: string, messageId: string, userId: string) {
  return transactionWithJobs(async (db, enqueue) => {
    const [message] = await db
      .select()
      .from(s.outgoingMessages)
      .where(and(eq(s.outgoingMessages.id, messageId), eq(s.outgoingMessages.organisationId, organisationId)))
      .for('update');
    if (!message) throw new HttpError(404, 'No such message in your business.');
    if (!RESENDABLE.includes(message.status)) {
      throw new HttpError(409, `Only a failed or uncertain message can be sent again; this one is ${message.status}.`);
    }
    const base = message.idempotencyKey.replace(/:resend:\d+$/, '');
    const [{ copies }] = (await db
      .select({ copies: sql<number>`count(*)::int` })
      .from(s.outgoingMessages)
      .where(like(s.outgoingMessages.idempotencyKey, `${base}:resend:%`))) as [{ copies: number }];
    const id = await queueMessage(db, enqueue, {
      organisationId,
      kind: message.kind,
      idempotencyKey: `${base}:resend:${copies + 1}`,
      to: { address: message.toAddress, name: message.toName },
      mail: { subject: message.subject, html: message.html, text: message.text },
      customerId: message.customerId,
      visitId: message.visitId,
      vehicleId: message.vehicleId,
      invoiceId: message.invoiceId,
      createdBy: userId,
    });
    return { messageId: id };
  });
}
