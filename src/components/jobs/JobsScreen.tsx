import { useState, type FormEvent } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import DataTable from '../team/DataTable';
import Field from '../team/Field';
import { errorOf, formatWhen, send } from '../team/format';
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
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const body = {
      teamId,
      name: String(form.get('name') ?? ''),
      reference: String(form.get('reference') ?? ''),
      client: String(form.get('client') ?? ''),
      location: String(form.get('location') ?? ''),
    };
    setBusy(true);
    setMessage(null);
    const res = await send('POST', '/api/jobs', body);
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setErrors(err.fields);
      setMessage(err.message);
      return;
    }
    const { job } = (await res.json()) as { job: { id: number } };
    window.location.href = `/jobs/${job.id}`;
  }

  return (
    <div className="space-y-4">
      {canEdit ? (
        open ? (
          <form onSubmit={submit} noValidate className="rounded border border-line bg-panel p-4 space-y-3" aria-label="New job">
            <h2 className="font-semibold">New job</h2>
            <div className="grid gap-3 md:grid-cols-2">
              <Field label="Job name" name="name" required maxLength={160} error={errors.name} autoFocus hint="The building project, e.g. Harrow Lane Library re-cladding" />
              <Field label="Reference" name="reference" maxLength={60} error={errors.reference} hint="Your job number (optional)" />
              <Field label="Client" name="client" maxLength={160} error={errors.client} />
              <Field label="Location" name="location" maxLength={160} error={errors.location} />
            </div>
            {message ? <p className="text-sm text-danger" role="alert">{message}</p> : null}
            <div className="flex gap-2">
              <button type="submit" disabled={busy} className="rounded bg-accent px-3 py-1.5 font-semibold text-white disabled:opacity-60">
                {busy ? 'Creating…' : 'Create job'}
              </button>
              <button type="button" className="rounded border border-line px-3 py-1.5" onClick={() => { setOpen(false); setErrors({}); setMessage(null); }}>
                Cancel
              </button>
            </div>
          </form>
        ) : (
          <button type="button" className="rounded bg-accent px-3 py-1.5 font-semibold text-white" onClick={() => setOpen(true)}>
            New job
          </button>
        )
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
