// Used oil the vans carry away. Each visit's drained litres are the reading of its checklist item
// with rule 'used_oil'; a van's running total is what it drained since its last disposal; the
// office records each disposal at a licensed site. These are the business's own records: local
// waste rules (carrier registration, transfer notes, storage limits) apply on top.
import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import {
  readingResults,
  signOffs,
  templateItems,
  usedOilDisposals,
  user,
  vehicles,
  visits,
} from '../../db/schema';
import { roundQuantity } from '../trade/quantity';
import { getOrganisation } from './organisation';
import { HttpError } from './http';
import type { Van } from './van-access';

export const USED_OIL_RULE = 'used_oil';

// Oil drains out during the visit and rides in the van from its end: from the sign-off, or from
// the booked slot's end while the visit is not signed off yet.
const collectedAt = sql<Date>`coalesce(${signOffs.signedAt}, ${visits.slotEnd})`;

/** Drained litres per visit with their collection time, for one van or the whole business. */
function collections(organisationId: string, technicianId?: string) {
  return getDb()
    .select({
      visitId: visits.id,
      registration: vehicles.registration,
      litres: readingResults.value,
      collectedAt: collectedAt.as('collected_at'),
    })
    .from(readingResults)
    .innerJoin(templateItems, eq(templateItems.id, readingResults.itemId))
    .innerJoin(visits, eq(visits.id, readingResults.visitId))
    .innerJoin(vehicles, eq(vehicles.id, visits.vehicleId))
    .leftJoin(signOffs, and(eq(signOffs.visitId, visits.id), isNull(signOffs.voidedAt)))
    .where(
      and(
        eq(visits.organisationId, organisationId),
        technicianId ? eq(visits.technicianId, technicianId) : undefined,
        eq(templateItems.rule, USED_OIL_RULE),
        eq(readingResults.unit, 'L'),
        sql`${readingResults.value} > 0`,
        sql`${visits.status} <> 'cancelled'`,
      ),
    )
    .as('collections');
}

async function lastDisposal(van: Van) {
  const [row] = await getDb()
    .select({ disposedAt: usedOilDisposals.disposedAt, litres: usedOilDisposals.litres, siteName: usedOilDisposals.siteName })
    .from(usedOilDisposals)
    .where(and(eq(usedOilDisposals.organisationId, van.organisationId), eq(usedOilDisposals.technicianId, van.technicianId)))
    .orderBy(desc(usedOilDisposals.disposedAt))
    .limit(1);
  return row ?? null;
}

/** The van's used oil: what it holds, the visits that filled it since its last disposal, and that disposal. */
export async function usedOilForVan(van: Van) {
  const last = await lastDisposal(van);
  const c = collections(van.organisationId, van.technicianId);
  const since = await getDb()
    .select({ visitId: c.visitId, registration: c.registration, litres: c.litres, collectedAt: c.collectedAt })
    .from(c)
    .where(last ? gt(c.collectedAt, last.disposedAt) : undefined)
    .orderBy(c.collectedAt);
  return {
    technicianId: van.technicianId,
    technicianName: van.technicianName,
    heldL: roundQuantity(since.reduce((sum, r) => sum + (r.litres ?? 0), 0)),
    sinceLastDisposal: since.map((r) => ({ ...r, litres: roundQuantity(r.litres ?? 0), collectedAt: new Date(r.collectedAt).toISOString() })),
    lastDisposal: last ? { ...last, disposedAt: last.disposedAt.toISOString() } : null,
  };
}

/** Litres of used oil in the van now: drained since its last disposal. */
export async function usedOilHeld(van: Van): Promise<number> {
  return (await usedOilForVan(van)).heldL;
}

export type Disposal = {
  disposedAt: Date;
  siteName: string;
  siteLicence: string;
  reference: string;
  litres: number;
};

// A disposal is recorded after the trip; a day's grace covers a clock or time-zone slip.
const FUTURE_GRACE_MS = 24 * 60 * 60 * 1000;

export async function recordDisposal(van: Van, by: string, disposal: Disposal) {
  if (disposal.disposedAt.getTime() > Date.now() + FUTURE_GRACE_MS) {
    throw new HttpError(422, 'A disposal is recorded once it has happened; the date is in the future.');
  }
  const [row] = await getDb()
    .insert(usedOilDisposals)
    .values({
      organisationId: van.organisationId,
      technicianId: van.technicianId,
      ...disposal,
      litres: roundQuantity(disposal.litres),
      recordedBy: by,
    })
    .returning({ id: usedOilDisposals.id });
  return row!;
}

export async function disposalsOf(organisationId: string, limit = 100) {
  const rows = await getDb()
    .select({
      id: usedOilDisposals.id,
      technicianId: usedOilDisposals.technicianId,
      technicianName: user.name,
      disposedAt: usedOilDisposals.disposedAt,
      siteName: usedOilDisposals.siteName,
      siteLicence: usedOilDisposals.siteLicence,
      reference: usedOilDisposals.reference,
      litres: usedOilDisposals.litres,
    })
    .from(usedOilDisposals)
    .innerJoin(user, eq(user.id, usedOilDisposals.technicianId))
    .where(eq(usedOilDisposals.organisationId, organisationId))
    .orderBy(desc(usedOilDisposals.disposedAt))
    .limit(limit);
  return rows.map((r) => ({ ...r, disposedAt: r.disposedAt.toISOString() }));
}

export type MonthRow = { month: string; collectedL: number; disposedL: number };

/** Litres collected and disposed per calendar month in the business's time zone, newest first. */
export async function usedOilByMonth(organisationId: string, months = 12): Promise<MonthRow[]> {
  const db = getDb();
  const tz = (await getOrganisation(organisationId)).timeZone;
  const c = collections(organisationId);
  // Grouped by position (`group by 1`): the time zone is a bound parameter, and PostgreSQL does
  // not treat two parameters as the same expression.
  const monthOf = (instant: unknown) => sql<string>`to_char(${instant} at time zone ${tz}, 'YYYY-MM')`;
  const collected = await db
    .select({ month: monthOf(c.collectedAt), litres: sql<number>`sum(${c.litres})`.mapWith(Number) })
    .from(c)
    .groupBy(sql`1`);
  const disposed = await db
    .select({ month: monthOf(usedOilDisposals.disposedAt), litres: sql<number>`sum(${usedOilDisposals.litres})`.mapWith(Number) })
    .from(usedOilDisposals)
    .where(eq(usedOilDisposals.organisationId, organisationId))
    .groupBy(sql`1`);
  const byMonth = new Map<string, MonthRow>();
  const row = (month: string) => byMonth.get(month) ?? byMonth.set(month, { month, collectedL: 0, disposedL: 0 }).get(month)!;
  for (const r of collected) row(r.month).collectedL = roundQuantity(r.litres);
  for (const r of disposed) row(r.month).disposedL = roundQuantity(r.litres);
  return [...byMonth.values()].sort((a, b) => b.month.localeCompare(a.month)).slice(0, months);
}
