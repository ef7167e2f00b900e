// Where a visit goes in a round. The office may have put a round in an order that differs from
// the slot times (a customer who must be first), so a new visit slots in after the last visit
// that starts no later than it, and the order the office chose for the others stays.

export type RoundEntry = { id: string; slotStart: Date; roundPosition: number };

/** The round's visit ids in order, with `visit` placed by its slot start. */
export function placeInRound(round: readonly RoundEntry[], visit: { id: string; slotStart: Date }): string[] {
  const ordered = [...round].filter((v) => v.id !== visit.id).sort(byPosition);
  let index = 0;
  ordered.forEach((other, i) => {
    if (other.slotStart.getTime() <= visit.slotStart.getTime()) index = i + 1;
  });
  const ids = ordered.map((v) => v.id);
  ids.splice(index, 0, visit.id);
  return ids;
}

function byPosition(a: RoundEntry, b: RoundEntry) {
  return a.roundPosition - b.roundPosition || a.slotStart.getTime() - b.slotStart.getTime();
}
