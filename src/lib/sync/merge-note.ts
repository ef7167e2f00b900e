// Notes: added, never overwritten; each note is its own record (PRODUCT.md). A second operation
// for a note id that exists with other words is kept for the office rather than dropped.
import { asStanding, type StandingNote } from './standing';
import { unchanged, type Incoming, type Merged } from './merge-result';

export function mergeNote(standing: StandingNote | null, incoming: Incoming<'note'>): Merged<StandingNote> {
  const { op } = incoming;
  if (!standing) {
    return { outcome: 'applied', next: asStanding({ body: op.payload.body, stamp: incoming.stamp, author: incoming.author }), conflicts: [] };
  }
  if (standing.body === op.payload.body) return unchanged('superseded', 'this note is already recorded');
  return unchanged('conflict', 'notes are never overwritten; the office will see both', [
    {
      kind: 'note',
      entityId: op.payload.noteId,
      proposed: { value: { body: op.payload.body }, stamp: incoming.stamp, opId: op.opId, author: incoming.author },
      standing: { value: { body: standing.body }, stamp: standing.stamp, opId: null, author: standing.author },
    },
  ]);
}
