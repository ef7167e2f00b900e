// Thousands of visits for one organisation, to see the office tables hold up (not part of the
// demo seed). Invented data: customers "Bulk customer N", plates BK000001 and on. Visits fill
// each technician's working days backwards from `until`, four two-hour slots a day.
import { and, eq } from 'drizzle-orm';
import type { Executor } from '../client';
import * as s from '../schema';
import { localInstant, shiftDate } from '../../lib/office/local-time';

export type BulkOptions = { count: number; until: string; vehiclesPerCustomer?: number };

const SLOTS_A_DAY = 4;
const FIRST_SLOT_MINUTE = 8 * 60;
const SLOT_MINUTES = 120;
// Rows a multi-row INSERT carries: well under PostgreSQL's 65 535 bind parameters.
const BATCH = 500;

export async function createBulkVisits(db: Executor, organisationId: string, options: BulkOptions) {
  const [org] = await db.select().from(s.organisations).where(eq(s.organisations.id, organisationId));
  if (!org) throw new Error(`no organisation ${organisationId}`);
  const technicians = await db
    .select({ id: s.user.id })
    .from(s.user)
    .where(and(eq(s.user.organisationId, organisationId), eq(s.user.role, 'technician')));
  const [version] = await db
    .select({ id: s.templateVersions.id })
    .from(s.templateVersions)
    .where(and(eq(s.templateVersions.organisationId, organisationId), eq(s.templateVersions.status, 'published')));
  if (technicians.length === 0 || !version) throw new Error('the organisation needs a technician and a published checklist');

  const tag = organisationId.slice(0, 4).toUpperCase();
  const customerCount = Math.max(1, Math.ceil(options.count / 8));
  const customerRows = Array.from({ length: customerCount }, (_, i) => ({
    organisationId,
    name: `Bulk customer ${i + 1}`,
    email: `bulk${i + 1}@bulk.example`,
    addressLines: `${i + 1} Long Row, Aldersby`,
    postcode: `QX9 ${String(i % 10)}BK`,
  }));
  const customers: { id: string }[] = [];
  for (let i = 0; i < customerRows.length; i += BATCH) {
    customers.push(...(await db.insert(s.customers).values(customerRows.slice(i, i + BATCH)).returning({ id: s.customers.id })));
  }
  const vehicleRows = customers.map((c, i) => ({
    organisationId,
    customerId: c.id,
    registration: `BK${tag.replace(/[^A-Z0-9]/g, '')}${String(i).padStart(4, '0')}`.slice(0, 10),
    make: 'Corvane',
    model: i % 2 ? 'Pippet' : 'Sable',
    engine: '1.2 petrol',
    fuel: 'petrol' as const,
    year: 2010 + (i % 15),
  }));
  const vehicles: { id: string; customerId: string }[] = [];
  for (let i = 0; i < vehicleRows.length; i += BATCH) {
    vehicles.push(...(await db.insert(s.vehicles).values(vehicleRows.slice(i, i + BATCH)).returning({ id: s.vehicles.id, customerId: s.vehicles.customerId })));
  }

  const visitRows: (typeof s.visits.$inferInsert)[] = [];
  let day = options.until;
  while (visitRows.length < options.count) {
    for (const technician of technicians) {
      for (let slot = 0; slot < SLOTS_A_DAY && visitRows.length < options.count; slot += 1) {
        const n = visitRows.length;
        const vehicle = vehicles[n % vehicles.length]!;
        const start = FIRST_SLOT_MINUTE + slot * SLOT_MINUTES;
        visitRows.push({
          organisationId,
          customerId: vehicle.customerId,
          vehicleId: vehicle.id,
          technicianId: technician.id,
          templateVersionId: version.id,
          roundDate: day,
          roundPosition: slot,
          slotStart: localInstant(day, start, org.timeZone),
          slotEnd: localInstant(day, start + SLOT_MINUTES, org.timeZone),
          addressLines: `${(n % customerCount) + 1} Long Row, Aldersby`,
          status: n % 5 === 0 ? 'signed_off' : 'reviewed',
        });
      }
    }
    day = shiftDate(day, -1);
  }
  const visits: { id: string; status: string }[] = [];
  for (let i = 0; i < visitRows.length; i += BATCH) {
    visits.push(...(await db.insert(s.visits).values(visitRows.slice(i, i + BATCH)).returning({ id: s.visits.id, status: s.visits.status })));
  }
  // Every seventh visit has a finding, so the severity filter has something to find.
  const severities = ['watch', 'soon', 'now', 'ok'] as const;
  const findingRows = visits
    .filter((_, i) => i % 7 === 0)
    .map((v, i) => ({
      id: crypto.randomUUID(),
      visitId: v.id,
      title: `Bulk finding ${i + 1}`,
      severity: severities[i % severities.length]!,
      severityStamp: '0',
      stamp: '0',
      createdBy: technicians[0]!.id,
    }));
  for (let i = 0; i < findingRows.length; i += BATCH) await db.insert(s.findings).values(findingRows.slice(i, i + BATCH));
  return { customers: customers.length, vehicles: vehicles.length, visits: visits.length, findings: findingRows.length, firstDay: day, lastDay: options.until };
}
