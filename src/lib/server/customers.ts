// The business's customers: the table, the form's reads and writes, and a customer's history.
import { and, count, desc, eq, ilike, inArray, ne, or, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import type { CustomerInput } from '../office/customer-input';
import type { TablePage, TableQuery } from '../office/table-query';
import type { CUSTOMER_SORTS } from '../office/customer-input';
import { HttpError } from './http';
import { withChangeFeedWrite } from './change-feed';
import { containsPattern, orderFor, pageWindow } from './table-sql';

export type CustomerRow = {
  id: string;
  name: string;
  email: string | null;
  phone: string | null;
  postcode: string;
  vehicleCount: number;
  lastVisit: string | null;
};

// Written with explicit aliases: in a single-table select Drizzle leaves column names
// unqualified, and inside the subquery "id" would mean the vehicle's id, not the customer's.
const vehicleCount = sql<number>`(select count(*)::int from ${s.vehicles} v where v.customer_id = ${s.customers}.id)`;
const lastVisit = sql<string | null>`(select max(vi.round_date)::text from ${s.visits} vi where vi.customer_id = ${s.customers}.id and vi.status <> 'cancelled')`;

export async function listCustomers(
  organisationId: string,
  query: TableQuery<(typeof CUSTOMER_SORTS)[number]>,
): Promise<TablePage<CustomerRow>> {
  const db = getDb();
  const where = and(
    eq(s.customers.organisationId, organisationId),
    query.q
      ? or(
          ilike(s.customers.name, containsPattern(query.q)),
          ilike(s.customers.email, containsPattern(query.q)),
          ilike(s.customers.phone, containsPattern(query.q)),
          ilike(s.customers.postcode, containsPattern(query.q)),
        )
      : undefined,
  );
  const sortColumn = {
    name: s.customers.name,
    postcode: s.customers.postcode,
    vehicles: vehicleCount,
    lastVisit,
    createdAt: s.customers.createdAt,
  }[query.sort];
  const { limit, offset } = pageWindow(query);
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: s.customers.id,
        name: s.customers.name,
        email: s.customers.email,
        phone: s.customers.phone,
        postcode: s.customers.postcode,
        vehicleCount,
        lastVisit,
      })
      .from(s.customers)
      .where(where)
      .orderBy(...orderFor(sortColumn, query.dir, s.customers.id))
      .limit(limit)
      .offset(offset),
    db.select({ n: count() }).from(s.customers).where(where),
  ]);
  return { rows, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize };
}

export async function getCustomer(organisationId: string, customerId: string) {
  const [row] = await getDb()
    .select()
    .from(s.customers)
    .where(and(eq(s.customers.id, customerId), eq(s.customers.organisationId, organisationId)));
  if (!row) throw new HttpError(404, 'No such customer in this business.');
  return row;
}

export async function createCustomer(organisationId: string, input: CustomerInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const [row] = await tx
      .insert(s.customers)
      .values({ organisationId, ...input })
      .returning();
    return row!;
  });
}

export async function updateCustomer(organisationId: string, customerId: string, input: CustomerInput) {
  return withChangeFeedWrite(organisationId, async (tx) => {
    const [row] = await tx
      .update(s.customers)
      .set({ ...input, updatedAt: new Date(), changeSeq: s.nextChangeSeq })
      .where(and(eq(s.customers.id, customerId), eq(s.customers.organisationId, organisationId)))
      .returning();
    if (!row) throw new HttpError(404, 'No such customer in this business.');
    return row;
  });
}

/** Every vehicle, visit and finding of a customer, newest visit first. */
export async function customerHistory(organisationId: string, customerId: string) {
  const db = getDb();
  const customer = await getCustomer(organisationId, customerId);
  const vehicles = await db
    .select({
      id: s.vehicles.id,
      registration: s.vehicles.registration,
      make: s.vehicles.make,
      model: s.vehicles.model,
      engine: s.vehicles.engine,
      year: s.vehicles.year,
      lastServiceDate: s.vehicles.lastServiceDate,
    })
    .from(s.vehicles)
    .where(and(eq(s.vehicles.customerId, customer.id), eq(s.vehicles.organisationId, organisationId)))
    .orderBy(s.vehicles.registration);
  const visits = await db
    .select({
      id: s.visits.id,
      roundDate: s.visits.roundDate,
      slotStart: s.visits.slotStart,
      status: s.visits.status,
      vehicleId: s.visits.vehicleId,
      registration: s.vehicles.registration,
      technicianName: s.user.name,
      checklist: s.checklistTemplates.name,
    })
    .from(s.visits)
    .innerJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
    .innerJoin(s.user, eq(s.user.id, s.visits.technicianId))
    .innerJoin(s.templateVersions, eq(s.templateVersions.id, s.visits.templateVersionId))
    .innerJoin(s.checklistTemplates, eq(s.checklistTemplates.id, s.templateVersions.templateId))
    .where(and(eq(s.visits.customerId, customer.id), eq(s.visits.organisationId, organisationId), ne(s.visits.status, 'cancelled')))
    .orderBy(desc(s.visits.slotStart))
    .limit(500);
  const findings = visits.length
    ? await db
        .select({ id: s.findings.id, visitId: s.findings.visitId, title: s.findings.title, severity: s.findings.severity })
        .from(s.findings)
        .where(inArray(s.findings.visitId, visits.map((v) => v.id)))
    : [];
  const invoices = await db
    .select({
      id: s.invoices.id,
      visitId: s.invoices.visitId,
      number: s.invoices.number,
      status: s.invoices.status,
      currency: s.invoices.currency,
      totalMinor: s.invoices.totalMinor,
      issuedAt: s.invoices.issuedAt,
      paidAt: s.invoices.paidAt,
    })
    .from(s.invoices)
    .where(and(eq(s.invoices.customerId, customer.id), eq(s.invoices.organisationId, organisationId)))
    .orderBy(desc(s.invoices.createdAt))
    .limit(500);
  return {
    customer,
    vehicles,
    visits: visits.map((visit) => ({ ...visit, findings: findings.filter((f) => f.visitId === visit.id) })),
    invoices,
  };
}
