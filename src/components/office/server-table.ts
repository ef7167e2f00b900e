// State of a server-side table (page, size, sort, search, filters), kept in the address bar so
// a reload, the back button or a shared link shows the same rows.
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useCallback, useEffect, useState } from 'react';
import type { TablePage } from '../../lib/office/table-query';
import { api } from './api';

export type TableState = {
  page: number;
  pageSize: number;
  sort: string;
  dir: 'asc' | 'desc';
  q: string;
  filters: Record<string, string>;
};

export function tableStateFrom(search: string, defaults: { sort: string; dir?: 'asc' | 'desc'; pageSize?: number }, filterKeys: readonly string[] = []): TableState {
  const params = new URLSearchParams(search);
  const filters: Record<string, string> = {};
  for (const key of filterKeys) {
    const value = params.get(key);
    if (value) filters[key] = value;
  }
  const dir = params.get('dir');
  return {
    page: Math.max(1, Number(params.get('page')) || 1),
    pageSize: Number(params.get('pageSize')) || defaults.pageSize || 50,
    sort: params.get('sort') ?? defaults.sort,
    dir: dir === 'asc' || dir === 'desc' ? dir : (defaults.dir ?? 'asc'),
    q: params.get('q') ?? '',
    filters,
  };
}

function toQuery(state: TableState) {
  return { page: state.page, pageSize: state.pageSize, sort: state.sort, dir: state.dir, q: state.q.trim(), ...state.filters };
}

export function useServerTable<Row>(endpoint: string, initial: TableState, options: { syncUrl?: boolean } = {}) {
  const [state, setState] = useState(initial);
  const syncUrl = options.syncUrl ?? true;
  useEffect(() => {
    if (!syncUrl) return;
    const params = new URLSearchParams();
    for (const [key, value] of Object.entries(toQuery(state))) {
      if (value !== '' && value !== undefined) params.set(key, String(value));
    }
    window.history.replaceState(null, '', `${window.location.pathname}?${params}`);
  }, [state, syncUrl]);
  const query = useQuery({
    queryKey: [endpoint, toQuery(state)],
    queryFn: () => api<TablePage<Row>>(endpoint, { query: toQuery(state) }),
    placeholderData: keepPreviousData,
  });
  const update = useCallback((change: Partial<TableState>) => {
    // Any change but the page itself starts again from page 1: page 7 of a new filter is rarely wanted.
    setState((old) => ({ ...old, ...change, page: change.page ?? 1 }));
  }, []);
  const setFilter = useCallback(
    (key: string, value: string) =>
      setState((old) => {
        const filters = { ...old.filters };
        if (value) filters[key] = value;
        else delete filters[key];
        return { ...old, filters, page: 1 };
      }),
    [],
  );
  return { state, update, setFilter, query };
}
