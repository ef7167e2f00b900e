// A technician's round for one test: in a fresh organisation (tests/support/fixtures.ts), one
// customer with one invented vehicle, the interim-service checklist, and one visit today.
import { randomUUID } from 'node:crypto';
import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import * as s from '../../src/db/schema';
import { INTERIM_SERVICE, type ChecklistSeed } from '../../src/db/seed/checklists';
import { testDb } from './database';
import type { OrganisationFixture } from './fixtures';

export type RoundFixture = {
  visitId: string;
  vehicleId: string;
  customerName: string;
  registration: string;
  /** Template item ids by the seed checklist's item key ('oil-grade', 'tread-fl', ...). */
  items: Record<string, string>;
};

export async function createRound(org: OrganisationFixture, options: { checklist?: ChecklistSeed } = {}): Promise<RoundFixture> {
  const db = testDb();
  const organisationId = org.organisationId;
  const tag = organisationId.slice(0, 4).toUpperCase().replace(/[^A-Z0-9]/g, 'X');
  const [oil, filter] = [randomUUID(), randomUUID()];
  await db.insert(s.parts).values([
    { id: oil, organisationId, partNumber: 'T-OIL-0W20', description: 'Engine oil 0W-20', kind: 'oil', unit: 'L', oilGrade: '0W-20' },
    { id: filter, organisationId, partNumber: 'T-OF-1', description: 'Oil filter, spin-on', kind: 'oil_filter', unit: '{each}' },
  ]);
  const customerId = randomUUID();
  const customerName = 'Wren Halloway';
  await db.insert(s.customers).values({ id: customerId, organisationId, name: customerName, phone: '07700 900999', addressLines: '3 Osier Walk, Testbury', postcode: 'QX9 1TT' });
  const vehicleId = randomUUID();
  const registration = `QT${tag}`.slice(0, 7);
  await db.insert(s.vehicles).values({
    id: vehicleId,
    organisationId,
    customerId,
    registration,
    make: 'Corvane',
    model: 'Pippet',
    engine: '1.2 petrol',
    fuel: 'petrol',
    year: 2019,
    odometerUnit: '[mi_i]',
    oilGrade: '0W-20',
    oilCapacityL: 3.2,
    oilFilterPartId: filter,
    sumpPlugTorqueNm: 30,
    wheelNutTorqueNm: 100,
    brakeFluidGrade: 'DOT 4',
    tyrePressureFrontKpa: 230,
    tyrePressureRearKpa: 220,
    specialTools: ['14 mm bi-hex plug socket'],
    lastServiceOdometer: 31200,
  });

  const checklist = options.checklist ?? INTERIM_SERVICE;
  const templateId = randomUUID();
  const versionId = randomUUID();
  await db.insert(s.checklistTemplates).values({ id: templateId, organisationId, name: checklist.name, description: checklist.description });
  await db.insert(s.templateVersions).values({ id: versionId, templateId, organisationId, version: 1, status: 'published', publishedAt: new Date(), publishedBy: org.owner.id });
  const items: Record<string, string> = {};
  for (const [sectionIndex, section] of checklist.sections.entries()) {
    const sectionId = randomUUID();
    await db.insert(s.templateSections).values({ id: sectionId, versionId, position: sectionIndex, title: section.title });
    for (const [position, item] of section.items.entries()) {
      const id = randomUUID();
      items[item.key] = id;
      await db.insert(s.templateItems).values({
        id,
        versionId,
        sectionId,
        position,
        kind: item.kind,
        label: item.label,
        unit: item.unit ?? null,
        expectedMin: item.expectedMin ?? null,
        expectedMax: item.expectedMax ?? null,
        rule: item.rule ?? null,
        partKind: item.partKind ?? null,
        caution: item.caution ?? null,
        hint: item.hint ?? null,
      });
    }
  }

  // Today in the business's time zone (the organisation default, Europe/London), 09:00 to 10:30.
  const now = new TZDate(Date.now(), 'Europe/London');
  const slotStart = new Date(new TZDate(now.getFullYear(), now.getMonth(), now.getDate(), 9, 0, 'Europe/London').getTime());
  const visitId = randomUUID();
  await db.insert(s.visits).values({
    id: visitId,
    organisationId,
    customerId,
    vehicleId,
    technicianId: org.technician.id,
    templateVersionId: versionId,
    roundDate: format(now, 'yyyy-MM-dd'),
    roundPosition: 0,
    slotStart,
    slotEnd: new Date(slotStart.getTime() + 90 * 60_000),
    addressLines: '3 Osier Walk, Testbury',
    postcode: 'QX9 1TT',
    accessNotes: 'Car on the drive; keys with the neighbour at number 5.',
  });
  return { visitId, vehicleId, customerName, registration, items };
}
