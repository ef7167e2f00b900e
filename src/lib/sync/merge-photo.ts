// Photos: a set in which an add wins over a remove that had not seen it (PRODUCT.md). A photo
// is removed when some remove had seen its latest add (the remove's seen stamp is at least that
// add's stamp); a newer add brings it back. Because "removed" is decided from the recorded
// removes rather than from arrival order, a remove that arrives before its add still counts.
import { compareStamps, type Stamp } from './clock';
import { asStanding, type StandingPhoto } from './standing';
import type { HistoryEntry } from './history';
import { isLater, unchanged, type Incoming, type Merged } from './merge-result';

/** The latest recorded remove that had seen the add stamped `addStamp`, if any. */
export function removalCovering(history: readonly HistoryEntry[], addStamp: Stamp): Stamp | null {
  let latest: Stamp | null = null;
  for (const h of history) {
    if (h.kind !== 'photo.remove' || h.seenStamp === null || compareStamps(h.seenStamp, addStamp) < 0) continue;
    if (latest === null || isLater(h.stamp, latest)) latest = h.stamp;
  }
  return latest;
}

export function mergePhotoAdd(
  standing: StandingPhoto | null,
  incoming: Incoming<'photo.add'>,
  history: readonly HistoryEntry[],
): Merged<StandingPhoto> {
  if (standing && !isLater(incoming.stamp, standing.addStamp)) return unchanged('superseded', 'a later add of this photo stands');
  const { photoId: _photoId, ...photo } = incoming.op.payload;
  const removedStamp = removalCovering(history, incoming.stamp);
  const next = asStanding({ ...photo, addStamp: incoming.stamp, removedStamp, author: standing?.author ?? incoming.author });
  return removedStamp
    ? { outcome: 'applied', next, conflicts: [], reason: 'a remove that had seen this photo was already recorded' }
    : { outcome: 'applied', next, conflicts: [] };
}

export function mergePhotoRemove(standing: StandingPhoto | null, incoming: Incoming<'photo.remove'>): Merged<StandingPhoto> {
  const seen = incoming.op.seenStamp;
  // Kept in the history: when the add arrives, removalCovering finds it.
  if (!standing) return unchanged('applied', 'recorded; it takes effect when the photo arrives');
  if (seen === null || compareStamps(seen, standing.addStamp) < 0) {
    return unchanged('superseded', 'a newer add of this photo wins over a remove that had not seen it');
  }
  if (standing.removedStamp && !isLater(incoming.stamp, standing.removedStamp)) return unchanged('superseded', 'the photo is already removed');
  return { outcome: 'applied', next: asStanding({ ...standing, removedStamp: incoming.stamp }), conflicts: [] };
}
