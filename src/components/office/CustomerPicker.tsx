// Finding a customer by typing part of a name, phone or postcode.
import { useQuery } from '@tanstack/react-query';
import { useEffect, useId, useState } from 'react';
import type { CustomerRow } from '../../lib/server/customers';
import type { TablePage } from '../../lib/office/table-query';
import { api } from './api';

export type PickedCustomer = Pick<CustomerRow, 'id' | 'name' | 'postcode'>;

export function CustomerPicker({
  value,
  onPick,
  error,
}: {
  value: PickedCustomer | null;
  onPick: (customer: PickedCustomer | null) => void;
  error?: string | undefined;
}) {
  const id = useId();
  const [text, setText] = useState('');
  const [search, setSearch] = useState('');
  useEffect(() => {
    const timer = setTimeout(() => setSearch(text.trim()), 250);
    return () => clearTimeout(timer);
  }, [text]);
  const results = useQuery({
    queryKey: ['customer-picker', search],
    queryFn: () => api<TablePage<CustomerRow>>('/api/office/customers', { query: { q: search, pageSize: 8, sort: 'name' } }),
    enabled: value === null && search.length >= 2,
  });
  if (value) {
    return (
      <div className="flex flex-col gap-1">
        <span className="text-sm font-bold">Customer</span>
        <div className="flex min-h-10 items-center gap-3 rounded border border-ink/40 bg-white px-2">
          <span className="font-bold">{value.name}</span>
          <span className="text-ink/70">{value.postcode}</span>
          <button type="button" className="ml-auto text-brand underline" onClick={() => onPick(null)}>
            Change
          </button>
        </div>
      </div>
    );
  }
  return (
    <div className="relative flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-bold">
        Customer
      </label>
      <input
        id={id}
        type="search"
        value={text}
        onChange={(e) => setText(e.target.value)}
        placeholder="Type two letters of the name, phone or postcode"
        aria-invalid={Boolean(error)}
        className="min-h-10 rounded border border-ink/40 bg-white px-2 aria-[invalid=true]:border-2 aria-[invalid=true]:border-sev-now"
      />
      {error && (
        <p role="alert" className="text-sm font-bold text-sev-now">
          Customer: {error}
        </p>
      )}
      {search.length >= 2 && (
        <ul aria-label="Matching customers" className="rounded border border-ink/30 bg-white">
          {results.data?.rows.map((c) => (
            <li key={c.id}>
              <button
                type="button"
                className="flex min-h-10 w-full items-center gap-3 px-2 text-left hover:bg-brand/10"
                onClick={() => onPick({ id: c.id, name: c.name, postcode: c.postcode })}
              >
                <span className="font-bold">{c.name}</span>
                <span className="text-ink/70">{c.postcode}</span>
                <span className="ml-auto text-sm text-ink/70">{c.vehicleCount} vehicle(s)</span>
              </button>
            </li>
          ))}
          {results.data?.rows.length === 0 && <li className="px-2 py-2">No customer matches “{search}”.</li>}
          {results.isLoading && <li className="px-2 py-2">Searching…</li>}
        </ul>
      )}
    </div>
  );
}
