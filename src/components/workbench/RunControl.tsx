// the Response pane's top line: Run (or Run again), progress with Cancel, the Report link,
// and the banner that says a shown run is not of the current settings.

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
