// Whose van a request may read or change. A technician sees their own van only; the office and
// the owner see every van of their business.
import { and, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { organisations, user } from '../../db/schema';
import type { SessionUser } from '../auth';
import { HttpError } from './http';

export type Van = { technicianId: string; technicianName: string; organisationId: string; timeZone: string };

/** A technician of the caller's business, or 404 (another business's people are not found). */
export async function vanOf(organisationId: string, technicianId: string): Promise<Van> {
  const [row] = await getDb()
    .select({ id: user.id, name: user.name, timeZone: organisations.timeZone })
    .from(user)
    .innerJoin(organisations, eq(organisations.id, user.organisationId))
    .where(and(eq(user.id, technicianId), eq(user.organisationId, organisationId), eq(user.role, 'technician')));
  if (!row) throw new HttpError(404, 'No technician with that id works for your business.');
  return { technicianId: row.id, technicianName: row.name, organisationId, timeZone: row.timeZone };
}

/** The van the caller asks about: their own if they are a technician (403 for anyone else's). */
export async function vanForCaller(caller: SessionUser, technicianId: string | undefined): Promise<Van> {
  if (caller.role === 'technician') {
    if (technicianId && technicianId !== caller.id) {
      throw new HttpError(403, 'A technician can see only their own van.');
    }
    return vanOf(caller.organisationId, caller.id);
  }
  if (!technicianId) throw new HttpError(400, 'Say which van: add technicianId to the request.');
  return vanOf(caller.organisationId, technicianId);
}

/** Every technician's van in the business, by name. */
export async function vansOf(organisationId: string): Promise<Van[]> {
  const rows = await getDb()
    .select({ technicianId: user.id, technicianName: user.name, timeZone: organisations.timeZone })
    .from(user)
    .innerJoin(organisations, eq(organisations.id, user.organisationId))
    .where(and(eq(user.organisationId, organisationId), eq(user.role, 'technician')))
    .orderBy(user.name);
  return rows.map((r) => ({ ...r, organisationId }));
}
