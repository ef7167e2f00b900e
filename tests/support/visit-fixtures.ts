// Visits built straight in the test database for a fixture organisation (fixtures.ts):
//  - createSignedOffVisit: a signed-off visit with results (checks, readings, parts fitted,
//    findings, sign-off); money and parts come from a small catalogue of its own;
//  - createVisitSetup + createVisit: a customer, a vehicle and a published checklist, and booked
//    visits on it, for tests that record the work themselves (through sync).
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import * as s from '../../src/db/schema';
import { encodeStamp } from '../../src/lib/sync/clock';
import { testDb } from './database';
import type { OrganisationFixture } from './fixtures';

// Real clock stamps (lib/sync/clock), so the merge rules can read them if the visit is reopened.
const stamp = (n: number) => encodeStamp({ wallMs: 1_760_000_000_000 + n, counter: 0, deviceId: 'fixture' });

export type VisitFixture = {
  visitId: string;
  customerId: string;
  customerEmail: string;
  vehicleId: string;
  registration: string;
  findingIds: { soon: string; watch: string };
  templateVersionId: string;
};

export async function createSignedOffVisit(
  org: OrganisationFixture,
  options: { email?: string | null; signedAt?: Date; odometer?: number; lastServiceDate?: string; lastServiceOdometer?: number } = {},
): Promise<VisitFixture> {
  const db = testDb();
  const tag = randomUUID().slice(0, 6).toUpperCase();
  const customerEmail = options.email === undefined ? `keeper.${tag.toLowerCase()}@customer.example` : options.email;
  await db.update(s.organisations).set({ currency: 'GBP', taxRateBasisPoints: 2000, labourRateMinorPerHour: 6000 }).where(eq(s.organisations.id, org.organisationId));
  const [customer] = await db
    .insert(s.customers)
    .values({ organisationId: org.organisationId, name: `Robin Keeper ${tag}`, email: customerEmail, addressLines: '7 Test Lane, Aldersby', postcode: 'QX9 9TT' })
    .returning();
  const [oil] = await db
    .insert(s.parts)
    .values({ organisationId: org.organisationId, partNumber: `OIL-${tag}`, description: 'Engine oil 5W-30', kind: 'oil', unit: 'L', oilGrade: '5W-30', priceMinor: 1150 })
    .returning();
  const [filter] = await db
    .insert(s.parts)
    .values({ organisationId: org.organisationId, partNumber: `OF-${tag}`, description: 'Oil filter', kind: 'oil_filter', unit: '{each}', priceMinor: 1100 })
    .returning();
  const registration = `QT${tag.replace(/[^A-Z0-9]/g, '').slice(0, 5)}`;
  const [vehicle] = await db
    .insert(s.vehicles)
    .values({
      organisationId: org.organisationId,
      customerId: customer!.id,
      registration,
      make: 'Corvane',
      model: 'Pippet',
      engine: '1.2 petrol',
      fuel: 'petrol',
      year: 2019,
      odometerUnit: '[mi_i]',
      serviceIntervalMonths: 12,
      serviceIntervalDistance: 10000,
      lastServiceDate: options.lastServiceDate ?? null,
      lastServiceOdometer: options.lastServiceOdometer ?? null,
    })
    .returning();
  const [template] = await db
    .insert(s.checklistTemplates)
    .values({ organisationId: org.organisationId, name: `Annual service ${tag}`, labourCentiHours: 150 })
    .returning();
  const [version] = await db
    .insert(s.templateVersions)
    .values({ templateId: template!.id, organisationId: org.organisationId, version: 1, status: 'published', publishedAt: new Date('2026-01-01T09:00:00Z') })
    .returning();
  const [section] = await db.insert(s.templateSections).values({ versionId: version!.id, position: 0, title: 'Under the bonnet' }).returning();
  const item = async (position: number, values: Partial<typeof s.templateItems.$inferInsert> & { kind: s.ItemKind; label: string }) =>
    (await db.insert(s.templateItems).values({ versionId: version!.id, sectionId: section!.id, position, ...values }).returning())[0]!;
  const belts = await item(0, { kind: 'check', label: 'Drive belts checked' });
  const drains = await item(1, { kind: 'check', label: 'Scuttle drains cleared' });
  const coolant = await item(2, { kind: 'reading', label: 'Coolant protection', unit: 'Cel', expectedMin: -60, expectedMax: -25 });
  const battery = await item(3, { kind: 'reading', label: 'Battery at rest', unit: 'V', expectedMin: 12.4, expectedMax: 13 });
  const oilItem = await item(4, { kind: 'part', label: 'Engine oil drained and refilled', unit: 'L', partKind: 'oil' });
  const filterItem = await item(5, { kind: 'part', label: 'Oil filter replaced', unit: '{each}', partKind: 'oil_filter' });
  const signedAt = options.signedAt ?? new Date(Date.now() - 2 * 86_400_000);
  const [visit] = await db
    .insert(s.visits)
    .values({
      organisationId: org.organisationId,
      customerId: customer!.id,
      vehicleId: vehicle!.id,
      technicianId: org.technician.id,
      templateVersionId: version!.id,
      roundDate: signedAt.toISOString().slice(0, 10),
      slotStart: new Date(signedAt.getTime() - 2 * 3_600_000),
      slotEnd: new Date(signedAt.getTime()),
      addressLines: '7 Test Lane, Aldersby',
      postcode: 'QX9 9TT',
      status: 'signed_off',
    })
    .returning();
  const visitId = visit!.id;
  const by = org.technician.id;
  await db.insert(s.checkResults).values([
    { visitId, itemId: belts.id, state: 'done', stamp: stamp(1), opId: randomUUID(), updatedBy: by },
    { visitId, itemId: drains.id, state: 'skipped', stamp: stamp(2), opId: randomUUID(), updatedBy: by },
  ]);
  await db.insert(s.readingResults).values([
    { visitId, itemId: coolant.id, value: -18, unit: 'Cel', stamp: stamp(3), opId: randomUUID(), updatedBy: by },
    { visitId, itemId: battery.id, value: 12.62, unit: 'V', stamp: stamp(4), opId: randomUUID(), updatedBy: by },
  ]);
  await db.insert(s.partLines).values([
    { id: randomUUID(), visitId, itemId: oilItem.id, partId: oil!.id, partNumber: oil!.partNumber, description: oil!.description, quantity: 3.2, unit: 'L', stamp: stamp(5), updatedBy: by },
    { id: randomUUID(), visitId, itemId: filterItem.id, partId: filter!.id, partNumber: filter!.partNumber, description: filter!.description, quantity: 1, unit: '{each}', stamp: stamp(6), updatedBy: by },
  ]);
  const soon = randomUUID();
  const watch = randomUUID();
  await db.insert(s.findings).values([
    { id: soon, visitId, itemId: coolant.id, title: 'Coolant protection only to −18 °C', detail: 'Diluted with water. Change the coolant before winter.', severity: 'soon', severityStamp: stamp(7), stamp: stamp(7), createdBy: by },
    { id: watch, visitId, itemId: null, title: 'Breather elbow hardening', detail: 'No split yet.', severity: 'watch', severityStamp: stamp(8), stamp: stamp(8), createdBy: by },
  ]);
  await db.insert(s.signOffs).values({
    id: randomUUID(),
    visitId,
    odometer: options.odometer ?? 41_230,
    odometerUnit: '[mi_i]',
    customerName: customer!.name,
    signatureSvg: '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M1 5h8"/></svg>',
    declaration: 'Work done as recorded.',
    technicianId: by,
    signedAt,
    stamp: stamp(9),
    opId: randomUUID(),
  });
  return {
    visitId,
    customerId: customer!.id,
    customerEmail: customerEmail ?? '',
    vehicleId: vehicle!.id,
    registration,
    findingIds: { soon, watch },
    templateVersionId: version!.id,
  };
}

export type Checklist = {
  versionId: string;
  checks: string[];
  readings: string[];
  parts: string[];
};

export type VisitSetup = { customerId: string; vehicleId: string; checklist: Checklist };

export async function createVisitSetup(org: OrganisationFixture, db = testDb()): Promise<VisitSetup> {
  const customerId = randomUUID();
  const vehicleId = randomUUID();
  const tag = customerId.slice(0, 6).toUpperCase().replace(/[^A-Z0-9]/g, 'X');
  await db.insert(s.customers).values({ id: customerId, organisationId: org.organisationId, name: `Ada Fenn ${tag}`, addressLines: '4 Mill Lane', postcode: 'ZZ1 1AA' });
  await db.insert(s.vehicles).values({
    id: vehicleId,
    organisationId: org.organisationId,
    customerId,
    registration: `TK${tag}`.slice(0, 10),
    make: 'Corvane',
    model: 'Estrel',
    engine: '1.4 petrol',
    fuel: 'petrol',
    year: 2017,
    oilGrade: '5W-30',
    oilCapacityL: 4.2,
  });
  const templateId = randomUUID();
  const versionId = randomUUID();
  await db.insert(s.checklistTemplates).values({ id: templateId, organisationId: org.organisationId, name: `Annual service ${tag}` });
  await db.insert(s.templateVersions).values({
    id: versionId,
    templateId,
    organisationId: org.organisationId,
    version: 1,
    status: 'published',
    publishedAt: new Date(),
    publishedBy: org.owner.id,
  });
  const sectionId = randomUUID();
  await db.insert(s.templateSections).values({ id: sectionId, versionId, position: 0, title: 'Under the bonnet' });
  const checklist: Checklist = { versionId, checks: [], readings: [], parts: [] };
  const items: { kind: s.ItemKind; label: string; unit?: string }[] = [
    { kind: 'check', label: 'Drive belt condition' },
    { kind: 'check', label: 'Hoses and breathers' },
    { kind: 'check', label: 'Cabin drains clear' },
    { kind: 'reading', label: 'Tread depth, rear right', unit: 'mm' },
    { kind: 'reading', label: 'Battery resting voltage', unit: 'V' },
    { kind: 'reading', label: 'Coolant protection', unit: 'Cel' },
    { kind: 'part', label: 'Oil filter', unit: '{each}' },
    { kind: 'part', label: 'Engine oil', unit: 'L' },
  ];
  for (const [position, item] of items.entries()) {
    const id = randomUUID();
    await db.insert(s.templateItems).values({ id, versionId, sectionId, position, kind: item.kind, label: item.label, unit: item.unit ?? null });
    checklist[item.kind === 'check' ? 'checks' : item.kind === 'reading' ? 'readings' : 'parts'].push(id);
  }
  return { customerId, vehicleId, checklist };
}

export async function createVisit(
  org: OrganisationFixture,
  setup: VisitSetup,
  options: { technicianId?: string; status?: s.VisitStatus; roundDate?: string } = {},
  db = testDb(),
): Promise<string> {
  const id = randomUUID();
  const slotStart = new Date();
  await db.insert(s.visits).values({
    id,
    organisationId: org.organisationId,
    customerId: setup.customerId,
    vehicleId: setup.vehicleId,
    technicianId: options.technicianId ?? org.technician.id,
    templateVersionId: setup.checklist.versionId,
    roundDate: options.roundDate ?? slotStart.toISOString().slice(0, 10),
    slotStart,
    slotEnd: new Date(slotStart.getTime() + 7_200_000),
    addressLines: '4 Mill Lane',
    status: options.status ?? 'booked',
  });
  return id;
}
