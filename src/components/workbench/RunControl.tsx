// the Response pane's top line: Run (or Run again), progress with Cancel, the Report link;
// the line saying where the shown run comes from (with Keep), and the banner that says a
// shown run is not of the current settings.
import type { RunDone } from '../../lib/workbench/runner';
import { whenText, type RunOrigin } from './KeptRuns';

/** runs of up to this many days (warm-up included) re-run by themselves after an edit */
export const AUTO_RUN_DAYS = 7;

interface Props {
  totalDays: number;
  /** a run is shown: the button reads "Run again" */
  hasRun: boolean;
  disabled: boolean;
  running: boolean;
  progress: number;
  onRun(): void;
  onCancel(): void;
  /** the Report of the assembly, when there is one */
  reportHref: string | null;
}

export default function RunControl({ totalDays, hasRun, disabled, running, progress, onRun, onCancel, reportHref }: Props) {
  const pct = Math.round(progress * 100);
  return (
    <div className="flex flex-wrap items-center gap-3">
      <h2 id="response-title" className="text-base font-semibold">
        Response
      </h2>
      <button type="button" className="px-3 py-1.5 rounded bg-accent text-white hover:bg-accent-strong disabled:opacity-50" onClick={onRun} disabled={disabled} data-testid="run">
        {hasRun ? 'Run again' : 'Run'} {totalDays} {totalDays === 1 ? 'day' : 'days'}
      </button>
      {running ? (
        <div className="flex items-center gap-2" data-testid="run-progress">
          <div role="progressbar" aria-label="Run progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="w-40 h-2 rounded bg-line overflow-hidden">
            <div className="h-full bg-accent transition-[width] duration-100" style={{ width: `${pct}%` }} />
          </div>
          <span className="tabular text-ink-soft w-10">{pct} %</span>
          <button type="button" className="px-2 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={onCancel}>
            Cancel
          </button>
        </div>
      ) : null}
      {reportHref ? (
        <a className="ml-auto px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" href={reportHref}>
          Report
        </a>
      ) : null}
    </div>
  );
}

/** the banner over a run whose settings are not the current ones */
export function StaleBanner({ reasons, willRerun }: { reasons: string[]; willRerun: boolean }) {
  return (
    <p role="status" className="rounded border border-warn/40 bg-warn-soft px-3 py-2 text-sm" data-testid="stale-banner">
      <strong>These results are from other settings.</strong> Changed since the run: {reasons.join('; ')}.{' '}
      {willRerun ? 'A new run follows by itself.' : 'To bring them up to date, press Run.'}
    </p>
  );
}

/**
 * who looks at the pane: 'edit' (engineer or admin: runs can be kept with the saved revision),
 * 'checker' (runs in the browser only; keeping needs the edit role), 'guest' (the Shared view:
 * an issued revision run in the guest's browser, nothing is kept). with no mode, a pane without
 * an assembly in the store is the guest's.
 */
export type ResponseMode = 'edit' | 'checker' | 'guest';

export type Saved = { state: 'none' } | { state: 'saving' } | { state: 'saved'; id: number; revision: number; withSeries: boolean } | { state: 'error'; message: string };

interface RunStateProps {
  origin: RunOrigin;
  mode: ResponseMode;
  revision: number | null;
  run: RunDone;
  /** ms from the request to the figures, for runs of this browser */
  wallMs: number | null;
  /** the run may be kept with the revision now */
  canKeep: boolean;
  /** the run is of unsaved settings: saving comes first */
  mustSave: boolean;
  saved: Saved;
  onKeep(): void;
}

/** where the shown run comes from, how long it took, and keeping it */
export function RunState({ origin, mode, revision, run, wallMs, canKeep, mustSave, saved, onKeep }: RunStateProps) {
  return (
    <div className="flex flex-wrap items-center gap-2 text-xs" data-testid="run-state">
      {origin.kind === 'kept' ? (
        <span className="rounded bg-accent-soft px-2 py-0.5 font-semibold text-accent-strong" data-testid="run-origin">
          Kept run of revision {revision}, {whenText(origin.at)}
          {origin.byName ? ` by ${origin.byName}` : ''}
        </span>
      ) : mode === 'guest' ? (
        <span className="rounded bg-paper px-2 py-0.5 font-semibold text-ink-soft" data-testid="run-origin" title="Nothing of this run is sent or stored">
          Computed in your browser from the issued revision
        </span>
      ) : mode === 'checker' ? (
        <span className="rounded bg-paper px-2 py-0.5 font-semibold text-ink-soft" data-testid="run-origin" title="Runs are kept with a revision by engineers and admins">
          Computed in your browser from {revision !== null ? `revision ${revision}` : 'the build-up'}; not kept
        </span>
      ) : (
        <span className="rounded bg-warn-soft text-warn px-2 py-0.5 font-semibold" title="This run lives in this browser tab only">
          Unsaved run
        </span>
      )}
      <span className="text-ink-soft tabular">
        {run.steps.toLocaleString('en-GB')} steps in {run.elapsedMs.toFixed(1)} ms (engine)
        {wallMs !== null ? `, figures ${wallMs.toFixed(0)} ms after the request` : ''}
      </span>
      {canKeep ? (
        <button type="button" className="px-2 py-0.5 rounded border border-line bg-panel hover:bg-paper" onClick={onKeep} disabled={saved.state === 'saving'}>
          {saved.state === 'saving' ? 'Keeping…' : `Keep this run with revision ${revision}`}
        </button>
      ) : null}
      {mustSave ? <span className="text-ink-faint">Save the revision to keep runs with it.</span> : null}
      {saved.state === 'saved' ? (
        <span className="text-ok" data-testid="run-saved">
          Kept with revision {saved.revision} (run {saved.id}){saved.withSeries ? '' : ', figures only: the series is over the size limit'}.
        </span>
      ) : null}
      {saved.state === 'error' ? (
        <span className="text-danger" role="alert">
          {saved.message}
        </span>
      ) : null}
    </div>
  );
}
