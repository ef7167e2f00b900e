// Parts fitted on a visit take stock out of the technician's van. Sync calls this after it has
// applied a push, in the same transaction, for every visit the push touched.
import { eq, inArray } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { parts, partLines, user, vanStockMovements, visits } from '../../db/schema';
import { stockCorrections, type Holding } from '../trade/van-stock';

export type ReconcileResult = { movementsWritten: number };

/**
 * Makes the stock movements of a visit's part lines match the lines as they stand now. Safe to
 * call any number of times: a line synced twice writes nothing the second time, a changed
 * quantity writes only the difference, and a removed line (tombstone) gives its stock back.
 * Lines without a catalogue part, or in a unit other than the part's, do not touch stock.
 */
export async function reconcileVanStockForVisit(tx: Executor, visitId: string): Promise<ReconcileResult> {
  // The row lock makes two pushes for one visit reconcile one after the other, so neither reads
  // the movements before the other has written its own.
  const [visit] = await tx
    .select({ organisationId: visits.organisationId, technicianId: visits.technicianId })
    .from(visits)
    .where(eq(visits.id, visitId))
    .for('update');
  if (!visit) return { movementsWritten: 0 };

  const lines = await tx
    .select({
      id: partLines.id,
      partId: partLines.partId,
      quantity: partLines.quantity,
      unit: partLines.unit,
      removed: partLines.removed,
      // Null when the line's author is not a user row (an audit name must not fail a push).
      updatedBy: user.id,
      partUnit: parts.unit,
    })
    .from(partLines)
    .leftJoin(parts, eq(parts.id, partLines.partId))
    .leftJoin(user, eq(user.id, partLines.updatedBy))
    .where(eq(partLines.visitId, visitId));
  if (lines.length === 0) return { movementsWritten: 0 };

  const recorded = await tx
    .select({
      partLineId: vanStockMovements.partLineId,
      technicianId: vanStockMovements.technicianId,
      partId: vanStockMovements.partId,
      quantity: vanStockMovements.quantity,
    })
    .from(vanStockMovements)
    .where(inArray(vanStockMovements.partLineId, lines.map((l) => l.id)));

  let written = 0;
  for (const line of lines) {
    const takesStock = !line.removed && line.partId !== null && line.unit === line.partUnit;
    const wanted: Holding[] = takesStock
      ? [{ technicianId: visit.technicianId, partId: line.partId!, quantity: -line.quantity }]
      : [];
    const corrections = stockCorrections(
      wanted,
      recorded.filter((m) => m.partLineId === line.id),
    );
    if (corrections.length === 0) continue;
    await tx.insert(vanStockMovements).values(
      corrections.map((c) => ({
        organisationId: visit.organisationId,
        technicianId: c.technicianId,
        partId: c.partId,
        quantity: c.quantity,
        reason: 'fitted' as const,
        visitId,
        partLineId: line.id,
        recordedBy: line.updatedBy,
      })),
    );
    written += corrections.length;
  }
  return { movementsWritten: written };
}
