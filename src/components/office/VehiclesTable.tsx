import type { ColumnDef } from '@tanstack/react-table';
import type { VehicleRow } from '../../lib/server/vehicles';
import { linkButtonClass } from '../ui/Button';
import { DataTable } from './DataTable';
import { dayLabel } from './format';
import { island } from './query-client';
import { tableStateFrom, useServerTable } from './server-table';

const columns: ColumnDef<VehicleRow, unknown>[] = [
  {
    id: 'registration',
    header: 'Registration',
    cell: ({ row }) => (
      <a href={`/office/vehicles/${row.original.id}`} className="font-mono font-bold text-brand underline underline-offset-2">
        {row.original.registration}
      </a>
    ),
  },
  { id: 'make', header: 'Make and model', cell: ({ row }) => `${row.original.make} ${row.original.model}` },
  { id: 'engine', header: 'Engine', enableSorting: false, cell: ({ row }) => row.original.engine || '—' },
  { id: 'year', header: 'Year', cell: ({ row }) => row.original.year ?? '—' },
  {
    id: 'customer',
    header: 'Customer',
    cell: ({ row }) => (
      <a href={`/office/customers/${row.original.customerId}`} className="text-brand underline underline-offset-2">
        {row.original.customerName}
      </a>
    ),
  },
  {
    id: 'lastService',
    header: 'Last service',
    cell: ({ row }) => (row.original.lastServiceDate ? dayLabel(row.original.lastServiceDate, 'd MMM yyyy') : '—'),
  },
];

function VehiclesTable({ search }: { search: string }) {
  const table = useServerTable<VehicleRow>('/api/office/vehicles', tableStateFrom(search, { sort: 'registration' }));
  return (
    <DataTable
      label="Vehicles"
      table={table}
      columns={columns}
      rowKey={(row) => row.id}
      searchPlaceholder="Registration, VIN, make, model or customer"
      empty="No vehicles match. Clear the search, or add a vehicle from its customer’s page."
      actions={
        <>
          <a href="/office/model-notes" className="inline-flex min-h-10 items-center rounded border border-ink/50 bg-white px-3 font-bold">
            Model notes
          </a>
          <a href="/office/vehicles/new" className={linkButtonClass}>
            New vehicle
          </a>
        </>
      }
    />
  );
}

export default island(VehiclesTable);
