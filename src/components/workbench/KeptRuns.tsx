// runs kept with a revision: keeping one (packed, with its series), loading the newest back
// into the pane, the list of kept runs, and the comparison of a new run with the kept one.
import { useEffect, useState } from 'react';
import type { RunDone } from '../../lib/workbench/runner';
import { exposureSchema, type Exposure, type WorkbenchDocument } from '../../lib/schemas/workbench';
import { summaryOf } from '../../lib/workbench/figures';
import { FIGURE_DEFS, fixed, formatFigure } from '../../lib/workbench/figureDefs';
import { MAX_PACKED_BYTES, packRun, toBase64, unpackRun } from '../../lib/workbench/keptRun';
import type { RevisionInfo } from '../../lib/workbench/store';

/** a run kept with the revision, as GET /api/revisions/:id/runs lists it */
export interface KeptRunRow {
  id: number;
  exposure: unknown;
  summary: Record<string, number | string | null>;
  createdByName: string | null;
  createdAt: string;
  hasSeries: boolean;
}

/** where a shown run came from: this browser, or a run kept with the revision */
export type RunOrigin = { kind: 'browser' } | { kind: 'kept'; runId: number; byName: string | null; at: string };

export const whenText = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** the runs kept with a revision, newest first; null while loading or without a revision */
export function useKeptRuns(base: RevisionInfo | null, refresh: number): { rows: KeptRunRow[] | null; loaded: boolean } {
  const [state, setState] = useState<{ id: number | null; rows: KeptRunRow[] | null }>({ id: null, rows: null });
  useEffect(() => {
    if (!base) return;
    let stop = false;
    fetch(`/api/revisions/${base.id}/runs`)
      .then((r) => (r.ok ? r.json() : null))
      .then((body: { items?: KeptRunRow[] } | null) => !stop && setState({ id: base.id, rows: body?.items ?? [] }))
      .catch(() => !stop && setState({ id: base.id, rows: [] }));
    return () => {
      stop = true;
    };
  }, [base?.id, refresh]);
  if (!base) return { rows: null, loaded: true };
  return { rows: state.id === base.id ? state.rows : null, loaded: state.id === base.id };
}

/** fetches and unpacks a kept run; the document it ran is the revision's build-up with the run's own exposure */
export async function loadKeptRun(row: KeptRunRow, savedDoc: WorkbenchDocument): Promise<{ run: RunDone; doc: WorkbenchDocument } | null> {
  const res = await fetch(`/api/runs/${row.id}/packed`);
  if (!res.ok) return null;
  const run = unpackRun(new Uint8Array(await res.arrayBuffer()));
  const exposure = exposureSchema.safeParse(row.exposure);
  return { run, doc: { ...savedDoc, exposure: exposure.success ? (exposure.data as Exposure) : savedDoc.exposure } };
}

/** keeps a run with a revision: its exposure, summary and the run packed (or the figures only when too large) */
export async function keepRun(revisionId: number, run: RunDone, exposure: Exposure): Promise<{ ok: true; id: number; withSeries: boolean } | { ok: false; message: string }> {
  const packed = packRun(run);
  const withSeries = packed.length <= MAX_PACKED_BYTES;
  try {
    const res = await fetch(`/api/revisions/${revisionId}/runs`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ exposure, summary: summaryOf(run.figures), ...(withSeries ? { packed: toBase64(packed) } : {}) }),
    });
    const body = await res.json().catch(() => null);
    if (res.status !== 201) return { ok: false, message: body?.error?.message ?? `The run was not kept (HTTP ${res.status}).` };
    return { ok: true, id: body.run.id, withSeries };
  } catch (e) {
    return { ok: false, message: `The run could not be sent: ${e instanceof Error ? e.message : String(e)}` };
  }
}

const LISTED = ['decrementFactorSimulated', 'timeLagSimulatedH', 'peakHeatGainWm2', 'peakHeatLossWm2', 'insideSurfaceMinC'];

/** the list of kept runs, folded */
export function KeptRunsList({ rows, revision }: { rows: KeptRunRow[]; revision: number | undefined }) {
  const defs = LISTED.map((k) => FIGURE_DEFS.find((d) => d.key === k)!);
  return (
    <details className="text-xs" data-testid="kept-runs">
      <summary className="cursor-pointer text-ink-soft">
        {rows.length} {rows.length === 1 ? 'run' : 'runs'} kept with revision {revision}
      </summary>
      <table className="mt-1 tabular">
        <thead>
          <tr className="text-ink-faint">
            <th className="text-left font-normal pr-3">Kept</th>
            <th className="text-left font-normal pr-3">By</th>
            {defs.map((d) => (
              <th key={d.key} className="text-right font-normal pr-3" title={d.how}>
                {d.label}
                {d.unit && d.unit !== '–' ? ` (${d.unit})` : ''}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id}>
              <td className="pr-3">{whenText(r.createdAt)}</td>
              <td className="pr-3">{r.createdByName ?? '–'}</td>
              {defs.map((d) => (
                <td key={d.key} className="text-right pr-3">
                  {formatFigure(d.key, r.summary[d.key])}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}

const COMPARED = ['decrementFactorSimulated', 'timeLagSimulatedH', 'peakHeatGainWm2', 'peakHeatLossWm2', 'heatGainedWhm2', 'heatLostWhm2', 'insideSurfaceMinC', 'insideSurfaceMaxC', 'lowestInterfaceC'];

/** the new run's figures beside the kept run's, with the difference */
export function Comparison({ kept, fresh, keptLabel }: { kept: RunDone; fresh: RunDone; keptLabel: string }) {
  const a = summaryOf(kept.figures);
  const b = summaryOf(fresh.figures);
  const defs = FIGURE_DEFS.filter((d) => COMPARED.includes(d.key) && typeof a[d.key] === 'number' && typeof b[d.key] === 'number');
  return (
    <div className="rounded border border-line bg-panel p-2 text-xs" data-testid="run-comparison">
      <p className="font-semibold">This run beside the kept one ({keptLabel})</p>
      <table className="mt-1 tabular">
        <thead>
          <tr className="text-ink-faint">
            <th className="text-left font-normal pr-3">Figure</th>
            <th className="text-right font-normal pr-3">Kept</th>
            <th className="text-right font-normal pr-3">This run</th>
            <th className="text-right font-normal pr-3">Difference</th>
            <th className="text-left font-normal">Unit</th>
          </tr>
        </thead>
        <tbody>
          {defs.map((d) => {
            const diff = (b[d.key] as number) - (a[d.key] as number);
            const digits = typeof d.format === 'number' ? d.format : 3;
            return (
              <tr key={d.key} data-compare={d.key}>
                <th scope="row" className="text-left font-normal pr-3" title={d.how}>
                  {d.label}
                </th>
                <td className="text-right pr-3">{formatFigure(d.key, a[d.key])}</td>
                <td className="text-right pr-3 font-semibold">{formatFigure(d.key, b[d.key])}</td>
                <td className="text-right pr-3">{Math.abs(diff) < 0.5 * 10 ** -digits ? 'same' : `${diff > 0 ? '+' : ''}${fixed(diff, digits)}`}</td>
                <td className="text-ink-soft">{d.unit}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
