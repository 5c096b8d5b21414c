// a table over one of the API's paginated lists (?page=&pageSize=&sort=&q=): sorting,
// filtering and paging happen on the server; TanStack Table keeps the column model.
import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';
import { errorOf } from './format';
import type { Page } from '../../lib/schemas/rows';

interface Props<T> {
  /** list endpoint, may already carry query parameters (teamId) */
  endpoint: string;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<T, any>[];
  /** "key" or "-key" */
  defaultSort: string;
  /** what the filter box searches, e.g. "name, client or reference" */
  filterHint: string;
  /** shown when the list is empty and no filter is set */
  empty: ReactNode;
  caption: string;
  /** change it to fetch again (after a create, a revoke...) */
  reloadKey?: number;
  pageSize?: number;
  testId?: string;
  /** a row to mark as selected */
  selectedKey?: string | number | null;
  rowKey: (row: T) => string | number;
  onRowClick?: (row: T) => void;
}

function toSorting(sort: string): SortingState {
  return [{ id: sort.replace(/^-/, ''), desc: sort.startsWith('-') }];
}

export default function DataTable<T>({ endpoint, columns, defaultSort, filterHint, empty, caption, reloadKey = 0, pageSize = 20, testId, selectedKey, rowKey, onRowClick }: Props<T>) {
  const [sorting, setSorting] = useState<SortingState>(toSorting(defaultSort));
  const [filter, setFilter] = useState('');
  const [q, setQ] = useState('');
  const [page, setPage] = useState(1);
  const [data, setData] = useState<Page<T> | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [loading, setLoading] = useState(true);
  const [retry, setRetry] = useState(0);

  // wait for a pause in typing before asking the server
  useEffect(() => {
    const t = setTimeout(() => {
      setQ(filter.trim());
      setPage(1);
    }, 250);
    return () => clearTimeout(t);
  }, [filter]);

  const sort = sorting[0] ? `${sorting[0].desc ? '-' : ''}${sorting[0].id}` : defaultSort;
  useEffect(() => {
    const ctrl = new AbortController();
    const url = new URL(endpoint, window.location.origin);
    url.searchParams.set('page', String(page));
    url.searchParams.set('pageSize', String(pageSize));
    url.searchParams.set('sort', sort);
    if (q) url.searchParams.set('q', q);
    setLoading(true);
    fetch(url, { signal: ctrl.signal })
      .then(async (res) => {
        if (!res.ok) throw new Error((await errorOf(res)).message);
        setData((await res.json()) as Page<T>);
        setError(null);
      })
      .catch((err: unknown) => {
        if ((err as Error).name !== 'AbortError') setError((err as Error).message || 'The list could not be loaded.');
      })
      .finally(() => {
        if (!ctrl.signal.aborted) setLoading(false);
      });
    return () => ctrl.abort();
  }, [endpoint, page, pageSize, sort, q, reloadKey, retry]);

  const items = useMemo(() => data?.items ?? [], [data]);
  const table = useReactTable({
    data: items,
    columns,
    state: { sorting },
    onSortingChange: (updater) => {
      setSorting((old) => {
        const next = typeof updater === 'function' ? updater(old) : updater;
        return next.length ? next : toSorting(defaultSort);
      });
      setPage(1);
    },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => String(rowKey(row)),
  });

  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  return (
    <div data-testid={testId} className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <label className="flex items-center gap-2 text-sm">
          <span className="text-ink-soft">Filter</span>
          <input
            type="search"
            value={filter}
            onChange={(e) => setFilter(e.target.value)}
            placeholder={filterHint}
            aria-label={`Filter ${caption.toLowerCase()} by ${filterHint}`}
            className="w-72 rounded border border-line bg-panel px-2 py-1"
          />
        </label>
        <span className="text-sm text-ink-faint" aria-live="polite">
          {loading ? 'Loading…' : data ? `${data.total} ${data.total === 1 ? 'item' : 'items'}` : ''}
        </span>
      </div>
      {error ? (
        <div role="alert" className="rounded border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {error}{' '}
          <button type="button" className="underline" onClick={() => setRetry((n) => n + 1)}>
            Try again
          </button>
        </div>
      ) : null}
      <div className="overflow-x-auto rounded border border-line bg-panel">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id} className="border-b border-line text-left text-ink-soft">
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  const align = (h.column.columnDef.meta as { align?: string } | undefined)?.align === 'right' ? 'text-right' : '';
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      className={`px-3 py-2 font-semibold ${align}`}
                      aria-sort={sorted ? (sorted === 'desc' ? 'descending' : 'ascending') : undefined}
                    >
                      {h.column.getCanSort() ? (
                        <button type="button" className="inline-flex items-center gap-1 hover:text-ink" onClick={h.column.getToggleSortingHandler()} title="Sort by this column">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true" className="text-xs">
                            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={loading && data ? 'opacity-60' : ''}>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                className={`border-b border-line/60 last:border-0 ${onRowClick ? 'cursor-pointer hover:bg-paper' : ''} ${selectedKey !== undefined && String(selectedKey) === row.id ? 'bg-accent-soft' : ''}`}
                onClick={onRowClick ? () => onRowClick(row.original) : undefined}
              >
                {row.getVisibleCells().map((cell) => {
                  const align = (cell.column.columnDef.meta as { align?: string } | undefined)?.align === 'right' ? 'text-right tabular' : '';
                  return (
                    <td key={cell.id} className={`px-3 py-2 align-top ${align}`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  );
                })}
              </tr>
            ))}
            {!loading && data && data.items.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-soft">
                  {q ? `Nothing matches “${q}”.` : empty}
                </td>
              </tr>
            ) : null}
            {!data && loading ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-faint">
                  Loading…
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      {data && data.total > data.pageSize ? (
        <nav className="flex items-center gap-2 text-sm" aria-label={`${caption} pages`}>
          <button type="button" className="rounded border border-line px-2 py-1 disabled:opacity-40" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
            ← Previous
          </button>
          <span className="text-ink-soft tabular">
            Page {page} of {pages}
          </span>
          <button type="button" className="rounded border border-line px-2 py-1 disabled:opacity-40" disabled={page >= pages} onClick={() => setPage((p) => p + 1)}>
            Next →
          </button>
        </nav>
      ) : null}
    </div>
  );
}
