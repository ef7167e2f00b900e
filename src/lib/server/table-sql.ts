// SQL pieces every office table query uses: paging, one sort column, and a search pattern.
import { asc, desc, sql, type SQL } from 'drizzle-orm';
import type { AnyColumn } from 'drizzle-orm';
import type { TableQuery } from '../office/table-query';

/** An ILIKE pattern that finds `text` anywhere, with the user's own % and _ taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export function pageWindow(query: Pick<TableQuery, 'page' | 'pageSize'>) {
  return { limit: query.pageSize, offset: (query.page - 1) * query.pageSize };
}

/** ORDER BY for the chosen column, with a stable tie-breaker so pages never repeat a row. */
export function orderFor(expression: AnyColumn | SQL, direction: 'asc' | 'desc', tieBreaker: AnyColumn): SQL[] {
  const sorted = direction === 'asc' ? sql`${expression} asc nulls last` : sql`${expression} desc nulls last`;
  return [sorted, direction === 'asc' ? asc(tieBreaker) : desc(tieBreaker)];
}
