// Everything a service record shows, gathered for one visit: the customer's page, its PDF and the
// office's preview all render this one view model, so they cannot disagree.
import { and, asc, desc, eq, inArray, isNull, ne } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import * as s from '../../db/schema';
import { SEVERITY_RANK } from '../sync/operations';
import { formatDocumentNumber } from '../billing/document-numbers';
import { serviceDue } from '../reminders/service-due';
import { odometerHistory } from './odometer-history';
import { localDate } from './local-date';

export type RecordReading = { label: string; value: number | null; textValue: string | null; unit: string | null; expectedMin: number | null; expectedMax: number | null; outOfRange: boolean };
export type RecordSection = { title: string; done: string[]; notDone: string[]; readings: RecordReading[] };
export type RecordFinding = {
  id: string;
  title: string;
  detail: string;
  severity: s.Severity;
  photos: { id: string; caption: string }[];
  advised: { id: string; description: string; priceMinor: number; taxMinor: number; decision: s.AdvisedDecision; decidedAt: Date | null; booked: boolean } | null;
};
export type RecordInvoice = {
  id: string;
  number: string;
  status: s.InvoiceStatus;
  issuedAt: Date | null;
  dueAt: Date | null;
  paidAt: Date | null;
  lines: { description: string; quantity: number; unit: string; unitPriceMinor: number; netMinor: number }[];
  netMinor: number;
  taxMinor: number;
  totalMinor: number;
  taxRateBasisPoints: number;
  creditNote: { number: string; totalMinor: number; reason: string } | null;
};

export type ServiceRecord = {
  visitId: string;
  organisationId: string;
  business: { name: string; addressLines: string; phone: string; email: string; currency: string; timeZone: string; taxRateBasisPoints: number };
  customer: { id: string; name: string; email: string | null };
  vehicle: { id: string; registration: string; make: string; model: string; engine: string; year: number | null; vin: string | null };
  visit: { date: string; dateLabel: string; address: string; technicianName: string; templateName: string; status: s.VisitStatus };
  signOff: { odometer: number; odometerUnit: s.DistanceUnit; signedAt: Date; customerName: string } | null;
  sections: RecordSection[];
  parts: { description: string; partNumber: string; quantity: number; unit: string }[];
  findings: RecordFinding[];
  notes: string[];
  nextService: { dueDate: string | null; dueOdometer: number | null; distanceDate: string | null; unit: s.DistanceUnit } | null;
  invoice: RecordInvoice | null;
};

export const SEVERITY_ORDER = (a: { severity: s.Severity }, b: { severity: s.Severity }) => SEVERITY_RANK[b.severity] - SEVERITY_RANK[a.severity];

/** The record of a visit in this organisation, or null when there is no such visit. */
export async function loadServiceRecord(db: Executor, organisationId: string, visitId: string): Promise<ServiceRecord | null> {
  const [row] = await db
    .select({ visit: s.visits, organisation: s.organisations, customer: s.customers, vehicle: s.vehicles, technicianName: s.user.name, templateName: s.checklistTemplates.name })
    .from(s.visits)
    .innerJoin(s.organisations, eq(s.organisations.id, s.visits.organisationId))
    .innerJoin(s.customers, eq(s.customers.id, s.visits.customerId))
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .innerJoin(s.user, eq(s.user.id, s.visits.technicianId))
    .innerJoin(s.templateVersions, eq(s.templateVersions.id, s.visits.templateVersionId))
    .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
    .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, organisationId)));
  if (!row) return null;
  const { visit, organisation: org, customer, vehicle } = row;

  const [signOff] = await db
    .select()
    .from(s.signOffs)
    .where(and(eq(s.signOffs.visitId, visitId), isNull(s.signOffs.voidedAt)));
  const sectionRows = await db.select().from(s.templateSections).where(eq(s.templateSections.versionId, visit.templateVersionId)).orderBy(asc(s.templateSections.position));
  const items = await db.select().from(s.templateItems).where(eq(s.templateItems.versionId, visit.templateVersionId)).orderBy(asc(s.templateItems.position));
  const checks = await db.select().from(s.checkResults).where(eq(s.checkResults.visitId, visitId));
  const readings = await db.select().from(s.readingResults).where(eq(s.readingResults.visitId, visitId));
  const partLines = await db
    .select()
    .from(s.partLines)
    .where(and(eq(s.partLines.visitId, visitId), eq(s.partLines.removed, false)));
  const findingRows = await db.select().from(s.findings).where(eq(s.findings.visitId, visitId)).orderBy(asc(s.findings.createdAt));
  const photoRows = await db
    .select({ id: s.photos.id, findingId: s.photos.findingId, caption: s.photos.caption })
    .from(s.photos)
    .where(and(eq(s.photos.visitId, visitId), isNull(s.photos.removedStamp)));
  const advisedRows = await db.select().from(s.advisedWork).where(eq(s.advisedWork.visitId, visitId));
  const notes = await db.select({ body: s.visitNotes.body }).from(s.visitNotes).where(eq(s.visitNotes.visitId, visitId)).orderBy(asc(s.visitNotes.createdAt));

  const checkState = new Map(checks.map((c) => [c.itemId, c.state]));
  const readingOf = new Map(readings.map((r) => [r.itemId, r]));
  const partItemsDone = new Set(partLines.map((p) => p.itemId).filter(Boolean));
  const sections: RecordSection[] = sectionRows.map((section) => {
    const own = items.filter((i) => i.sectionId === section.id);
    const done: string[] = [];
    const notDone: string[] = [];
    const sectionReadings: RecordReading[] = [];
    for (const item of own) {
      if (item.kind === 'check') {
        const state = checkState.get(item.id);
        if (state === 'done') done.push(item.label);
        else if (state === 'skipped') notDone.push(item.label);
      } else if (item.kind === 'part') {
        if (partItemsDone.has(item.id)) done.push(item.label);
      } else {
        const r = readingOf.get(item.id);
        if (!r) continue;
        const outOfRange = r.value !== null && ((item.expectedMin !== null && r.value < item.expectedMin) || (item.expectedMax !== null && r.value > item.expectedMax));
        sectionReadings.push({ label: item.label, value: r.value, textValue: r.textValue, unit: r.unit ?? item.unit, expectedMin: item.expectedMin, expectedMax: item.expectedMax, outOfRange });
      }
    }
    return { title: section.title, done, notDone, readings: sectionReadings };
  });

  const taxBp = org.taxRateBasisPoints;
  const findings: RecordFinding[] = findingRows
    .map((f) => {
      const advised = advisedRows.find((a) => a.findingId === f.id);
      return {
        id: f.id,
        title: f.title,
        detail: f.detail,
        severity: f.severity,
        photos: photoRows.filter((p) => p.findingId === f.id).map((p) => ({ id: p.id, caption: p.caption })),
        advised: advised
          ? {
              id: advised.id,
              description: advised.description,
              priceMinor: advised.priceMinor,
              taxMinor: Math.floor((advised.priceMinor * taxBp) / 10_000 + 0.5),
              decision: advised.decision,
              decidedAt: advised.decidedAt,
              booked: advised.bookedVisitId !== null,
            }
          : null,
      };
    })
    .sort(SEVERITY_ORDER);

  const unit = signOff?.odometerUnit ?? vehicle.odometerUnit;
  let nextService: ServiceRecord['nextService'] = null;
  if (signOff && (vehicle.serviceIntervalMonths || vehicle.serviceIntervalDistance)) {
    const history = await odometerHistory(db, vehicle.id, org.timeZone);
    const due = serviceDue({
      last: { date: localDate(signOff.signedAt, org.timeZone), odometer: signOff.odometer },
      interval: { months: vehicle.serviceIntervalMonths, distance: vehicle.serviceIntervalDistance, unit: vehicle.odometerUnit },
      history,
    });
    nextService = { dueDate: due.dueDate, dueOdometer: due.dueOdometer, distanceDate: due.distanceDate, unit };
  }

  return {
    visitId,
    organisationId,
    business: { name: org.name, addressLines: org.addressLines, phone: org.phone, email: org.email, currency: org.currency, timeZone: org.timeZone, taxRateBasisPoints: taxBp },
    customer: { id: customer.id, name: customer.name, email: customer.email },
    vehicle: { id: vehicle.id, registration: vehicle.registration, make: vehicle.make, model: vehicle.model, engine: vehicle.engine, year: vehicle.year, vin: vehicle.vin },
    visit: {
      date: localDate(signOff?.signedAt ?? visit.slotStart, org.timeZone),
      dateLabel: localDate(signOff?.signedAt ?? visit.slotStart, org.timeZone, 'EEEE d MMMM yyyy'),
      address: [visit.addressLines, visit.postcode].filter(Boolean).join(', '),
      technicianName: row.technicianName,
      templateName: row.templateName,
      status: visit.status,
    },
    signOff: signOff ? { odometer: signOff.odometer, odometerUnit: signOff.odometerUnit, signedAt: signOff.signedAt, customerName: signOff.customerName } : null,
    sections,
    parts: partLines.map((p) => ({ description: p.description, partNumber: p.partNumber, quantity: p.quantity, unit: p.unit })),
    findings,
    notes: notes.map((n) => n.body),
    nextService,
    invoice: await loadRecordInvoice(db, visitId),
  };
}

/** The invoice the customer should see: the live one once issued, else the last credited one. */
async function loadRecordInvoice(db: Executor, visitId: string): Promise<RecordInvoice | null> {
  const [invoice] = await db
    .select()
    .from(s.invoices)
    .where(and(eq(s.invoices.visitId, visitId), ne(s.invoices.status, 'draft')))
    .orderBy(asc(s.invoices.status), desc(s.invoices.issuedAt))
    .limit(1);
  if (!invoice || invoice.number === null) return null;
  const lines = await db.select().from(s.invoiceLines).where(eq(s.invoiceLines.invoiceId, invoice.id)).orderBy(asc(s.invoiceLines.position));
  const [credit] = await db.select().from(s.creditNotes).where(inArray(s.creditNotes.invoiceId, [invoice.id]));
  return {
    id: invoice.id,
    number: formatDocumentNumber('invoice', invoice.number),
    status: invoice.status,
    issuedAt: invoice.issuedAt,
    dueAt: invoice.dueAt,
    paidAt: invoice.paidAt,
    lines: lines.map((l) => ({ description: l.description, quantity: l.quantity, unit: l.unit, unitPriceMinor: l.unitPriceMinor, netMinor: l.netMinor })),
    netMinor: invoice.netMinor,
    taxMinor: invoice.taxMinor,
    totalMinor: invoice.totalMinor,
    taxRateBasisPoints: invoice.taxRateBasisPoints,
    creditNote: credit ? { number: formatDocumentNumber('credit_note', credit.number), totalMinor: credit.totalMinor, reason: credit.reason } : null,
  };
}
