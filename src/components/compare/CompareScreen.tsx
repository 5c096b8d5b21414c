// the compare page: pick 2–4 assemblies or revisions of a job and one exposure, run them
// together in the worker pool, and read them side by side: a line at a glance, overlaid traces,
// the figures table with the best of each row and the difference to a baseline, the sections to
// one scale, and the sensitivity of each
import { useEffect, useMemo, useRef, useState } from 'react';
import { defaultExposure, effectiveWarmupDays, exposureSchema, workbenchDocumentSchema, type Exposure, type UploadedSeries, type WorkbenchDocument } from '../../lib/schemas/workbench';
import { CompareRunner } from '../../lib/workbench/compareRunner';
import type { CompareOutcome } from '../../lib/workbench/compareApi';
import type { CompareFigures, CompareSeries } from '../../lib/workbench/compare';
import { strongest, type MetricKey } from '../../lib/workbench/sensitivity';
import SectionDrawing from '../workbench/SectionDrawing';
import { fixed } from '../workbench/format';
import CompareTable from './CompareTable';
import { moistureRisk } from './rows';
import OverlayCharts from './OverlayCharts';
import SensitivityPanel, { type SensitivityResult } from './SensitivityPanel';
import { alternativeColour, ALTERNATIVE_STYLE } from './palette';
import ProgressBar, { ProgressSignal } from './Progress';

const STATE_LABEL: Record<string, string> = { draft: 'draft', in_check: 'in check', checked: 'checked', sent_back: 'sent back', issued: 'issued' };
const MAX_PICKS = 4;
/** runs of up to this many days (warm-up included) follow every change by themselves */
const AUTO_RUN_DAYS = 7;
/** the thickest compared build-up is drawn this tall, px */
const SECTION_PX = 340;

interface WireRevision {
  id: number;
  number: number;
  state: string;
  note: string;
  createdAt: string;
  model: unknown;
}
interface WireAssembly {
  id: number;
  name: string;
  element: string;
  revisions: WireRevision[];
}

interface Source {
  assembly: WireAssembly;
  revision: WireRevision;
  doc: WorkbenchDocument | null;
  issues: string[];
}

/** the fields of an exposure set on this page: a daily sine applied to every alternative */
interface CustomExposure {
  mean: string;
  amplitude: string;
  peakHour: string;
  indoor: string;
  days: string;
}

const CUSTOM_FIELDS: { key: keyof CustomExposure; label: string; unit: string; path: string }[] = [
  { key: 'mean', label: 'Daily mean', unit: '°C', path: 'outdoor.mean' },
  { key: 'amplitude', label: 'Daily amplitude', unit: 'K', path: 'outdoor.amplitude' },
  { key: 'peakHour', label: 'Hour of the peak', unit: 'h', path: 'outdoor.peakHour' },
  { key: 'indoor', label: 'Indoor air', unit: '°C', path: 'indoor.value' },
  { key: 'days', label: 'Days to report', unit: 'd', path: 'days' },
];

function customFrom(e: Exposure): CustomExposure {
  const o = e.outdoor;
  const d = defaultExposure().outdoor as { mean: number; amplitude: number; peakHour: number };
  const sine = o.mode === 'sine' || o.mode === 'solair' ? o : d;
  return {
    mean: String(sine.mean),
    amplitude: String(sine.amplitude),
    peakHour: String(sine.peakHour),
    indoor: String(e.indoor.mode === 'constant' ? e.indoor.value : 24),
    days: String(e.days),
  };
}

/** the custom exposure, or the field messages (each naming the field and its unit) */
function buildCustom(c: CustomExposure, from: Exposure): { ok: true; exposure: Exposure } | { ok: false; fields: Record<string, string> } {
  const n = (s: string) => (s.trim() === '' ? NaN : Number(s.replace(',', '.')));
  // the rest (surface resistances, step, mesh, humidity and climate) from the exposure it starts from
  const parsed = exposureSchema.safeParse({
    ...from,
    outdoor: { mode: 'sine', mean: n(c.mean), amplitude: n(c.amplitude), peakHour: n(c.peakHour) },
    indoor: { mode: 'constant', value: n(c.indoor) },
    days: n(c.days),
  });
  if (parsed.success) return { ok: true, exposure: parsed.data };
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const path = issue.path.join('.');
    const f = CUSTOM_FIELDS.find((x) => x.path === path);
    if (f) fields[f.key] = `${f.label} (${f.unit}) ${issue.message}`;
  }
  return { ok: false, fields };
}

function readUrl(): { picks: number[]; base: number; exposure: number | 'custom' | null } {
  const q = new URLSearchParams(location.search);
  const picks = (q.get('r') ?? '')
    .split(',')
    .map(Number)
    .filter((n) => Number.isInteger(n) && n > 0)
    .slice(0, MAX_PICKS);
  const e = q.get('exposure');
  return { picks, base: Math.max(0, Number(q.get('base')) || 0), exposure: e === 'custom' ? 'custom' : e && Number(e) > 0 ? Number(e) : null };
}

interface Ran {
  docs: WorkbenchDocument[];
  labels: string[];
  outcomes: CompareOutcome[];
  ms: number;
}

export default function CompareScreen({ jobId, jobName }: { jobId: number; jobName: string }) {
  const [assemblies, setAssemblies] = useState<WireAssembly[] | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const initial = useMemo(readUrl, []);
  const [picks, setPicks] = useState<number[]>(initial.picks);
  const [baseline, setBaseline] = useState(initial.base);
  const [exposureFrom, setExposureFrom] = useState<number | 'custom' | null>(initial.exposure);
  const [custom, setCustom] = useState<CustomExposure>(() => customFrom(defaultExposure()));
  const [upload, setUpload] = useState<{ id: number; series: UploadedSeries } | null>(null);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const [running, setRunning] = useState(false);
  const progress = useRef(new ProgressSignal()).current;
  const [ran, setRan] = useState<Ran | null>(null);
  const [runError, setRunError] = useState<string | null>(null);
  const [sensitivity, setSensitivity] = useState<Record<number, SensitivityResult>>({});
  const runner = useRef<CompareRunner | null>(null);
  const cancelRef = useRef<(() => void) | null>(null);

  useEffect(() => {
    const r = new CompareRunner();
    void r.warm().catch(() => undefined);
    runner.current = r;
    return () => r.dispose();
  }, []);

  // the job's assemblies and revisions
  useEffect(() => {
    let stop = false;
    fetch(`/api/jobs/${jobId}/revisions`)
      .then(async (res) => {
        const body = await res.json().catch(() => null);
        if (!res.ok) throw new Error(body?.error?.message ?? `HTTP ${res.status}`);
        return body as { assemblies: WireAssembly[] };
      })
      .then((body) => {
        if (stop) return;
        setAssemblies(body.assemblies);
        const known = new Set(body.assemblies.flatMap((a) => a.revisions.map((r) => r.id)));
        setPicks((p) => {
          const kept = p.filter((id) => known.has(id));
          if (kept.length > 0) return kept;
          // by default the newest revision of each assembly, up to four
          return body.assemblies.filter((a) => a.revisions.length > 0).slice(0, MAX_PICKS).map((a) => a.revisions[0].id);
        });
      })
      .catch((e: unknown) => !stop && setLoadError(`The job's assemblies could not be loaded: ${e instanceof Error ? e.message : String(e)}`));
    return () => {
      stop = true;
    };
  }, [jobId]);

  const sources = useMemo(() => {
    const map = new Map<number, Source>();
    for (const a of assemblies ?? []) {
      for (const r of a.revisions) {
        const parsed = workbenchDocumentSchema.safeParse(r.model);
        map.set(r.id, { assembly: a, revision: r, doc: parsed.success ? parsed.data : null, issues: parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) });
      }
    }
    return map;
  }, [assemblies]);

  const picked = picks.map((id) => sources.get(id)).filter((s): s is Source => !!s);
  const from = exposureFrom === null ? (picked[0]?.revision.id ?? null) : exposureFrom;
  const customBase = useMemo(() => customBaseOf(sources, picked[0]?.revision.id), [sources, picked[0]?.revision.id]); // eslint-disable-line react-hooks/exhaustive-deps
  const customBuilt = useMemo(() => buildCustom(custom, customBase), [custom, customBase]);
  const exposure: Exposure | null = useMemo(() => {
    if (from === 'custom') return customBuilt.ok ? customBuilt.exposure : null;
    return from !== null ? (sources.get(from)?.doc?.exposure ?? null) : null;
  }, [from, customBuilt, sources]);

  // the upload an uploaded-series exposure needs
  const uploadId = exposure?.outdoor.mode === 'series' ? exposure.outdoor.uploadId : null;
  useEffect(() => {
    if (uploadId === null || upload?.id === uploadId) return;
    let stop = false;
    setUploadError(null);
    fetch(`/api/uploads/${uploadId}`)
      .then(async (res) => {
        const body = await res.json().catch(() => null);
        if (!res.ok) throw new Error(body?.error?.message ?? `HTTP ${res.status}`);
        if (!stop) setUpload({ id: uploadId, series: body.upload.series });
      })
      .catch((e: unknown) => !stop && setUploadError(`The uploaded outdoor series could not be loaded: ${e instanceof Error ? e.message : String(e)}`));
    return () => {
      stop = true;
    };
  }, [uploadId, upload?.id]);
  const uploadSeries = uploadId !== null && upload?.id === uploadId ? upload.series : null;

  const labels = useMemo(() => {
    const count = new Map<number, number>();
    for (const s of picked) count.set(s.assembly.id, (count.get(s.assembly.id) ?? 0) + 1);
    return picked.map((s) => (count.get(s.assembly.id)! > 1 ? `${s.assembly.name} (R${s.revision.number})` : s.assembly.name));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [picks.join(','), sources]);

  // the documents as compared: each build-up under the one exposure
  const docs = useMemo(() => (exposure ? picked.map((s) => (s.doc ? { ...s.doc, exposure } : null)) : []), [picks.join(','), sources, exposure]); // eslint-disable-line react-hooks/exhaustive-deps
  const ready = exposure !== null && docs.length > 0 && docs.every((d) => d !== null) && (uploadId === null || uploadSeries !== null);
  // the days the run really steps: repeating days start periodic, only an upload warms up
  const totalDays = exposure ? exposure.days + effectiveWarmupDays(exposure) : 0;

  // keep the choice in the address, so the view can be reopened or sent to a colleague of the team
  useEffect(() => {
    const q = new URLSearchParams();
    if (picks.length) q.set('r', picks.join(','));
    if (baseline) q.set('base', String(baseline));
    if (exposureFrom !== null) q.set('exposure', String(exposureFrom));
    history.replaceState(null, '', `${location.pathname}${q.size ? `?${q}` : ''}`);
  }, [picks, baseline, exposureFrom]);

  useEffect(() => {
    if (baseline >= picked.length && picked.length > 0) setBaseline(0);
  }, [baseline, picked.length]);

  const run = () => {
    const r = runner.current;
    if (!r || !ready) return;
    const list = docs as WorkbenchDocument[];
    const names = labels;
    setRunning(true);
    setRunError(null);
    progress.reset();
    const t0 = performance.now();
    const job = r.compare(
      list.map((doc) => ({ doc, upload: uploadSeries })),
      (f) => progress.set(f),
    );
    cancelRef.current = job.cancel;
    job.result
      .then((outcomes) => {
        if (!outcomes) return;
        setRan({ docs: list, labels: names, outcomes, ms: performance.now() - t0 });
        setRunning(false);
      })
      .catch((e: unknown) => {
        setRunError(`The comparison could not run: ${e instanceof Error ? e.message : String(e)}`);
        setRunning(false);
      });
  };

  // short runs follow every change (debounced)
  useEffect(() => {
    if (!ready || totalDays > AUTO_RUN_DAYS) return;
    const t = setTimeout(run, 150);
    return () => clearTimeout(t);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [docs, uploadSeries, ready]);

  const cancel = () => {
    cancelRef.current?.();
    cancelRef.current = null;
    setRunning(false);
  };

  if (loadError) return <p role="alert" className="rounded border border-danger/40 bg-danger-soft px-3 py-2">{loadError}</p>;
  if (!assemblies) return <p className="text-ink-soft" role="status">Loading the job’s assemblies…</p>;
  if (assemblies.length === 0)
    return (
      <p className="rounded border border-line bg-panel p-4">
        {jobName} has no assemblies yet. <a className="text-accent-strong hover:underline" href={`/jobs/${jobId}`}>Add one on the job page</a>, then come back to compare.
      </p>
    );

  const current = ran && ran.docs.length === docs.length && ran.docs.every((d, i) => d === docs[i]);
  const done = ran ? ran.outcomes.map((o) => (o.kind === 'done' ? o : null)) : [];
  const allDone = ran !== null && done.every((o) => o !== null);
  const figures = allDone ? done.map((o) => o!.figures) : [];
  const series: CompareSeries[] = allDone ? done.map((o) => o!.series) : [];
  const invalid = ran ? ran.outcomes.flatMap((o, i) => (o.kind === 'invalid' ? [`${ran.labels[i]}: ${o.issues.join('; ')}`] : [])) : [];
  const strongestOf = picked.map((s, i) => {
    const r = sensitivity[s.revision.id];
    if (!r || r.doc !== docs[i]) return null;
    const out: { [K in MetricKey]?: ReturnType<typeof strongest> } = {};
    for (const k of Object.keys(r.effects) as MetricKey[]) out[k] = strongest(r.effects[k]);
    return out;
  });
  // the alternatives whose document can run, for the sensitivity
  const runnable = picked.flatMap((s, i) => (docs[i] ? [{ i, id: s.revision.id, doc: docs[i]! }] : []));
  const maxMm = Math.max(1, ...picked.map((s) => (s.doc ? s.doc.layers.reduce((a, l) => a + l.thickness, 0) * 1000 : 0)));

  return (
    <div className="flex flex-col gap-4" data-testid="compare-screen">
      <section aria-labelledby="pick-title" className="rounded border border-line bg-panel p-3 no-print">
        <h2 id="pick-title" className="text-lg font-semibold">
          Alternatives and exposure
        </h2>
        <ol className="mt-2 flex flex-col gap-2" data-testid="picks">
          {picks.map((id, i) => (
            <li key={`${i}-${id}`} className="flex flex-wrap items-center gap-2">
              <span aria-hidden="true" className="inline-block h-3 w-6 rounded-sm" style={{ background: alternativeColour(i) }} title={ALTERNATIVE_STYLE[i].name} />
              <label className="flex items-center gap-2 text-sm">
                <span className="w-28 font-semibold">Alternative {i + 1}</span>
                <select
                  className="min-w-80 rounded border border-line bg-panel px-2 py-1.5"
                  value={id}
                  onChange={(e) => setPicks((p) => p.map((x, k) => (k === i ? Number(e.target.value) : x)))}
                  data-testid={`pick-${i}`}
                >
                  {assemblies.map((a) => (
                    <optgroup key={a.id} label={a.name}>
                      {a.revisions.map((r) => (
                        <option key={r.id} value={r.id}>
                          {a.name} · revision {r.number} · {STATE_LABEL[r.state] ?? r.state}
                        </option>
                      ))}
                    </optgroup>
                  ))}
                </select>
              </label>
              {sources.get(id)?.issues.length ? <span className="text-xs text-danger">This revision’s document cannot run: {sources.get(id)!.issues.join('; ')}</span> : null}
              <button
                type="button"
                className="rounded border border-line px-2 py-1 text-sm hover:bg-paper disabled:opacity-40"
                onClick={() => setPicks((p) => p.filter((_, k) => k !== i))}
                disabled={picks.length <= 1}
                aria-label={`Remove alternative ${i + 1}`}
              >
                Remove
              </button>
            </li>
          ))}
        </ol>
        <div className="mt-2 flex flex-wrap items-center gap-3 text-sm">
          <button
            type="button"
            className="rounded border border-line-strong bg-panel px-2.5 py-1 hover:bg-paper disabled:opacity-40"
            disabled={picks.length >= MAX_PICKS}
            onClick={() => {
              const unused = assemblies.flatMap((a) => a.revisions.map((r) => r.id)).find((rid) => !picks.includes(rid));
              if (unused) setPicks((p) => [...p, unused]);
            }}
            data-testid="add-pick"
          >
            Add an alternative
          </button>
          <span className="text-ink-soft">{picks.length < 2 ? 'Pick at least two to compare; the sensitivity below works with one.' : `${picks.length} of at most ${MAX_PICKS}.`}</span>
        </div>
        <div className="mt-3 flex flex-wrap items-end gap-3 text-sm">
          <label className="flex flex-col">
            <span className="font-semibold">Exposure applied to all</span>
            <select
              className="mt-1 min-w-80 rounded border border-line bg-panel px-2 py-1.5"
              value={from === null ? '' : String(from)}
              onChange={(e) => {
                const v = e.target.value === 'custom' ? 'custom' : Number(e.target.value);
                if (v === 'custom' && exposure) setCustom(customFrom(exposure));
                setExposureFrom(v);
              }}
              data-testid="exposure-from"
            >
              {picked.map((s, i) => (
                <option key={s.revision.id} value={s.revision.id}>
                  the exposure of alternative {i + 1}, {labels[i]}
                </option>
              ))}
              <option value="custom">a daily sine set here</option>
            </select>
          </label>
          {from === 'custom'
            ? CUSTOM_FIELDS.map((f) => {
                const err = !customBuilt.ok ? customBuilt.fields[f.key] : undefined;
                return (
                  <label key={f.key} className="flex flex-col" htmlFor={`cx-${f.key}`}>
                    <span className="font-semibold">
                      {f.label} <span className="font-normal text-ink-soft">({f.unit})</span>
                    </span>
                    <input
                      id={`cx-${f.key}`}
                      inputMode="decimal"
                      className={`mt-1 w-24 rounded border bg-panel px-2 py-1.5 tabular ${err ? 'border-danger' : 'border-line'}`}
                      value={custom[f.key]}
                      onChange={(e) => setCustom((c) => ({ ...c, [f.key]: e.target.value }))}
                      aria-invalid={!!err}
                    />
                  </label>
                );
              })
            : null}
        </div>
        {!customBuilt.ok && from === 'custom' ? (
          <ul role="alert" className="mt-2 text-xs text-danger">
            {Object.values(customBuilt.fields).map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        ) : null}
        {exposure ? <p className="mt-2 text-xs text-ink-soft" data-testid="exposure-summary">{describeExposure(exposure)}</p> : null}
        {uploadError ? <p role="alert" className="mt-2 text-sm text-danger">{uploadError}</p> : null}
        <div className="mt-3 flex flex-wrap items-center gap-3 text-sm">
          <button type="button" className="rounded bg-accent px-3 py-1.5 text-white hover:bg-accent-strong disabled:opacity-50" onClick={run} disabled={!ready || running} data-testid="compare-run">
            Run {picks.length} together
          </button>
          {running ? (
            <span className="flex items-center gap-2" data-testid="compare-progress">
              <ProgressBar signal={progress} label="Comparison progress" />
              <button type="button" className="rounded border border-line bg-panel px-2 py-1 hover:bg-paper" onClick={cancel}>
                Cancel
              </button>
            </span>
          ) : null}
          {ran && !running ? (
            <span className="text-xs text-ink-soft tabular" data-testid="compare-time">
              {ran.outcomes.length} run together in {ran.ms.toFixed(0)} ms on {runner.current?.pool.size ?? 1} {runner.current?.pool.size === 1 ? 'worker' : 'workers'}
            </span>
          ) : null}
          {ran && !current && !running ? <span className="text-warn">The choice changed since this run{totalDays > AUTO_RUN_DAYS ? ': press Run' : ''}.</span> : null}
          {!ran && !running && ready && totalDays > AUTO_RUN_DAYS ? <span className="text-ink-soft">A run of more than {AUTO_RUN_DAYS} days waits for the Run button.</span> : null}
          <button type="button" className="ml-auto rounded border border-line bg-panel px-2.5 py-1 hover:bg-paper" onClick={() => window.print()}>
            Print
          </button>
        </div>
      </section>

      {runError ? <p role="alert" className="rounded border border-danger/40 bg-danger-soft px-3 py-2">{runError}</p> : null}
      {invalid.length ? (
        <div role="alert" className="rounded border border-danger/40 bg-danger-soft px-3 py-2 text-sm">
          <p className="font-semibold">The engine cannot run these:</p>
          <ul className="font-mono text-xs">
            {invalid.map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
        </div>
      ) : null}

      {allDone && figures.length >= 2 ? (
        <>
          <p className="hidden print:block text-sm">{exposure ? describeExposure(exposure) : ''}</p>
          <Glance labels={ran!.labels} figures={figures} />
          <OverlayCharts labels={ran!.labels} series={series} />
          <CompareTable
            labels={ran!.labels}
            figures={figures}
            baseline={Math.min(baseline, figures.length - 1)}
            onBaseline={setBaseline}
            strongest={strongestOf.length === figures.length ? strongestOf : figures.map(() => null)}
            fraction={Object.values(sensitivity)[0]?.fraction ?? 0.1}
          />
        </>
      ) : null}

      {picked.length > 0 ? (
        <section aria-labelledby="sections-title" className="rounded border border-line bg-panel p-3 break-inside-avoid">
          <h2 id="sections-title" className="text-lg font-semibold">
            Sections to one scale
          </h2>
          <div className="mt-2 flex flex-wrap items-start gap-6" data-testid="compare-sections">
            {picked.map((s, i) =>
              s.doc ? (
                <div key={`${i}-${s.revision.id}`} className="flex flex-col items-center">
                  <span className="mb-1 inline-flex h-12 max-w-40 items-start gap-1.5 text-center text-xs font-semibold" title={labels[i]}>
                    <span aria-hidden="true" className="inline-block h-2.5 w-4 shrink-0 rounded-sm" style={{ background: alternativeColour(i) }} />
                    {labels[i]}
                  </span>
                  <span className="text-xs text-ink-soft tabular">{fixed(s.doc.layers.reduce((a, l) => a + l.thickness, 0) * 1000, 1)} mm</span>
                  <SectionDrawing layers={s.doc.layers} pxPerMm={SECTION_PX / maxMm} />
                </div>
              ) : null,
            )}
          </div>
        </section>
      ) : null}

      {picked.length > 0 && exposure && runner.current ? (
        <SensitivityPanel
          alternatives={runnable.map(({ i, doc }) => ({ label: labels[i], doc, upload: uploadSeries }))}
          runner={runner.current}
          results={runnable.map(({ id }) => sensitivity[id] ?? null)}
          onResult={(k, result) => setSensitivity((m) => ({ ...m, [runnable[k].id]: result }))}
        />
      ) : null}
    </div>
  );
}

function describeExposure(e: Exposure): string {
  const o = e.outdoor;
  const out =
    o.mode === 'series'
      ? `an uploaded hourly series (absorptance ${o.absorptance})`
      : o.mode === 'solair'
        ? `a sol-air day: air ${o.mean} °C ± ${o.amplitude} K peaking at ${o.peakHour} h, sun on the face (absorptance ${o.absorptance})`
        : `a daily sine: ${o.mean} °C ± ${o.amplitude} K peaking at ${o.peakHour} h`;
  const ind = e.indoor.mode === 'constant' ? `${e.indoor.value} °C indoors` : 'an indoor day schedule';
  return `Exposure for all: ${out}; ${ind}; R_se ${e.outsideSurfaceResistance}, R_si ${e.insideSurfaceResistance} m²K/W; ${e.days} reported ${e.days === 1 ? 'day' : 'days'}, step ${e.timeStep} s.`;
}

/** the exposure a custom one starts from: the first alternative's, else the default */
function customBaseOf(sources: Map<number, Source>, id: number | undefined): Exposure {
  return (id !== undefined ? sources.get(id)?.doc?.exposure : undefined) ?? defaultExposure();
}

/** the line at a glance: which alternative damps the swing most, reacts latest, loses least heat, and which carry a moisture risk */
function Glance({ labels, figures }: { labels: string[]; figures: CompareFigures[] }) {
  const pick = (v: (f: CompareFigures) => number, sign: 1 | -1) => {
    let best = -1;
    figures.forEach((f, i) => {
      const x = v(f);
      if (Number.isFinite(x) && (best < 0 || sign * x < sign * v(figures[best]))) best = i;
    });
    return best;
  };
  const damp = pick((f) => f.decrementFactor, 1);
  const late = pick((f) => f.timeLag, -1);
  const least = pick((f) => f.heatLost, 1);
  const assessed = figures.some((f) => f.moisture);
  const risk = figures.map((f, i) => (moistureRisk(f.moisture) ? labels[i] : null)).filter(Boolean);
  const item = (title: string, i: number, value: string, testId: string) => (
    <div className="rounded border border-line bg-panel px-3 py-2" data-testid={testId} data-alt={i}>
      <dt className="text-xs font-semibold text-ink-soft">{title}</dt>
      <dd className="mt-0.5 flex items-center gap-1.5 font-semibold">
        <span aria-hidden="true" className="inline-block h-2.5 w-4 shrink-0 rounded-sm" style={{ background: alternativeColour(i) }} />
        {i >= 0 ? labels[i] : '–'}
      </dd>
      <dd className="text-xs text-ink-soft tabular">{value}</dd>
    </div>
  );
  return (
    <dl className="grid gap-2 sm:grid-cols-2 lg:grid-cols-4" aria-label="At a glance" data-testid="glance">
      {item('Damps the swing most', damp, damp >= 0 ? `decrement factor ${fixed(figures[damp].decrementFactor, 3)}` : '', 'glance-damps')}
      {item('Reacts latest', late, late >= 0 ? `time lag ${fixed(figures[late].timeLag / 3600, 2)} h` : '', 'glance-latest')}
      {item('Loses least heat', least, least >= 0 ? `${fixed(figures[least].heatLost, 3)} kWh/m² over ${fixed(figures[least].reportedDays, 0)} days` : '', 'glance-least-loss')}
      <div className={`rounded border px-3 py-2 ${risk.length ? 'border-danger/40 bg-danger-soft' : 'border-line bg-panel'}`} data-testid="glance-moisture">
        <dt className="text-xs font-semibold text-ink-soft">Moisture risk (ISO 13788)</dt>
        <dd className="mt-0.5 font-semibold">{!assessed ? 'Not assessed: no monthly climate' : risk.length ? `${risk.join(', ')}` : 'None of them'}</dd>
        <dd className="text-xs text-ink-soft">{risk.length ? 'water accumulates over the year, or a surface risk; see the table' : 'A monthly method; local codes decide.'}</dd>
      </div>
    </dl>
  );
}
