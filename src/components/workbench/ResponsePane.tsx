// the Response pane: the run in the worker (progress, cancel, auto re-run of short runs), the
// run kept with the revision loaded back, playback and the figures table. its parts:
// RunControl (the top line), KeptRuns (keep, load, list, compare), Playback (profile and traces).
import { useCallback, useEffect, useRef, useState } from 'react';
import { useWorkbench } from '../../lib/workbench/store';
import { Runner, type RunDone } from '../../lib/workbench/runner';
import { seriesCsv } from '../../lib/workbench/exportCsv';
import { staleReasons } from '../../lib/workbench/staleness';
import type { UploadedSeries, WorkbenchDocument } from '../../lib/schemas/workbench';
import FiguresTable from './FiguresTable';
import Playback from './Playback';
import { download } from './chartExport';
import RunControl, { AUTO_RUN_DAYS, StaleBanner } from './RunControl';
import { Comparison, keepRun, KeptRunsList, loadKeptRun, useKeptRuns, whenText, type RunOrigin } from './KeptRuns';

export { AUTO_RUN_DAYS };

/** ms: edits closer together than this make one run */
const DEBOUNCE_MS = 300;

interface Shown {
  run: RunDone;
  /** the document and upload it ran */
  doc: WorkbenchDocument;
  origin: RunOrigin;
  /** ms from the request to the figures (runs of this browser) */
  wallMs: number | null;
}

type Saved = { state: 'none' } | { state: 'saving' } | { state: 'saved'; id: number; revision: number; withSeries: boolean } | { state: 'error'; message: string };

/**
 * who looks at the pane: 'edit' (engineer or admin: runs can be kept with the saved revision),
 * 'checker' (runs in the browser only; keeping needs the edit role), 'guest' (the Shared view:
 * an issued revision run in the guest's browser, nothing is kept). with no mode, a pane without
 * an assembly in the store is the guest's.
 */
export type ResponseMode = 'edit' | 'checker' | 'guest';

export default function ResponsePane({ mode: given }: { mode?: ResponseMode } = {}) {
  const doc = useWorkbench((s) => s.doc);
  const upload = useWorkbench((s) => s.upload);
  const base = useWorkbench((s) => s.base);
  const assembly = useWorkbench((s) => s.assembly);
  const savedDoc = useWorkbench((s) => s.savedDoc);
  const mode: ResponseMode = given ?? (assembly ? 'edit' : 'guest');
  const canKeep = mode === 'edit';

  const runner = useRef<Runner | null>(null);
  const lastStart = useRef(0);
  const [running, setRunning] = useState(false);
  const [progress, setProgress] = useState(0);
  const [issues, setIssues] = useState<string[] | null>(null);
  const [shown, setShown] = useState<Shown | null>(null);
  /** the kept run a new run is compared with */
  const [kept, setKept] = useState<Shown | null>(null);
  const [saved, setSaved] = useState<Saved>({ state: 'none' });
  const cancelRef = useRef<(() => void) | null>(null);

  const totalDays = doc.exposure.days + doc.exposure.warmupDays;
  const waitingForUpload = doc.exposure.outdoor.mode === 'series' && !upload;
  const keptRuns = useKeptRuns(base, saved.state === 'saved' ? saved.id : 0);
  // the newest kept run is loaded once per revision before anything runs by itself
  const [keptFor, setKeptFor] = useState<number | null>(null);

  useEffect(() => {
    const r = new Runner();
    r.warm();
    runner.current = r;
    return () => r.dispose();
  }, []);

  useEffect(() => {
    if (!base || !keptRuns.loaded || keptFor === base.id) return;
    const newest = keptRuns.rows?.find((r) => r.hasSeries);
    if (!newest) {
      setKeptFor(base.id);
      return;
    }
    let stop = false;
    loadKeptRun(newest, savedDoc)
      .then((got) => {
        if (stop) return;
        if (got) {
          const k: Shown = { run: got.run, doc: got.doc, origin: { kind: 'kept', runId: newest.id, byName: newest.createdByName, at: newest.createdAt }, wallMs: null };
          setShown(k);
          setKept(k);
        }
        setKeptFor(base.id);
      })
      .catch(() => !stop && setKeptFor(base.id));
    return () => {
      stop = true;
    };
  }, [base?.id, keptRuns.loaded, keptRuns.rows, savedDoc, keptFor]);

  const start = useCallback((d: WorkbenchDocument, u: UploadedSeries | null) => {
    const r = runner.current;
    if (!r || d.layers.length === 0) return;
    if (d.exposure.outdoor.mode === 'series' && !u) return;
    const requested = performance.now();
    lastStart.current = requested;
    setRunning(true);
    setProgress(0);
    // progress arrives often for long runs: one state update per frame at most
    let pending = -1;
    let frame = 0;
    const started = r.run(d, u, (f) => {
      pending = f;
      if (!frame)
        frame = requestAnimationFrame(() => {
          frame = 0;
          setProgress(pending);
        });
    });
    cancelRef.current = started.cancel;
    void started.result.then((outcome) => {
      if (frame) cancelAnimationFrame(frame);
      if (outcome.kind === 'cancelled') {
        if (!runner.current?.busy) setRunning(false);
        return;
      }
      setRunning(false);
      cancelRef.current = null;
      if (outcome.kind === 'invalid') {
        setIssues(outcome.issues);
        return;
      }
      setIssues(null);
      setSaved({ state: 'none' });
      setShown({ run: outcome, doc: d, origin: { kind: 'browser' }, wallMs: performance.now() - requested });
    });
  }, []);

  const keptReady = !base || keptFor === base.id;
  // short runs follow every edit (at once when idle, else once the edits pause); a kept run of the same settings is not run again
  useEffect(() => {
    if (doc.layers.length === 0) {
      setShown(null);
      setIssues(null);
      return;
    }
    if (!keptReady || totalDays > AUTO_RUN_DAYS) return;
    if (shown && staleReasons(shown.doc, doc).length === 0) return;
    const since = performance.now() - lastStart.current;
    if (!runner.current?.busy && since > DEBOUNCE_MS) {
      start(doc, upload);
      return;
    }
    const timer = setTimeout(() => start(useWorkbench.getState().doc, useWorkbench.getState().upload), DEBOUNCE_MS);
    return () => clearTimeout(timer);
    // `shown` is read, not followed: a finished run must not start another
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [doc, upload, totalDays, start, keptReady]);

  const cancel = () => {
    cancelRef.current?.();
    cancelRef.current = null;
    setRunning(false);
  };

  const saveRun = async () => {
    if (!shown || !base) return;
    setSaved({ state: 'saving' });
    const out = await keepRun(base.id, shown.run, shown.doc.exposure);
    if (!out.ok) {
      setSaved({ state: 'error', message: out.message });
      return;
    }
    setSaved({ state: 'saved', id: out.id, revision: base.number, withSeries: out.withSeries });
    const k: Shown = { ...shown, origin: { kind: 'kept', runId: out.id, byName: null, at: new Date().toISOString() } };
    setShown(k);
    setKept(k);
  };

  const reasons = shown ? staleReasons(shown.doc, doc) : [];
  const stale = reasons.length > 0;
  const ofRevision = !!base && !!shown && staleReasons(shown.doc, savedDoc).length === 0;
  const fromBrowser = shown?.origin.kind === 'browser';

  return (
    <section aria-labelledby="response-title" className="flex flex-col gap-3 text-sm" data-testid="response-pane">
      <RunControl
        totalDays={totalDays}
        hasRun={!!shown}
        disabled={doc.layers.length === 0 || waitingForUpload}
        running={running}
        progress={progress}
        onRun={() => start(doc, upload)}
        onCancel={cancel}
        reportHref={assembly ? `/assemblies/${assembly.id}/report` : null}
      />
      {!running && !shown && doc.layers.length > 0 && totalDays > AUTO_RUN_DAYS && keptReady ? (
        <p className="text-ink-soft">A run of more than {AUTO_RUN_DAYS} days waits for the Run button.</p>
      ) : null}
      {doc.layers.length === 0 ? <p className="text-ink-soft">Add a layer to the build-up to see how it answers the day.</p> : null}
      {waitingForUpload ? <p className="text-ink-soft">Choose an uploaded series in the Exposure pane to run it.</p> : null}
      {issues ? (
        <div role="alert" className="rounded border border-danger/40 bg-danger-soft p-3" data-testid="run-issues">
          <p className="font-semibold">The engine cannot run this model:</p>
          <ul className="mt-1 font-mono text-xs">
            {issues.map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
        </div>
      ) : null}

      {shown ? (
        <>
          {stale && !running ? <StaleBanner reasons={reasons} willRerun={totalDays <= AUTO_RUN_DAYS} /> : null}
          <div className="flex flex-wrap items-center gap-2 text-xs" data-testid="run-state">
            {shown.origin.kind === 'kept' ? (
              <span className="rounded bg-accent-soft px-2 py-0.5 font-semibold text-accent-strong" data-testid="run-origin">
                Kept run of revision {base?.number}, {whenText(shown.origin.at)}
                {shown.origin.byName ? ` by ${shown.origin.byName}` : ''}
              </span>
            ) : mode === 'guest' ? (
              <span className="rounded bg-paper px-2 py-0.5 font-semibold text-ink-soft" data-testid="run-origin" title="Nothing of this run is sent or stored">
                Computed in your browser from the issued revision
              </span>
            ) : mode === 'checker' ? (
              <span className="rounded bg-paper px-2 py-0.5 font-semibold text-ink-soft" data-testid="run-origin" title="Runs are kept with a revision by engineers and admins">
                Computed in your browser from {base ? `revision ${base.number}` : 'the build-up'}; not kept
              </span>
            ) : (
              <span className="rounded bg-warn-soft text-warn px-2 py-0.5 font-semibold" title="This run lives in this browser tab only">
                Unsaved run
              </span>
            )}
            <span className="text-ink-soft tabular">
              {shown.run.steps.toLocaleString('en-GB')} steps in {shown.run.elapsedMs.toFixed(1)} ms (engine)
              {shown.wallMs !== null ? `, figures ${shown.wallMs.toFixed(0)} ms after the request` : ''}
            </span>
            {canKeep && base && fromBrowser && ofRevision && saved.state !== 'saved' ? (
              <button type="button" className="px-2 py-0.5 rounded border border-line bg-panel hover:bg-paper" onClick={() => void saveRun()} disabled={saved.state === 'saving'}>
                {saved.state === 'saving' ? 'Keeping…' : `Keep this run with revision ${base.number}`}
              </button>
            ) : null}
            {canKeep && base && fromBrowser && !ofRevision ? <span className="text-ink-faint">Save the revision to keep runs with it.</span> : null}
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
          {keptRuns.rows && keptRuns.rows.length > 0 ? <KeptRunsList rows={keptRuns.rows} revision={base?.number} /> : null}
          {kept && fromBrowser && kept.origin.kind === 'kept' ? <Comparison kept={kept.run} fresh={shown.run} keptLabel={whenText(kept.origin.at)} /> : null}
          <div className={stale ? 'opacity-50 transition-opacity' : undefined} data-stale={stale ? 'true' : 'false'} data-testid="run-results">
            <Playback run={shown.run} classes={shown.doc.layers.map((l) => l.materialClass)} />
            <FiguresTable run={shown.run} exposure={shown.doc.exposure} />
          </div>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper"
              data-testid="export-csv"
              onClick={() => {
                const text = seriesCsv(shown.run, { assembly: assembly?.name ?? null, revision: base?.number ?? null, doc: shown.doc });
                const url = URL.createObjectURL(new Blob([text], { type: 'text/csv' }));
                download(`${assembly?.name ?? 'wallpulse'}-series.csv`.replace(/[^\w.-]+/g, '-'), url);
                setTimeout(() => URL.revokeObjectURL(url), 10_000);
              }}
            >
              Series as CSV
            </button>
          </div>
        </>
      ) : null}
    </section>
  );
}
