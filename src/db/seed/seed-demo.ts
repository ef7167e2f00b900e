// Writes the demo scenario. Idempotent: every row has a stable id and existing rows are left as
// they are, so a second run changes nothing. Visits are laid out around `today`.
import { addDays, format, isSunday, subMonths } from 'date-fns';
import { TZDate } from '@date-fns/tz';
import { hashPassword } from 'better-auth/crypto';
import { eq } from 'drizzle-orm';
import type { Database, Executor } from '../client';
import * as s from '../schema';
import { encodeStamp } from '../../lib/sync/clock';
import { reconcileVanStockForVisit } from '../../lib/server/van-stock-reconcile';
import { normaliseRegistration } from '../../lib/trade/registration';
import { clockTime } from '../../lib/office/form-values';
import { localInstant } from '../../lib/office/local-time';
import { templateContentInput } from '../../lib/office/template-input';
import { insertTemplate, publishVersion, writeDraftContent } from '../../lib/server/templates';
import { ANNUAL_SERVICE, INTERIM_SERVICE, type ChecklistItemSeed, type ChecklistSeed } from './checklists';
import { seedId } from './ids';
import { seedInvoices } from './invoices';
import { seedLateNote } from './late-note';
import {
  CHECKLIST_FOR_VEHICLE,
  CUSTOMERS,
  DEMO_PASSWORD,
  MODEL_NOTES,
  ORGANISATION,
  PARTS,
  PEOPLE,
  OIL_CONTAINER_SIZES_L,
  USED_OIL_DISPOSALS,
  VAN_MINIMUMS,
  VAN_OPENING_STOCK,
  VEHICLES,
} from './scenario';

type SeedOptions = { today?: Date };

export async function seedDemo(db: Database, options: SeedOptions = {}) {
  const today = options.today ?? new Date();
  const organisationId = seedId('org', ORGANISATION.key);
  const laidOut = await db.transaction(async (tx) => {
    const { key: _key, ...org } = ORGANISATION;
    await tx.insert(s.organisations).values({ id: organisationId, ...org }).onConflictDoNothing();

    const userIds = await seedPeople(tx, organisationId);
    const partIds = await seedParts(tx, organisationId);
    await seedCustomersAndVehicles(tx, organisationId, partIds, today);
    await seedModelNotes(tx, organisationId);
    const items = new Map<string, ItemRow[]>();
    for (const checklist of [ANNUAL_SERVICE, INTERIM_SERVICE]) {
      items.set(checklist.key, await seedChecklist(tx, organisationId, checklist, userIds.get('owner')!));
    }
    // The week is laid out once, around the day of the first seed: laying it out again on a later
    // day would book the same cars twice in overlapping slots. `npm run demo:reset` starts over.
    const [anyVisit] = await tx.select({ id: s.visits.id }).from(s.visits).where(eq(s.visits.organisationId, organisationId)).limit(1);
    if (anyVisit) return null;
    await seedWeek(tx, organisationId, userIds, items, partIds, today);
    await seedVans(tx, organisationId, userIds, partIds, today);
    await seedInvoices(tx, organisationId, userIds.get('office')!);
    return { lateNoteBy: userIds.get('tech-jess')! };
  });
  // After the week commits: the note goes through the sync merge, which reads the signed visit.
  if (laidOut) await seedLateNote(db, organisationId, laidOut.lateNoteBy);
}

async function seedPeople(tx: Executor, organisationId: string) {
  const ids = new Map<string, string>();
  for (const person of PEOPLE) {
    const existing = await tx.select({ id: s.user.id }).from(s.user).where(eq(s.user.email, person.email));
    if (existing[0]) {
      ids.set(person.key, existing[0].id);
      continue;
    }
    const id = seedId('user', person.key);
    await tx.insert(s.user).values({
      id,
      name: person.name,
      email: person.email,
      emailVerified: true,
      role: person.role,
      organisationId,
    });
    await tx.insert(s.account).values({
      id: seedId('account', person.key),
      accountId: id,
      providerId: 'credential',
      userId: id,
      password: await hashPassword(DEMO_PASSWORD),
    });
    ids.set(person.key, id);
  }
  return ids;
}

async function seedParts(tx: Executor, organisationId: string) {
  const ids = new Map<string, string>();
  for (const { key, ...part } of PARTS) {
    const id = seedId('part', key);
    await tx.insert(s.parts).values({ id, organisationId, ...part, oilGrade: part.oilGrade ?? null }).onConflictDoNothing();
    ids.set(key, id);
  }
  return ids;
}

async function seedCustomersAndVehicles(tx: Executor, organisationId: string, partIds: Map<string, string>, today: Date) {
  for (const { key, ...customer } of CUSTOMERS) {
    await tx.insert(s.customers).values({ id: seedId('customer', key), organisationId, ...customer }).onConflictDoNothing();
  }
  const part = (key: string | undefined) => (key ? partIds.get(key) ?? null : null);
  for (const v of VEHICLES) {
    await tx
      .insert(s.vehicles)
      .values({
        id: seedId('vehicle', v.key),
        organisationId,
        customerId: seedId('customer', v.customer),
        registration: normaliseRegistration(v.registration),
        vin: v.vin ?? null,
        make: v.make,
        model: v.model,
        engine: v.engine,
        fuel: v.fuel,
        year: v.year,
        odometerUnit: '[mi_i]',
        oilGrade: v.oilGrade,
        oilCapacityL: v.oilCapacityL,
        oilFilterPartId: part(v.oilFilter),
        airFilterPartId: part(v.airFilter),
        cabinFilterPartId: part(v.cabinFilter),
        fuelFilterPartId: part(v.fuelFilter),
        sparkPlugPartId: part(v.sparkPlug),
        sparkPlugCount: v.sparkPlugCount ?? null,
        plugThread: v.plugThread ?? null,
        plugSeat: v.plugSeat ?? null,
        plugGapMm: v.plugGapMm ?? null,
        plugTorqueNm: v.plugTorqueNm ?? null,
        sumpPlugTorqueNm: v.sumpPlugTorqueNm,
        wheelNutTorqueNm: v.wheelNutTorqueNm,
        brakeFluidGrade: v.brakeFluidGrade,
        tyrePressureFrontKpa: v.tyrePressureFrontKpa,
        tyrePressureRearKpa: v.tyrePressureRearKpa,
        specialTools: v.specialTools,
        serviceIntervalMonths: v.serviceIntervalMonths,
        serviceIntervalDistance: v.serviceIntervalDistance,
        lastServiceDate: format(subMonths(today, v.lastServiceMonthsAgo), 'yyyy-MM-dd'),
        lastServiceOdometer: v.lastServiceOdometer,
      })
      .onConflictDoNothing();
  }
}

async function seedModelNotes(tx: Executor, organisationId: string) {
  for (const { key, ...note } of MODEL_NOTES) {
    await tx.insert(s.modelNotes).values({ id: seedId('model-note', key), organisationId, ...note }).onConflictDoNothing();
  }
}

type ItemRow = { id: string; key: string; kind: s.ItemKind; unit: string | null; rule: string | null; partKind: s.PartKind | null };

async function seedChecklist(tx: Executor, organisationId: string, checklist: ChecklistSeed, publishedBy: string) {
  const templateId = seedId('template', checklist.key);
  const versionId = seedId('template-version', checklist.key, 1);
  // The editor's own rules check the demo checklists too.
  const content = templateContentInput.parse({
    sections: checklist.sections.map((section) => ({ title: section.title, items: section.items.map(itemInputOf) })),
  });
  const [existing] = await tx
    .select({ id: s.checklistTemplates.id })
    .from(s.checklistTemplates)
    .where(eq(s.checklistTemplates.id, templateId));
  if (!existing) {
    const { name, description, labourCentiHours } = checklist;
    await insertTemplate(tx, organisationId, { name, description, labourCentiHours }, { templateId, versionId });
    await writeDraftContent(tx, organisationId, versionId, {
      sections: content.sections.map((section, sectionIndex) => ({
        id: seedId('section', checklist.key, sectionIndex),
        title: section.title,
        items: section.items.map((item, itemIndex) => ({
          ...item,
          id: seedId('item', checklist.key, checklist.sections[sectionIndex]!.items[itemIndex]!.key),
        })),
      })),
    });
    await publishVersion(tx, organisationId, versionId, publishedBy, new Date('2026-01-05T09:00:00Z'));
  }
  return checklist.sections.flatMap((section) =>
    section.items.map(
      (item): ItemRow => ({
        id: seedId('item', checklist.key, item.key),
        key: item.key,
        kind: item.kind,
        unit: item.unit ?? null,
        rule: item.rule ?? null,
        partKind: item.partKind ?? null,
      }),
    ),
  );
}

function itemInputOf(item: ChecklistItemSeed) {
  return {
    kind: item.kind,
    label: item.label,
    unit: item.unit ?? null,
    expectedMin: item.expectedMin ?? null,
    expectedMax: item.expectedMax ?? null,
    rule: item.rule ?? null,
    partKind: item.partKind ?? null,
    caution: item.caution ?? null,
    hint: item.hint ?? null,
  };
}

// The week: three working days back, today, and two ahead. Sundays are rest days.
const WEEK_PLAN: { day: number; tech: 'tech-tom' | 'tech-jess'; vehicle: string; start: string; hours: number }[] = [
  { day: -3, tech: 'tech-tom', vehicle: 'v07', start: '09:00', hours: 2 },
  { day: -3, tech: 'tech-jess', vehicle: 'v09', start: '10:30', hours: 2 },
  { day: -2, tech: 'tech-tom', vehicle: 'v02', start: '09:00', hours: 2 },
  { day: -2, tech: 'tech-jess', vehicle: 'v12', start: '13:00', hours: 2 },
  { day: -1, tech: 'tech-tom', vehicle: 'v06', start: '09:00', hours: 2 },
  { day: -1, tech: 'tech-jess', vehicle: 'v10', start: '11:00', hours: 1.5 },
  { day: 0, tech: 'tech-tom', vehicle: 'v01', start: '08:30', hours: 2 },
  { day: 0, tech: 'tech-tom', vehicle: 'v05', start: '11:00', hours: 2 },
  { day: 0, tech: 'tech-tom', vehicle: 'v08', start: '14:00', hours: 2 },
  { day: 0, tech: 'tech-jess', vehicle: 'v03', start: '09:30', hours: 1.5 },
  { day: 0, tech: 'tech-jess', vehicle: 'v04', start: '13:00', hours: 2.5 },
  { day: 1, tech: 'tech-tom', vehicle: 'v11', start: '09:00', hours: 2 },
  { day: 1, tech: 'tech-jess', vehicle: 'v13', start: '10:00', hours: 1.5 },
];

/** The working day `offset` working days from `today`, in the business's time zone. */
export function workingDay(today: Date, offset: number, timeZone: string): string {
  let day = new TZDate(today.getTime(), timeZone);
  let remaining = Math.abs(offset);
  const step = offset < 0 ? -1 : 1;
  while (remaining > 0) {
    day = addDays(day, step);
    if (!isSunday(day)) remaining -= 1;
  }
  if (offset === 0 && isSunday(day)) day = addDays(day, 1);
  return format(day, 'yyyy-MM-dd');
}

async function seedWeek(
  tx: Executor,
  organisationId: string,
  userIds: Map<string, string>,
  items: Map<string, ItemRow[]>,
  partIds: Map<string, string>,
  today: Date,
) {
  const tz = ORGANISATION.timeZone;
  const positions = new Map<string, number>();
  for (const plan of WEEK_PLAN) {
    const roundDate = workingDay(today, plan.day, tz);
    const vehicle = VEHICLES.find((v) => v.key === plan.vehicle)!;
    const customer = CUSTOMERS.find((c) => c.key === vehicle.customer)!;
    const checklistKey = CHECKLIST_FOR_VEHICLE[vehicle.key]!;
    const technicianId = userIds.get(plan.tech)!;
    const roundKey = `${plan.tech}:${roundDate}`;
    const position = positions.get(roundKey) ?? 0;
    positions.set(roundKey, position + 1);
    const slotStart = localInstant(roundDate, clockTime.parse(plan.start), tz);
    const slotEnd = new Date(slotStart.getTime() + plan.hours * 3_600_000);
    const visitId = seedId('visit', roundDate, plan.tech, plan.vehicle);
    const done = plan.day < 0;
    const inserted = await tx
      .insert(s.visits)
      .values({
        id: visitId,
        organisationId,
        customerId: seedId('customer', customer.key),
        vehicleId: seedId('vehicle', vehicle.key),
        technicianId,
        templateVersionId: seedId('template-version', checklistKey, 1),
        roundDate,
        roundPosition: position,
        slotStart,
        slotEnd,
        addressLines: customer.addressLines,
        postcode: customer.postcode,
        accessNotes: vehicle.key === 'v05' ? 'Ask at reception for the key; park on the gravel, not the bays.' : '',
        status: plan.day === -3 ? 'reviewed' : done ? 'signed_off' : 'booked',
        reviewedAt: plan.day === -3 ? slotEnd : null,
        reviewedBy: plan.day === -3 ? userIds.get('office')! : null,
      })
      .onConflictDoNothing()
      .returning({ id: s.visits.id });
    if (done && inserted.length > 0) {
      await seedVisitResults(tx, {
        visitId,
        technicianId,
        vehicle,
        items: items.get(checklistKey)!,
        partIds,
        slotStart,
        customerName: customer.name,
      });
    }
  }
}

type VisitResultSeed = {
  visitId: string;
  technicianId: string;
  vehicle: (typeof VEHICLES)[number];
  items: ItemRow[];
  partIds: Map<string, string>;
  slotStart: Date;
  customerName: string;
};

// Readings a careful technician would record on these cars; a few are deliberately poor so the
// demo has findings to review.
function demoReading(key: string, v: VisitResultSeed['vehicle']): number | string | null {
  const worn = v.key === 'v09';
  const table: Record<string, number | string | undefined> = {
    'used-oil': Math.round((v.oilCapacityL - 0.3) * 10) / 10,
    'sump-plug': v.sumpPlugTorqueNm,
    'oil-grade': v.oilGrade,
    'plug-gap': v.plugGapMm,
    'plug-torque': v.plugTorqueNm,
    'coolant-protection': v.key === 'v02' ? -18 : -34,
    'brake-fluid-boiling': v.key === 'v07' ? 152 : 196,
    'battery-rest': v.key === 'v12' ? 12.31 : 12.62,
    charging: 14.1,
    'earth-drop': 0.08,
    'tread-fl': 5.4,
    'tread-fr': 5.1,
    'tread-rl': worn ? 2.1 : 4.6,
    'tread-rr': worn ? 1.9 : 4.4,
    'pressure-front': v.tyrePressureFrontKpa,
    'pressure-rear': v.tyrePressureRearKpa,
    'pads-front': v.key === 'v07' ? 2.5 : 7.2,
    'pads-rear': 6.0,
    'wheel-nuts': v.wheelNutTorqueNm,
  };
  return table[key] ?? null;
}

const DEMO_FINDINGS: Record<string, { title: string; detail: string; severity: s.Severity; itemKey?: string }[]> = {
  v07: [
    { title: 'Front brake pads worn to 2.5 mm', detail: 'Both sides even. Replace pads; discs measured within limits.', severity: 'soon', itemKey: 'pads-front' },
    { title: 'Brake fluid boiling point low (152 °C)', detail: 'Below the DOT 4 wet minimum of 155 °C. Renew the fluid.', severity: 'soon', itemKey: 'brake-fluid-boiling' },
  ],
  v09: [
    { title: 'Rear tyres near the legal limit', detail: 'RL 2.1 mm, RR 1.9 mm across the central tread. Replace both rear tyres within weeks.', severity: 'soon', itemKey: 'tread-rr' },
  ],
  v02: [
    { title: 'Breather elbow hardening', detail: 'No split yet; crackles when squeezed. Keep an eye on it.', severity: 'watch' },
    { title: 'Coolant protection only to −18 °C', detail: 'Topped up with water at some point. Advise a coolant change before winter.', severity: 'soon', itemKey: 'coolant-protection' },
  ],
  v12: [{ title: 'Battery resting voltage 12.31 V', detail: 'About half charged after a night parked. Retest after a long drive.', severity: 'watch', itemKey: 'battery-rest' }],
};

const DECLARATION =
  'I carried out the work recorded here, and the vehicle was left safe to drive. The vehicle maker’s data and local regulations take precedence over the values shown.';

// A short signature stroke, drawn as an SVG path.
const DEMO_SIGNATURE =
  '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 300 100"><path d="M10 70 C 40 10, 60 90, 90 40 S 140 80, 170 30 S 230 70, 290 40" fill="none" stroke="#14202b" stroke-width="3"/></svg>';

async function seedVisitResults(tx: Executor, seed: VisitResultSeed) {
  const deviceId = `seed-${seed.technicianId.slice(0, 8)}`;
  let minute = 0;
  const nextStamp = () => {
    minute += 1;
    return encodeStamp({ wallMs: seed.slotStart.getTime() + minute * 60_000, counter: 0, deviceId });
  };
  const { vehicle } = seed;
  for (const item of seed.items) {
    const opId = seedId('op', seed.visitId, item.key);
    if (item.kind === 'check') {
      await tx.insert(s.checkResults).values({
        visitId: seed.visitId,
        itemId: item.id,
        state: 'done',
        stamp: nextStamp(),
        opId,
        updatedBy: seed.technicianId,
      });
    } else if (item.kind === 'reading') {
      const value = demoReading(item.key, vehicle);
      if (value === null || value === undefined) continue;
      await tx.insert(s.readingResults).values({
        visitId: seed.visitId,
        itemId: item.id,
        value: typeof value === 'number' ? value : null,
        textValue: typeof value === 'string' ? value : null,
        unit: item.unit,
        stamp: nextStamp(),
        opId,
        updatedBy: seed.technicianId,
      });
    } else {
      const line = demoPartLine(item, vehicle, seed.partIds);
      if (!line) continue;
      await tx.insert(s.partLines).values({
        id: seedId('part-line', seed.visitId, item.key),
        visitId: seed.visitId,
        itemId: item.id,
        ...line,
        stamp: nextStamp(),
        updatedBy: seed.technicianId,
      });
    }
  }
  for (const [index, finding] of (DEMO_FINDINGS[vehicle.key] ?? []).entries()) {
    const stamp = nextStamp();
    await tx.insert(s.findings).values({
      id: seedId('finding', seed.visitId, index),
      visitId: seed.visitId,
      itemId: finding.itemKey ? seed.items.find((i) => i.key === finding.itemKey)?.id ?? null : null,
      title: finding.title,
      detail: finding.detail,
      severity: finding.severity,
      severityStamp: stamp,
      stamp,
      createdBy: seed.technicianId,
    });
  }
  const odometer = vehicle.lastServiceOdometer + 9000 + (vehicle.year % 7) * 311;
  const signedAt = new Date(seed.slotStart.getTime() + 100 * 60_000);
  await tx.insert(s.signOffs).values({
    id: seedId('sign-off', seed.visitId),
    visitId: seed.visitId,
    odometer,
    odometerUnit: '[mi_i]',
    customerName: seed.customerName,
    signatureSvg: DEMO_SIGNATURE,
    declaration: DECLARATION,
    technicianId: seed.technicianId,
    signedAt,
    stamp: nextStamp(),
    opId: seedId('op', seed.visitId, 'sign-off'),
  });
  await tx
    .update(s.vehicles)
    .set({ lastServiceDate: format(signedAt, 'yyyy-MM-dd'), lastServiceOdometer: odometer })
    .where(eq(s.vehicles.id, seedId('vehicle', vehicle.key)));
}

function demoPartLine(item: ItemRow, v: VisitResultSeed['vehicle'], partIds: Map<string, string>) {
  const lookup = (key: string | undefined) => {
    if (!key) return undefined;
    const part = PARTS_BY_KEY.get(key);
    return part ? { partId: partIds.get(key)!, partNumber: part.partNumber, description: part.description } : undefined;
  };
  switch (item.partKind) {
    case 'oil': {
      const oil = [...PARTS_BY_KEY.values()].find((p) => p.kind === 'oil' && p.oilGrade === v.oilGrade);
      if (!oil) return undefined;
      return { partId: partIds.get(oil.key)!, partNumber: oil.partNumber, description: oil.description, quantity: v.oilCapacityL, unit: 'L' };
    }
    case 'oil_filter':
      return withQuantity(lookup(v.oilFilter), 1);
    case 'air_filter':
      return withQuantity(lookup(v.airFilter), 1);
    case 'cabin_filter':
      return withQuantity(lookup(v.cabinFilter), 1);
    case 'fuel_filter':
      return withQuantity(lookup(v.fuelFilter), 1);
    case 'spark_plug':
      return withQuantity(lookup(v.sparkPlug), v.sparkPlugCount ?? 0);
    default:
      return undefined;
  }
}

function withQuantity(part: { partId: string; partNumber: string; description: string } | undefined, quantity: number) {
  return part && quantity > 0 ? { ...part, quantity, unit: '{each}' } : undefined;
}

const PARTS_BY_KEY = new Map(PARTS.map((p) => [p.key, p]));

/**
 * Oil containers, each van's opening stock and minimums, and a used-oil disposal. The parts
 * fitted on the seeded visits then come off the vans the way synced part lines do.
 */
async function seedVans(tx: Executor, organisationId: string, userIds: Map<string, string>, partIds: Map<string, string>, today: Date) {
  const tz = ORGANISATION.timeZone;
  for (const [partKey, sizes] of Object.entries(OIL_CONTAINER_SIZES_L)) {
    for (const sizeL of sizes) {
      await tx
        .insert(s.oilContainers)
        .values({ id: seedId('oil-container', partKey, sizeL), organisationId, partId: partIds.get(partKey)!, sizeL })
        .onConflictDoNothing();
    }
  }
  const loadedAt = localInstant(workingDay(today, -4, tz), clockTime.parse('07:30'), tz);
  for (const [tech, stock] of Object.entries(VAN_OPENING_STOCK)) {
    const technicianId = userIds.get(tech)!;
    for (const [partKey, quantity] of Object.entries(stock)) {
      await tx
        .insert(s.vanStockMovements)
        .values({
          id: seedId('van-opening', tech, partKey),
          organisationId,
          technicianId,
          partId: partIds.get(partKey)!,
          quantity,
          reason: 'restock',
          note: 'Loaded for the week',
          recordedBy: userIds.get('office')!,
          recordedAt: loadedAt,
        })
        .onConflictDoNothing();
    }
    for (const [partKey, minimum] of Object.entries(VAN_MINIMUMS)) {
      await tx
        .insert(s.vanStockMinimums)
        .values({ organisationId, technicianId, partId: partIds.get(partKey)!, minimum })
        .onConflictDoNothing();
    }
  }
  for (const d of USED_OIL_DISPOSALS) {
    await tx
      .insert(s.usedOilDisposals)
      .values({
        id: seedId('used-oil-disposal', d.key),
        organisationId,
        technicianId: userIds.get(d.tech)!,
        disposedAt: localInstant(workingDay(today, d.day, tz), clockTime.parse(d.time), tz),
        siteName: d.siteName,
        siteLicence: d.siteLicence,
        reference: d.reference,
        litres: d.litres,
        recordedBy: userIds.get('office')!,
        recordedAt: localInstant(workingDay(today, d.day, tz), clockTime.parse(d.time), tz),
      })
      .onConflictDoNothing();
  }
  const seededVisits = await tx.select({ id: s.visits.id }).from(s.visits).where(eq(s.visits.organisationId, organisationId));
  for (const visit of seededVisits) await reconcileVanStockForVisit(tx, visit.id);
}
