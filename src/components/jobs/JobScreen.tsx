import type { ColumnDef } from '@tanstack/react-table';
import DataTable from '../team/DataTable';
import Field from '../team/Field';
import StateBadge from '../team/StateBadge';
import { formatWhen } from '../team/format';
import CreateForm from './CreateForm';
import type { AssemblyRow as ServerAssemblyRow, Wire } from '../../lib/schemas/rows';

type AssemblyRow = Wire<ServerAssemblyRow>;

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
  return (
    <div className="space-y-4">
      {canEdit ? (
        <CreateForm<{ assembly: { id: number } }>
          noun="assembly"
          endpoint={`/api/jobs/${jobId}/assemblies`}
          body={(form) => ({
            name: String(form.get('name') ?? ''),
            element: String(form.get('element') ?? 'wall'),
            description: String(form.get('description') ?? ''),
          })}
          next={({ assembly }) => `/assemblies/${assembly.id}`}
        >
          {(errors) => (
            <>
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
            </>
          )}
        </CreateForm>
      ) : null}
      {canEdit ? (
        <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
          <a href={`/api/jobs/${jobId}/export`} download className="rounded border border-line bg-panel px-3 py-1.5 font-semibold text-accent-strong hover:bg-accent-soft" data-testid="download-backup">
            Download backup
          </a>
          <span className="text-ink-soft">One JSON file with this job’s assemblies, revisions, check trail, comments, runs and uploaded series; restore it from the Jobs page.</span>
        </p>
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
