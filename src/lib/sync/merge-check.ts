// Check state (done / skipped / not yet): the later stamp wins. Two people ticking the same
// item is not worth the office's attention, so an older change is just superseded.
import { asStanding, type StandingCheck } from './standing';
import { isLater, unchanged, type Incoming, type Merged } from './merge-result';

export function mergeCheck(standing: StandingCheck | null, incoming: Incoming<'check'>): Merged<StandingCheck> {
  if (standing && !isLater(incoming.stamp, standing.stamp)) return unchanged('superseded', 'a later change to this check stands');
  return {
    outcome: 'applied',
    next: asStanding({ state: incoming.op.payload.state, stamp: incoming.stamp, opId: incoming.op.opId, author: incoming.author }),
    conflicts: [],
  };
}
