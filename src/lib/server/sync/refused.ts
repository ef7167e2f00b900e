// The operations the server refused outright, for the office: read-only, newest first. They were
// not applied; the phone that sent them still holds them until its technician lets them go.
import { and, count, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import * as s from '../../../db/schema';

export async function countRefused(organisationId: string): Promise<number> {
  const [row] = await getDb().select({ n: count() }).from(s.refusedOperations).where(eq(s.refusedOperations.organisationId, organisationId));
  return row?.n ?? 0;
}

export async function listRefused(organisationId: string, page: { limit: number; offset: number }) {
  const [rows, total] = await Promise.all([
    getDb()
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
      .where(eq(s.refusedOperations.organisationId, organisationId))
      .orderBy(desc(s.refusedOperations.receivedAt), desc(s.refusedOperations.id))
      .limit(page.limit)
      .offset(page.offset),
    countRefused(organisationId),
  ]);
  return { total, refused: rows };
}
