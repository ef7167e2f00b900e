// The send-mail job: hands one queued message to SMTP, at most once.
// 1. Claim: queued/retrying -> sending, in its own committed statement. A message in any other
//    status is left alone, so a duplicate job or a late retry sends nothing.
// 2. Send over SMTP with a Message-ID fixed per message.
// 3. sent; or, when the server refused it for now (4xx, connection trouble), retrying and throw so
//    pg-boss retries with backoff; a permanent refusal (5xx) or the last retry ends as failed.
// A worker that dies between 1 and 3 leaves `sending`; the sweep marks it `uncertain` after a while
// and a person decides whether to send it again, because it may already have arrived.
import { and, eq, inArray, lt, sql } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { organisations, outgoingMessages } from '../../../db/schema';
import { mailFrom } from '../follow-up-config';
import { mailTransport } from './transport';

// A claim older than this with no outcome means its worker died mid-send.
export const STALE_SENDING_MINUTES = 10;

export type DeliveryOutcome = 'sent' | 'skipped' | 'retrying' | 'failed';

function isPermanent(error: unknown): boolean {
  const code = (error as { responseCode?: number }).responseCode;
  return typeof code === 'number' && code >= 500;
}

function describe(error: unknown): string {
  const e = error as { message?: string; response?: string };
  return (e.response ?? e.message ?? String(error)).slice(0, 500);
}

export async function deliverMessage(messageId: string, { lastAttempt }: { lastAttempt: boolean }): Promise<DeliveryOutcome> {
  const db = getDb();
  const [message] = await db
    .update(outgoingMessages)
    .set({ status: 'sending', attempts: sql`${outgoingMessages.attempts} + 1`, claimedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(outgoingMessages.id, messageId), inArray(outgoingMessages.status, ['queued', 'retrying'])))
    .returning();
  if (!message) return 'skipped';
  const [organisation] = await db
    .select({ name: organisations.name, email: organisations.email })
    .from(organisations)
    .where(eq(organisations.id, message.organisationId));
  try {
    const info = await mailTransport().sendMail({
      from: { name: organisation?.name ?? 'Tickover', address: mailFrom() },
      replyTo: organisation?.email || undefined,
      to: { name: message.toName, address: message.toAddress },
      subject: message.subject,
      html: message.html,
      text: message.text,
      messageId: `<${message.id}@tickover.mail>`,
      headers: { 'X-Tickover-Message-Kind': message.kind },
    });
    await db
      .update(outgoingMessages)
      .set({ status: 'sent', sentAt: sql`now()`, providerResponse: String(info.response ?? '').slice(0, 500), lastError: null, updatedAt: sql`now()` })
      .where(eq(outgoingMessages.id, messageId));
    return 'sent';
  } catch (error) {
    const final = lastAttempt || isPermanent(error);
    await db
      .update(outgoingMessages)
      .set({ status: final ? 'failed' : 'retrying', lastError: describe(error), updatedAt: sql`now()` })
      .where(eq(outgoingMessages.id, messageId));
    if (final) return 'failed';
    throw error;
  }
}

/** Marks claims whose worker died as uncertain; returns queued messages that may have lost their job. */
export async function sweepMessages() {
  const db = getDb();
  const uncertain = await db
    .update(outgoingMessages)
    .set({ status: 'uncertain', lastError: 'The worker stopped while sending; the message may or may not have arrived.', updatedAt: sql`now()` })
    .where(and(eq(outgoingMessages.status, 'sending'), lt(outgoingMessages.claimedAt, sql`now() - make_interval(mins => ${STALE_SENDING_MINUTES})`)))
    .returning({ id: outgoingMessages.id });
  const waiting = await db
    .select({ id: outgoingMessages.id })
    .from(outgoingMessages)
    .where(and(eq(outgoingMessages.status, 'queued'), lt(outgoingMessages.createdAt, sql`now() - interval '5 minutes'`)))
    .limit(500);
  return { uncertain: uncertain.length, waiting: waiting.map((w) => w.id) };
}
