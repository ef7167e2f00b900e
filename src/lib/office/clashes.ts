// Clash warnings for the rounds planner: one technician booked in two places at once, and slots
// outside the business's working hours. Warnings, not refusals: the office may know better (a
// customer who asked for an early start), but must see it.
import { localClock } from './local-time';
import { minutesToClock } from './form-values';

export type PlannedVisit = {
  id: string;
  technicianId: string;
  slotStart: Date;
  slotEnd: Date;
  status: string;
};

export type WorkingHours = { timeZone: string; workdayStartMinute: number; workdayEndMinute: number };

export type Clash =
  | { kind: 'overlap'; visitId: string; otherVisitId: string; message: string }
  | { kind: 'out_of_hours'; visitId: string; message: string };

/** Every clash among `visits`, each overlap reported once per visit involved. */
export function findClashes(visits: readonly PlannedVisit[], hours: WorkingHours): Clash[] {
  const live = visits.filter((v) => v.status !== 'cancelled');
  const clashes: Clash[] = [];
  const byTechnician = new Map<string, PlannedVisit[]>();
  for (const visit of live) {
    byTechnician.set(visit.technicianId, [...(byTechnician.get(visit.technicianId) ?? []), visit]);
    const outside = outOfHours(visit, hours);
    if (outside) clashes.push({ kind: 'out_of_hours', visitId: visit.id, message: outside });
  }
  for (const own of byTechnician.values()) {
    const sorted = [...own].sort((a, b) => a.slotStart.getTime() - b.slotStart.getTime());
    for (let i = 0; i < sorted.length; i += 1) {
      const a = sorted[i]!;
      // Sorted by start, so only later visits starting before `a` ends can overlap it.
      for (let j = i + 1; j < sorted.length && sorted[j]!.slotStart < a.slotEnd; j += 1) {
        const b = sorted[j]!;
        const when = `${clock(b.slotStart, hours)}–${clock(a.slotEnd, hours)}`;
        clashes.push({ kind: 'overlap', visitId: a.id, otherVisitId: b.id, message: `Overlaps another of this technician’s visits (${when}).` });
        clashes.push({ kind: 'overlap', visitId: b.id, otherVisitId: a.id, message: `Overlaps another of this technician’s visits (${when}).` });
      }
    }
  }
  return clashes;
}

function outOfHours(visit: PlannedVisit, hours: WorkingHours): string | null {
  const start = localClock(visit.slotStart, hours.timeZone);
  const end = localClock(visit.slotEnd, hours.timeZone);
  const day = `${minutesToClock(hours.workdayStartMinute)}–${minutesToClock(hours.workdayEndMinute)}`;
  if (end.date !== start.date && !(end.minute === 0 && hours.workdayEndMinute === 1440)) {
    return `Runs past midnight; working hours are ${day}.`;
  }
  if (start.minute < hours.workdayStartMinute) return `Starts at ${minutesToClock(start.minute)}, before working hours (${day}).`;
  const endMinute = end.date !== start.date ? 1440 : end.minute;
  if (endMinute > hours.workdayEndMinute) return `Ends at ${minutesToClock(end.minute)}, after working hours (${day}).`;
  return null;
}

function clock(instant: Date, hours: WorkingHours) {
  return minutesToClock(localClock(instant, hours.timeZone).minute);
}
