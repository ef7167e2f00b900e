import type { ColumnDef } from '@tanstack/react-table';
import type { CustomerRow } from '../../lib/server/customers';
import { linkButtonClass } from '../ui/Button';
import { DataTable } from './DataTable';
import { island } from './query-client';
import { tableStateFrom, useServerTable } from './server-table';
import { dayLabel } from './format';

const columns: ColumnDef<CustomerRow, unknown>[] = [
  {
    id: 'name',
    header: 'Name',
    cell: ({ row }) => (
      <a href={`/office/customers/${row.original.id}`} className="font-bold text-brand underline underline-offset-2">
        {row.original.name}
      </a>
    ),
  },
  { id: 'phone', header: 'Phone', enableSorting: false, cell: ({ row }) => row.original.phone ?? '—' },
  { id: 'email', header: 'E-mail', enableSorting: false, cell: ({ row }) => row.original.email ?? '—' },
  { id: 'postcode', header: 'Postcode', cell: ({ row }) => row.original.postcode || '—' },
  { id: 'vehicles', header: 'Vehicles', cell: ({ row }) => row.original.vehicleCount },
  { id: 'lastVisit', header: 'Last visit', cell: ({ row }) => (row.original.lastVisit ? dayLabel(row.original.lastVisit, 'd MMM yyyy') : '—') },
];

function CustomersTable({ search }: { search: string }) {
  const table = useServerTable<CustomerRow>('/api/office/customers', tableStateFrom(search, { sort: 'name' }));
  return (
    <DataTable
      label="Customers"
      table={table}
      columns={columns}
      rowKey={(row) => row.id}
      searchPlaceholder="Name, e-mail, phone or postcode"
      empty="No customers match. Clear the search, or add a new customer."
      actions={
        <a href="/office/customers/new" className={linkButtonClass}>
          New customer
        </a>
      }
    />
  );
}

export default island(CustomersTable);
