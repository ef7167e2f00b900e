// Everything a technician records on a visit. Each action writes the new state and its outbox
// operation in ONE IndexedDB transaction (with the clock tick), so the phone never holds a change
// the outbox does not know about, nor an operation for a change it does not show.
import type { ZodError } from 'zod';
import type { Stamp } from '../sync/clock';
import type { Operation, OperationOf, Severity } from '../sync/operations';
import { recordingTables, type CheckState, type DeviceDb, type LocalPhoto } from './db';
import { nextStamp } from './clock-store';

/** The change could not be recorded; `message` says what to do. Nothing was written. */
export class RecordingError extends Error {}

export class VisitLockedError extends RecordingError {
  constructor() {
    super('This visit is signed off and locked. The office can reopen it if something must change.');
  }
}

// The operation schema carries zod, which the visit page does not need for its first paint:
// it is loaded with the first change (from the service worker's cache when offline).
let schema: Promise<typeof import('../sync/operations').operationSchema> | undefined;
function operationSchema() {
  schema ??= import('../sync/operations').then((m) => m.operationSchema);
  return schema;
}

function describe(error: ZodError): string {
  return error.issues
    .map((issue) => `${issue.path.filter((p) => p !== 'payload').join('.') || 'change'} ${issue.message}`)
    .join('; ');
}

type Envelope = { opId: string; visitId: string; deviceId: string; stamp: Stamp };

/**
 * Records one change: `build` receives the envelope and returns the operation and a writer that
 * applies the validated operation to local state. A thrown error rolls everything back.
 */
async function recordChange<O extends Operation>(
  db: DeviceDb,
  visitId: string,
  build: (envelope: Envelope) => Promise<{ op: O; apply: (op: O) => Promise<void> }>,
): Promise<O> {
  const validator = await operationSchema();
  return db.transaction('rw', recordingTables(db), async () => {
    const visit = await db.visits.get(visitId);
    if (!visit) throw new RecordingError('This visit is not on this phone any more. Go back to the round.');
    if (await db.signOffs.get(visitId)) throw new VisitLockedError();
    const { stamp, deviceId } = await nextStamp(db);
    const { op, apply } = await build({ opId: crypto.randomUUID(), visitId, deviceId, stamp });
    const parsed = validator.safeParse(op);
    if (!parsed.success) throw new RecordingError(`Not saved: ${describe(parsed.error)}.`);
    const valid = parsed.data as O;
    await apply(valid);
    await db.outbox.add({
      opId: valid.opId,
      visitId,
      kind: valid.kind,
      entityId: entityIdOf(valid),
      op: valid,
      state: 'pending',
      attempts: 0,
      reason: null,
      createdAt: new Date().toISOString(),
    });
    return valid;
  });
}

// lib/sync/operations exports these too, but importing a value from there pulls zod into the
// page's first load; tests/unit/device keeps the copies equal to the originals.
export const SEVERITY_RANK: Record<Severity, number> = { ok: 0, watch: 1, soon: 2, now: 3 };

export function entityIdOf(op: Operation): string {
  switch (op.kind) {
    case 'check':
    case 'reading':
      return op.payload.itemId;
    case 'finding':
      return op.payload.findingId;
    case 'note':
      return op.payload.noteId;
    case 'photo.add':
    case 'photo.remove':
      return op.payload.photoId;
    case 'part_line':
      return op.payload.lineId;
    case 'sign_off':
      return op.visitId;
  }
}

export function setCheck(db: DeviceDb, visitId: string, itemId: string, state: CheckState) {
  return recordChange<OperationOf<'check'>>(db, visitId, async (envelope) => {
    const current = await db.checkResults.get([visitId, itemId]);
    return {
      op: { ...envelope, kind: 'check', seenStamp: current?.stamp ?? null, payload: { itemId, state } },
      apply: async (op) => {
        await db.checkResults.put({ visitId, itemId, state: op.payload.state, stamp: op.stamp });
      },
    };
  });
}

export type ReadingInput = { value: number; textValue?: never } | { textValue: string; value?: never };

export function recordReading(db: DeviceDb, visitId: string, itemId: string, reading: ReadingInput, unit: string) {
  return recordChange<OperationOf<'reading'>>(db, visitId, async (envelope) => {
    const current = await db.readingResults.get([visitId, itemId]);
    const payload = {
      itemId,
      value: reading.value ?? null,
      textValue: reading.textValue ?? null,
      unit,
    };
    return {
      op: { ...envelope, kind: 'reading', seenStamp: current?.stamp ?? null, payload },
      apply: async (op) => {
        const { value, textValue, unit: u } = op.payload;
        await db.readingResults.put({ visitId, itemId, value, textValue, unit: u, stamp: op.stamp });
      },
    };
  });
}

export type FindingInput = {
  findingId?: string;
  itemId: string | null;
  title: string;
  detail: string;
  severity: Severity;
};

export function saveFinding(db: DeviceDb, visitId: string, input: FindingInput) {
  return recordChange<OperationOf<'finding'>>(db, visitId, async (envelope) => {
    const findingId = input.findingId ?? crypto.randomUUID();
    const current = await db.findings.get(findingId);
    // The higher severity wins on the server and only the office may lower one (PRODUCT.md):
    // refusing here keeps the phone from showing a value the server would never accept.
    if (current && SEVERITY_RANK[input.severity] < SEVERITY_RANK[current.severity]) {
      throw new RecordingError(`Only the office can lower a severity. This finding stays at “${current.severity}” or higher.`);
    }
    const payload = {
      findingId,
      itemId: input.itemId,
      title: input.title,
      detail: input.detail,
      severity: input.severity,
      downgrade: false,
    };
    return {
      op: { ...envelope, kind: 'finding', seenStamp: current?.stamp ?? null, payload },
      apply: async (op) => {
        const p = op.payload;
        await db.findings.put({
          id: findingId,
          visitId,
          itemId: p.itemId,
          title: p.title,
          detail: p.detail,
          severity: p.severity,
          stamp: op.stamp,
        });
      },
    };
  });
}

export function addNote(db: DeviceDb, visitId: string, body: string) {
  return recordChange<OperationOf<'note'>>(db, visitId, async (envelope) => {
    const noteId = crypto.randomUUID();
    return {
      op: { ...envelope, kind: 'note', seenStamp: null, payload: { noteId, body } },
      apply: async (op) => {
        await db.notes.put({ id: noteId, visitId, body: op.payload.body, stamp: op.stamp });
      },
    };
  });
}

export type PreparedPhoto = {
  blob: Blob;
  sha256: string;
  contentType: 'image/jpeg' | 'image/png' | 'image/webp';
  width: number | null;
  height: number | null;
};

export function addPhoto(
  db: DeviceDb,
  visitId: string,
  photo: PreparedPhoto,
  links: { findingId?: string | null; itemId?: string | null; caption?: string } = {},
) {
  return recordChange<OperationOf<'photo.add'>>(db, visitId, async (envelope) => {
    const photoId = crypto.randomUUID();
    const payload = {
      photoId,
      findingId: links.findingId ?? null,
      itemId: links.itemId ?? null,
      caption: links.caption ?? '',
      sha256: photo.sha256,
      contentType: photo.contentType,
      sizeBytes: photo.blob.size,
      width: photo.width,
      height: photo.height,
    };
    return {
      op: { ...envelope, kind: 'photo.add', seenStamp: null, payload },
      apply: async (op) => {
        const p = op.payload;
        await db.photoBlobs.put({ sha256: p.sha256, blob: photo.blob });
        const row: LocalPhoto = {
          id: photoId,
          visitId,
          findingId: p.findingId,
          itemId: p.itemId,
          caption: p.caption,
          sha256: p.sha256,
          contentType: p.contentType,
          sizeBytes: p.sizeBytes,
          width: p.width,
          height: p.height,
          uploaded: false,
          remoteUrl: null,
          removed: false,
          stamp: op.stamp,
          takenAt: new Date().toISOString(),
        };
        await db.photos.put(row);
      },
    };
  });
}

export function removePhoto(db: DeviceDb, visitId: string, photoId: string) {
  return recordChange<OperationOf<'photo.remove'>>(db, visitId, async (envelope) => {
    const current = await db.photos.get(photoId);
    if (!current || current.visitId !== visitId) throw new RecordingError('That photo is not on this visit.');
    return {
      op: { ...envelope, kind: 'photo.remove', seenStamp: current.stamp, payload: { photoId } },
      apply: async (op) => {
        // The bytes stay until the add is acknowledged: the server still needs them for the add.
        await db.photos.update(photoId, { removed: true, stamp: op.stamp });
      },
    };
  });
}

export type PartLineInput = {
  lineId?: string;
  itemId: string | null;
  partId: string | null;
  partNumber: string;
  description: string;
  quantity: number;
  unit: string;
  removed?: boolean;
};

export function savePartLine(db: DeviceDb, visitId: string, input: PartLineInput) {
  return recordChange<OperationOf<'part_line'>>(db, visitId, async (envelope) => {
    const lineId = input.lineId ?? crypto.randomUUID();
    const current = await db.partLines.get(lineId);
    const payload = {
      lineId,
      itemId: input.itemId,
      partId: input.partId,
      partNumber: input.partNumber,
      description: input.description,
      quantity: input.quantity,
      unit: input.unit,
      removed: input.removed ?? false,
    };
    return {
      op: { ...envelope, kind: 'part_line', seenStamp: current?.stamp ?? null, payload },
      apply: async (op) => {
        const p = op.payload;
        await db.partLines.put({
          id: lineId,
          visitId,
          itemId: p.itemId,
          partId: p.partId,
          partNumber: p.partNumber,
          description: p.description,
          quantity: p.quantity,
          unit: p.unit,
          removed: p.removed,
          stamp: op.stamp,
        });
      },
    };
  });
}

export type SignOffInput = {
  odometer: number;
  odometerUnit: 'km' | '[mi_i]';
  customerName: string;
  signatureSvg: string;
  declaration: string;
};

/** Signs the visit off; from then on the phone refuses every change to it (VisitLockedError). */
export function signOff(db: DeviceDb, visitId: string, input: SignOffInput, now = new Date()) {
  return recordChange<OperationOf<'sign_off'>>(db, visitId, async (envelope) => {
    const signOffId = crypto.randomUUID();
    const payload = { signOffId, ...input, signedAt: now.toISOString() };
    return {
      op: { ...envelope, kind: 'sign_off', seenStamp: null, payload },
      apply: async (op) => {
        const p = op.payload;
        await db.signOffs.put({
          id: signOffId,
          visitId,
          odometer: p.odometer,
          odometerUnit: p.odometerUnit,
          customerName: p.customerName,
          signatureSvg: p.signatureSvg,
          declaration: p.declaration,
          signedAt: p.signedAt,
          stamp: op.stamp,
        });
      },
    };
  });
}
