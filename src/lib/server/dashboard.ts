// The office's week at a glance: visits per week by technician, findings by severity, what
// waits for review, advised work accepted, and money invoiced and paid.
import { and, count, eq, gte, isNotNull, isNull, lte, ne, sql, sum, type AnyColumn } from 'drizzle-orm';
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

  // Instants fall into the business's own weeks (Monday first), as the rounds do.
  const localWeek = (instant: AnyColumn) => sql<string>`to_char(date_trunc('week', ${instant} at time zone ${org.timeZone}), 'YYYY-MM-DD')`;
  const inLocalWindow = (instant: AnyColumn) =>
    and(sql`(${instant} at time zone ${org.timeZone})::date >= ${from}::date`, sql`(${instant} at time zone ${org.timeZone})::date <= ${to}::date`);
  const money = (rows: { week: string; amount: string | null }[], week: string) => Number(rows.find((r) => r.week === week)?.amount ?? 0);

  const [visitsByWeek, findingsBySeverity, awaitingReview, openConflicts, todayVisits, invoiced, credited, paid, advised] = await Promise.all([
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
    db
      .select({ week: localWeek(s.invoices.issuedAt), amount: sum(s.invoices.totalMinor) })
      .from(s.invoices)
      .where(and(eq(s.invoices.organisationId, organisationId), eq(s.invoices.currency, org.currency), isNotNull(s.invoices.issuedAt), inLocalWindow(s.invoices.issuedAt)))
      // By position: the week expression carries the time zone as a parameter, and PostgreSQL
      // cannot see that two parameters are the same value.
      .groupBy(sql`1`),
    db
      .select({ week: localWeek(s.creditNotes.issuedAt), amount: sum(s.creditNotes.totalMinor) })
      .from(s.creditNotes)
      .where(and(eq(s.creditNotes.organisationId, organisationId), eq(s.creditNotes.currency, org.currency), inLocalWindow(s.creditNotes.issuedAt)))
      .groupBy(sql`1`),
    db
      .select({ week: localWeek(s.payments.receivedAt), amount: sum(s.payments.amountMinor) })
      .from(s.payments)
      .where(and(eq(s.payments.organisationId, organisationId), eq(s.payments.currency, org.currency), inLocalWindow(s.payments.receivedAt)))
      .groupBy(sql`1`),
    db
      .select({ decision: s.advisedWork.decision, items: count(), amount: sum(s.advisedWork.priceMinor) })
      .from(s.advisedWork)
      .where(and(eq(s.advisedWork.organisationId, organisationId), inLocalWindow(s.advisedWork.createdAt)))
      .groupBy(s.advisedWork.decision),
  ]);
  const advisedOf = (decision: s.AdvisedDecision) => advised.find((r) => r.decision === decision);

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
    // Invoiced is what was issued less what credit notes took back, in the business's currency.
    money: {
      currency: org.currency,
      weeks: weeks.map((week) => ({ week, invoicedMinor: money(invoiced, week) - money(credited, week), paidMinor: money(paid, week) })),
    },
    advisedWork: {
      offered: advised.reduce((n, r) => n + r.items, 0),
      accepted: advisedOf('approved')?.items ?? 0,
      declined: advisedOf('declined')?.items ?? 0,
      pending: advisedOf('pending')?.items ?? 0,
      acceptedMinor: Number(advisedOf('approved')?.amount ?? 0),
    },
  };
}

export type Dashboard = Awaited<ReturnType<typeof dashboard>>;
