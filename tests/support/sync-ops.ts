// Builds sync operations the way a device does: each device has its own hybrid logical clock,
// every operation gets a fresh id and the next stamp. Used by unit and integration tests.
import { randomUUID } from 'node:crypto';
import { encodeStamp, tick, type Hlc, type Stamp } from '../../src/lib/sync/clock';
import type { Operation, OperationKind, OperationOf } from '../../src/lib/sync/operations';

export const SIGNATURE = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M1 1 L9 9"/></svg>';

export class TestDevice {
  private clock: Hlc;
  constructor(
    readonly deviceId: string,
    private wallMs: number,
  ) {
    this.clock = { wallMs: 0, counter: 0, deviceId };
  }

  /** Moves the device's wall clock on (the next stamp uses it). */
  advance(ms: number): this {
    this.wallMs += ms;
    return this;
  }

  nextStamp(): Stamp {
    this.wallMs += 1000;
    this.clock = tick(this.clock, this.wallMs);
    return encodeStamp(this.clock);
  }

  op<K extends OperationKind>(visitId: string, kind: K, payload: OperationOf<K>['payload'], seenStamp: Stamp | null = null): OperationOf<K> {
    return { opId: randomUUID(), visitId, deviceId: this.deviceId, stamp: this.nextStamp(), seenStamp, kind, payload } as OperationOf<K>;
  }

  check(visitId: string, itemId: string, state: 'done' | 'skipped' | 'not_yet', seen: Stamp | null = null) {
    return this.op(visitId, 'check', { itemId, state }, seen);
  }

  reading(visitId: string, itemId: string, value: number, seen: Stamp | null = null, unit = 'mm') {
    return this.op(visitId, 'reading', { itemId, value, textValue: null, unit }, seen);
  }

  finding(
    visitId: string,
    findingId: string,
    severity: 'ok' | 'watch' | 'soon' | 'now',
    options: { title?: string; downgrade?: boolean; seen?: Stamp | null; itemId?: string | null } = {},
  ) {
    return this.op(
      visitId,
      'finding',
      {
        findingId,
        itemId: options.itemId ?? null,
        title: options.title ?? 'Rear brake hose perished',
        detail: 'Surface cracking along the outer cover.',
        severity,
        downgrade: options.downgrade ?? false,
      },
      options.seen ?? null,
    );
  }

  note(visitId: string, body: string, noteId: string = randomUUID()) {
    return this.op(visitId, 'note', { noteId, body });
  }

  partLine(visitId: string, lineId: string, quantity: number, options: { removed?: boolean; itemId?: string | null; partNumber?: string } = {}) {
    return this.op(visitId, 'part_line', {
      lineId,
      itemId: options.itemId ?? null,
      partId: null,
      partNumber: options.partNumber ?? 'TK-OF-118',
      description: 'Oil filter',
      quantity,
      unit: '{each}',
      removed: options.removed ?? false,
    });
  }

  photoAdd(visitId: string, photoId: string, sha256: string, options: { caption?: string; seen?: Stamp | null; sizeBytes?: number } = {}) {
    return this.op(
      visitId,
      'photo.add',
      {
        photoId,
        findingId: null,
        itemId: null,
        caption: options.caption ?? 'Worn pad',
        sha256,
        contentType: 'image/png',
        sizeBytes: options.sizeBytes ?? 100,
        width: null,
        height: null,
      },
      options.seen ?? null,
    );
  }

  photoRemove(visitId: string, photoId: string, seen: Stamp | null) {
    return this.op(visitId, 'photo.remove', { photoId }, seen);
  }

  signOff(visitId: string, signOffId: string = randomUUID()) {
    return this.op(visitId, 'sign_off', {
      signOffId,
      odometer: 48_210,
      odometerUnit: '[mi_i]',
      customerName: 'Rosa Quill',
      signatureSvg: SIGNATURE,
      declaration: 'I carried out the work recorded here.',
      signedAt: new Date(this.wallMs).toISOString(),
    });
  }
}

export type AnyOperation = Operation;
