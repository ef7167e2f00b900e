import { describe, expect, it } from 'vitest';
import { dailyDistance, reminderIsDue, serviceDue } from '../../../src/lib/reminders/service-due';

describe('serviceDue', () => {
  it('is due by date or distance, whichever comes first (TRADE-REFERENCES.md section 10 worked example, common practice)', () => {
    // Interval 12 months / 15 000 km, last done 2024-03-15 at 42 000 km: due 2025-03-15 or 57 000 km.
    const due = serviceDue({ last: { date: '2024-03-15', odometer: 42_000 }, interval: { months: 12, distance: 15_000 }, history: [] });
    expect(due).toMatchObject({ dueDate: '2025-03-15', dueOdometer: 57_000, date: '2025-03-15', trigger: 'date', distanceDate: null });
  });

  it('clamps to the end of the month: 2024-02-29 + 12 months = 2025-02-28 (the usual convention, TRADE-REFERENCES.md section 10)', () => {
    expect(serviceDue({ last: { date: '2024-02-29', odometer: null }, interval: { months: 12, distance: null }, history: [] }).dueDate).toBe('2025-02-28');
  });

  it('estimates the date of the distance limit from the odometer history', () => {
    // 9 000 km in 90 days = 100 km a day; 15 000 km after 42 000 is reached 60 days after the
    // last reading at 51 000 km.
    const due = serviceDue({
      last: { date: '2024-03-15', odometer: 42_000 },
      interval: { months: 12, distance: 15_000 },
      history: [{ date: '2024-06-13', odometer: 51_000 }],
    });
    expect(due.dailyDistance).toBe(100);
    expect(due).toMatchObject({ distanceDate: '2024-08-12', date: '2024-08-12', trigger: 'distance' });
  });

  it('does not guess a daily distance from less than 30 days of history', () => {
    expect(dailyDistance([{ date: '2024-01-01', odometer: 0 }, { date: '2024-01-20', odometer: 5_000 }])).toBeNull();
    expect(dailyDistance([{ date: '2024-01-01', odometer: 9_000 }, { date: '2024-03-01', odometer: 5_000 }])).toBeNull();
  });
});

describe('reminderIsDue', () => {
  it('is due from lead days before the due date, and after it', () => {
    expect(reminderIsDue('2025-03-15', '2025-02-22', 21)).toBe(true);
    expect(reminderIsDue('2025-03-15', '2025-02-21', 21)).toBe(false);
    expect(reminderIsDue('2025-03-15', '2025-04-01', 21)).toBe(true);
  });
});
