// The one table of the console: TanStack Table in manual mode over a server-side page, with
// sortable headers, a search box, filters the caller adds, and a pager.
import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import { useEffect, useState, type ReactNode } from 'react';
import type { useServerTable } from './server-table';

type ServerTable<Row> = ReturnType<typeof useServerTable<Row>>;

type Props<Row> = {
  label: string;
  table: ServerTable<Row>;
  columns: ColumnDef<Row, unknown>[];
  searchPlaceholder?: string;
  filters?: ReactNode;
  actions?: ReactNode;
  empty: ReactNode;
  rowKey: (row: Row) => string;
};

// Typing pauses shorter than this are one search, not one request a keystroke.
const SEARCH_DELAY_MS = 300;

export function DataTable<Row>({ label, table, columns, searchPlaceholder, filters, actions, empty, rowKey }: Props<Row>) {
  const { state, update, query } = table;
  const page = query.data;
  const pageCount = page ? Math.max(1, Math.ceil(page.total / page.pageSize)) : 1;
  const sorting: SortingState = [{ id: state.sort, desc: state.dir === 'desc' }];
  const reactTable = useReactTable({
    data: page?.rows ?? [],
    // TanStack only sorts columns it can read a value from; the server does the sorting here.
    columns: columns.map((c) => ('accessorFn' in c || 'accessorKey' in c ? c : { ...c, accessorFn: () => null })),
    getRowId: rowKey,
    manualPagination: true,
    manualSorting: true,
    pageCount,
    state: { sorting, pagination: { pageIndex: state.page - 1, pageSize: state.pageSize } },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) update({ sort: first.id, dir: first.desc ? 'desc' : 'asc' });
      else update({ dir: state.dir === 'asc' ? 'desc' : 'asc' });
    },
    enableSortingRemoval: false,
    getCoreRowModel: getCoreRowModel(),
  });

  const [search, setSearch] = useState(state.q);
  useEffect(() => {
    if (search === state.q) return;
    const timer = setTimeout(() => update({ q: search }), SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [search, state.q, update]);

  const first = page && page.total > 0 ? (page.page - 1) * page.pageSize + 1 : 0;
  const last = page ? Math.min(page.total, page.page * page.pageSize) : 0;

  return (
    <section aria-label={label} className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-sm font-bold">
          Search
          <input
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder={searchPlaceholder}
            className="min-h-10 w-72 rounded border border-ink/40 bg-white px-2 text-base font-normal"
          />
        </label>
        {filters}
        <div className="ml-auto flex items-end gap-2">{actions}</div>
      </div>
      {query.isError && (
        <p role="alert" className="rounded border-2 border-sev-now bg-white p-3 font-bold text-sev-now">
          {(query.error as Error).message}
        </p>
      )}
      <div className="overflow-x-auto rounded border border-ink/20 bg-white">
        <table className="w-full border-collapse text-left text-[15px]" aria-busy={query.isFetching}>
          <thead className="bg-ink/5">
            {reactTable.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                      className="border-b border-ink/20 px-3 py-2 font-bold whitespace-nowrap"
                    >
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 hover:underline"
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true" className="w-3 text-xs">
                            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={query.isFetching && !query.isLoading ? 'opacity-70' : ''}>
            {reactTable.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-ink/10 last:border-0 hover:bg-brand/5">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {page && page.rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-8 text-center text-ink/80">
                  {empty}
                </td>
              </tr>
            )}
            {query.isLoading && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-8 text-center text-ink/80">
                  Loading…
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <nav aria-label={`${label} pages`} className="flex flex-wrap items-center gap-3 text-sm">
        <span aria-live="polite">
          {page ? (page.total === 0 ? 'No rows' : `${first}–${last} of ${page.total.toLocaleString('en-GB')}`) : ' '}
        </span>
        <div className="ml-auto flex items-center gap-2">
          <label className="flex items-center gap-1">
            Rows a page
            <select
              value={state.pageSize}
              onChange={(e) => update({ pageSize: Number(e.target.value) })}
              className="min-h-9 rounded border border-ink/40 bg-white px-1"
            >
              {[25, 50, 100, 200].map((n) => (
                <option key={n}>{n}</option>
              ))}
            </select>
          </label>
          <PagerButton label="First page" disabled={state.page <= 1} onClick={() => update({ page: 1 })}>
            «
          </PagerButton>
          <PagerButton label="Previous page" disabled={state.page <= 1} onClick={() => update({ page: state.page - 1 })}>
            ‹ Previous
          </PagerButton>
          <span>
            Page {state.page} of {pageCount}
          </span>
          <PagerButton label="Next page" disabled={state.page >= pageCount} onClick={() => update({ page: state.page + 1 })}>
            Next ›
          </PagerButton>
          <PagerButton label="Last page" disabled={state.page >= pageCount} onClick={() => update({ page: pageCount })}>
            »
          </PagerButton>
        </div>
      </nav>
    </section>
  );
}

function PagerButton({ label, disabled, onClick, children }: { label: string; disabled: boolean; onClick: () => void; children: ReactNode }) {
  return (
    <button
      type="button"
      aria-label={label}
      disabled={disabled}
      onClick={onClick}
      className="min-h-9 min-w-9 rounded border border-ink/40 bg-white px-2 font-bold disabled:opacity-40"
    >
      {children}
    </button>
  );
}

/** A plain filter select for the table's toolbar. */
export function FilterSelect({
  label,
  value,
  onChange,
  options,
  all = 'All',
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  options: readonly { value: string; label: string }[];
  all?: string;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm font-bold">
      {label}
      <select value={value} onChange={(e) => onChange(e.target.value)} className="min-h-10 rounded border border-ink/40 bg-white px-2 text-base font-normal">
        <option value="">{all}</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}
