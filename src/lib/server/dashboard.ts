// The office's week at a glance: visits per week by technician, findings by severity, what
// waits for review. Money figures join here once billing has its tables (issue 7).
import { and, count, eq, gte, isNull, lte, ne, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import * as s from '../../db/schema';
import { localToday, shiftDate, weekOf } from '../office/local-time';
import { getOrganisation } from './organisation';

// Two months of weeks: enough to see a trend, few enough bars to read at a glance.
export const DASHBOARD_WEEKS = 8;

export async function dashboard(organisationId: string) {
  const db = getDb();
  const org = await getOrganisation(organisationId);
  const today = localToday(org.timeZone);
  const thisWeek = weekOf(today);
  const from = shiftDate(thisWeek[0]!, -7 * (DASHBOARD_WEEKS - 1));
  const to = thisWeek[6]!;
  const weeks = Array.from({ length: DASHBOARD_WEEKS }, (_, i) => shiftDate(from, 7 * i));
  const inWindow = and(
    eq(s.visits.organisationId, organisationId),
    gte(s.visits.roundDate, from),
    lte(s.visits.roundDate, to),
    ne(s.visits.status, 'cancelled'),
  );
  const weekStart = sql<string>`to_char(date_trunc('week', ${s.visits.roundDate}::timestamp), 'YYYY-MM-DD')`;

  const [visitsByWeek, findingsBySeverity, awaitingReview, openConflicts, todayVisits] = await Promise.all([
    db
      .select({ week: weekStart, technicianId: s.visits.technicianId, technicianName: s.user.name, visits: count() })
      .from(s.visits)
      .innerJoin(s.user, eq(s.user.id, s.visits.technicianId))
      .where(inWindow)
      .groupBy(weekStart, s.visits.technicianId, s.user.name),
    db
      .select({ severity: s.findings.severity, findings: count() })
      .from(s.findings)
      .innerJoin(s.visits, eq(s.visits.id, s.findings.visitId))
      .where(inWindow)
      .groupBy(s.findings.severity),
    db.select({ n: count() }).from(s.visits).where(and(eq(s.visits.organisationId, organisationId), eq(s.visits.status, 'signed_off'))),
    db.select({ n: count() }).from(s.conflicts).where(and(eq(s.conflicts.organisationId, organisationId), isNull(s.conflicts.resolvedAt))),
    db
      .select({ n: count() })
      .from(s.visits)
      .where(and(eq(s.visits.organisationId, organisationId), eq(s.visits.roundDate, today), ne(s.visits.status, 'cancelled'))),
  ]);

  const technicians = [...new Map(visitsByWeek.map((r) => [r.technicianId, r.technicianName])).entries()]
    .map(([id, name]) => ({ id, name }))
    .sort((a, b) => a.name.localeCompare(b.name));
  return {
    today,
    weeks: weeks.map((week) => ({
      week,
      byTechnician: Object.fromEntries(
        technicians.map((t) => [t.id, visitsByWeek.find((r) => r.week === week && r.technicianId === t.id)?.visits ?? 0]),
      ),
    })),
    technicians,
    findingsBySeverity: s.SEVERITIES.map((severity) => ({
      severity,
      findings: findingsBySeverity.find((r) => r.severity === severity)?.findings ?? 0,
    })),
    awaitingReview: awaitingReview[0]?.n ?? 0,
    openConflicts: openConflicts[0]?.n ?? 0,
    todayVisits: todayVisits[0]?.n ?? 0,
    // Advised work accepted and money invoiced and paid: filled in by billing (issue 7).
    money: null as null | { currency: string; weeks: { week: string; invoicedMinor: number; paidMinor: number }[] },
    advisedWork: null as null | { offered: number; accepted: number },
  };
}

export type Dashboard = Awaited<ReturnType<typeof dashboard>>;
