// A customer, a vehicle, a published checklist and visits, for tests that work on visits. Each
// call makes new rows in the test's own organisation (fixtures.ts).
import { randomUUID } from 'node:crypto';
import * as s from '../../src/db/schema';
import { testDb } from './database';
import type { OrganisationFixture } from './fixtures';

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
