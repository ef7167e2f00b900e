// Importing a phone's file of unsent changes (lib/sync/unsent-file.ts), for the office. The file
// goes through the very path a sync takes: its photos through storePhoto (type sniffed, hash
// checked, thumbnail made), its operations through pushOperations AS THE TECHNICIAN WHO SAVED IT,
// so authorisation (their own visits only; a visit moved away keeps the work for the office),
// attribution, merge rules and idempotency are those of a sync. Importing the same file again, or
// after the phone synced after all, changes nothing: every operation is then a `duplicate`.
//
// Why office/owner and not the technician: the file exists because the phone cannot reach the
// server, so it travels to the office by other means. The importer is written to the server log
// with the file's device and counts.
import { and, eq } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import * as s from '../../../db/schema';
import type { UserRole } from '../../../db/schema';
import { HttpError } from '../http';
import { MAX_BATCH_OPERATIONS } from '../../sync/push';
import type { Outcome } from '../../sync/operations';
import type { UnsentFile } from '../../sync/unsent-file';
import { MAX_PHOTO_BYTES } from '../photos/photo-bytes';
import { storePhoto } from '../photos/photos';
import { pushOperations } from './push';

type Importer = { id: string; role: UserRole; organisationId: string };

export type UnsentImportSummary = {
  technician: { id: string; name: string };
  deviceId: string;
  operations: number;
  outcomes: Partial<Record<Outcome, number>>;
  /** Operations the server did not take, with its reason (the office decides what to do). */
  rejected: { opId: string; visitId: string; kind: string; reason: string }[];
  photos: { stored: number; alreadyHeld: number; refused: { sha256: string; reason: string }[] };
};

export async function importUnsentFile(importer: Importer, file: UnsentFile): Promise<UnsentImportSummary> {
  const [technician] = await getDb()
    .select({ id: s.user.id, name: s.user.name, role: s.user.role })
    .from(s.user)
    .where(and(eq(s.user.id, file.user.id), eq(s.user.organisationId, importer.organisationId)));
  if (!technician) throw new HttpError(404, 'This file was saved by someone who is not in your business; nothing was imported.');
  if (technician.role !== 'technician') {
    throw new HttpError(422, `This file was saved by ${technician.name}, who is not a technician; only a technician's phone has changes to import.`);
  }
  const pusher = { id: technician.id, role: 'technician' as const, organisationId: importer.organisationId };

  const photos: UnsentImportSummary['photos'] = { stored: 0, alreadyHeld: 0, refused: [] };
  for (const photo of file.photos) {
    const bytes = Buffer.from(photo.base64, 'base64');
    if (bytes.byteLength > MAX_PHOTO_BYTES) {
      photos.refused.push({ sha256: photo.sha256, reason: `larger than ${MAX_PHOTO_BYTES} bytes` });
      continue;
    }
    try {
      const stored = await storePhoto(pusher, photo.sha256, photo.contentType, new Uint8Array(bytes));
      if (stored.created) photos.stored += 1;
      else photos.alreadyHeld += 1;
    } catch (error) {
      // Its photo.add is then rejected by the push below, with the reason; the rest goes on.
      if (!(error instanceof HttpError)) throw error;
      photos.refused.push({ sha256: photo.sha256, reason: error.message });
    }
  }

  const summary: UnsentImportSummary = {
    technician: { id: technician.id, name: technician.name },
    deviceId: file.deviceId,
    operations: file.operations.length,
    outcomes: {},
    rejected: [],
    photos,
  };
  const ops = file.operations.map((e) => e.op);
  for (let i = 0; i < ops.length; i += MAX_BATCH_OPERATIONS) {
    const batch = ops.slice(i, i + MAX_BATCH_OPERATIONS);
    let results;
    try {
      results = (await pushOperations(pusher, { deviceId: file.deviceId, operations: batch })).results;
    } catch (error) {
      if (error instanceof HttpError && error.status === 403) {
        throw new HttpError(422, `${error.message} The file names a visit that was never on ${technician.name}'s round.${i > 0 ? ` The first ${i} operations were imported; importing the file again skips them.` : ''}`);
      }
      throw error;
    }
    results.forEach((result, index) => {
      summary.outcomes[result.outcome] = (summary.outcomes[result.outcome] ?? 0) + 1;
      if (result.outcome === 'rejected') {
        const op = batch[index]!;
        summary.rejected.push({ opId: op.opId, visitId: op.visitId, kind: op.kind, reason: result.reason ?? '' });
      }
    });
  }
  console.info(
    `[sync] unsent-changes file of ${technician.id} (device ${file.deviceId}, saved ${file.createdAt}) imported by ${importer.id}: ${JSON.stringify(summary.outcomes)}`,
  );
  return summary;
}
