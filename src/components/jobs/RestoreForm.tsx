import { useId, useRef, useState, type SubmitEvent } from 'react';
import { MAX_BACKUP_BYTES, MAX_BACKUP_MB, describeBackupPath, type RestoreResult } from '../../lib/schemas/backup';

type Phase = { kind: 'idle' } | { kind: 'sending'; percent: number } | { kind: 'writing' } | { kind: 'failed'; message: string; fields: [string, string][] } | { kind: 'done'; result: RestoreResult };

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** the upload of a backup file, with the progress of the bytes sent (fetch cannot report it) */
function post(url: string, file: File, onProgress: (percent: number) => void): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.setRequestHeader('content-type', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(Math.round((100 * e.loaded) / e.total));
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // an answer that is not JSON is reported by its status
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => reject(new Error('network'));
    xhr.send(file);
  });
}

/** "Restore a job from a backup file": a job's backup becomes a new job of this team, all of it or nothing */
export default function RestoreForm({ teamId }: { teamId: number }) {
  const [open, setOpen] = useState(false);
  const [phase, setPhase] = useState<Phase>({ kind: 'idle' });
  const [fileError, setFileError] = useState('');
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  const busy = phase.kind === 'sending' || phase.kind === 'writing';

  async function submit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const file = input.current?.files?.[0];
    setFileError('');
    if (!file) {
      setFileError('Choose a backup file (.json) first.');
      input.current?.focus();
      return;
    }
    if (file.size > MAX_BACKUP_BYTES) {
      setFileError(`The file is ${(file.size / 1024 / 1024).toFixed(1)} MB; a backup file can be at most ${MAX_BACKUP_MB} MB.`);
      input.current?.focus();
      return;
    }
    setPhase({ kind: 'sending', percent: 0 });
    try {
      const { status, body } = await post(`/api/teams/${teamId}/import`, file, (percent) => setPhase(percent >= 100 ? { kind: 'writing' } : { kind: 'sending', percent }));
      if (status === 201) {
        setPhase({ kind: 'done', result: body as RestoreResult });
        return;
      }
      const error = (body as { error?: { message?: string; fields?: Record<string, string> } } | null)?.error;
      setPhase({
        kind: 'failed',
        message: error?.message ?? `The server answered ${status}; nothing was restored.`,
        fields: Object.entries(error?.fields ?? {}).slice(0, 6),
      });
    } catch {
      setPhase({ kind: 'failed', message: 'The server could not be reached; nothing was restored.', fields: [] });
    }
  }

  if (!open) {
    return (
      <button type="button" className="rounded border border-line bg-panel px-3 py-1.5" onClick={() => setOpen(true)}>
        Restore a job from a backup file
      </button>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded border border-line bg-panel p-4" aria-label="Restore a job from a backup file" data-testid="restore-form">
      <h2 className="font-semibold">Restore a job from a backup file</h2>
      <p className="max-w-3xl text-sm text-ink-soft">
        A backup file is what “Download backup” on a job’s page saves. It comes back as a new job of this team with its assemblies, revisions, check trail, comments, runs and
        uploaded series. People of the file who are not members here are recorded under your name, and the job’s notes say who they were. A file with any problem restores
        nothing. At most {MAX_BACKUP_MB} MB.
      </p>
      <label htmlFor={id} className="block text-sm">
        <span className="font-semibold">Backup file</span>
        <input
          ref={input}
          id={id}
          name="file"
          type="file"
          accept=".json,application/json"
          disabled={busy}
          aria-invalid={fileError ? true : undefined}
          aria-describedby={fileError ? `${id}-error` : undefined}
          className="mt-1 block text-sm"
          onChange={() => {
            setFileError('');
            if (phase.kind !== 'sending' && phase.kind !== 'writing') setPhase({ kind: 'idle' });
          }}
        />
        {fileError ? (
          <span id={`${id}-error`} role="alert" className="mt-0.5 block text-xs text-danger">
            {fileError}
          </span>
        ) : null}
      </label>

      {phase.kind === 'sending' || phase.kind === 'writing' ? (
        <div className="space-y-1" data-testid="restore-progress">
          <div
            role="progressbar"
            aria-label="Restoring the backup"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={phase.kind === 'sending' ? phase.percent : undefined}
            className="h-2 w-full max-w-md overflow-hidden rounded bg-line"
          >
            <div className={`h-full bg-accent ${phase.kind === 'writing' ? 'w-full animate-pulse' : ''}`} style={phase.kind === 'sending' ? { width: `${phase.percent}%` } : undefined} />
          </div>
          <p role="status" className="text-sm text-ink-soft">
            {phase.kind === 'sending' ? `Sending the file… ${phase.percent} %` : 'Checking the file and writing the job…'}
          </p>
        </div>
      ) : null}

      {phase.kind === 'failed' ? (
        <div role="alert" className="rounded border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger" data-testid="restore-error">
          <p className="font-semibold">{phase.message}</p>
          {phase.fields.length > 1 ? (
            <ul className="mt-1 list-disc pl-5">
              {phase.fields.map(([path, message]) => (
                <li key={path}>
                  {describeBackupPath(path)} {message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      {phase.kind === 'done' ? (
        <div role="status" className="rounded border border-ok/30 bg-ok/10 px-3 py-2 text-sm" data-testid="restore-done">
          <p>
            Restored <a href={`/jobs/${phase.result.job.id}`} className="font-semibold text-accent-strong underline">{phase.result.job.name}</a>:{' '}
            {plural(phase.result.counts.assemblies, 'assembly', 'assemblies')}, {plural(phase.result.counts.revisions, 'revision')}, {plural(phase.result.counts.runs, 'run')},{' '}
            {plural(phase.result.counts.comments, 'comment')}, {plural(phase.result.counts.uploads, 'uploaded series', 'uploaded series')}.
          </p>
          {phase.result.reassigned.length ? <p className="mt-1 text-ink-soft">Recorded under your name (not members of this team): {phase.result.reassigned.join(', ')}.</p> : null}
        </div>
      ) : null}

      <div className="flex gap-2">
        <button type="submit" disabled={busy} className="rounded bg-accent px-3 py-1.5 font-semibold text-white disabled:opacity-60">
          {busy ? 'Restoring…' : 'Restore job'}
        </button>
        <button
          type="button"
          disabled={busy}
          className="rounded border border-line px-3 py-1.5 disabled:opacity-60"
          onClick={() => {
            setOpen(false);
            setPhase({ kind: 'idle' });
            setFileError('');
          }}
        >
          Close
        </button>
      </div>
    </form>
  );
}
