import { useId, useState } from 'react';
import type { MaterialFields } from '../../lib/materials/schema';
import type { CsvProblem } from '../../lib/materials/csv';
import { CLASS_LABELS } from '../../lib/materials/builtin';
import Modal from '../workbench/Modal';
import { fixed } from '../workbench/format';

interface Preview {
  rows: { line: number; material: MaterialFields }[];
  problems: CsvProblem[];
  valid: boolean;
}

/** choose a file, see what would be imported and every problem by line, then import all of it or nothing */
export default function CsvImport({ teamId, onClose, onImported }: { teamId: number; onClose(): void; onImported(n: number): void }) {
  const [csv, setCsv] = useState<string | null>(null);
  const [fileName, setFileName] = useState('');
  const [preview, setPreview] = useState<Preview | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState('');
  const id = useId();

  const send = async (text: string, commit: boolean) => {
    setBusy(true);
    setError('');
    try {
      const r = await fetch('/api/materials/import', {
        method: 'POST',
        headers: { 'content-type': 'application/json', accept: 'application/json' },
        body: JSON.stringify({ teamId, csv: text, commit }),
      });
      const body = (await r.json().catch(() => null)) as (Preview & { created?: number; error?: { message: string; fields?: Record<string, string> } }) | null;
      if (commit && r.status === 201 && body?.created !== undefined) {
        onImported(body.created);
        return;
      }
      if (body?.rows && body.problems) setPreview({ rows: body.rows, problems: body.problems, valid: body.problems.length === 0 });
      if (!r.ok) {
        const fields = body?.error?.fields ? ` ${Object.entries(body.error.fields).map(([k, v]) => `${k} ${v}`).join('; ')}` : '';
        setError(`${body?.error?.message ?? `The import failed (HTTP ${r.status}).`}${fields}`);
      }
    } catch {
      setError('The server could not be reached; nothing was imported.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <Modal title="Import materials from CSV" onClose={onClose} testId="csv-import">
      <div className="mt-2 max-h-[70vh] space-y-3 overflow-y-auto text-sm">
        <p className="text-ink-soft">
          One material a line after a header line with the columns <code>name</code>, <code>class</code>, <code>conductivity [W/(m·K)]</code>, <code>density [kg/m³]</code>,{' '}
          <code>specific heat [J/(kg·K)]</code>, <code>vapour resistance factor μ [–]</code>, <code>source</code> and optionally <code>notes</code> (the layout of the export). A file with any problem
          imports nothing.
        </p>
        <div>
          <label htmlFor={id} className="block font-semibold">
            CSV file
          </label>
          <input
            id={id}
            type="file"
            accept=".csv,text/csv"
            className="mt-1 block text-sm"
            onChange={async (e) => {
              const f = e.target.files?.[0];
              setPreview(null);
              if (!f) return;
              if (f.size > 1_000_000) {
                setError(`The file is ${(f.size / 1e6).toFixed(1)} MB; at most 1 MB can be imported.`);
                return;
              }
              const text = await f.text();
              setCsv(text);
              setFileName(f.name);
              send(text, false);
            }}
          />
        </div>
        {busy ? <p role="status">Checking…</p> : null}
        {error ? (
          <p role="alert" className="rounded bg-danger-soft px-2 py-1.5 text-danger">
            {error}
          </p>
        ) : null}
        {preview ? (
          <div className="space-y-2" data-testid="import-preview">
            {preview.problems.length ? (
              <div role="alert" className="rounded border border-danger/40 bg-danger-soft px-3 py-2">
                <p className="font-semibold text-danger">
                  {preview.problems.length} problem{preview.problems.length > 1 ? 's' : ''} in {fileName}; nothing will be imported until the file is corrected:
                </p>
                <ul className="mt-1 space-y-0.5" data-testid="import-problems">
                  {preview.problems.map((p, i) => (
                    <li key={i}>
                      <span className="font-semibold tabular">Line {p.line}</span>: {p.message}
                    </li>
                  ))}
                </ul>
              </div>
            ) : (
              <p className="font-semibold text-ok">{preview.rows.length} materials ready to import from {fileName}.</p>
            )}
            {preview.rows.length ? (
              <table className="w-full text-xs">
                <thead>
                  <tr className="border-b border-line text-left text-ink-soft">
                    <th className="py-1 pr-2">Line</th>
                    <th className="py-1 pr-2">Name</th>
                    <th className="py-1 pr-2">Class</th>
                    <th className="py-1 pr-2 text-right">λ [W/(m·K)]</th>
                    <th className="py-1 pr-2 text-right">ρ [kg/m³]</th>
                    <th className="py-1 pr-2 text-right">c [J/(kg·K)]</th>
                    <th className="py-1 text-right">μ [–]</th>
                  </tr>
                </thead>
                <tbody className="tabular">
                  {preview.rows.map((r) => (
                    <tr key={r.line} className="border-b border-line/50">
                      <td className="py-0.5 pr-2">{r.line}</td>
                      <td className="py-0.5 pr-2">{r.material.name}</td>
                      <td className="py-0.5 pr-2">{CLASS_LABELS[r.material.materialClass]}</td>
                      <td className="py-0.5 pr-2 text-right">{fixed(r.material.conductivity, 3)}</td>
                      <td className="py-0.5 pr-2 text-right">{fixed(r.material.density, 0)}</td>
                      <td className="py-0.5 pr-2 text-right">{fixed(r.material.specificHeat, 0)}</td>
                      <td className="py-0.5 text-right">{fixed(r.material.vapourResistanceFactor, 0)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </div>
        ) : null}
      </div>
      <div className="mt-4 flex justify-end gap-2">
        <button type="button" onClick={onClose} className="rounded border border-line px-3 py-1.5 text-sm">
          Cancel
        </button>
        <button
          type="button"
          disabled={busy || !csv || !preview?.valid}
          onClick={() => csv && send(csv, true)}
          className="rounded bg-accent px-4 py-1.5 text-sm font-semibold text-white disabled:opacity-50"
        >
          {preview?.valid ? `Import ${preview.rows.length} materials` : 'Import'}
        </button>
      </div>
    </Modal>
  );
}
