// Queues an e-mail: a row in outgoing_messages plus a send-mail job, in the caller's transaction.
// The idempotency key is unique, so asking twice for the same message (a retried request, a double
// click, a second run of the reminder scan) leaves exactly one.
import { outgoingMessages, type MessageKind } from '../../../db/schema';
import type { Database } from '../../../db/client';
import type { Enqueue } from '../jobs/transaction';
import { QUEUES, type SendMailJob } from '../jobs/queues';
import type { RenderedMail } from './templates';

export type QueueMessageInput = {
  organisationId: string;
  kind: MessageKind;
  idempotencyKey: string;
  to: { address: string; name: string };
  mail: RenderedMail;
  customerId?: string | null;
  visitId?: string | null;
  vehicleId?: string | null;
  invoiceId?: string | null;
  createdBy?: string | null;
};

/** The new message's id, or null when a message with this idempotency key already exists. */
export async function queueMessage(db: Database, enqueue: Enqueue, input: QueueMessageInput): Promise<string | null> {
  const [row] = await db
    .insert(outgoingMessages)
    .values({
      organisationId: input.organisationId,
      kind: input.kind,
      idempotencyKey: input.idempotencyKey,
      toAddress: input.to.address,
      toName: input.to.name,
      subject: input.mail.subject,
      html: input.mail.html,
      text: input.mail.text,
      customerId: input.customerId ?? null,
      visitId: input.visitId ?? null,
      vehicleId: input.vehicleId ?? null,
      invoiceId: input.invoiceId ?? null,
      createdBy: input.createdBy ?? null,
    })
    .onConflictDoNothing({ target: outgoingMessages.idempotencyKey })
    .returning({ id: outgoingMessages.id });
  if (!row) return null;
  enqueue(QUEUES.sendMail, { messageId: row.id } satisfies SendMailJob, { singletonKey: row.id });
  return row.id;
}
