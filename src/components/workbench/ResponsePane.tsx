// the Response pane: the run in the worker (progress, cancel, auto re-run of short runs),
// playback of the profile through the thickness, the traces and the figures table.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import './traces.css';
import { useWorkbench } from '../../lib/workbench/store';
import { Runner, type RunDone } from '../../lib/workbench/runner';
import { dayClock, summaryOf } from '../../lib/workbench/figures';
import { seriesCsv } from '../../lib/workbench/exportCsv';
import type { MaterialClass, UploadedSeries, WorkbenchDocument } from '../../lib/schemas/workbench';
import { effectiveWarmupDays } from '../../lib/schemas/workbench';
import { drawProfile, profileRange, profileStyle, type ProfileStyle } from './profileDraw';
import FiguresTable, { fixed } from './FiguresTable';

/** runs of up to this many days (warm-up included) re-run by themselves after an edit */
export const AUTO_RUN_DAYS = 7;
/** ms: edits closer together than this make one run */
const DEBOUNCE_MS = 300;
/** "a day in N s" */
const SPEEDS = [60, 30, 20, 10, 5, 2];

interface Shown {
  run: RunDone;
  /** the document and upload it ran */
  doc: WorkbenchDocument;
  classes: MaterialClass[];
  finishedAt: number;
  /** ms from the request to the figures */
  wallMs: number;
}

/** a run kept with the revision, as GET /api/revisions/:id/runs lists it */
interface KeptRun {
  id: number;
  summary: Record<string, number | string | null>;
  createdByName: string | null;
  createdAt: string;
}

type Saved = { state: 'none' } | { state: 'saving' } | { state: 'saved'; id: number; revision: number } | { state: 'error'; message: string };

const css = (name: string, fallback: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

function download(name: string, href: string) {
  const a = document.createElement('a');
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
}

/** a canvas on white with a title, for a PNG of a chart */
function withTitle(source: HTMLCanvasElement, title: string): string {
  const c = document.createElement('canvas');
  c.width = source.width;
  c.height = source.height + 28 * (window.devicePixelRatio || 1);
  const ctx = c.getContext('2d')!;
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, c.width, c.height);
  const dpr = window.devicePixelRatio || 1;
  ctx.fillStyle = '#23211d';
  ctx.font = `${600} ${14 * dpr}px "Source Sans 3", sans-serif`;
  ctx.fillText(title, 8 * dpr, 19 * dpr);
  ctx.drawImage(source, 0, 28 * dpr);
  return c.toDataURL('image/png');
}

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
  const dirty = useWorkbench((s) => s.dirty);
  const mode: ResponseMode = given ?? (assembly ? 'edit' : 'guest');
  const canKeep = mode === 'edit';

  const runner = useRef<Runner | null>(null);
  const lastStart = useRef(0);
  const [running, setRunning] = useState(false);
  const [progress, setProgress] = useState(0);
  const [issues, setIssues] = useState<string[] | null>(null);
  const [shown, setShown] = useState<Shown | null>(null);
  const [stale, setStale] = useState(false);
  const [saved, setSaved] = useState<Saved>({ state: 'none' });
  const cancelRef = useRef<(() => void) | null>(null);

  const totalDays = doc.exposure.days + effectiveWarmupDays(doc.exposure);
  const waitingForUpload = doc.exposure.outdoor.mode === 'series' && !upload;

  useEffect(() => {
    const r = new Runner();
    r.warm();
    runner.current = r;
    return () => r.dispose();
  }, []);

  const start = useCallback((d: WorkbenchDocument, u: UploadedSeries | null) => {
    const r = runner.current;
    if (!r || d.layers.length === 0) return;
    if (d.exposure.outdoor.mode === 'series' && !u) return;
    const requested = performance.now();
    lastStart.current = requested;
    setRunning(true);
    setProgress(0);
    setStale(false);
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
      setShown({ run: outcome, doc: d, classes: d.layers.map((l) => l.materialClass), finishedAt: Date.now(), wallMs: performance.now() - requested });
    });
  }, []);

  // short runs follow every edit: at once when idle, else once the edits pause
  useEffect(() => {
    if (doc.layers.length === 0) {
      setShown(null);
      setIssues(null);
      return;
    }
    if (totalDays > AUTO_RUN_DAYS) {
      setStale(true);
      return;
    }
    const since = performance.now() - lastStart.current;
    if (!runner.current?.busy && since > DEBOUNCE_MS) {
      start(doc, upload);
      return;
    }
    const timer = setTimeout(() => start(useWorkbench.getState().doc, useWorkbench.getState().upload), DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [doc, upload, totalDays, start]);

  const cancel = () => {
    cancelRef.current?.();
    cancelRef.current = null;
    setRunning(false);
    setStale(true);
  };

  const saveRun = async () => {
    if (!shown || !base) return;
    setSaved({ state: 'saving' });
    try {
      const res = await fetch(`/api/revisions/${base.id}/runs`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ exposure: shown.doc.exposure, summary: summaryOf(shown.run.figures) }),
      });
      const body = await res.json().catch(() => null);
      if (res.status !== 201) {
        setSaved({ state: 'error', message: body?.error?.message ?? `The run was not kept (HTTP ${res.status}).` });
        return;
      }
      setSaved({ state: 'saved', id: body.run.id, revision: base.number });
    } catch (e) {
      setSaved({ state: 'error', message: `The run could not be sent: ${e instanceof Error ? e.message : String(e)}` });
    }
  };

  // the runs kept with the revision (newest first), refreshed after keeping one
  const [keptRuns, setKeptRuns] = useState<KeptRun[] | null>(null);
  useEffect(() => {
    if (!base) {
      setKeptRuns(null);
      return;
    }
    let stop = false;
    fetch(`/api/revisions/${base.id}/runs`)
      .then((r) => (r.ok ? r.json() : null))
      .then((body: { items?: KeptRun[] } | null) => !stop && setKeptRuns(body?.items ?? null))
      .catch(() => !stop && setKeptRuns(null));
    return () => {
      stop = true;
    };
  }, [base?.id, saved.state === 'saved' ? saved.id : 0]);

  const runIsOfRevision = !!base && !dirty && !!shown && shown.doc === useWorkbench.getState().savedDoc;

  return (
    <section aria-labelledby="response-title" className="flex flex-col gap-3 text-sm" data-testid="response-pane">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="response-title" className="text-base font-semibold">
          Response
        </h2>
        <button
          type="button"
          className="px-3 py-1.5 rounded bg-accent text-white hover:bg-accent-strong disabled:opacity-50"
          onClick={() => start(doc, upload)}
          disabled={doc.layers.length === 0 || waitingForUpload}
          data-testid="run"
        >
          Run {totalDays} {totalDays === 1 ? 'day' : 'days'}
        </button>
        {running ? (
          <div className="flex items-center gap-2" data-testid="run-progress">
            <div role="progressbar" aria-label="Run progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(progress * 100)} className="w-40 h-2 rounded bg-line overflow-hidden">
              <div className="h-full bg-accent transition-[width] duration-100" style={{ width: `${Math.round(progress * 100)}%` }} />
            </div>
            <span className="tabular text-ink-soft w-10">{Math.round(progress * 100)} %</span>
            <button type="button" className="px-2 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={cancel}>
              Cancel
            </button>
          </div>
        ) : null}
        {!running && stale && shown ? <span className="text-warn">The settings changed since this run: press Run.</span> : null}
        {!running && stale && !shown && doc.layers.length > 0 ? <span className="text-ink-soft">A run of more than {AUTO_RUN_DAYS} days waits for the Run button.</span> : null}
        {assembly ? (
          <a className="ml-auto px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" href={`/assemblies/${assembly.id}/report`}>
            Report
          </a>
        ) : null}
      </div>

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
          <div className="flex flex-wrap items-center gap-2 text-xs" data-testid="run-state">
            {mode === 'guest' ? (
              <span className="rounded bg-paper px-2 py-0.5 font-semibold text-ink-soft" data-testid="run-origin" title="Nothing of this run is sent or stored">
                Computed in your browser from the issued revision
              </span>
            ) : mode === 'checker' ? (
              <span className="rounded bg-paper px-2 py-0.5 font-semibold text-ink-soft" data-testid="run-origin" title="Runs are kept with a revision by engineers and admins">
                Computed in your browser from {base ? `revision ${base.number}` : 'the build-up'}; not kept
              </span>
            ) : runIsOfRevision || saved.state === 'saved' ? null : (
              <span className="rounded bg-warn-soft text-warn px-2 py-0.5 font-semibold" title="This run lives in this browser tab only">
                Unsaved run
              </span>
            )}
            <span className="text-ink-soft tabular">
              {shown.run.steps.toLocaleString('en-GB')} steps in {shown.run.elapsedMs.toFixed(1)} ms (engine), figures {shown.wallMs.toFixed(0)} ms after the request
            </span>
            {canKeep && base && runIsOfRevision && saved.state !== 'saved' ? (
              <button type="button" className="px-2 py-0.5 rounded border border-line bg-panel hover:bg-paper" onClick={() => void saveRun()} disabled={saved.state === 'saving'}>
                {saved.state === 'saving' ? 'Keeping…' : `Keep this run with revision ${base.number}`}
              </button>
            ) : null}
            {canKeep && base && !runIsOfRevision && saved.state !== 'saved' ? <span className="text-ink-faint">Save the revision to keep runs with it.</span> : null}
            {saved.state === 'saved' ? <span className="text-ok" data-testid="run-saved">Kept with revision {saved.revision} (run {saved.id}).</span> : null}
            {saved.state === 'error' ? <span className="text-danger" role="alert">{saved.message}</span> : null}
          </div>
          {keptRuns && keptRuns.length > 0 ? (
            <details className="text-xs" data-testid="kept-runs">
              <summary className="cursor-pointer text-ink-soft">
                {keptRuns.length} {keptRuns.length === 1 ? 'run' : 'runs'} kept with revision {base?.number}
              </summary>
              <table className="mt-1 tabular">
                <thead>
                  <tr className="text-ink-faint">
                    <th className="text-left font-normal pr-3">Kept</th>
                    <th className="text-left font-normal pr-3">By</th>
                    <th className="text-right font-normal pr-3">Decrement factor</th>
                    <th className="text-right font-normal pr-3">Time lag (h)</th>
                    <th className="text-right font-normal">Peak inside flux (W/m²)</th>
                  </tr>
                </thead>
                <tbody>
                  {keptRuns.map((r) => (
                    <tr key={r.id}>
                      <td className="pr-3">{new Date(r.createdAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}</td>
                      <td className="pr-3">{r.createdByName ?? '–'}</td>
                      <td className="text-right pr-3">{fixed(r.summary.decrementFactorSimulated as number | null, 3)}</td>
                      <td className="text-right pr-3">{fixed(r.summary.timeLagSimulatedH as number | null, 2)}</td>
                      <td className="text-right">{fixed(r.summary.peakInsideFluxWm2 as number | null, 2)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </details>
          ) : null}
          <Playback shown={shown} />
          <FiguresTable run={shown.run} exposure={shown.doc.exposure} />
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper"
              data-testid="export-csv"
              onClick={() => {
                const url = URL.createObjectURL(new Blob([seriesCsv(shown.run)], { type: 'text/csv' }));
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

/** the width of a box's content, px: its client width less its left and right padding */
function contentWidth(el: HTMLElement): number {
  const cs = getComputedStyle(el);
  return Math.floor(el.clientWidth - parseFloat(cs.paddingLeft || '0') - parseFloat(cs.paddingRight || '0'));
}

/** playback of one run: the profile canvas, the traces, the controls */
function Playback({ shown }: { shown: Shown }) {
  const { run, classes } = shown;
  const profileBox = useRef<HTMLDivElement>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const tempBox = useRef<HTMLDivElement>(null);
  const fluxBox = useRef<HTMLDivElement>(null);
  const scrub = useRef<HTMLInputElement>(null);
  const timeOut = useRef<HTMLSpanElement>(null);
  const surfOut = useRef<HTMLSpanElement>(null);
  const fluxOut = useRef<HTMLSpanElement>(null);
  const tempPlot = useRef<uPlot | null>(null);
  const fluxPlot = useRef<uPlot | null>(null);
  const pos = useRef(0);
  const speed = useRef(10);
  const [playing, setPlaying] = useState(false);
  const [speedShown, setSpeedShown] = useState(10);
  const style = useRef<ProfileStyle | null>(null);
  const scratch = useRef(new Float64Array(0));
  const size = useRef({ w: 600, h: 260 });
  const range = useMemo(() => profileRange(run), [run]);
  const hours = useMemo(() => Float64Array.from(run.series.time, (t) => t / 3600), [run]);
  const shape = `${run.nInterfaces}|${run.interfaceNames.join('|')}`;

  const draw = useCallback(() => {
    const c = canvas.current;
    if (!c) return;
    const ctx = c.getContext('2d');
    if (!ctx) return;
    style.current ??= profileStyle();
    if (scratch.current.length !== run.nNodes) scratch.current = new Float64Array(run.nNodes);
    const dpr = window.devicePixelRatio || 1;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    drawProfile(ctx, size.current.w, size.current.h, run, classes, range, pos.current, style.current, scratch.current);
    const k = Math.round(pos.current);
    const t = run.series.time[k];
    if (timeOut.current) timeOut.current.textContent = dayClock(t);
    if (surfOut.current) surfOut.current.textContent = run.series.insideSurface[k].toFixed(2);
    if (fluxOut.current) fluxOut.current.textContent = run.series.insideFlux[k].toFixed(2);
    if (scrub.current && document.activeElement !== scrub.current) scrub.current.value = String(k);
    if (scrub.current) scrub.current.setAttribute('aria-valuetext', dayClock(t));
    for (const u of [tempPlot.current, fluxPlot.current]) {
      if (!u) continue;
      // outputs are uniform, so the fractional index maps straight to hours
      u.setCursor({ left: u.valToPos((pos.current * run.outputInterval) / 3600, 'x'), top: 8 }, false);
    }
  }, [run, classes, range, hours]);

  // canvas size follows its box (the width inside its padding, so the canvas never spills over the border)
  useEffect(() => {
    const box = profileBox.current;
    const c = canvas.current;
    if (!box || !c) return;
    const fit = () => {
      const w = Math.max(320, contentWidth(box));
      const h = 280;
      const dpr = window.devicePixelRatio || 1;
      size.current = { w, h };
      c.width = w * dpr;
      c.height = h * dpr;
      c.style.width = `${w}px`;
      c.style.height = `${h}px`;
      tempPlot.current?.setSize({ width: w, height: 220 });
      fluxPlot.current?.setSize({ width: w, height: 150 });
      draw();
    };
    fit();
    const ro = new ResizeObserver(fit);
    ro.observe(box);
    return () => ro.disconnect();
  }, [draw]);

  // the traces: made once per shape of the result, then fed with setData
  useEffect(() => {
    if (!tempBox.current || !fluxBox.current) return;
    const w = Math.max(320, profileBox.current ? contentWidth(profileBox.current) : 600);
    const faint = css('--color-ink-faint', '#8b857a');
    const axis = { stroke: css('--color-ink-soft', '#5d5850'), grid: { stroke: css('--color-line', '#dedad2'), width: 1 }, ticks: { stroke: css('--color-line', '#dedad2') } };
    const hourAxis = { ...axis, label: 'hours from the start of day 1', values: (_u: uPlot, v: number[]) => v.map((x) => `${x}`) };
    const series: uPlot.Series[] = [
      { label: 'time', value: (_u, v) => (v === null ? '–' : dayClock(v * 3600)) },
      { label: 'outdoor air', stroke: css('--color-t1', '#3f6ea8'), width: 1.5, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      { label: 'sol-air', stroke: css('--color-warn', '#8a5a00'), width: 1, dash: [5, 4], value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      { label: 'outside surface', stroke: css('--color-t2', '#79a0c8'), width: 1.5, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      ...run.interfaceNames.map((n) => ({ label: n, stroke: faint, width: 1, dash: [2, 3], value: (_u: uPlot, v: number | null) => (v === null ? '–' : `${v.toFixed(2)} °C`) })),
      { label: 'inside surface', stroke: css('--color-t7', '#bf5038'), width: 2, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      { label: 'indoor air', stroke: css('--color-accent', '#21646a'), width: 1.5, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
    ];
    const temp = new uPlot(
      {
        width: w,
        height: 220,
        scales: { x: { time: false } },
        series,
        axes: [hourAxis, { ...axis, label: '°C' }],
        cursor: { drag: { x: false, y: false }, points: { show: false } },
        legend: { live: true },
      },
      [[], ...series.slice(1).map(() => [])] as unknown as uPlot.AlignedData,
      tempBox.current,
    );
    const flux = new uPlot(
      {
        width: w,
        height: 150,
        scales: { x: { time: false } },
        series: [
          { label: 'time', value: (_u, v) => (v === null ? '–' : dayClock(v * 3600)) },
          { label: 'inside heat flux (+ into the room)', stroke: css('--color-accent-strong', '#174a4f'), width: 2, fill: 'rgba(33,100,106,0.08)', value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} W/m²`) },
        ],
        axes: [hourAxis, { ...axis, label: 'W/m²' }],
        cursor: { drag: { x: false, y: false }, points: { show: false } },
      },
      [[], []],
      fluxBox.current,
    );
    tempPlot.current = temp;
    fluxPlot.current = flux;
    return () => {
      temp.destroy();
      flux.destroy();
      tempPlot.current = null;
      fluxPlot.current = null;
    };
  }, [shape]);

  // new data into the same charts
  useEffect(() => {
    const s = run.series;
    const interfaces = Array.from({ length: run.nInterfaces }, (_, j) => s.interfaces.subarray(j * run.nTimes, (j + 1) * run.nTimes));
    tempPlot.current?.setData([hours, s.outsideAir, s.solAir, s.outsideSurface, ...interfaces, s.insideSurface, s.insideAir] as unknown as uPlot.AlignedData);
    fluxPlot.current?.setData([hours, s.insideFlux] as unknown as uPlot.AlignedData);
    pos.current = Math.min(pos.current, run.nTimes - 1);
    draw();
  }, [run, hours, shape, draw]);

  // playback: advance by wall-clock time, a day in `speed` seconds
  useEffect(() => {
    if (!playing) return;
    let last = performance.now();
    let frame = requestAnimationFrame(function tick(now) {
      const dt = (now - last) / 1000;
      last = now;
      pos.current += (dt * 86400) / speed.current / run.outputInterval;
      if (pos.current >= run.nTimes - 1) pos.current = 0;
      draw();
      frame = requestAnimationFrame(tick);
    });
    return () => cancelAnimationFrame(frame);
  }, [playing, run, draw]);

  const pngOf = (which: 'profile' | 'temperatures' | 'flux') => {
    if (which === 'profile' && canvas.current) download('profile.png', withTitle(canvas.current, `Temperature through the wall, ${dayClock(run.series.time[Math.round(pos.current)])}`));
    const u = which === 'temperatures' ? tempPlot.current : which === 'flux' ? fluxPlot.current : null;
    if (u) download(`${which}.png`, withTitle(u.ctx.canvas, which === 'temperatures' ? 'Temperatures (°C) over the reported days' : 'Inside heat flux (W/m², positive into the room)'));
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="rounded border border-line bg-panel p-2" ref={profileBox}>
        <canvas ref={canvas} role="img" aria-label="Temperature profile through the thickness at the playback time" data-testid="profile-canvas" />
        <div className="flex flex-wrap items-center gap-3 mt-2">
          <button
            type="button"
            className="px-3 py-1 rounded border border-line-strong bg-panel hover:bg-paper w-20"
            onClick={() => setPlaying((p) => !p)}
            aria-pressed={playing}
            data-testid="play"
          >
            {playing ? 'Pause' : 'Play'}
          </button>
          <label className="flex items-center gap-2 grow min-w-48">
            <span className="sr-only">Playback time</span>
            <input
              ref={scrub}
              type="range"
              min={0}
              max={run.nTimes - 1}
              step={1}
              defaultValue={0}
              className="grow accent-accent"
              aria-label="Playback time"
              data-testid="scrub"
              onInput={(e) => {
                pos.current = Number((e.target as HTMLInputElement).value);
                draw();
              }}
            />
          </label>
          <span className="tabular font-semibold w-28" ref={timeOut} data-testid="playback-time" aria-live="off" />
          <label className="flex items-center gap-1">
            <span className="text-ink-soft">Speed</span>
            <select
              className="rounded border border-line px-1.5 py-1 bg-panel"
              value={speedShown}
              onChange={(e) => {
                speed.current = Number(e.target.value);
                setSpeedShown(speed.current);
              }}
            >
              {SPEEDS.map((s) => (
                <option key={s} value={s}>
                  a day in {s} s
                </option>
              ))}
            </select>
          </label>
        </div>
        <p className="mt-1 text-xs text-ink-soft tabular">
          Inside surface <span ref={surfOut} data-testid="readout-inside-surface" className="text-ink font-semibold" /> °C · inside heat flux <span ref={fluxOut} className="text-ink font-semibold" /> W/m²
        </p>
      </div>
      <div className="wp-traces rounded border border-line bg-panel p-2" data-testid="trace-temperatures">
        <div ref={tempBox} />
      </div>
      <div className="wp-traces rounded border border-line bg-panel p-2" data-testid="trace-flux">
        <div ref={fluxBox} />
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => pngOf('profile')}>
          Profile as PNG
        </button>
        <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => pngOf('temperatures')}>
          Temperatures as PNG
        </button>
        <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => pngOf('flux')}>
          Heat flux as PNG
        </button>
      </div>
    </div>
  );
}
