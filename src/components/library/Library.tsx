import { useCallback, useEffect, useId, useMemo, useState } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type FilterFn,
  type SortingState,
} from '@tanstack/react-table';
import { fetchMaterials, type LibraryMaterial } from '../../lib/materials/library';
import { CLASS_LABELS } from '../../lib/materials/builtin';
import { MATERIAL_CLASSES } from '../../lib/schemas/workbench';
import { MAT_BG } from '../workbench/materialStyle';
import { fixed } from '../workbench/format';
import MaterialForm from './MaterialForm';
import CsvImport from './CsvImport';

interface Props {
  teamId: number;
  teamName: string;
  canEdit: boolean;
}

const col = createColumnHelper<LibraryMaterial>();

const matches: FilterFn<LibraryMaterial> = (row, _id, value: string) => {
  const m = row.original;
  const text = `${m.name} ${CLASS_LABELS[m.materialClass]} ${m.source} ${m.notes}`.toLowerCase();
  return value
    .toLowerCase()
    .split(/\s+/)
    .filter(Boolean)
    .every((w) => text.includes(w));
};

/** the Library screen: built-in and team materials in a sortable, filterable table */
export default function Library({ teamId, teamName, canEdit }: Props) {
  const [materials, setMaterials] = useState<LibraryMaterial[] | null>(null);
  const [loadError, setLoadError] = useState('');
  const [sorting, setSorting] = useState<SortingState>([]);
  const [search, setSearch] = useState('');
  const [cls, setCls] = useState<string>('');
  const [origin, setOrigin] = useState<'all' | 'builtin' | 'team'>('all');
  const [editing, setEditing] = useState<LibraryMaterial | 'new' | null>(null);
  const [importing, setImporting] = useState(false);
  const [notice, setNotice] = useState('');
  const [deleting, setDeleting] = useState<LibraryMaterial | null>(null);
  const [deleteError, setDeleteError] = useState('');
  const searchId = useId();

  const reload = useCallback(async () => {
    try {
      setMaterials(await fetchMaterials(teamId));
      setLoadError('');
    } catch (e) {
      setLoadError((e as Error).message);
    }
  }, [teamId]);
  useEffect(() => {
    reload();
  }, [reload]);

  const filtered = useMemo(
    () => (materials ?? []).filter((m) => (!cls || m.materialClass === cls) && (origin === 'all' || (origin === 'team') === (m.teamId !== null))),
    [materials, cls, origin],
  );

  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Name',
        cell: (c) => (
          <span className="font-semibold">
            {c.getValue()}
            {c.row.original.teamId !== null ? <span className="ml-2 rounded bg-accent-soft px-1 text-xs font-normal text-accent-strong">team</span> : null}
          </span>
        ),
      }),
      col.accessor((m) => CLASS_LABELS[m.materialClass], {
        id: 'class',
        header: 'Class',
        cell: (c) => (
          <span className="whitespace-nowrap">
            <span className={`mr-1.5 inline-block h-3 w-3 rounded-sm border border-line-strong align-middle ${MAT_BG[c.row.original.materialClass]}`} aria-hidden="true" />
            {c.getValue()}
          </span>
        ),
      }),
      col.accessor('conductivity', { header: 'λ [W/(m·K)]', meta: { numeric: true }, cell: (c) => fixed(c.getValue(), 3) }),
      col.accessor('density', { header: 'ρ [kg/m³]', meta: { numeric: true }, cell: (c) => fixed(c.getValue(), c.getValue() < 10 ? 1 : 0) }),
      col.accessor('specificHeat', { header: 'c [J/(kg·K)]', meta: { numeric: true }, cell: (c) => fixed(c.getValue(), 0) }),
      col.accessor('vapourResistanceFactor', { header: 'μ [–]', meta: { numeric: true }, cell: (c) => (c.getValue() >= 1e5 ? c.getValue().toExponential(0) : fixed(c.getValue(), 0)) }),
      col.accessor('source', {
        header: 'Source',
        enableSorting: false,
        cell: (c) => (
          <span className="block max-w-md text-xs text-ink-soft" title={c.row.original.notes || undefined}>
            {c.getValue()}
          </span>
        ),
      }),
      col.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) =>
          canEdit && c.row.original.teamId !== null ? (
            <span className="flex gap-1">
              <button type="button" className="rounded border border-line px-2 py-0.5 text-xs hover:border-accent" onClick={() => setEditing(c.row.original)} aria-label={`Edit ${c.row.original.name}`}>
                Edit
              </button>
              <button
                type="button"
                className="rounded border border-line px-2 py-0.5 text-xs hover:border-danger hover:text-danger"
                onClick={() => {
                  setDeleteError('');
                  setDeleting(c.row.original);
                }}
                aria-label={`Delete ${c.row.original.name}`}
              >
                Delete
              </button>
            </span>
          ) : null,
      }),
    ],
    [canEdit],
  );

  const table = useReactTable({
    data: filtered,
    columns,
    state: { sorting, globalFilter: search },
    onSortingChange: setSorting,
    onGlobalFilterChange: setSearch,
    globalFilterFn: matches,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const rows = table.getRowModel().rows;
  const teamCount = (materials ?? []).filter((m) => m.teamId !== null).length;

  const remove = async (m: LibraryMaterial) => {
    const r = await fetch(`/api/materials/${m.id}`, { method: 'DELETE' });
    if (r.status === 204) {
      setDeleting(null);
      setNotice(`Deleted “${m.name}”. Build-ups that used it keep their own copy of its values.`);
      reload();
    } else {
      const body = (await r.json().catch(() => null)) as { error?: { message: string } } | null;
      setDeleteError(body?.error?.message ?? `Deleting failed (HTTP ${r.status}).`);
    }
  };

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold">Library</h1>
          <p className="text-sm text-ink-soft">
            Built-in materials and the materials of {teamName} ({teamCount} of the team’s own).
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <a className="rounded border border-line px-3 py-1.5 text-sm hover:border-accent" href={`/api/materials/export.csv?teamId=${teamId}&scope=team`} download>
            Export team materials (CSV)
          </a>
          <a className="rounded border border-line px-3 py-1.5 text-sm hover:border-accent" href={`/api/materials/export.csv?teamId=${teamId}&scope=all`} download>
            Export all (CSV)
          </a>
          {canEdit ? (
            <>
              <button type="button" className="rounded border border-accent px-3 py-1.5 text-sm font-semibold text-accent-strong hover:bg-accent-soft" onClick={() => setImporting(true)}>
                Import CSV…
              </button>
              <button type="button" className="rounded bg-accent px-3 py-1.5 text-sm font-semibold text-white hover:bg-accent-strong" onClick={() => setEditing('new')} data-testid="new-material">
                New material…
              </button>
            </>
          ) : null}
        </div>
      </div>

      <p className="rounded border border-warn/30 bg-warn-soft px-3 py-2 text-sm" role="note">
        <strong className="font-semibold">Typical values.</strong> The built-in values are typical values from the published tables named in each source; replace
        them with the declared data of the product you specify. Air layers carry an equivalent conductivity for their own thickness only; ISO 6946 governs the real
        resistance of an air layer.
      </p>

      {notice ? (
        <p role="status" className="rounded border border-ok/30 bg-accent-soft px-3 py-2 text-sm text-ok">
          {notice}
        </p>
      ) : null}

      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor={searchId} className="block text-xs font-semibold text-ink-soft">
            Search
          </label>
          <input
            id={searchId}
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="name, class or source"
            className="w-72 rounded border border-line bg-panel px-2 py-1.5 text-sm"
          />
        </div>
        <label className="text-xs font-semibold text-ink-soft">
          Class
          <select value={cls} onChange={(e) => setCls(e.target.value)} className="mt-0.5 block rounded border border-line bg-panel px-2 py-1.5 text-sm font-normal text-ink">
            <option value="">All classes</option>
            {MATERIAL_CLASSES.map((c) => (
              <option key={c} value={c}>
                {CLASS_LABELS[c]}
              </option>
            ))}
          </select>
        </label>
        <label className="text-xs font-semibold text-ink-soft">
          Origin
          <select value={origin} onChange={(e) => setOrigin(e.target.value as typeof origin)} className="mt-0.5 block rounded border border-line bg-panel px-2 py-1.5 text-sm font-normal text-ink">
            <option value="all">Built-in and team</option>
            <option value="builtin">Built-in only</option>
            <option value="team">Team only</option>
          </select>
        </label>
        <p className="ml-auto text-sm text-ink-soft" role="status" aria-live="polite">
          {materials ? `${rows.length} of ${materials.length} materials` : ''}
        </p>
      </div>

      {loadError ? (
        <p role="alert" className="rounded bg-danger-soft px-3 py-2 text-danger">
          {loadError}
        </p>
      ) : !materials ? (
        <p role="status" className="py-6 text-center text-ink-soft">
          Loading the library…
        </p>
      ) : (
        <div className="overflow-x-auto rounded border border-line bg-panel">
          <table className="w-full text-sm" data-testid="materials-table">
            <thead>
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id} className="border-b border-line text-left">
                  {hg.headers.map((h) => {
                    const numeric = (h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                    const sorted = h.column.getIsSorted();
                    return (
                      <th
                        key={h.id}
                        scope="col"
                        aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : h.column.getCanSort() ? 'none' : undefined}
                        className={`px-2 py-2 text-xs font-semibold text-ink-soft ${numeric ? 'text-right' : ''}`}
                      >
                        {h.column.getCanSort() ? (
                          <button type="button" onClick={h.column.getToggleSortingHandler()} className={`inline-flex items-center gap-1 hover:text-ink ${numeric ? 'flex-row-reverse' : ''}`}>
                            {flexRender(h.column.columnDef.header, h.getContext())}
                            <span aria-hidden="true" className="w-2">
                              {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}
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
            <tbody>
              {rows.length === 0 ? (
                <tr>
                  <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-soft">
                    No material matches these filters.
                  </td>
                </tr>
              ) : (
                rows.map((r) => (
                  <tr key={r.id} className="border-b border-line/60 align-top last:border-0 hover:bg-paper" data-testid="material-row">
                    {r.getVisibleCells().map((c) => {
                      const numeric = (c.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                      return (
                        <td key={c.id} className={`px-2 py-1.5 ${numeric ? 'text-right tabular whitespace-nowrap' : ''}`}>
                          {flexRender(c.column.columnDef.cell, c.getContext())}
                        </td>
                      );
                    })}
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      )}

      {editing ? (
        <MaterialForm
          teamId={teamId}
          material={editing === 'new' ? null : editing}
          onClose={() => setEditing(null)}
          onSaved={(m, created) => {
            setEditing(null);
            setNotice(created ? `Added “${m.name}” to the team library.` : `Saved “${m.name}”.`);
            reload();
          }}
        />
      ) : null}
      {importing ? (
        <CsvImport
          teamId={teamId}
          onClose={() => setImporting(false)}
          onImported={(n) => {
            setImporting(false);
            setNotice(`Imported ${n} material${n === 1 ? '' : 's'} into the team library.`);
            reload();
          }}
        />
      ) : null}
      {deleting ? (
        <div className="fixed inset-0 z-50 flex items-start justify-center bg-ink/30 p-4 pt-[15vh]">
          <div role="alertdialog" aria-modal="true" aria-labelledby="delete-title" className="w-full max-w-md rounded-lg border border-line-strong bg-panel p-4 shadow-2xl">
            <h2 id="delete-title" className="text-lg font-semibold">
              Delete “{deleting.name}”?
            </h2>
            <p className="mt-2 text-sm text-ink-soft">It leaves the team library. Build-ups already using it keep their own copy of its values.</p>
            {deleteError ? (
              <p role="alert" className="mt-2 text-sm text-danger">
                {deleteError}
              </p>
            ) : null}
            <div className="mt-4 flex justify-end gap-2">
              <button type="button" autoFocus className="rounded border border-line px-3 py-1.5 text-sm" onClick={() => setDeleting(null)}>
                Keep it
              </button>
              <button type="button" className="rounded bg-danger px-3 py-1.5 text-sm font-semibold text-white" onClick={() => remove(deleting)}>
                Delete
              </button>
            </div>
          </div>
        </div>
      ) : null}
    </div>
  );
}
