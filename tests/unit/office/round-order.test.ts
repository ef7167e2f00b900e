import { describe, expect, it } from 'vitest';
import { placeInRound } from '../../../src/lib/office/round-order';

const at = (hh: number) => new Date(Date.UTC(2031, 0, 6, hh));

describe('placing a visit in a round', () => {
  it('puts a new visit after the last one starting no later than it', () => {
    const round = [
      { id: 'a', slotStart: at(9), roundPosition: 0 },
      { id: 'b', slotStart: at(13), roundPosition: 1 },
    ];
    expect(placeInRound(round, { id: 'n', slotStart: at(11) })).toEqual(['a', 'n', 'b']);
    expect(placeInRound(round, { id: 'n', slotStart: at(8) })).toEqual(['n', 'a', 'b']);
    expect(placeInRound(round, { id: 'n', slotStart: at(13) })).toEqual(['a', 'b', 'n']);
  });

  it('keeps the order the office chose for the others', () => {
    // The office put the 13:00 visit first (a customer who must be seen early).
    const round = [
      { id: 'late', slotStart: at(13), roundPosition: 0 },
      { id: 'early', slotStart: at(9), roundPosition: 1 },
    ];
    expect(placeInRound(round, { id: 'n', slotStart: at(10) })).toEqual(['late', 'early', 'n']);
  });

  it('moves a visit already in the round rather than listing it twice', () => {
    const round = [
      { id: 'a', slotStart: at(9), roundPosition: 0 },
      { id: 'm', slotStart: at(15), roundPosition: 1 },
      { id: 'b', slotStart: at(11), roundPosition: 2 },
    ];
    expect(placeInRound(round, { id: 'm', slotStart: at(15) })).toEqual(['a', 'b', 'm']);
  });
});
