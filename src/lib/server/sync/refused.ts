// The operations the server refused outright, for the office: read-only, newest first. They were
// not applied; the phone that sent them still holds them until its technician lets them go.
import { and, count, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import * as s from '../../../db/schema';

export async function listRefused(organisationId: string, page: { limit: number; offset: number }) {
  const db = getDb();
  const where = eq(s.refusedOperations.organisationId, organisationId);
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: s.refusedOperations.id,
        opId: s.refusedOperations.opId,
        kind: s.refusedOperations.kind,
        visitId: s.refusedOperations.visitId,
        deviceId: s.refusedOperations.deviceId,
        reason: s.refusedOperations.reason,
        body: s.refusedOperations.body,
        receivedAt: s.refusedOperations.receivedAt,
        technicianName: s.user.name,
        // Only a visit of this business is named; an id from elsewhere stays a bare id.
        registration: s.vehicles.registration,
      })
      .from(s.refusedOperations)
      .leftJoin(s.user, eq(s.user.id, s.refusedOperations.userId))
      .leftJoin(s.visits, and(eq(s.visits.organisationId, organisationId), sql`${s.visits.id}::text = ${s.refusedOperations.visitId}`))
      .leftJoin(s.vehicles, eq(s.vehicles.id, s.visits.vehicleId))
      .where(where)
      .orderBy(desc(s.refusedOperations.receivedAt), desc(s.refusedOperations.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ n: count() }).from(s.refusedOperations).where(where),
  ]);
  return { total: total?.n ?? 0, refused: rows };
}
