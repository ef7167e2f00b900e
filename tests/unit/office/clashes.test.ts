import { describe, expect, it } from 'vitest';
import { findClashes, type PlannedVisit } from '../../../src/lib/office/clashes';

// Europe/London in January is UTC, in July UTC+1 (British Summer Time).
const hours = { timeZone: 'Europe/London', workdayStartMinute: 8 * 60, workdayEndMinute: 18 * 60 };
const visit = (id: string, start: string, end: string, over: Partial<PlannedVisit> = {}): PlannedVisit => ({
  id,
  technicianId: 'tom',
  slotStart: new Date(start),
  slotEnd: new Date(end),
  status: 'booked',
  ...over,
});

describe('clash warnings', () => {
  it('finds nothing in a clean round', () => {
    expect(findClashes([visit('a', '2031-01-06T09:00Z', '2031-01-06T11:00Z'), visit('b', '2031-01-06T11:00Z', '2031-01-06T13:00Z')], hours)).toEqual([]);
  });

  it('reports an overlap on both visits, with the overlapping stretch', () => {
    const clashes = findClashes([visit('a', '2031-01-06T09:00Z', '2031-01-06T11:00Z'), visit('b', '2031-01-06T10:30Z', '2031-01-06T12:00Z')], hours);
    expect(clashes).toEqual([
      { kind: 'overlap', visitId: 'a', otherVisitId: 'b', message: 'Overlaps another of this technician’s visits (10:30–11:00).' },
      { kind: 'overlap', visitId: 'b', otherVisitId: 'a', message: 'Overlaps another of this technician’s visits (10:30–11:00).' },
    ]);
  });

  it('finds an overlap with a visit that does not follow directly', () => {
    const long = visit('long', '2031-01-06T09:00Z', '2031-01-06T15:00Z');
    const clashes = findClashes([long, visit('b', '2031-01-06T10:00Z', '2031-01-06T11:00Z'), visit('c', '2031-01-06T13:00Z', '2031-01-06T14:00Z')], hours);
    expect(clashes.filter((c) => c.visitId === 'long').map((c) => c.kind === 'overlap' && c.otherVisitId)).toEqual(['b', 'c']);
  });

  it('ignores other technicians and cancelled visits', () => {
    expect(
      findClashes(
        [
          visit('a', '2031-01-06T09:00Z', '2031-01-06T11:00Z'),
          visit('b', '2031-01-06T09:00Z', '2031-01-06T11:00Z', { technicianId: 'jess' }),
          visit('c', '2031-01-06T09:00Z', '2031-01-06T11:00Z', { status: 'cancelled' }),
        ],
        hours,
      ),
    ).toEqual([]);
  });

  it('judges working hours on the business’s local clock, summer time included', () => {
    // 07:30 UTC in July is 08:30 in London: inside hours. 17:30 UTC is 18:30: after them.
    expect(findClashes([visit('a', '2031-07-07T07:30Z', '2031-07-07T09:00Z')], hours)).toEqual([]);
    expect(findClashes([visit('b', '2031-07-07T16:00Z', '2031-07-07T17:30Z')], hours)).toEqual([
      { kind: 'out_of_hours', visitId: 'b', message: 'Ends at 18:30, after working hours (08:00–18:00).' },
    ]);
    expect(findClashes([visit('c', '2031-01-06T07:45Z', '2031-01-06T09:00Z')], hours)[0]!.message).toBe('Starts at 07:45, before working hours (08:00–18:00).');
  });

  it('flags a slot that runs past midnight', () => {
    const night = { ...hours, workdayEndMinute: 1440 };
    expect(findClashes([visit('a', '2031-01-06T22:00Z', '2031-01-07T01:00Z')], night)[0]!.message).toMatch(/past midnight/);
    expect(findClashes([visit('b', '2031-01-06T22:00Z', '2031-01-07T00:00Z')], night)).toEqual([]);
  });
});
