// Demo invoices for the visits the office has already reviewed, so the billing pages and the
// dashboard's money chart have something to show: the oldest reviewed visit is paid by card, the
// others are sent and waiting. Lines come from the same rule the office's "prepare invoice" uses.
import { and, eq, ne, sql } from 'drizzle-orm';
import { addDays } from 'date-fns';
import type { Executor } from '../client';
import * as s from '../schema';
import { nextChangeSeq } from '../schema/change-feed';
import { priceLines } from '../../lib/billing/totals';
import { linesFromVisit, writeLines } from '../../lib/server/invoices';
import { allocateDocumentNumber } from '../../lib/server/document-numbers';
import { seedId } from './ids';

const PAYMENT_DAYS = 14;

export async function seedInvoices(tx: Executor, organisationId: string, issuedBy: string) {
  const reviewed = await tx
    .select()
    .from(s.visits)
    .where(and(eq(s.visits.organisationId, organisationId), eq(s.visits.status, 'reviewed')))
    .orderBy(s.visits.slotStart);
  const [org] = await tx.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
  for (const [index, visit] of reviewed.entries()) {
    const [live] = await tx.select({ id: s.invoices.id }).from(s.invoices).where(and(eq(s.invoices.visitId, visit.id), ne(s.invoices.status, 'void')));
    if (live) continue;
    const lines = await linesFromVisit(tx, visit);
    if (priceLines(lines, org!.taxRateBasisPoints).totalMinor <= 0) continue;
    const issuedAt = visit.slotEnd;
    const paid = index === 0;
    const invoiceId = seedId('invoice', visit.id);
    await tx.insert(s.invoices).values({
      id: invoiceId,
      organisationId,
      visitId: visit.id,
      customerId: visit.customerId,
      number: await allocateDocumentNumber(tx, organisationId, 'invoice'),
      status: paid ? 'paid' : 'sent',
      currency: org!.currency,
      taxRateBasisPoints: org!.taxRateBasisPoints,
      issuedAt,
      dueAt: addDays(issuedAt, PAYMENT_DAYS),
      paidAt: paid ? addDays(issuedAt, 1) : null,
      createdBy: issuedBy,
    });
    const totals = await writeLines(tx, invoiceId, org!.taxRateBasisPoints, lines);
    if (paid) {
      await tx.insert(s.payments).values({
        organisationId,
        invoiceId,
        amountMinor: totals.totalMinor,
        currency: org!.currency,
        method: 'card',
        providerReference: `demo-payment-${index + 1}`,
        receivedAt: addDays(issuedAt, 1),
      });
    }
    // Devices pull the visit's status, so the row moves up the change feed like any office write.
    await tx.update(s.visits).set({ status: 'invoiced', updatedAt: sql`now()`, changeSeq: nextChangeSeq }).where(eq(s.visits.id, visit.id));
  }
}
