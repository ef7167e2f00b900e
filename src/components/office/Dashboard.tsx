// The week at a glance: what waits for the office, visits per week by technician, and findings
// by severity. Money and advised work appear once billing provides them (issue 7).
import { useQuery } from '@tanstack/react-query';
import { Bar, BarChart, CartesianGrid, Legend, Rectangle, ResponsiveContainer, Tooltip, XAxis, YAxis, type BarShapeProps } from 'recharts';
import type { Dashboard as DashboardData } from '../../lib/server/dashboard';
import type { Severity } from '../../lib/sync/operations';
import { SEVERITY_LABEL, SeverityIcon } from '../ui/SeverityBadge';
import { api, type Json } from './api';
import { dayLabel } from './format';
import { formatMoney } from '../../lib/trade';
import { Panel } from './Panel';
import { island } from './query-client';

type Data = Json<DashboardData>;

// Technicians' bars: our brand teal and companions that stay apart for common colour blindness;
// the legend and the table beside carry the names too.
const TECHNICIAN_COLOURS = ['#0d5c63', '#f0b429', '#6b4c9a', '#3d8f5a', '#c05a2b', '#2a6fb0'];
const SEVERITY_FILL: Record<Severity, string> = { ok: '#1f7a3d', watch: '#1d5fa8', soon: '#a35a00', now: '#b3261e' };

function Dashboard() {
  const data = useQuery({ queryKey: ['dashboard'], queryFn: () => api<Data>('/api/office/dashboard'), refetchInterval: 60_000 });
  if (data.isLoading) return <p>Loading…</p>;
  if (data.isError) return <p role="alert">{(data.error as Error).message}</p>;
  const d = data.data!;
  const weekRows = d.weeks.map((w) => ({ week: dayLabel(w.week, 'd MMM'), ...w.byTechnician }));
  const thisWeek = d.weeks.at(-1);
  const visitsThisWeek = thisWeek ? Object.values(thisWeek.byTechnician).reduce((a, b) => a + b, 0) : 0;

  return (
    <div className="flex flex-col gap-5">
      <div className="grid grid-cols-4 gap-4">
        <Tile label="Visits today" value={d.todayVisits} href="/office/rounds" />
        <Tile label="Visits this week" value={visitsThisWeek} href="/office/rounds" />
        <Tile label="Signed off, waiting for review" value={d.awaitingReview} href="/office/visits?status=signed_off" strong={d.awaitingReview > 0} />
        <Tile label="Open conflicts" value={d.openConflicts} href="/office/conflicts" strong={d.openConflicts > 0} />
      </div>
      <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-5">
        <Panel title={`Visits per week by technician (last ${d.weeks.length} weeks)`}>
          <div className="h-72">
            <ResponsiveContainer width="100%" height="100%">
              <BarChart data={weekRows} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="week" tick={{ fontSize: 13 }} />
                <YAxis allowDecimals={false} tick={{ fontSize: 13 }} />
                <Tooltip />
                <Legend />
                {d.technicians.map((t, i) => (
                  <Bar key={t.id} dataKey={t.id} name={t.name} stackId="visits" isAnimationActive={false} fill={TECHNICIAN_COLOURS[i % TECHNICIAN_COLOURS.length]} />
                ))}
              </BarChart>
            </ResponsiveContainer>
          </div>
          {d.technicians.length === 0 && <p>No visits in these weeks yet.</p>}
        </Panel>
        <Panel title="Findings by severity (same weeks)">
          <div className="h-56">
            <ResponsiveContainer width="100%" height="100%">
              <BarChart data={d.findingsBySeverity} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="severity" tickFormatter={(s: Severity) => SEVERITY_LABEL[s]} tick={{ fontSize: 13 }} />
                <YAxis allowDecimals={false} tick={{ fontSize: 13 }} />
                <Tooltip labelFormatter={(s) => SEVERITY_LABEL[s as Severity]} />
                <Bar
                  dataKey="findings"
                  name="Findings"
                  isAnimationActive={false}
                  shape={(props: BarShapeProps) => <Rectangle {...props} fill={SEVERITY_FILL[d.findingsBySeverity[props.index]!.severity]} />}
                />
              </BarChart>
            </ResponsiveContainer>
          </div>
          <table className="mt-2 w-full text-left">
            <tbody>
              {d.findingsBySeverity.map((row) => (
                <tr key={row.severity} className="border-t border-ink/10">
                  <td className="py-1">
                    <span className="inline-flex items-center gap-2 font-bold">
                      <SeverityIcon severity={row.severity} /> {SEVERITY_LABEL[row.severity]}
                    </span>
                  </td>
                  <td className="py-1 text-right font-mono">{row.findings}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
      </div>
      <div className="grid grid-cols-[minmax(0,2fr)_minmax(0,3fr)] gap-5">
        <Panel title="Advised work (same weeks)">
          <AdvisedWork advised={d.advisedWork} currency={d.money.currency} />
        </Panel>
        <Panel title="Money invoiced and paid (same weeks)">
          {d.money.weeks.every((w) => w.invoicedMinor === 0 && w.paidMinor === 0) ? (
            <p className="text-ink/80">No invoices issued or paid in these weeks.</p>
          ) : (
          <div className="h-64">
            <ResponsiveContainer width="100%" height="100%">
              <BarChart data={d.money.weeks.map((w) => ({ week: dayLabel(w.week, 'd MMM'), invoiced: w.invoicedMinor, paid: w.paidMinor }))} margin={{ top: 8, right: 8, bottom: 0, left: 24 }}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="week" tick={{ fontSize: 13 }} />
                <YAxis tickFormatter={(minor: number) => formatMoney(minor, d.money.currency).replace(/\.00$/, '')} tick={{ fontSize: 13 }} />
                <Tooltip formatter={(minor) => formatMoney(Number(minor), d.money.currency)} />
                <Legend />
                <Bar dataKey="invoiced" name="Invoiced (less credit notes)" fill="#0d5c63" isAnimationActive={false} />
                <Bar dataKey="paid" name="Paid" fill="#f0b429" isAnimationActive={false} />
              </BarChart>
            </ResponsiveContainer>
          </div>
          )}
          <p className="mt-2 text-sm">
            These weeks: invoiced {formatMoney(sumOf(d.money.weeks, 'invoicedMinor'), d.money.currency)}, paid {formatMoney(sumOf(d.money.weeks, 'paidMinor'), d.money.currency)}.{' '}
            <a href="/office/invoices" className="text-brand underline">
              Invoices
            </a>
          </p>
        </Panel>
      </div>
    </div>
  );
}

function sumOf<T>(rows: T[], key: keyof T): number {
  return rows.reduce((total, row) => total + Number(row[key]), 0);
}

function AdvisedWork({ advised, currency }: { advised: Data['advisedWork']; currency: string }) {
  if (advised.offered === 0) return <p className="text-ink/80">No advised work priced in these weeks.</p>;
  const parts = [
    { label: 'Accepted', n: advised.accepted, className: 'bg-sev-ok' },
    { label: 'Waiting', n: advised.pending, className: 'bg-ink/30' },
    { label: 'Declined', n: advised.declined, className: 'bg-sev-now' },
  ];
  return (
    <div className="flex flex-col gap-3">
      <p className="text-lg">
        <strong className="text-3xl">{advised.accepted}</strong> of {advised.offered} accepted, worth <strong>{formatMoney(advised.acceptedMinor, currency)}</strong>
      </p>
      <div className="flex h-6 overflow-hidden rounded border border-ink/30" aria-hidden="true">
        {parts.map((p) => (p.n > 0 ? <div key={p.label} className={p.className} style={{ width: `${(100 * p.n) / advised.offered}%` }} /> : null))}
      </div>
      <ul className="flex gap-4 text-sm">
        {parts.map((p) => (
          <li key={p.label} className="flex items-center gap-1">
            <span className={`inline-block size-3 rounded-sm ${p.className}`} aria-hidden="true" /> {p.label}: <strong>{p.n}</strong>
          </li>
        ))}
      </ul>
      <a href="/office/advised-work" className="text-brand underline">
        Advised work
      </a>
    </div>
  );
}

function Tile({ label, value, href, strong }: { label: string; value: number; href: string; strong?: boolean }) {
  return (
    <a href={href} className={`flex flex-col rounded border bg-white p-4 hover:border-brand ${strong ? 'border-2 border-sev-soon' : 'border-ink/20'}`}>
      <span className="text-sm font-bold">{label}</span>
      <span className="text-4xl font-bold">{value}</span>
    </a>
  );
}

export default island(Dashboard);
