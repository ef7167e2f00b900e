// Reopening a signed-off visit: the office voids the sign-off (it stays, with voided_at, as a
// record of what the customer signed) and the visit goes back to in progress, so operations
// apply again and the next sign-off wins and locks it afresh.
import { and, eq, isNull } from 'drizzle-orm';
import type { Transaction } from '../../../db/client';
import * as s from '../../../db/schema';
import { nextChangeSeq } from '../../../db/schema';
import { HttpError } from '../http';

const REOPENABLE = new Set<s.VisitStatus>(['signed_off', 'reviewed']);

/** Call inside a transaction holding the organisation's change-feed lock (change-feed.ts). */
export async function reopenVisit(tx: Transaction, office: { id: string; organisationId: string }, visitId: string): Promise<void> {
  const [visit] = await tx
    .select({ status: s.visits.status })
    .from(s.visits)
    .where(and(eq(s.visits.id, visitId), eq(s.visits.organisationId, office.organisationId)))
    .for('update');
  if (!visit) throw new HttpError(404, 'No such visit.');
  if (!REOPENABLE.has(visit.status)) {
    const why = visit.status === 'invoiced' || visit.status === 'paid' ? 'it is already invoiced; credit the invoice first' : `it is ${visit.status.replace('_', ' ')}`;
    throw new HttpError(409, `The visit cannot be reopened: ${why}.`);
  }
  await tx
    .update(s.signOffs)
    .set({ voidedAt: new Date(), voidedBy: office.id, changeSeq: nextChangeSeq })
    .where(and(eq(s.signOffs.visitId, visitId), isNull(s.signOffs.voidedAt)));
  await tx
    .update(s.visits)
    .set({ status: 'in_progress', reviewedAt: null, reviewedBy: null, updatedAt: new Date(), changeSeq: nextChangeSeq })
    .where(eq(s.visits.id, visitId));
}
