// A small pull page for device-store tests: one visit on one round, its customer, vehicle and a
// two-section checklist. Invented data, shaped by lib/sync/pull.ts (parsed, so it stays true to it).
import { randomUUID } from 'node:crypto';
import { pullResponseSchema, type PullResponse } from '../../../src/lib/sync/pull';

export function emptyPage(cursor = '1'): PullResponse {
  return pullResponseSchema.parse({
    cursor,
    hasMore: false,
    removedVisitIds: [],
    visits: [],
    customers: [],
    vehicles: [],
    parts: [],
    modelNotes: [],
    templateVersions: [],
    checkResults: [],
    readingResults: [],
    findings: [],
    notes: [],
    photos: [],
    partLines: [],
    signOffs: [],
  });
}

export function roundPage() {
  const ids = {
    visit: randomUUID(),
    customer: randomUUID(),
    vehicle: randomUUID(),
    version: randomUUID(),
    sectionA: randomUUID(),
    sectionB: randomUUID(),
    check: randomUUID(),
    tread: randomUUID(),
    oilGrade: randomUUID(),
    oilFilter: randomUUID(),
    filterPart: randomUUID(),
  };
  const item = (over: Record<string, unknown>) => ({
    unit: null, expectedMin: null, expectedMax: null, rule: null, partKind: null, caution: null, hint: null, ...over,
  });
  const page = pullResponseSchema.parse({
    ...emptyPage('10'),
    visits: [
      {
        id: ids.visit, customerId: ids.customer, vehicleId: ids.vehicle, technicianId: 'tech-1', templateVersionId: ids.version,
        roundDate: '2026-03-02', roundPosition: 1, slotStart: '2026-03-02T09:00:00.000Z', slotEnd: '2026-03-02T10:30:00.000Z',
        addressLines: '7 Nettle Lane, Aldersby', postcode: 'QX9 9ZZ', accessNotes: 'Side gate', status: 'booked',
      },
    ],
    customers: [{ id: ids.customer, name: 'Rowan Pell', phone: null, addressLines: '7 Nettle Lane, Aldersby', postcode: 'QX9 9ZZ' }],
    vehicles: [
      {
        id: ids.vehicle, customerId: ids.customer, registration: 'QA11TST', vin: null, make: 'Corvane', model: 'Pippet', engine: '1.2 petrol',
        fuel: 'petrol', year: 2019, odometerUnit: '[mi_i]', oilGrade: '0W-20', oilCapacityL: 3.2, oilFilterPartId: ids.filterPart,
        airFilterPartId: null, cabinFilterPartId: null, fuelFilterPartId: null, sparkPlugPartId: null, sparkPlugCount: 3, plugThread: 'M12',
        plugSeat: 'flat', plugGapMm: 0.9, plugTorqueNm: 18, sumpPlugTorqueNm: 30, wheelNutTorqueNm: 100, brakeFluidGrade: 'DOT 4',
        tyrePressureFrontKpa: 230, tyrePressureRearKpa: 220, specialTools: [], serviceIntervalMonths: 12, serviceIntervalDistance: 10000,
        lastServiceDate: '2025-03-01', lastServiceOdometer: 30000,
      },
    ],
    parts: [{ id: ids.filterPart, partNumber: 'OF-118', description: 'Oil filter', kind: 'oil_filter', unit: '{each}', oilGrade: null }],
    templateVersions: [
      {
        id: ids.version, templateId: randomUUID(), name: 'Interim service', version: 1,
        sections: [
          {
            id: ids.sectionA, position: 1, title: 'Underneath',
            items: [
              item({ id: ids.check, sectionId: ids.sectionA, position: 1, kind: 'check', label: 'Exhaust and mountings' }),
              item({ id: ids.oilFilter, sectionId: ids.sectionA, position: 2, kind: 'part', label: 'Oil filter replaced', unit: '{each}', partKind: 'oil_filter' }),
            ],
          },
          {
            id: ids.sectionB, position: 2, title: 'Wheels',
            items: [
              item({ id: ids.tread, sectionId: ids.sectionB, position: 1, kind: 'reading', label: 'Tread depth, front left', unit: 'mm', expectedMin: 1.6, expectedMax: 12, rule: 'tread_depth' }),
              item({ id: ids.oilGrade, sectionId: ids.sectionB, position: 2, kind: 'reading', label: 'Oil grade used', unit: '{grade}', rule: 'oil_grade' }),
            ],
          },
        ],
      },
    ],
  });
  return { page, ids };
}

/** A fresh device database (fake-indexeddb) holding the round of `roundPage()`. */
export async function openDeviceWithRound(prefix: string) {
  const { DeviceDb } = await import('../../../src/lib/device/db');
  const { storePulledPage } = await import('../../../src/lib/device/pull-store');
  const db = new DeviceDb(`${prefix}-${randomUUID()}`);
  const round = roundPage();
  await storePulledPage(db, round.page);
  return { db, ids: round.ids };
}

export async function closeDevice(db: { close(): void; delete(): Promise<void> }) {
  db.close();
  await db.delete();
}
