// the Response pane: the run in the worker (progress, cancel, auto re-run of short runs), the
// run kept with the revision loaded back, playback and the figures table. its parts:
// RunControl (the top line), KeptRuns (keep, load, list, compare), Playback (profile and traces).
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useWorkbench } from '../../lib/workbench/store';
import { Runner, type RunDone } from '../../lib/workbench/runner';
import { seriesCsv } from '../../lib/workbench/exportCsv';
import { staleReasons } from '../../lib/workbench/staleness';
import { effectiveWarmupDays, type UploadedSeries, type WorkbenchDocument } from '../../lib/schemas/workbench';
import FiguresTable from './FiguresTable';
import Playback from './Playback';
import { download } from './chartExport';
import RunControl, { AUTO_RUN_DAYS, RunState, StaleBanner, type ResponseMode, type Saved } from './RunControl';
import { Comparison, keepRun, KeptRunsList, loadKeptRun, useKeptRuns, whenText, type RunOrigin } from './KeptRuns';

export type { ResponseMode };

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

  const totalDays = doc.exposure.days + effectiveWarmupDays(doc.exposure);
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

  // one array per shown run: playback redraws its charts when this changes
  const ranLayers = shown?.doc.layers;
  const classes = useMemo(() => (ranLayers ?? []).map((l) => l.materialClass), [ranLayers]);
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
          <RunState
            origin={shown.origin}
            mode={mode}
            revision={base?.number ?? null}
            run={shown.run}
            wallMs={shown.wallMs}
            canKeep={canKeep && !!base && fromBrowser && ofRevision && saved.state !== 'saved'}
            mustSave={canKeep && !!base && fromBrowser && !ofRevision}
            saved={saved}
            onKeep={() => void saveRun()}
          />
          {keptRuns.rows && keptRuns.rows.length > 0 ? <KeptRunsList rows={keptRuns.rows} revision={base?.number} /> : null}
          {kept && fromBrowser && kept.origin.kind === 'kept' ? <Comparison kept={kept.run} fresh={shown.run} keptLabel={whenText(kept.origin.at)} /> : null}
          <div className={stale ? 'opacity-50 transition-opacity' : undefined} data-stale={stale ? 'true' : 'false'} data-testid="run-results">
            <Playback run={shown.run} classes={classes} />
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
