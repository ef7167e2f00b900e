// The query every office table sends: page, page size, one sort column, direction and a search
// text. Tables hold thousands of rows, so paging, sorting and filtering happen on the server.
import { z } from 'zod';

// Large enough for a busy week on one screen, small enough that one page stays quick to render.
export const MAX_PAGE_SIZE = 200;
export const DEFAULT_PAGE_SIZE = 50;

export const SORT_DIRECTIONS = ['asc', 'desc'] as const;
export type SortDirection = (typeof SORT_DIRECTIONS)[number];

/** A zod schema for URL search parameters of a table whose sortable columns are `sortKeys`. */
export function tableQuery<const K extends readonly [string, ...string[]]>(sortKeys: K, defaultSort: K[number]) {
  return z.object({
    page: z.coerce.number().int().min(1, 'pages start at 1').max(1_000_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE, `at most ${MAX_PAGE_SIZE} rows a page`).default(DEFAULT_PAGE_SIZE),
    sort: z.enum(sortKeys).default(defaultSort as never),
    dir: z.enum(SORT_DIRECTIONS).default('asc'),
    q: z.string().trim().max(100, 'search text is at most 100 characters').optional(),
  });
}

export type TableQuery<K extends string = string> = {
  page: number;
  pageSize: number;
  sort: K;
  dir: SortDirection;
  q?: string | undefined;
};

export type TablePage<Row> = { rows: Row[]; total: number; page: number; pageSize: number };
