import { useState, type FormEvent } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import DataTable from '../team/DataTable';
import Field from '../team/Field';
import StateBadge from '../team/StateBadge';
import { errorOf, formatWhen, send } from '../team/format';

interface AssemblyRow {
  id: number;
  name: string;
  element: 'wall' | 'roof' | 'floor';
  description: string;
  headNumber: number | null;
  headState: string | null;
  updatedAt: string;
}

const ELEMENT_LABEL = { wall: 'Wall', roof: 'Roof', floor: 'Floor' };

const columns: ColumnDef<AssemblyRow>[] = [
  {
    id: 'name',
    header: 'Assembly',
    cell: ({ row }) => (
      <div>
        <a className="font-semibold text-accent-strong hover:underline" href={`/assemblies/${row.original.id}`}>{row.original.name}</a>
        {row.original.description ? <div className="text-xs text-ink-soft line-clamp-2">{row.original.description}</div> : null}
      </div>
    ),
  },
  { id: 'element', header: 'Element', cell: ({ row }) => ELEMENT_LABEL[row.original.element] },
  { id: 'headNumber', header: 'Revision', meta: { align: 'right' }, cell: ({ row }) => (row.original.headNumber ? `R${row.original.headNumber}` : '—') },
  { id: 'headState', header: 'State', cell: ({ row }) => (row.original.headState ? <StateBadge state={row.original.headState} /> : '—') },
  { id: 'updatedAt', header: 'Last change', cell: ({ row }) => formatWhen(row.original.updatedAt) },
  {
    id: 'history',
    header: '',
    enableSorting: false,
    cell: ({ row }) => <a className="text-sm text-accent-strong hover:underline" href={`/assemblies/${row.original.id}/history`}>History and check</a>,
  },
];

/** a job's assemblies, with the form for a new one (editors only) */
export default function JobScreen({ jobId, canEdit }: { jobId: number; canEdit: boolean }) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setMessage(null);
    const res = await send('POST', `/api/jobs/${jobId}/assemblies`, {
      name: String(form.get('name') ?? ''),
      element: String(form.get('element') ?? 'wall'),
      description: String(form.get('description') ?? ''),
    });
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setErrors(err.fields);
      setMessage(err.message);
      return;
    }
    const { assembly } = (await res.json()) as { assembly: { id: number } };
    window.location.href = `/assemblies/${assembly.id}`;
  }

  return (
    <div className="space-y-4">
      {canEdit ? (
        open ? (
          <form onSubmit={submit} noValidate className="rounded border border-line bg-panel p-4 space-y-3" aria-label="New assembly">
            <h2 className="font-semibold">New assembly</h2>
            <div className="grid gap-3 md:grid-cols-[2fr_1fr]">
              <Field label="Assembly name" name="name" required maxLength={160} error={errors.name} autoFocus hint="e.g. West wall, option B (mineral wool)" />
              <label className="block text-sm" htmlFor="f-element">
                <span className="font-semibold">Element</span>
                <select id="f-element" name="element" defaultValue="wall" className="mt-1 block w-full rounded border border-line bg-panel px-2 py-1.5">
                  <option value="wall">Wall (R_si 0.13 m²K/W, horizontal heat flow)</option>
                  <option value="roof">Roof (R_si 0.10 m²K/W, heat flow upward)</option>
                  <option value="floor">Floor (R_si 0.17 m²K/W, heat flow downward)</option>
                </select>
                <span className="mt-0.5 block text-xs text-ink-faint">Sets the inside surface resistance (ISO 6946) and the starting build-up.</span>
              </label>
            </div>
            <label className="block text-sm" htmlFor="f-description">
              <span className="font-semibold">Description</span>
              <textarea id="f-description" name="description" rows={2} maxLength={5000} className="mt-1 block w-full rounded border border-line bg-panel px-2 py-1.5" />
              {errors.description ? <span className="text-xs text-danger">{errors.description}</span> : null}
            </label>
            <p className="text-xs text-ink-soft">The new assembly starts with revision 1: a typical build-up for the element and a summer-day exposure, ready to edit in the workbench.</p>
            {message ? <p className="text-sm text-danger" role="alert">{message}</p> : null}
            <div className="flex gap-2">
              <button type="submit" disabled={busy} className="rounded bg-accent px-3 py-1.5 font-semibold text-white disabled:opacity-60">
                {busy ? 'Creating…' : 'Create assembly'}
              </button>
              <button type="button" className="rounded border border-line px-3 py-1.5" onClick={() => { setOpen(false); setErrors({}); setMessage(null); }}>
                Cancel
              </button>
            </div>
          </form>
        ) : (
          <button type="button" className="rounded bg-accent px-3 py-1.5 font-semibold text-white" onClick={() => setOpen(true)}>
            New assembly
          </button>
        )
      ) : null}
      <DataTable<AssemblyRow>
        endpoint={`/api/jobs/${jobId}/assemblies`}
        columns={columns}
        defaultSort="name"
        filterHint="name, description or element"
        caption="Assemblies"
        empty={canEdit ? 'No assemblies yet. Add the first wall, roof or floor with “New assembly”.' : 'No assemblies yet.'}
        rowKey={(r) => r.id}
        testId="assemblies-table"
      />
    </div>
  );
}
