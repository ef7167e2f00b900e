// Office data for one test organisation: a published checklist made through the template
// service, customers, vehicles, visits, and what a synced visit holds (results, findings,
// sign-off, operations, conflicts) written as the sync service would leave it.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import * as s from '../../src/db/schema';
import { encodeStamp } from '../../src/lib/sync/clock';
import { insertTemplate, publishVersion, writeDraftContent, type VersionContent } from '../../src/lib/server/templates';
import { testDb } from './database';
import type { OrganisationFixture } from './fixtures';

export const SMALL_CHECKLIST: VersionContent = {
  sections: [
    {
      title: 'Under the bonnet',
      items: [
        { kind: 'check', label: 'Coolant level and hoses', unit: null, expectedMin: null, expectedMax: null, rule: null, partKind: null, caution: 'Never open a hot cooling system.', hint: null },
        { kind: 'reading', label: 'Battery resting voltage', unit: 'V', expectedMin: 12.4, expectedMax: 12.9, rule: 'battery_rest', partKind: null, caution: null, hint: null },
        { kind: 'reading', label: 'Oil grade used', unit: '{grade}', expectedMin: null, expectedMax: null, rule: 'oil_grade', partKind: null, caution: null, hint: null },
        { kind: 'part', label: 'Oil filter replaced', unit: '{each}', expectedMin: null, expectedMax: null, rule: null, partKind: 'oil_filter', caution: null, hint: null },
      ],
    },
    {
      title: 'Wheels',
      items: [{ kind: 'reading', label: 'Tread depth, front left', unit: 'mm', expectedMin: 1.6, expectedMax: 12, rule: 'tread_depth', partKind: null, caution: null, hint: null }],
    },
  ],
};

export async function publishedChecklist(org: OrganisationFixture, name = 'Test service', content: VersionContent = SMALL_CHECKLIST) {
  const db = testDb();
  return db.transaction(async (tx) => {
    const { template, version } = await insertTemplate(tx, org.organisationId, { name, description: '', labourCentiHours: 150 });
    await writeDraftContent(tx, org.organisationId, version.id, content);
    await publishVersion(tx, org.organisationId, version.id, org.owner.id);
    return { templateId: template.id, versionId: version.id };
  });
}

let plate = 0;

export async function customerWithVehicle(org: OrganisationFixture, name = 'Ada Testwell') {
  const db = testDb();
  const [customer] = await db
    .insert(s.customers)
    .values({ organisationId: org.organisationId, name, addressLines: '1 Test Lane, Aldersby', postcode: 'QX1 1TT' })
    .returning();
  plate += 1;
  const [vehicle] = await db
    .insert(s.vehicles)
    .values({
      organisationId: org.organisationId,
      customerId: customer!.id,
      registration: `QT${String(plate).padStart(2, '0')}${randomUUID().slice(0, 4).toUpperCase().replace(/[^A-Z0-9]/g, 'X')}`,
      make: 'Corvane',
      model: 'Pippet',
      engine: '1.2 petrol',
      fuel: 'petrol',
      oilGrade: '0W-20',
    })
    .returning();
  return { customer: customer!, vehicle: vehicle! };
}

export async function visitFor(
  org: OrganisationFixture,
  refs: { customerId: string; vehicleId: string; versionId: string },
  slot: { roundDate: string; start: string; end: string; technicianId?: string; status?: s.VisitStatus },
) {
  const [visit] = await testDb()
    .insert(s.visits)
    .values({
      organisationId: org.organisationId,
      customerId: refs.customerId,
      vehicleId: refs.vehicleId,
      technicianId: slot.technicianId ?? org.technician.id,
      templateVersionId: refs.versionId,
      roundDate: slot.roundDate,
      slotStart: new Date(slot.start),
      slotEnd: new Date(slot.end),
      addressLines: '1 Test Lane, Aldersby',
      status: slot.status ?? 'booked',
    })
    .returning();
  return visit!;
}

/** What a visit holds after its technician's phone synced it and signed it off. */
export async function syncedSignedOffVisit(org: OrganisationFixture, visit: typeof s.visits.$inferSelect, options: { openConflict?: boolean } = {}) {
  const db = testDb();
  const items = await db.select().from(s.templateItems).where(eq(s.templateItems.versionId, visit.templateVersionId));
  const byLabel = (label: string) => items.find((i) => i.label === label)!;
  let minute = 0;
  const stamp = () => encodeStamp({ wallMs: visit.slotStart.getTime() + ++minute * 60_000, counter: 0, deviceId: 'test-phone' });
  const op = async (kind: string, entityId: string, payload: unknown, outcome: s.OpOutcome = 'applied') => {
    const opId = randomUUID();
    await db.insert(s.syncOperations).values({
      opId,
      organisationId: org.organisationId,
      visitId: visit.id,
      userId: visit.technicianId,
      deviceId: 'test-phone',
      kind,
      entityId,
      stamp: stamp(),
      payload,
      outcome,
    });
    return opId;
  };
  const coolant = byLabel('Coolant level and hoses');
  await db.insert(s.checkResults).values({ visitId: visit.id, itemId: coolant.id, state: 'done', stamp: stamp(), opId: await op('check', coolant.id, { state: 'done' }), updatedBy: visit.technicianId });
  const battery = byLabel('Battery resting voltage');
  await db.insert(s.readingResults).values({ visitId: visit.id, itemId: battery.id, value: 12.2, unit: 'V', stamp: stamp(), opId: await op('reading', battery.id, { value: 12.2 }), updatedBy: visit.technicianId });
  const tread = byLabel('Tread depth, front left');
  await db.insert(s.readingResults).values({ visitId: visit.id, itemId: tread.id, value: 1.4, unit: 'mm', stamp: stamp(), opId: await op('reading', tread.id, { value: 1.4 }), updatedBy: visit.technicianId });
  const findingId = randomUUID();
  await db.insert(s.findings).values({ id: findingId, visitId: visit.id, itemId: tread.id, title: 'Front left tyre below the legal limit', detail: '1.4 mm across the central band.', severity: 'now', severityStamp: stamp(), stamp: stamp(), createdBy: visit.technicianId });
  await db.insert(s.photos).values({
    id: randomUUID(),
    visitId: visit.id,
    findingId,
    objectKey: `photos/${'a'.repeat(64)}`,
    sha256: 'a'.repeat(64),
    sizeBytes: 123_456,
    contentType: 'image/jpeg',
    addStamp: stamp(),
    createdBy: visit.technicianId,
  });
  const signOffOp = await op('sign_off', visit.id, { odometer: 41_000 });
  await db.insert(s.signOffs).values({
    id: randomUUID(),
    visitId: visit.id,
    odometer: 41_000,
    odometerUnit: '[mi_i]',
    customerName: 'Ada Testwell',
    // A hostile signature: it must only ever be shown as an image, never as markup.
    signatureSvg: '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><script>window.__signed=1</script><path d="M0 5 L10 5" stroke="black"/></svg>',
    declaration: 'I carried out the work recorded here.',
    technicianId: visit.technicianId,
    signedAt: new Date(visit.slotStart.getTime() + 90 * 60_000),
    stamp: stamp(),
    opId: signOffOp,
  });
  if (options.openConflict) {
    const late = await op('reading', battery.id, { value: 12.6 }, 'locked');
    await db.insert(s.conflicts).values({
      organisationId: org.organisationId,
      visitId: visit.id,
      opId: late,
      kind: 'reading',
      entityId: battery.id,
      reason: 'visit_locked',
      proposed: { value: 12.6 },
      standing: { value: 12.2 },
    });
  }
  await db.update(s.visits).set({ status: 'signed_off' }).where(eq(s.visits.id, visit.id));
  return { findingId };
}
