// The device's view: pulled rows with the outbox's operations merged on top by the server's rules.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { encodeStamp } from '../../../src/lib/sync/clock';
import { ledgerFromPull, localView, type PulledVisitRecords } from '../../../src/lib/sync/local-view';
import type { ItemKind } from '../../../src/lib/sync/ledger';
import { TestDevice } from '../../support/sync-ops';

const visitId = randomUUID();
const check = randomUUID();
const reading = randomUUID();
const findingId = randomUUID();
const items = new Map<string, ItemKind>([
  [check, 'check'],
  [reading, 'reading'],
]);
const server = (ms: number) => encodeStamp({ wallMs: ms, counter: 0, deviceId: 'server' });
const T0 = Date.UTC(2026, 3, 2, 9, 0, 0);

function pulled(overrides: Partial<PulledVisitRecords> = {}): PulledVisitRecords {
  return {
    checkResults: [{ visitId, itemId: check, state: 'done', stamp: server(T0) }],
    readingResults: [{ visitId, itemId: reading, value: 2.4, textValue: null, unit: 'mm', stamp: server(T0) }],
    findings: [
      { id: findingId, visitId, itemId: null, title: 'Wiper blades smearing', detail: '', severity: 'now', severityStamp: server(T0), stamp: server(T0) },
    ],
    notes: [],
    photos: [],
    partLines: [],
    signOffs: [],
    ...overrides,
  };
}

describe('local view', () => {
  it('shows pulled values where nothing is waiting in the outbox', () => {
    const view = localView(ledgerFromPull(visitId, 'in_progress', items, pulled()), [], { userId: 'u', role: 'technician' });
    expect(view.checks.get(check)?.state).toBe('done');
    expect(view.readings.get(reading)?.value).toBe(2.4);
  });

  it('keeps an unpushed change on top of an older pulled value, as the server will', () => {
    const phone = new TestDevice('phone', T0 + 60_000);
    const pending = [phone.check(visitId, check, 'skipped', server(T0)), phone.finding(visitId, findingId, 'watch', { seen: server(T0) })];
    const view = localView(ledgerFromPull(visitId, 'in_progress', items, pulled()), pending, { userId: 'u', role: 'technician' });
    expect(view.checks.get(check)?.state).toBe('skipped');
    // A technician cannot lower a severity; the phone shows what the server will keep.
    expect(view.findings.get(findingId)?.severity).toBe('now');
  });

  it('shows a pending change as locked out once the pull says the visit is signed off', () => {
    const phone = new TestDevice('phone', T0 + 60_000);
    const records = pulled({
      signOffs: [
        {
          id: randomUUID(),
          visitId,
          odometer: 1000,
          odometerUnit: 'km',
          customerName: 'Ola Brook',
          signatureSvg: '<svg/>',
          declaration: 'Done.',
          technicianId: 'u2',
          signedAt: new Date(T0).toISOString(),
          stamp: server(T0),
          voided: false,
        },
      ],
    });
    const view = localView(ledgerFromPull(visitId, 'signed_off', items, records), [phone.reading(visitId, reading, 9.9)], { userId: 'u', role: 'technician' });
    expect(view.readings.get(reading)?.value).toBe(2.4);
  });

  it('leaves the pulled ledger untouched', () => {
    const ledger = ledgerFromPull(visitId, 'in_progress', items, pulled());
    localView(ledger, [new TestDevice('phone', T0 + 60_000).check(visitId, check, 'not_yet')], { userId: 'u', role: 'technician' });
    expect(ledger.checks.get(check)?.state).toBe('done');
  });
});
