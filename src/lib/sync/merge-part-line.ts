// Part lines: the later stamp wins per line; removal is a tombstone (removed = true), so an
// older edit arriving late cannot bring a removed line back.
import { asStanding, type StandingPartLine } from './standing';
import { isLater, unchanged, type Incoming, type Merged } from './merge-result';

export function mergePartLine(standing: StandingPartLine | null, incoming: Incoming<'part_line'>): Merged<StandingPartLine> {
  if (standing && !isLater(incoming.stamp, standing.stamp)) return unchanged('superseded', 'a later change to this part line stands');
  const { lineId: _lineId, ...line } = incoming.op.payload;
  return {
    outcome: 'applied',
    next: asStanding({ ...line, stamp: incoming.stamp, opId: incoming.op.opId, author: incoming.author }),
    conflicts: [],
  };
}
