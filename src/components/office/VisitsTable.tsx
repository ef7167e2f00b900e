// Every visit, filtered for review: by day range, technician, status, findings that need a
// call to the customer (soon or now) and open conflicts.
import { useQuery } from '@tanstack/react-query';
import type { ColumnDef } from '@tanstack/react-table';
import type { VisitRow } from '../../lib/server/visit-review';
import { VISIT_STATUSES } from '../../lib/words';
import { SeverityBadge } from '../ui/SeverityBadge';
import { api, type Json } from './api';
import { DataTable, FilterSelect } from './DataTable';
import { clockLabel, dayLabel, STATUS_LABEL } from './format';
import { island } from './query-client';
import { tableStateFrom, useServerTable } from './server-table';

type Row = Json<VisitRow>;
const FILTERS = ['from', 'to', 'technicianId', 'status', 'attention', 'conflicts', 'customerId', 'vehicleId'] as const;

function columnsFor(timeZone: string): ColumnDef<Row, unknown>[] {
  return [
    {
      id: 'slotStart',
      header: 'When',
      cell: ({ row }) => (
        <a href={`/office/visits/${row.original.id}`} className="font-bold whitespace-nowrap text-brand underline underline-offset-2">
          {dayLabel(row.original.roundDate, 'EEE d MMM yyyy')} {clockLabel(row.original.slotStart, timeZone)}
        </a>
      ),
    },
    { id: 'technician', header: 'Technician', cell: ({ row }) => row.original.technicianName },
    { id: 'customer', header: 'Customer', cell: ({ row }) => row.original.customerName },
    {
      id: 'registration',
      header: 'Vehicle',
      cell: ({ row }) => (
        <span>
          <span className="font-mono font-bold">{row.original.registration}</span> {row.original.vehicle}
        </span>
      ),
    },
    { id: 'checklist', header: 'Checklist', enableSorting: false, cell: ({ row }) => row.original.checklist },
    { id: 'status', header: 'Status', cell: ({ row }) => STATUS_LABEL[row.original.status] },
    {
      id: 'findings',
      header: 'Findings',
      enableSorting: false,
      cell: ({ row }) =>
        row.original.worstSeverity ? (
          <span className="inline-flex items-center gap-2 whitespace-nowrap">
            <SeverityBadge severity={row.original.worstSeverity} size={16} />
            <span className="text-sm">({row.original.findingCount})</span>
          </span>
        ) : (
          '—'
        ),
    },
    {
      id: 'conflicts',
      header: 'Conflicts',
      enableSorting: false,
      cell: ({ row }) =>
        row.original.openConflicts > 0 ? (
          <a href={`/office/conflicts?visitId=${row.original.id}`} className="font-bold text-sev-now underline">
            {row.original.openConflicts} open
          </a>
        ) : (
          '—'
        ),
    },
  ];
}

function VisitsTable({ search, timeZone }: { search: string; timeZone: string }) {
  const table = useServerTable<Row>('/api/office/visits', tableStateFrom(search, { sort: 'slotStart', dir: 'desc' }, FILTERS));
  const team = useQuery({ queryKey: ['team'], queryFn: () => api<{ team: { id: string; name: string; role: string }[] }>('/api/office/team') });
  const { filters } = table.state;
  const dateInput = (key: 'from' | 'to', label: string) => (
    <label className="flex flex-col gap-1 text-sm font-bold">
      {label}
      <input type="date" value={filters[key] ?? ''} onChange={(e) => table.setFilter(key, e.target.value)} className="min-h-10 rounded border border-ink/40 bg-white px-2 text-base font-normal" />
    </label>
  );
  const flag = (key: 'attention' | 'conflicts', label: string) => (
    <label className="flex min-h-10 items-center gap-2 text-sm font-bold">
      <input type="checkbox" checked={filters[key] === '1'} onChange={(e) => table.setFilter(key, e.target.checked ? '1' : '')} className="size-5" />
      {label}
    </label>
  );
  return (
    <DataTable
      label="Visits"
      table={table}
      columns={columnsFor(timeZone)}
      rowKey={(row) => row.id}
      searchPlaceholder="Customer, registration or postcode"
      empty="No visits match these filters."
      filters={
        <>
          {dateInput('from', 'From')}
          {dateInput('to', 'To')}
          <FilterSelect
            label="Technician"
            value={filters.technicianId ?? ''}
            onChange={(v) => table.setFilter('technicianId', v)}
            options={(team.data?.team ?? []).filter((p) => p.role === 'technician').map((p) => ({ value: p.id, label: p.name }))}
          />
          <FilterSelect
            label="Status"
            value={filters.status ?? ''}
            onChange={(v) => table.setFilter('status', v)}
            options={VISIT_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))}
          />
          {flag('attention', 'Findings at soon or now')}
          {flag('conflicts', 'Open conflicts')}
          {(filters.vehicleId || filters.customerId) && (
            <button
              type="button"
              onClick={() => {
                table.setFilter('vehicleId', '');
                table.setFilter('customerId', '');
              }}
              className="min-h-10 rounded border-2 border-brand bg-white px-3 font-bold text-brand"
            >
              Showing one {filters.vehicleId ? 'vehicle' : 'customer'}’s visits · show all
            </button>
          )}
        </>
      }
    />
  );
}

export default island(VisitsTable);
