// A small business for the van tests: a catalogue with oil containers, one checklist with part
// items and a used-oil reading, two vehicles and a round. Built on a fresh organisation.
import { randomUUID } from 'node:crypto';
import * as s from '../../src/db/schema';
import { testDb } from './database';
import type { OrganisationFixture } from './fixtures';

export type VanFixture = {
  parts: Record<'oil5w30' | 'oil0w20' | 'of' | 'af' | 'sp' | 'ff' | 'cf', string>;
  items: Record<'oil' | 'oilFilter' | 'airFilter' | 'plugs' | 'fuelFilter' | 'usedOil' | 'check', string>;
  versionId: string;
  customerId: string;
  vehicles: { petrol: string; diesel: string };
};

export async function createVanFixture(org: OrganisationFixture): Promise<VanFixture> {
  const db = testDb();
  const organisationId = org.organisationId;
  const part = async (partNumber: string, kind: s.PartKind, unit: 'L' | '{each}', costMinor: number, supplier: string, oilGrade: string | null = null) => {
    const id = randomUUID();
    await db.insert(s.parts).values({ id, organisationId, partNumber, description: `${partNumber} test part`, kind, unit, oilGrade, costMinor, priceMinor: costMinor * 2, supplier });
    return id;
  };
  const parts = {
    oil5w30: await part('T-5W30', 'oil', 'L', 600, 'Oilery Test', '5W-30'),
    oil0w20: await part('T-0W20', 'oil', 'L', 700, 'Oilery Test', '0W-20'),
    of: await part('T-OF1', 'oil_filter', '{each}', 450, 'Filters Test'),
    af: await part('T-AF1', 'air_filter', '{each}', 700, 'Filters Test'),
    sp: await part('T-SP1', 'spark_plug', '{each}', 400, 'Sparks Test'),
    ff: await part('T-FF1', 'fuel_filter', '{each}', 1300, 'Filters Test'),
    cf: await part('T-CF1', 'cabin_filter', '{each}', 750, ''),
  };
  for (const partId of [parts.oil5w30, parts.oil0w20]) {
    for (const sizeL of [1, 5]) await db.insert(s.oilContainers).values({ organisationId, partId, sizeL });
  }

  const templateId = randomUUID();
  const versionId = randomUUID();
  const sectionId = randomUUID();
  await db.insert(s.checklistTemplates).values({ id: templateId, organisationId, name: 'Test service' });
  await db.insert(s.templateVersions).values({ id: versionId, templateId, organisationId, version: 1, status: 'published', publishedAt: new Date() });
  await db.insert(s.templateSections).values({ id: sectionId, versionId, position: 0, title: 'All' });
  const itemDefs = [
    ['oil', { kind: 'part', label: 'Oil', unit: 'L', partKind: 'oil' }],
    ['oilFilter', { kind: 'part', label: 'Oil filter', unit: '{each}', partKind: 'oil_filter' }],
    ['airFilter', { kind: 'part', label: 'Air filter', unit: '{each}', partKind: 'air_filter' }],
    ['plugs', { kind: 'part', label: 'Plugs', unit: '{each}', partKind: 'spark_plug' }],
    ['fuelFilter', { kind: 'part', label: 'Fuel filter', unit: '{each}', partKind: 'fuel_filter' }],
    ['usedOil', { kind: 'reading', label: 'Used oil drained', unit: 'L', rule: 'used_oil' }],
    ['check', { kind: 'check', label: 'Leaks' }],
  ] as const;
  const items = {} as VanFixture['items'];
  for (const [position, [key, def]] of itemDefs.entries()) {
    const id = randomUUID();
    await db.insert(s.templateItems).values({ id, versionId, sectionId, position, ...def });
    items[key] = id;
  }

  const customerId = randomUUID();
  await db.insert(s.customers).values({ id: customerId, organisationId, name: 'Test Keeper', addressLines: '1 Test Row' });
  const vehicle = async (registration: string, spec: Partial<typeof s.vehicles.$inferInsert>) => {
    const id = randomUUID();
    await db.insert(s.vehicles).values({ id, organisationId, customerId, registration, make: 'Testmake', model: 'Testmodel', fuel: 'petrol', ...spec });
    return id;
  };
  const vehicles = {
    petrol: await vehicle('TP01ABC', {
      fuel: 'petrol',
      oilGrade: '0W-20',
      oilCapacityL: 3.2,
      oilFilterPartId: parts.of,
      airFilterPartId: parts.af,
      sparkPlugPartId: parts.sp,
      sparkPlugCount: 4,
    }),
    diesel: await vehicle('TD02DEF', {
      fuel: 'diesel',
      oilGrade: '5W-30',
      oilCapacityL: 4.8,
      oilFilterPartId: parts.of,
      airFilterPartId: parts.af,
      fuelFilterPartId: parts.ff,
    }),
  };
  return { parts, items, versionId, customerId, vehicles };
}

export async function bookVisit(
  org: OrganisationFixture,
  fixture: VanFixture,
  options: { technicianId: string; vehicleId: string; roundDate: string; position?: number; status?: s.VisitStatus; slotEnd?: Date },
) {
  const id = randomUUID();
  const slotStart = new Date(`${options.roundDate}T09:00:00Z`);
  await testDb()
    .insert(s.visits)
    .values({
      id,
      organisationId: org.organisationId,
      customerId: fixture.customerId,
      vehicleId: options.vehicleId,
      technicianId: options.technicianId,
      templateVersionId: fixture.versionId,
      roundDate: options.roundDate,
      roundPosition: options.position ?? 0,
      slotStart,
      slotEnd: options.slotEnd ?? new Date(slotStart.getTime() + 2 * 3_600_000),
      addressLines: '1 Test Row',
      status: options.status ?? 'booked',
    });
  return id;
}
