// What each van holds: levels are sums of stock movements, never a number kept on its own, so
// the office can always see why a van holds what it holds.
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../../db/client';
import { parts, user, vanStockMinimums, vanStockMovements, vehicles, visits, type StockMovementReason } from '../../db/schema';
import { isLowStock } from '../trade/van-stock';
import { roundQuantity } from '../trade/quantity';
import { HttpError } from './http';
import type { Van } from './van-access';
import { stockPartColumns } from './catalogue';

/** Net stock per part in one van. */
export async function stockLevels(db: Executor, organisationId: string, technicianId: string): Promise<Map<string, number>> {
  const rows = await db
    .select({ partId: vanStockMovements.partId, level: sql<number>`sum(${vanStockMovements.quantity})`.mapWith(Number) })
    .from(vanStockMovements)
    .where(and(eq(vanStockMovements.organisationId, organisationId), eq(vanStockMovements.technicianId, technicianId)))
    .groupBy(vanStockMovements.partId);
  return new Map(rows.map((r) => [r.partId, roundQuantity(r.level)]));
}

/** Stock the business holds across all vans, per part: a van short of a part lends nothing. */
export async function stockOnHandAcrossVans(organisationId: string): Promise<Map<string, number>> {
  const perVan = getDb()
    .select({
      partId: vanStockMovements.partId,
      level: sql<number>`sum(${vanStockMovements.quantity})`.as('level'),
    })
    .from(vanStockMovements)
    .where(eq(vanStockMovements.organisationId, organisationId))
    .groupBy(vanStockMovements.partId, vanStockMovements.technicianId)
    .as('per_van');
  const rows = await getDb()
    .select({ partId: perVan.partId, onHand: sql<number>`sum(greatest(${perVan.level}, 0))`.mapWith(Number) })
    .from(perVan)
    .groupBy(perVan.partId);
  return new Map(rows.map((r) => [r.partId, roundQuantity(r.onHand)]));
}

export type VanStockRow = {
  partId: string;
  partNumber: string;
  description: string;
  kind: string;
  unit: string;
  oilGrade: string | null;
  level: number;
  minimum: number | null;
  low: boolean;
  lastMovementAt: string | null;
};

/** Every part the van holds, has held, or must keep a minimum of. */
export async function vanStock(van: Van): Promise<VanStockRow[]> {
  const db = getDb();
  const moved = await db
    .select({
      partId: vanStockMovements.partId,
      level: sql<number>`sum(${vanStockMovements.quantity})`.mapWith(Number),
      lastMovementAt: sql<string>`max(${vanStockMovements.recordedAt})`.mapWith((v) => new Date(v).toISOString()),
    })
    .from(vanStockMovements)
    .where(and(eq(vanStockMovements.organisationId, van.organisationId), eq(vanStockMovements.technicianId, van.technicianId)))
    .groupBy(vanStockMovements.partId);
  const minimums = await db
    .select({ partId: vanStockMinimums.partId, minimum: vanStockMinimums.minimum })
    .from(vanStockMinimums)
    .where(and(eq(vanStockMinimums.organisationId, van.organisationId), eq(vanStockMinimums.technicianId, van.technicianId)));
  const partIds = [...new Set([...moved.map((m) => m.partId), ...minimums.map((m) => m.partId)])];
  if (partIds.length === 0) return [];
  const partRows = await db
    .select(stockPartColumns)
    .from(parts)
    .where(and(eq(parts.organisationId, van.organisationId), inArray(parts.id, partIds)))
    .orderBy(asc(parts.kind), asc(parts.partNumber));
  const movedBy = new Map(moved.map((m) => [m.partId, m]));
  const minimumBy = new Map(minimums.map((m) => [m.partId, m.minimum]));
  return partRows.map((p) => {
    const level = roundQuantity(movedBy.get(p.id)?.level ?? 0);
    const minimum = minimumBy.get(p.id) ?? null;
    return {
      partId: p.id,
      partNumber: p.partNumber,
      description: p.description,
      kind: p.kind,
      unit: p.unit,
      oilGrade: p.oilGrade,
      level,
      minimum,
      low: isLowStock(level, minimum),
      lastMovementAt: movedBy.get(p.id)?.lastMovementAt ?? null,
    };
  });
}

export type MovementRow = {
  id: string;
  partId: string;
  partNumber: string;
  unit: string;
  quantity: number;
  /** The van's level of this part just after the movement. */
  levelAfter: number;
  reason: StockMovementReason;
  note: string;
  visitId: string | null;
  registration: string | null;
  recordedBy: string | null;
  recordedAt: string;
};

/** The van's movements, newest first, each with the level it left behind. */
export async function vanMovements(van: Van, options: { partId?: string; limit?: number } = {}): Promise<MovementRow[]> {
  const m = vanStockMovements;
  const rows = await getDb()
    .select({
      id: m.id,
      partId: m.partId,
      partNumber: parts.partNumber,
      unit: parts.unit,
      quantity: m.quantity,
      levelAfter: sql<number>`sum(${m.quantity}) over (partition by ${m.partId} order by ${m.recordedAt}, ${m.id})`.mapWith(Number),
      reason: m.reason,
      note: m.note,
      visitId: m.visitId,
      registration: vehicles.registration,
      recordedBy: user.name,
      recordedAt: m.recordedAt,
    })
    .from(m)
    .innerJoin(parts, eq(parts.id, m.partId))
    .leftJoin(visits, eq(visits.id, m.visitId))
    .leftJoin(vehicles, eq(vehicles.id, visits.vehicleId))
    .leftJoin(user, eq(user.id, m.recordedBy))
    .where(
      and(
        eq(m.organisationId, van.organisationId),
        eq(m.technicianId, van.technicianId),
        options.partId ? eq(m.partId, options.partId) : undefined,
      ),
    )
    .orderBy(desc(m.recordedAt), desc(m.id))
    .limit(options.limit ?? 200);
  return rows.map((r) => ({
    ...r,
    quantity: roundQuantity(r.quantity),
    levelAfter: roundQuantity(r.levelAfter),
    recordedAt: r.recordedAt.toISOString(),
  }));
}

export type StockLine = { partId: string; quantity: number };

/** Active parts of the business, checked for the lines of a restock or return. */
async function partsForLines(db: Executor, organisationId: string, partIds: string[]) {
  const rows = await db
    .select({ id: parts.id, unit: parts.unit, partNumber: parts.partNumber, active: parts.active })
    .from(parts)
    .where(and(eq(parts.organisationId, organisationId), inArray(parts.id, partIds)));
  const byId = new Map(rows.map((r) => [r.id, r]));
  for (const partId of partIds) {
    if (!byId.has(partId)) throw new HttpError(404, `Part ${partId} is not in your business's catalogue.`);
  }
  return byId;
}

function checkWholeCount(unit: string, quantity: number, partNumber: string) {
  if (unit === '{each}' && !Number.isInteger(quantity)) {
    throw new HttpError(422, `${partNumber} is counted in whole parts; ${quantity} is not a whole number.`);
  }
}

/**
 * Loads parts into a van from the store ('restock') or takes them back out ('returned'). One
 * movement per line, all or nothing.
 */
export async function moveStock(van: Van, by: string, reason: 'restock' | 'returned', lines: StockLine[], note: string) {
  return getDb().transaction(async (tx) => {
    const byId = await partsForLines(tx, van.organisationId, [...new Set(lines.map((l) => l.partId))]);
    for (const line of lines) {
      const part = byId.get(line.partId)!;
      checkWholeCount(part.unit, line.quantity, part.partNumber);
      if (reason === 'restock' && !part.active) {
        throw new HttpError(422, `${part.partNumber} is no longer stocked; make it active in the catalogue first.`);
      }
    }
    const sign = reason === 'restock' ? 1 : -1;
    return tx
      .insert(vanStockMovements)
      .values(
        lines.map((l) => ({
          organisationId: van.organisationId,
          technicianId: van.technicianId,
          partId: l.partId,
          quantity: sign * roundQuantity(l.quantity),
          reason,
          note,
          recordedBy: by,
        })),
      )
      .returning({ id: vanStockMovements.id });
  });
}

/**
 * A stock count: the van holds `counted` of a part, so a movement of the difference is written.
 * Nothing is written when the count agrees with the level.
 */
export async function recordCount(van: Van, by: string, partId: string, counted: number, note: string) {
  return getDb().transaction(async (tx) => {
    // One count at a time per van and part, so two counts cannot both correct the same gap.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${van.technicianId}), hashtext(${partId}))`);
    const part = (await partsForLines(tx, van.organisationId, [partId])).get(partId)!;
    checkWholeCount(part.unit, counted, part.partNumber);
    const level = (await stockLevels(tx, van.organisationId, van.technicianId)).get(partId) ?? 0;
    const difference = roundQuantity(counted - level);
    if (difference === 0) return { levelBefore: level, difference, movementId: null };
    const [row] = await tx
      .insert(vanStockMovements)
      .values({
        organisationId: van.organisationId,
        technicianId: van.technicianId,
        partId,
        quantity: difference,
        reason: 'count',
        note,
        recordedBy: by,
      })
      .returning({ id: vanStockMovements.id });
    return { levelBefore: level, difference, movementId: row!.id };
  });
}

/** Sets (or, with null, clears) the level below which the van's stock of a part is low. */
export async function setMinimum(van: Van, partId: string, minimum: number | null) {
  const db = getDb();
  await partsForLines(db, van.organisationId, [partId]);
  const where = and(eq(vanStockMinimums.technicianId, van.technicianId), eq(vanStockMinimums.partId, partId));
  if (minimum === null) {
    await db.delete(vanStockMinimums).where(where);
    return;
  }
  await db
    .insert(vanStockMinimums)
    .values({ organisationId: van.organisationId, technicianId: van.technicianId, partId, minimum: roundQuantity(minimum) })
    .onConflictDoUpdate({
      target: [vanStockMinimums.technicianId, vanStockMinimums.partId],
      set: { minimum: roundQuantity(minimum), updatedAt: new Date() },
    });
}
