// Invoices from a visit's parts and labour: a draft the office can adjust, issued once with the next
// number, paid through the customer's link, or credited in full and issued again corrected.
import { and, asc, desc, eq, inArray, ne, sql } from 'drizzle-orm';
import { addDays } from 'date-fns';
import { getDb, type Database, type Executor } from '../../db/client';
import * as s from '../../db/schema';
import { priceLines } from '../billing/totals';
import { formatDocumentNumber } from '../billing/document-numbers';
import { invoiceAllows, invoiceRefusal } from '../billing/invoice-status';
import { formatMoney } from '../billing/money';
import { HttpError } from './http';
import { allocateDocumentNumber } from './document-numbers';
import { transactionWithJobs } from './jobs/transaction';
import { invoicePaymentDays } from './follow-up-config';
import { currentRecordLink } from './record-sharing';
import { queueMessage } from './mail/outbox';
import { invoiceMail } from './mail/templates';
import { dayLabel, localDate } from './local-date';
import { nextChangeSeq } from '../../db/schema/change-feed';
import { lockChangeFeed } from './change-feed';

export type DraftLine = {
  kind: s.InvoiceLineKind;
  description: string;
  partNumber: string | null;
  quantity: number;
  unit: string;
  unitPriceMinor: number;
  discountMinor: number;
};

// A visit can be invoiced once the technician has signed it off.
const INVOICEABLE: readonly s.VisitStatus[] = ['signed_off', 'reviewed'];

async function visitInOrganisation(db: Executor, organisationId: string, visitId: string) {
  const [visit] = await db.select().from(s.visits).where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)));
  if (!visit) throw new HttpError(404, 'No such visit in your business.');
  return visit;
}

async function invoiceInOrganisation(db: Executor, organisationId: string, invoiceId: string, { lock = false } = {}) {
  const query = db.select().from(s.invoices).where(and(eq(s.invoices.id, invoiceId), eq(s.invoices.organisationId, organisationId)));
  const [invoice] = lock ? await query.for('update') : await query;
  if (!invoice) throw new HttpError(404, 'No such invoice in your business.');
  return invoice;
}

/** Lines for a visit: each part fitted at its catalogue price, and the checklist's labour. */
export async function linesFromVisit(db: Executor, visit: typeof s.visits.$inferSelect): Promise<DraftLine[]> {
  const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, visit.organisationId));
  const fitted = await db
    .select({ line: s.partLines, price: s.parts.priceMinor })
    .from(s.partLines)
    .leftJoin(s.parts, and(eq(s.parts.id, s.partLines.partId), eq(s.parts.organisationId, visit.organisationId)))
    .where(and(eq(s.partLines.visitId, visit.id), eq(s.partLines.removed, false)))
    .orderBy(asc(s.partLines.description));
  const byNumber = await db
    .select({ partNumber: s.parts.partNumber, price: s.parts.priceMinor })
    .from(s.parts)
    .where(and(eq(s.parts.organisationId, visit.organisationId), inArray(s.parts.partNumber, fitted.map((f) => f.line.partNumber).concat(['']))));
  const priceByNumber = new Map(byNumber.map((p) => [p.partNumber, p.price]));
  const lines: DraftLine[] = fitted.map(({ line, price }) => ({
    kind: 'part',
    description: line.description || line.partNumber,
    partNumber: line.partNumber,
    quantity: line.quantity,
    unit: line.unit,
    unitPriceMinor: price ?? priceByNumber.get(line.partNumber) ?? 0,
    discountMinor: 0,
  }));
  const [template] = await db
    .select({ name: s.checklistTemplates.name, labour: s.checklistTemplates.labourCentiHours })
    .from(s.templateVersions)
    .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
    .where(eq(s.templateVersions.id, visit.templateVersionId));
  if (template && template.labour > 0 && org) {
    lines.push({
      kind: 'labour',
      description: `Labour: ${template.name}`,
      partNumber: null,
      quantity: template.labour / 100,
      unit: 'h',
      unitPriceMinor: org.labourRateMinorPerHour,
      discountMinor: 0,
    });
  }
  return lines;
}

/** Replaces an invoice's lines and sets its totals from them; returns the totals. */
export async function writeLines(db: Executor, invoiceId: string, taxRateBasisPoints: number, lines: DraftLine[]) {
  let totals;
  try {
    totals = priceLines(lines, taxRateBasisPoints);
  } catch (error) {
    throw new HttpError(422, (error as Error).message);
  }
  await db.delete(s.invoiceLines).where(eq(s.invoiceLines.invoiceId, invoiceId));
  if (lines.length > 0) {
    await db.insert(s.invoiceLines).values(
      lines.map((line, position) => ({ invoiceId, position, ...line, netMinor: totals.lines[position]!.netMinor, taxMinor: totals.lines[position]!.taxMinor })),
    );
  }
  await db
    .update(s.invoices)
    .set({ netMinor: totals.netMinor, taxMinor: totals.taxMinor, totalMinor: totals.totalMinor, updatedAt: sql`now()` })
    .where(eq(s.invoices.id, invoiceId));
  return totals;
}

export async function prepareDraftInvoice(organisationId: string, visitId: string, userId: string) {
  return getDb().transaction(async (tx) => {
    const visit = await visitInOrganisation(tx, organisationId, visitId);
    await tx.select({ id: s.visits.id }).from(s.visits).where(eq(s.visits.id, visitId)).for('update');
    const [live] = await tx.select().from(s.invoices).where(and(eq(s.invoices.visitId, visitId), ne(s.invoices.status, 'void')));
    if (live) throw new HttpError(409, `This visit already has an invoice (${live.status}).`, { invoiceId: live.id });
    if (!INVOICEABLE.includes(visit.status)) {
      throw new HttpError(409, `A visit can be invoiced once it is signed off; this one is ${visit.status.replace('_', ' ')}.`);
    }
    const [org] = await tx.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
    const [invoice] = await tx
      .insert(s.invoices)
      .values({ organisationId, visitId, customerId: visit.customerId, currency: org!.currency, taxRateBasisPoints: org!.taxRateBasisPoints, createdBy: userId })
      .returning();
    await writeLines(tx, invoice!.id, invoice!.taxRateBasisPoints, await linesFromVisit(tx, visit));
    return invoice!.id;
  });
}

export async function replaceDraftLines(organisationId: string, invoiceId: string, lines: DraftLine[]) {
  return getDb().transaction(async (tx) => {
    const invoice = await invoiceInOrganisation(tx, organisationId, invoiceId, { lock: true });
    if (!invoiceAllows(invoice.status, 'edit')) throw new HttpError(409, invoiceRefusal(invoice.status, 'edit'));
    await writeLines(tx, invoiceId, invoice.taxRateBasisPoints, lines);
  });
}

export async function discardDraft(organisationId: string, invoiceId: string) {
  return getDb().transaction(async (tx) => {
    const invoice = await invoiceInOrganisation(tx, organisationId, invoiceId, { lock: true });
    if (!invoiceAllows(invoice.status, 'discard')) throw new HttpError(409, invoiceRefusal(invoice.status, 'discard'));
    await tx.delete(s.invoices).where(eq(s.invoices.id, invoiceId));
  });
}

async function businessOf(db: Executor, organisationId: string) {
  const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
  return org!;
}

/** Issues a draft: the next number, status sent, the visit invoiced, and the invoice e-mail queued. */
export async function sendInvoice(organisationId: string, invoiceId: string, userId: string) {
  return transactionWithJobs(async (db, enqueue) => {
    const invoice = await invoiceInOrganisation(db, organisationId, invoiceId, { lock: true });
    if (!invoiceAllows(invoice.status, 'send')) throw new HttpError(409, invoiceRefusal(invoice.status, 'send'));
    if (invoice.totalMinor <= 0) throw new HttpError(422, 'This invoice has nothing to charge. Add a line with a price first.');
    const org = await businessOf(db, organisationId);
    const number = await allocateDocumentNumber(db, organisationId, 'invoice');
    const issuedAt = new Date();
    const dueAt = addDays(issuedAt, invoicePaymentDays());
    await db.update(s.invoices).set({ number, status: 'sent', issuedAt, dueAt, updatedAt: sql`now()` }).where(eq(s.invoices.id, invoiceId));
    // Devices pull the visit's status: write it as a change-feed writer (change-feed.ts).
    await lockChangeFeed(db, organisationId);
    await db.update(s.visits).set({ status: 'invoiced', updatedAt: sql`now()`, changeSeq: nextChangeSeq }).where(eq(s.visits.id, invoice.visitId));
    const [customer] = await db.select().from(s.customers).where(eq(s.customers.id, invoice.customerId));
    const [vehicle] = await db
      .select({ registration: s.vehicles.registration, id: s.vehicles.id })
      .from(s.visits)
      .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
      .where(eq(s.visits.id, invoice.visitId));
    const printed = formatDocumentNumber('invoice', number);
    let messageId: string | null = null;
    if (customer?.email) {
      const link = await currentRecordLink(db, { organisationId, visitId: invoice.visitId, createdBy: userId });
      messageId = await queueMessage(db, enqueue, {
        organisationId,
        kind: 'invoice',
        idempotencyKey: `invoice:${invoiceId}`,
        to: { address: customer.email, name: customer.name },
        mail: invoiceMail({
          business: org,
          customerName: customer.name,
          invoiceNumber: printed,
          registration: vehicle!.registration,
          total: formatMoney(invoice.totalMinor, invoice.currency),
          dueDate: dayLabel(localDate(dueAt, org.timeZone), 'd MMMM yyyy'),
          url: link.url,
        }),
        customerId: customer.id,
        visitId: invoice.visitId,
        vehicleId: vehicle!.id,
        invoiceId,
        createdBy: userId,
      });
    }
    return { number: printed, messageId, emailed: Boolean(customer?.email) };
  });
}

/** Credits a sent invoice in full: a credit note with the next number, and the invoice void. */
export async function creditInvoice(organisationId: string, invoiceId: string, reason: string, userId: string) {
  return getDb().transaction(async (tx) => {
    const invoice = await invoiceInOrganisation(tx, organisationId, invoiceId, { lock: true });
    if (!invoiceAllows(invoice.status, 'credit')) throw new HttpError(409, invoiceRefusal(invoice.status, 'credit'));
    const number = await allocateDocumentNumber(tx, organisationId, 'credit_note');
    await tx.insert(s.creditNotes).values({
      organisationId,
      invoiceId,
      number,
      reason,
      currency: invoice.currency,
      netMinor: invoice.netMinor,
      taxMinor: invoice.taxMinor,
      totalMinor: invoice.totalMinor,
      createdBy: userId,
    });
    await tx.update(s.invoices).set({ status: 'void', voidedAt: sql`now()`, updatedAt: sql`now()` }).where(eq(s.invoices.id, invoiceId));
    // An unpaid checkout for this invoice must not be completed any more.
    await tx
      .update(s.paymentAttempts)
      .set({ status: 'expired' })
      .where(and(eq(s.paymentAttempts.invoiceId, invoiceId), eq(s.paymentAttempts.status, 'open')));
    const [visit] = await tx.select({ reviewedAt: s.visits.reviewedAt }).from(s.visits).where(eq(s.visits.id, invoice.visitId));
    await lockChangeFeed(tx, organisationId);
    await tx
      .update(s.visits)
      .set({ status: visit?.reviewedAt ? 'reviewed' : 'signed_off', updatedAt: sql`now()`, changeSeq: nextChangeSeq })
      .where(eq(s.visits.id, invoice.visitId));
    return { number: formatDocumentNumber('credit_note', number) };
  });
}

export type InvoiceListFilter = { status?: s.InvoiceStatus; page: number; pageSize: number };

export async function listInvoices(organisationId: string, filter: InvoiceListFilter) {
  const db = getDb();
  const where = and(eq(s.invoices.organisationId, organisationId), filter.status ? eq(s.invoices.status, filter.status) : undefined);
  const rows = await db
    .select({
      id: s.invoices.id,
      number: s.invoices.number,
      status: s.invoices.status,
      totalMinor: s.invoices.totalMinor,
      currency: s.invoices.currency,
      issuedAt: s.invoices.issuedAt,
      dueAt: s.invoices.dueAt,
      paidAt: s.invoices.paidAt,
      createdAt: s.invoices.createdAt,
      visitId: s.invoices.visitId,
      customerName: s.customers.name,
      registration: s.vehicles.registration,
    })
    .from(s.invoices)
    .innerJoin(s.customers, eq(s.customers.id, s.invoices.customerId))
    .innerJoin(s.visits, eq(s.visits.id, s.invoices.visitId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .where(where)
    .orderBy(desc(s.invoices.createdAt))
    .limit(filter.pageSize + 1)
    .offset(filter.page * filter.pageSize);
  return {
    invoices: rows.slice(0, filter.pageSize).map((r) => ({ ...r, printedNumber: r.number === null ? null : formatDocumentNumber('invoice', r.number) })),
    hasMore: rows.length > filter.pageSize,
  };
}

/** Signed-off visits with no live invoice yet: the office's to-do list. */
export async function visitsReadyToInvoice(organisationId: string) {
  return getDb()
    .select({
      visitId: s.visits.id,
      roundDate: s.visits.roundDate,
      status: s.visits.status,
      customerName: s.customers.name,
      registration: s.vehicles.registration,
    })
    .from(s.visits)
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .where(
      and(
        eq(s.visits.organisationId, organisationId),
        inArray(s.visits.status, [...INVOICEABLE]),
        sql`not exists (select 1 from invoices i where i.visit_id = ${s.visits.id} and i.status <> 'void')`,
      ),
    )
    .orderBy(asc(s.visits.roundDate))
    .limit(200);
}

export async function invoiceDetail(organisationId: string, invoiceId: string) {
  const db: Database = getDb();
  const invoice = await invoiceInOrganisation(db, organisationId, invoiceId);
  const lines = await db.select().from(s.invoiceLines).where(eq(s.invoiceLines.invoiceId, invoiceId)).orderBy(asc(s.invoiceLines.position));
  const [context] = await db
    .select({ customerName: s.customers.name, customerEmail: s.customers.email, registration: s.vehicles.registration, make: s.vehicles.make, model: s.vehicles.model, roundDate: s.visits.roundDate })
    .from(s.visits)
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .where(eq(s.visits.id, invoice.visitId));
  const [credit] = await db.select().from(s.creditNotes).where(eq(s.creditNotes.invoiceId, invoiceId));
  const paymentRows = await db.select().from(s.payments).where(eq(s.payments.invoiceId, invoiceId));
  return {
    invoice: { ...invoice, printedNumber: invoice.number === null ? null : formatDocumentNumber('invoice', invoice.number) },
    lines,
    context: context!,
    creditNote: credit ? { ...credit, printedNumber: formatDocumentNumber('credit_note', credit.number) } : null,
    payments: paymentRows,
  };
}
