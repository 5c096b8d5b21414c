import type { ColumnDef } from '@tanstack/react-table';
import DataTable from '../team/DataTable';
import Field from '../team/Field';
import { formatWhen } from '../team/format';
import CreateForm from './CreateForm';
import RestoreForm from './RestoreForm';
import type { JobRow as ServerJobRow, Wire } from '../../lib/schemas/rows';

type JobRow = Wire<ServerJobRow>;

const columns: ColumnDef<JobRow>[] = [
  { id: 'name', header: 'Job', cell: ({ row }) => <a className="font-semibold text-accent-strong hover:underline" href={`/jobs/${row.original.id}`}>{row.original.name}</a> },
  { id: 'reference', header: 'Reference', cell: ({ row }) => row.original.reference || '—' },
  { id: 'client', header: 'Client', cell: ({ row }) => row.original.client || '—' },
  { id: 'location', header: 'Location', cell: ({ row }) => row.original.location || '—' },
  { id: 'assemblyCount', header: 'Assemblies', meta: { align: 'right' }, cell: ({ row }) => row.original.assemblyCount },
  { id: 'updatedAt', header: 'Last change', cell: ({ row }) => formatWhen(row.original.updatedAt) },
];

/** the Jobs list with the form for a new job (editors only) */
export default function JobsScreen({ teamId, canEdit }: { teamId: number; canEdit: boolean }) {
  return (
    <div className="space-y-4">
      {canEdit ? (
        <CreateForm<{ job: { id: number } }>
          noun="job"
          endpoint="/api/jobs"
          body={(form) => ({
            teamId,
            name: String(form.get('name') ?? ''),
            reference: String(form.get('reference') ?? ''),
            client: String(form.get('client') ?? ''),
            location: String(form.get('location') ?? ''),
          })}
          next={({ job }) => `/jobs/${job.id}`}
        >
          {(errors) => (
            <div className="grid gap-3 md:grid-cols-2">
              <Field label="Job name" name="name" required maxLength={160} error={errors.name} autoFocus hint="The building project, e.g. Harrow Lane Library re-cladding" />
              <Field label="Reference" name="reference" maxLength={60} error={errors.reference} hint="Your job number (optional)" />
              <Field label="Client" name="client" maxLength={160} error={errors.client} />
              <Field label="Location" name="location" maxLength={160} error={errors.location} />
            </div>
          )}
        </CreateForm>
      ) : null}
      {canEdit ? (
        // a block of its own: beside the New job button it would read as one word
        <div>
          <RestoreForm teamId={teamId} />
        </div>
      ) : (
        <p className="text-sm text-ink-soft">Your role may read and check the team’s jobs; engineers and admins create them.</p>
      )}
      <DataTable<JobRow>
        endpoint={`/api/jobs?teamId=${teamId}`}
        columns={columns}
        defaultSort="-updatedAt"
        filterHint="name, reference, client or place"
        caption="Jobs"
        empty={canEdit ? 'No jobs yet. Create the first one with “New job”.' : 'No jobs yet.'}
        rowKey={(r) => r.id}
        testId="jobs-table"
      />
    </div>
  );
}
