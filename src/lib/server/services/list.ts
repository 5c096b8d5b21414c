import { asc, desc, type SQL, type AnyColumn } from 'drizzle-orm';
import type { ListQuery } from '../../schemas/api';

import type { Page } from '../../schemas/rows';

export type { Page };

/** the answer of a list endpoint: this page's items, where the page is, and how many there are in all */
export function pageOf<T>(items: T[], q: ListQuery, total: number): Page<T> {
  return { items, page: q.page, pageSize: q.pageSize, total };
}

/** ORDER BY for a "key" or "-key" sort, falling back to the first column */
export function orderFor(sort: string, columns: Record<string, AnyColumn | SQL>): SQL[] {
  const descending = sort.startsWith('-');
  const column = columns[sort.replace(/^-/, '')] ?? Object.values(columns)[0];
  return [descending ? desc(column) : asc(column)];
}

export function offsetOf(q: ListQuery): number {
  return (q.page - 1) * q.pageSize;
}

/** a LIKE pattern for the filter text, with % and _ taken literally */
export function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
