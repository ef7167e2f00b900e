// A demo conflict, made the way a real one is: a technician's note that reached the server after
// the customer had signed, pushed through the sync service's own merge, so the office's conflict
// list has something to decide.
import { and, desc, eq } from 'drizzle-orm';
import type { Database } from '../client';
import * as s from '../schema';
import { encodeStamp } from '../../lib/sync/clock';
import { pushOperations } from '../../lib/server/sync/push';
import { seedId } from './ids';

const LATE_NOTE =
  'Customer came out as I was packing up: the rear wiper judders on a dry screen. Blade looks fine; worth a look at the next visit.';

export async function seedLateNote(db: Database, organisationId: string, technicianId: string) {
  const [signed] = await db
    .select({ visitId: s.signOffs.visitId, signedAt: s.signOffs.signedAt })
    .from(s.signOffs)
    .innerJoin(s.visits, eq(s.visits.id, s.signOffs.visitId))
    .where(and(eq(s.visits.organisationId, organisationId), eq(s.visits.technicianId, technicianId), eq(s.visits.status, 'signed_off')))
    .orderBy(desc(s.signOffs.signedAt))
    .limit(1);
  if (!signed) return;
  // The same device the seed's results came from, a quarter of an hour after the signature.
  const deviceId = `seed-${technicianId.slice(0, 8)}`;
  const note = {
    opId: seedId('op', signed.visitId, 'late-note'),
    visitId: signed.visitId,
    deviceId,
    stamp: encodeStamp({ wallMs: signed.signedAt.getTime() + 15 * 60_000, counter: 0, deviceId }),
    seenStamp: null,
    kind: 'note',
    payload: { noteId: seedId('note', signed.visitId, 'late-note'), body: LATE_NOTE },
  };
  await pushOperations({ id: technicianId, role: 'technician', organisationId }, { deviceId, operations: [note] }, Date.now(), db);
}
