// Sign-off: the first sign-off to reach the server wins and locks the visit; later operations
// on a locked visit are kept in the conflict list, not applied, until the office reopens it.
// "First" is by arrival, not by stamp: the customer signed what the technician's phone showed,
// and a change arriving afterwards must not alter a signed record, whatever its stamp says.
import { asStanding, type StandingSignOff } from './standing';
import type { Incoming } from './merge-result';

export type VisitLockState = {
  status: 'booked' | 'in_progress' | 'signed_off' | 'reviewed' | 'invoiced' | 'paid' | 'cancelled';
  liveSignOff: StandingSignOff | null;
};

export type Lock = { reason: 'visit_locked' | 'visit_cancelled'; message: string };

const SIGNED_STATUSES = new Set<VisitLockState['status']>(['signed_off', 'reviewed', 'invoiced', 'paid']);

/** Why operations cannot be applied to this visit now, or null when they can. */
export function lockOf(visit: VisitLockState): Lock | null {
  if (visit.status === 'cancelled') return { reason: 'visit_cancelled', message: 'the visit was cancelled; kept for the office' };
  if (visit.liveSignOff || SIGNED_STATUSES.has(visit.status)) {
    return { reason: 'visit_locked', message: 'the visit is signed off; kept for the office until it reopens the visit' };
  }
  return null;
}

export function signOffFrom(incoming: Incoming<'sign_off'>): StandingSignOff {
  const { signOffId, ...p } = incoming.op.payload;
  return asStanding({ id: signOffId, ...p, technicianId: incoming.author, stamp: incoming.stamp, opId: incoming.op.opId });
}
