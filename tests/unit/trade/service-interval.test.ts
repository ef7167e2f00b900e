// Next service: whichever comes first of date and distance (TRADE-REFERENCES §10, common practice).
// Month arithmetic clamps to the month's end (2024-02-29 + 12 months = 2025-02-28), pinned here.
import { describe, expect, it } from 'vitest';
import { addMonths, nextServiceDue } from '../../../src/lib/trade';

const last = { date: '2024-03-15', odometer: 42_000 };
const interval = { months: 12, distance: 15_000, unit: 'km' as const };

describe('nextServiceDue', () => {
  it('12 months / 15 000 km from 2024-03-15 at 42 000 km is due 2025-03-15 or at 57 000 km (§10 example)', () => {
    const due = nextServiceDue({ last, interval, today: '2024-09-01', odometerNow: 48_000 });
    expect(due).toMatchObject({ status: 'ok', dueDate: '2025-03-15', dueOdometer: 57_000, dueBy: null, distanceLeft: 9_000 });
    expect(due.message).toMatch(/whichever comes first/);
  });

  it('on 2025-01-20 at 57 400 km it is overdue by distance (§10 example)', () => {
    expect(nextServiceDue({ last, interval, today: '2025-01-20', odometerNow: 57_400 })).toMatchObject({ status: 'overdue', dueBy: 'distance', distanceLeft: -400 });
  });

  it('on 2025-03-16 at 50 000 km it is overdue by date (§10 example)', () => {
    expect(nextServiceDue({ last, interval, today: '2025-03-16', odometerNow: 50_000 })).toMatchObject({ status: 'overdue', dueBy: 'date', daysLeft: -1 });
  });

  it('the limits themselves: due on the day, and at the exact distance', () => {
    expect(nextServiceDue({ last, interval, today: '2025-03-15', odometerNow: 50_000 }).status).toBe('overdue');
    expect(nextServiceDue({ last, interval, today: '2025-03-14', odometerNow: 50_000 }).status).toBe('due soon');
    expect(nextServiceDue({ last, interval, today: '2024-10-01', odometerNow: 57_000 }).status).toBe('overdue');
  });

  it('due soon: within 30 days, or within the last tenth of the distance (common practice)', () => {
    expect(nextServiceDue({ last, interval, today: '2025-02-13', odometerNow: 50_000 })).toMatchObject({ status: 'due soon', dueBy: 'date', daysLeft: 30 });
    expect(nextServiceDue({ last, interval, today: '2025-02-12', odometerNow: 50_000 }).status).toBe('ok');
    expect(nextServiceDue({ last, interval, today: '2024-10-01', odometerNow: 55_500 })).toMatchObject({ status: 'due soon', dueBy: 'distance', distanceLeft: 1_500 });
    expect(nextServiceDue({ last, interval, today: '2024-10-01', odometerNow: 55_499 }).status).toBe('ok');
  });

  it('miles: 10 000 mi is 16 093.44 km exactly (an odometer in km against an interval in miles)', () => {
    const due = nextServiceDue({ last: { date: '2024-01-10', odometer: 20_000 }, interval: { months: 12, distance: 10_000, unit: '[mi_i]' }, today: '2024-05-01', odometerNow: 25_000, odometerUnit: 'km' });
    expect(due.dueOdometer).toBe(36_093.44);
    expect(due.odometerUnit).toBe('km');
  });

  it('miles throughout, and date-only or distance-only intervals', () => {
    expect(nextServiceDue({ last: { date: '2024-01-10', odometer: 30_000 }, interval: { distance: 6_000, unit: 'mi' }, today: '2024-05-01', odometerNow: 35_500 })).toMatchObject({ status: 'due soon', dueBy: 'distance', dueDate: null, odometerUnit: '[mi_i]' });
    expect(nextServiceDue({ last: { date: '2024-01-10' }, interval: { months: 6 }, today: '2024-08-01' })).toMatchObject({ status: 'overdue', dueBy: 'date', dueOdometer: null });
  });

  it('when both are past, the one passed first (in share of its interval) is named', () => {
    // Date: 2025-06-15 is 92 days past 2025-03-15 (≈0.25 of a year); distance: 1 000 km past (≈0.07 of 15 000 km).
    expect(nextServiceDue({ last, interval, today: '2025-06-15', odometerNow: 58_000 }).dueBy).toBe('date');
  });

  it('refuses impossible input', () => {
    expect(() => nextServiceDue({ last, interval: {}, today: '2025-01-01' })).toThrow(/months, a distance, or both/);
    expect(() => nextServiceDue({ last, interval, today: '2025-02-30' })).toThrow(/must be a date like/);
    expect(() => nextServiceDue({ last, interval, today: '2025-01-01', odometerNow: 40_000 })).toThrow(/below the reading at the last service/);
    expect(() => nextServiceDue({ last, interval: { months: 1.5 }, today: '2025-01-01' })).toThrow(/whole number/);
    expect(() => nextServiceDue({ last, interval: { distance: 5000, unit: 'furlong' as 'km' }, today: '2025-01-01' })).toThrow(/not a distance unit/);
  });
});

describe('addMonths (clamped to the month end)', () => {
  it('2024-02-29 + 12 months is 2025-02-28; 2024-01-31 + 1 month is 2024-02-29; 2024-03-15 + 12 is 2025-03-15', () => {
    const day = (s: string) => new Date(`${s}T00:00:00Z`);
    expect(addMonths(day('2024-02-29'), 12).toISOString().slice(0, 10)).toBe('2025-02-28');
    expect(addMonths(day('2024-01-31'), 1).toISOString().slice(0, 10)).toBe('2024-02-29');
    expect(addMonths(day('2024-03-15'), 12).toISOString().slice(0, 10)).toBe('2025-03-15');
    expect(addMonths(day('2024-11-30'), 3).toISOString().slice(0, 10)).toBe('2025-02-28');
  });
});
