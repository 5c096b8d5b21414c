// the Exposure pane: outdoor and indoor conditions, surface films, run settings.
// every field keeps what was typed (a draft with its message) while the document keeps
// the last valid value, so a half-typed number never reaches the run.
import { createContext, useContext, useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { useWorkbench } from '../../lib/workbench/store';
import { HEAT_FLOW_DIRECTIONS, ISO6946_RSE, ISO6946_RSI, defaultPlaceSun, skyLossOf, type Exposure, type Outdoor, type SunSpec } from '../../lib/schemas/workbench';
import { PLACE_PRESETS } from '../../lib/solar/places';
import { HOTTEL_CLIMATE_NAMES } from '../../lib/solar/clearSky';
import SunOnFace from './SunOnFace';
import type { UploadSummary } from '../../lib/schemas/upload';
import CsvImport from './CsvImport';
import { MAX_RUN_DAYS, daysRule, parseNumber, warmupRule, type NumberRule } from './numberRule';
import { AUTO_RUN_DAYS } from './RunControl';

/** the pane is read-only (a checker's view): fields show their values and cannot change */
const ReadOnly = createContext(false);

/** a row of mutually exclusive choices shown as buttons (a radio group) */
function Choice<T extends string>({ label, options, value, onChoose }: { label: string; options: readonly (readonly [T, string])[]; value: T; onChoose(v: T): void }) {
  const readOnly = useContext(ReadOnly);
  return (
    <div role="radiogroup" aria-label={label} className="flex gap-1 w-full">
      {options.map(([m, text]) => (
        <button
          key={m}
          type="button"
          role="radio"
          aria-checked={value === m}
          disabled={readOnly}
          className={`px-2.5 py-1 rounded border ${value === m ? 'bg-accent text-white border-accent' : 'border-line bg-panel enabled:hover:bg-paper disabled:text-ink-faint'}`}
          onClick={() => onChoose(m)}
        >
          {text}
        </button>
      ))}
    </div>
  );
}

const show = (v: number | null | undefined, scale = 1) => (v === null || v === undefined ? '' : String(Number((v * scale).toPrecision(10))));

function NumberField({
  field,
  rule,
  value,
  onValue,
  hint,
  width = 'w-24',
}: {
  /** the draft key, e.g. "exposure:mean" */
  field: string;
  rule: NumberRule;
  value: number | null;
  onValue: (v: number | null) => void;
  hint?: string;
  width?: string;
}) {
  const id = useId();
  const draft = useWorkbench((s) => s.drafts[field]);
  const setDraft = useWorkbench((s) => s.setDraft);
  const clearDraft = useWorkbench((s) => s.clearDraft);
  const readOnly = useContext(ReadOnly);
  const text = draft ? draft.raw : show(value, rule.scale);
  const error = draft?.error ?? null;
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs text-ink-soft" title={hint}>
        {rule.label}
        {rule.unit ? <span className="text-ink-faint"> ({rule.unit})</span> : null}
      </label>
      <input
        id={id}
        name={field}
        inputMode="decimal"
        className={`${width} rounded border px-2 py-1 text-right tabular ${readOnly ? 'bg-paper text-ink-soft' : 'bg-panel'} ${error ? 'border-danger' : 'border-line'}`}
        value={text}
        readOnly={readOnly}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        title={hint}
        onChange={(e) => {
          if (readOnly) return;
          const raw = e.target.value;
          const parsed = parseNumber(rule, raw);
          if (!parsed.ok) setDraft(field, raw, parsed.error);
          else {
            setDraft(field, raw, null);
            if (parsed.value !== value) onValue(parsed.value);
          }
        }}
        onBlur={() => {
          if (draft && draft.error === null) clearDraft(field);
        }}
      />
      {error ? (
        <span id={`${id}-err`} className="text-xs text-danger" role="alert">
          {error}
        </span>
      ) : null}
    </div>
  );
}

function Group({ title, children, help }: { title: string; children: ReactNode; help?: string }) {
  return (
    <fieldset className="border-t border-line pt-3 mt-3 first:mt-0 first:border-t-0 first:pt-0">
      <legend className="text-sm font-semibold text-ink pr-2" title={help}>
        {title}
      </legend>
      <div className="mt-2 flex flex-wrap gap-3 items-start">{children}</div>
    </fieldset>
  );
}

const hourRule = (label: string): NumberRule => ({ label, unit: 'h', min: 0, max: 24 });

/** defaults when switching to a sol-air day: a west wall at the Harrow Lane site in July, with the sky's long-wave loss (our own choice) */
const SOLAIR_DEFAULTS = { absorptance: 0.6, face: { azimuth: 270, tilt: 90 }, skyLoss: { emissivity: 0.9 } };
/** the hand-typed sun of "custom": a west face in summer (our own choice) */
const CUSTOM_SUN: SunSpec = { source: 'custom', peakIrradiance: 550, sunrise: 11, sunset: 20 };
const CLIMATE_LABEL: Record<string, string> = {
  'midlatitude-summer': 'Mid-latitude summer',
  'midlatitude-winter': 'Mid-latitude winter',
  'subarctic-summer': 'Subarctic summer',
  tropical: 'Tropical',
};
const COMPASS: [number, string][] = [
  [0, 'north'],
  [45, 'north-east'],
  [90, 'east'],
  [135, 'south-east'],
  [180, 'south'],
  [225, 'south-west'],
  [270, 'west'],
  [315, 'north-west'],
];
const compassOf = (az: number) => COMPASS.find(([a]) => Math.abs(a - az) < 1e-9)?.[1] ?? null;

/** a labelled select that follows the pane's read-only state */
function Select({ label, value, onChange, children, hint, testId }: { label: string; value: string; onChange(v: string): void; children: ReactNode; hint?: string; testId?: string }) {
  const id = useId();
  const readOnly = useContext(ReadOnly);
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs text-ink-soft" title={hint}>
        {label}
      </label>
      <select id={id} data-testid={testId} title={hint} className="rounded border border-line px-2 py-1 bg-panel disabled:bg-paper disabled:text-ink-soft" disabled={readOnly} value={value} onChange={(e) => onChange(e.target.value)}>
        {children}
      </select>
    </div>
  );
}

export default function ExposurePane({ readOnly = false }: { readOnly?: boolean }) {
  const exposure = useWorkbench((s) => s.doc.exposure);
  const teamId = useWorkbench((s) => s.assembly?.teamId ?? null);
  const setExposure = useWorkbench((s) => s.setExposure);
  const setOutdoor = useWorkbench((s) => s.setOutdoor);
  const setIndoor = useWorkbench((s) => s.setIndoor);
  const setUpload = useWorkbench((s) => s.setUpload);
  const clearDraft = useWorkbench((s) => s.clearDraft);
  const out = exposure.outdoor;
  const [mode, setMode] = useState<Outdoor['mode']>(out.mode);
  const [uploads, setUploads] = useState<UploadSummary[] | null>(null);
  const [uploadsError, setUploadsError] = useState<string | null>(null);
  const [importing, setImporting] = useState(false);
  const [uploadState, setUploadState] = useState<'idle' | 'loading' | 'error'>('idle');
  const loadedUpload = useRef<number | null>(null);
  const lastSine = useRef({ mean: 'mean' in out ? out.mean : 22, amplitude: 'amplitude' in out ? out.amplitude : 6, peakHour: 'peakHour' in out ? out.peakHour : 15 });
  if (out.mode !== 'series') lastSine.current = { mean: out.mean, amplitude: out.amplitude, peakHour: out.peakHour };
  const lastSolair = useRef<Extract<Outdoor, { mode: 'solair' }> | null>(out.mode === 'solair' ? out : null);
  if (out.mode === 'solair') lastSolair.current = out;

  useEffect(() => setMode(out.mode), [out.mode]);

  const refreshUploads = async () => {
    try {
      const res = await fetch(`/api/uploads${teamId ? `?teamId=${teamId}` : ''}`);
      if (!res.ok) throw new Error((await res.json().catch(() => null))?.error?.message ?? `HTTP ${res.status}`);
      setUploads(((await res.json()) as { uploads: UploadSummary[] }).uploads);
      setUploadsError(null);
    } catch (e) {
      setUploadsError(`The team's uploads could not be listed: ${e instanceof Error ? e.message : String(e)}`);
    }
  };
  useEffect(() => {
    if (mode === 'series' && uploads === null) void refreshUploads();
  }, [mode]);

  // the series of the chosen upload, for the run
  useEffect(() => {
    if (out.mode !== 'series') {
      if (loadedUpload.current !== null) {
        loadedUpload.current = null;
        setUpload(null);
      }
      return;
    }
    if (loadedUpload.current === out.uploadId) return;
    let stop = false;
    setUploadState('loading');
    fetch(`/api/uploads/${out.uploadId}`)
      .then(async (res) => {
        if (!res.ok) throw new Error((await res.json().catch(() => null))?.error?.message ?? `HTTP ${res.status}`);
        return (await res.json()) as { upload: { series: { step: number; air: number[]; irradiance?: number[] } } };
      })
      .then(({ upload }) => {
        if (stop) return;
        loadedUpload.current = out.uploadId;
        setUpload(upload.series);
        setUploadState('idle');
      })
      .catch(() => !stop && setUploadState('error'));
    return () => {
      stop = true;
    };
  }, [out.mode === 'series' ? out.uploadId : null]);

  const chooseMode = (m: Outdoor['mode']) => {
    setMode(m);
    for (const k of Object.keys(useWorkbench.getState().drafts)) if (k.startsWith('exposure:sun') || ['exposure:mean', 'exposure:amplitude', 'exposure:peakHour', 'exposure:absorptance'].includes(k)) clearDraft(k);
    const sine = lastSine.current;
    if (m === 'sine') setOutdoor({ mode: 'sine', ...sine });
    else if (m === 'solair') setOutdoor(lastSolair.current ? { ...lastSolair.current, ...sine } : { mode: 'solair', ...sine, ...SOLAIR_DEFAULTS, sun: defaultPlaceSun() });
    // an uploaded series waits until an upload is picked
  };

  const patchOutdoor = (patch: Record<string, number>) => setOutdoor({ ...out, ...patch } as Outdoor);
  const num = (key: keyof Exposure, rule: NumberRule, hint?: string, width?: string) => (
    <NumberField field={`exposure:${key}`} rule={rule} value={exposure[key] as number | null} onValue={(v) => setExposure({ [key]: v } as Partial<Exposure>)} hint={hint} width={width} />
  );

  const totalDays = exposure.days + (out.mode === 'series' ? exposure.warmupDays : 0);
  const sunOrSkyIgnored = out.mode === 'solair' && exposure.outsideSurfaceResistance === 0;

  return (
    <ReadOnly.Provider value={readOnly}>
    <section aria-labelledby="exposure-title" className="flex flex-col gap-1 text-sm" data-testid="exposure-pane">
      <h2 id="exposure-title" className="text-base font-semibold">
        Exposure
      </h2>
      {readOnly ? (
        <p className="text-xs text-ink-soft" data-testid="exposure-read-only">
          Read only: these are the revision's saved settings; as checker you run them as they are, and engineers change them.
        </p>
      ) : null}

      <Group title="Outdoor air">
        <Choice
          label="Outdoor air"
          options={[
            ['sine', 'Daily sine'],
            ['solair', 'Sol-air day'],
            ['series', 'Uploaded series'],
          ]}
          value={mode}
          onChoose={chooseMode}
        />
        {out.mode !== 'series' && mode !== 'series' ? (
          <>
            <NumberField field="exposure:mean" rule={{ label: 'Daily mean', unit: '°C', min: -80, max: 70 }} value={out.mean} onValue={(v) => patchOutdoor({ mean: v! })} hint="Mean outdoor air temperature over the day" />
            <NumberField field="exposure:amplitude" rule={{ label: 'Amplitude', unit: 'K', min: 0, max: 30 }} value={out.amplitude} onValue={(v) => patchOutdoor({ amplitude: v! })} hint="Amplitude of the daily sine: the maximum lies this far above the mean (ISO 13786 works in amplitudes). The swing, maximum − minimum, is twice it." />
            <div className="flex flex-col gap-0.5" data-testid="swing-readout">
              <span className="text-xs text-ink-soft" title="Maximum − minimum of the day = 2 × amplitude">
                Swing (max − min)
              </span>
              <span className="px-2 py-1 tabular text-ink-soft" title="Maximum − minimum of the day = 2 × amplitude">
                {Number((2 * out.amplitude).toPrecision(10))} K
              </span>
            </div>
            <NumberField field="exposure:peakHour" rule={hourRule('Hour of peak')} value={out.peakHour} onValue={(v) => patchOutdoor({ peakHour: v! })} hint="Hour of the day when the outdoor air is warmest" />
          </>
        ) : null}
        {out.mode === 'solair' && mode === 'solair' ? (
          <SolAirFields out={out} outsideSurfaceResistance={exposure.outsideSurfaceResistance} setOutdoor={setOutdoor} clearDraft={clearDraft} />
        ) : null}
        {mode === 'series' ? (
          <div className="w-full flex flex-col gap-2" data-testid="upload-picker">
            {uploadsError ? <p className="text-danger" role="alert">{uploadsError}</p> : null}
            {uploads === null && !uploadsError ? <p className="text-ink-soft">Loading the team's uploads…</p> : null}
            {uploads && uploads.length === 0 ? <p className="text-ink-soft">The team has no uploaded series yet. Import a CSV file of hourly outdoor air temperatures.</p> : null}
            {uploads && uploads.length > 0 ? (
              <label className="flex flex-col gap-0.5">
                <span className="text-xs text-ink-soft">Upload of the team</span>
                <select
                  className="rounded border border-line px-2 py-1 bg-panel disabled:bg-paper disabled:text-ink-soft"
                  disabled={readOnly}
                  value={out.mode === 'series' ? String(out.uploadId) : ''}
                  onChange={(e) => {
                    const id = Number(e.target.value);
                    if (id > 0) setOutdoor({ mode: 'series', uploadId: id, absorptance: out.mode === 'series' ? out.absorptance : 0.6 });
                  }}
                >
                  <option value="">Choose an upload…</option>
                  {uploads.map((u) => (
                    <option key={u.id} value={u.id}>
                      {u.name} — {u.rowCount.toLocaleString('en-GB')} h{u.hasIrradiance ? ', with irradiance' : ''}
                    </option>
                  ))}
                </select>
              </label>
            ) : null}
            {uploadState === 'loading' ? <p className="text-ink-soft">Loading the series…</p> : null}
            {uploadState === 'error' ? <p className="text-danger" role="alert">The chosen upload could not be loaded.</p> : null}
            {out.mode === 'series' ? (
              <NumberField field="exposure:seriesAbsorptance" rule={{ label: 'Solar absorptance', unit: '', min: 0, max: 1 }} value={out.absorptance} onValue={(v) => setOutdoor({ ...out, absorptance: v! })} hint="Used with the upload's irradiance column, when it has one" />
            ) : null}
            {readOnly ? null : (
              <div>
                <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => setImporting(true)}>
                  Import a CSV file…
                </button>
              </div>
            )}
            {importing ? (
              <CsvImport
                teamId={teamId}
                onClose={() => setImporting(false)}
                onSaved={async (u) => {
                  setImporting(false);
                  await refreshUploads();
                  setOutdoor({ mode: 'series', uploadId: u.id, absorptance: out.mode === 'series' ? out.absorptance : 0.6 });
                }}
              />
            ) : null}
          </div>
        ) : null}
      </Group>

      <Group title="Indoor air">
        <Choice
          label="Indoor air"
          options={[
            ['constant', 'Constant'],
            ['schedule', '24-hour schedule'],
          ]}
          value={exposure.indoor.mode}
          onChoose={(m) => {
            const ind = exposure.indoor;
            if (m === ind.mode) return;
            if (m === 'schedule') setIndoor({ mode: 'schedule', hourly: Array.from({ length: 24 }, () => (ind.mode === 'constant' ? ind.value : 21)) });
            else setIndoor({ mode: 'constant', value: ind.mode === 'schedule' ? Number((ind.hourly.reduce((a, b) => a + b, 0) / 24).toFixed(1)) : 21 });
          }}
        />
        {exposure.indoor.mode === 'constant' ? (
          <NumberField field="exposure:indoor" rule={{ label: 'Indoor air', unit: '°C', min: -30, max: 60 }} value={exposure.indoor.value} onValue={(v) => setIndoor({ mode: 'constant', value: v! })} />
        ) : (
          <div className="grid grid-cols-6 gap-1.5 w-full" aria-label="Indoor air by hour (°C), each from the hour, linear between">
            {exposure.indoor.hourly.map((v, h) => (
              <NumberField
                key={h}
                field={`exposure:indoor:${h}`}
                rule={{ label: `${String(h).padStart(2, '0')}:00`, unit: '°C', min: -30, max: 60 }}
                value={v}
                width="w-16"
                onValue={(nv) => {
                  const ind = useWorkbench.getState().doc.exposure.indoor;
                  if (ind.mode !== 'schedule') return;
                  const hourly = ind.hourly.slice();
                  hourly[h] = nv!;
                  setIndoor({ mode: 'schedule', hourly });
                }}
              />
            ))}
          </div>
        )}
        <p className="basis-full text-xs text-ink-soft">Indoor humidity and the moisture check (ISO 13788, by month) are in the Moisture pane.</p>
      </Group>

      <Group title="Surface resistances" help="ISO 6946 conventional values by direction of heat flow, or your own">
        <label className="flex flex-col gap-0.5">
          <span className="text-xs text-ink-soft">Heat flow</span>
          <select
            className="rounded border border-line px-2 py-1 bg-panel disabled:bg-paper disabled:text-ink-soft"
                  disabled={readOnly}
            value={exposure.heatFlowDirection}
            onChange={(e) => {
              const dir = e.target.value as (typeof HEAT_FLOW_DIRECTIONS)[number];
              clearDraft('exposure:insideSurfaceResistance');
              setExposure({ heatFlowDirection: dir, insideSurfaceResistance: ISO6946_RSI[dir] });
            }}
          >
            <option value="horizontal">Horizontal (walls)</option>
            <option value="upward">Upward (roofs, ceilings in winter)</option>
            <option value="downward">Downward (floors)</option>
          </select>
        </label>
        {num('insideSurfaceResistance', { label: 'R_si', unit: 'm²K/W', min: 0, max: 1 }, `Inside surface resistance; ISO 6946 gives ${ISO6946_RSI[exposure.heatFlowDirection]} m²K/W for ${exposure.heatFlowDirection} heat flow`)}
        {num('outsideSurfaceResistance', { label: 'R_se', unit: 'm²K/W', min: 0, max: 1 }, `Outside surface resistance; ISO 6946 gives ${ISO6946_RSE} m²K/W; 0 prescribes the surface at the outdoor temperature`)}
        {!readOnly && (exposure.insideSurfaceResistance !== ISO6946_RSI[exposure.heatFlowDirection] || exposure.outsideSurfaceResistance !== ISO6946_RSE) ? (
          <button
            type="button"
            className="self-end px-2 py-1 rounded border border-line bg-panel hover:bg-paper text-xs"
            onClick={() => {
              clearDraft('exposure:insideSurfaceResistance');
              clearDraft('exposure:outsideSurfaceResistance');
              setExposure({ insideSurfaceResistance: ISO6946_RSI[exposure.heatFlowDirection], outsideSurfaceResistance: ISO6946_RSE });
            }}
          >
            ISO 6946 values
          </button>
        ) : exposure.insideSurfaceResistance === ISO6946_RSI[exposure.heatFlowDirection] && exposure.outsideSurfaceResistance === ISO6946_RSE ? (
          <span className="self-end text-xs text-ink-faint pb-1.5">ISO 6946 values</span>
        ) : (
          <span className="self-end text-xs text-ink-faint pb-1.5">Own values</span>
        )}
        {sunOrSkyIgnored ? (
          <p role="alert" className="w-full rounded border border-warn/40 bg-warn-soft px-3 py-2 text-xs" data-testid="rse-zero-warning">
            R<sub>se</sub> is 0: the outer surface is held at the outdoor air temperature, so the sun and the long-wave loss to the sky no longer apply (the sol-air terms are multiplied by R<sub>se</sub>).
          </p>
        ) : null}
      </Group>

      <Group title="Run">
        {num('days', daysRule(out.mode === 'series' ? exposure.warmupDays : 0), `Days whose figures are reported; with the warm-up days at most ${MAX_RUN_DAYS} days (ten years) in all`)}
        {out.mode === 'series' ? (
          num('warmupDays', warmupRule(exposure.days), 'Uploaded series only: days run first (from the steady state of the first hour) and left out of the figures, so the wall forgets its starting state')
        ) : (
          <p className="self-end text-xs text-ink-soft pb-1.5 max-w-56" data-testid="periodic-start-note" title="The run starts in the periodic steady state that the repeating day drives, computed by the engine; no warm-up days are needed">
            Starts in the periodic state of the repeating day: no warm-up.
          </p>
        )}
        <label className="flex flex-col gap-0.5">
          <span className="text-xs text-ink-soft">Time step</span>
          <select className="rounded border border-line px-2 py-1 bg-panel tabular disabled:bg-paper disabled:text-ink-soft" disabled={readOnly} value={exposure.timeStep} onChange={(e) => setExposure({ timeStep: Number(e.target.value) })}>
            {[60, 120, 300, 600, 900, 1800, 3600].map((s) => (
              <option key={s} value={s}>
                {s >= 60 ? `${s / 60} min` : `${s} s`}
              </option>
            ))}
          </select>
        </label>
        {num('maxCellSize', { label: 'Largest cell', unit: 'mm', min: 0.5, max: 100, scale: 1000 }, 'The mesh puts at least 4 cells in each layer and no cell thicker than this')}
        <p className="w-full text-xs text-ink-faint">
          {totalDays} days in all; opening a revision shows the run kept with it, if any.{' '}
          {readOnly
            ? totalDays <= AUTO_RUN_DAYS
              ? 'Without one they run once in your browser; press Run to run them again.'
              : `Without one, press Run to run them in your browser (more than ${AUTO_RUN_DAYS} days never run by themselves).`
            : totalDays <= AUTO_RUN_DAYS
              ? 'Without one, and after each edit, they run by themselves.'
              : `Longer than ${AUTO_RUN_DAYS} days: press Run after an edit.`}
        </p>
      </Group>
    </section>
    </ReadOnly.Provider>
  );
}

/** the sun and sky of a sol-air day: absorptance, the face, the sun by place or by hand, the sky's long-wave loss */
function SolAirFields({
  out,
  outsideSurfaceResistance,
  setOutdoor,
  clearDraft,
}: {
  out: Extract<Outdoor, { mode: 'solair' }>;
  outsideSurfaceResistance: number;
  setOutdoor(o: Outdoor): void;
  clearDraft(k: string): void;
}) {
  const readOnly = useContext(ReadOnly);
  const sun = out.sun;
  const patch = (p: Partial<Extract<Outdoor, { mode: 'solair' }>>) => setOutdoor({ ...useWorkbench.getState().doc.exposure.outdoor, ...p } as Outdoor);
  const patchSun = (p: Record<string, unknown>) => {
    const cur = useWorkbench.getState().doc.exposure.outdoor;
    if (cur.mode === 'solair') setOutdoor({ ...cur, sun: { ...cur.sun, ...p } as SunSpec });
  };
  const patchFace = (p: Partial<{ azimuth: number; tilt: number }>) => {
    const cur = useWorkbench.getState().doc.exposure.outdoor;
    if (cur.mode === 'solair') setOutdoor({ ...cur, face: { ...cur.face, ...p } });
  };
  const clearSunDrafts = () => {
    for (const k of Object.keys(useWorkbench.getState().drafts)) if (k.startsWith('exposure:sun')) clearDraft(k);
  };
  const preset = sun.source === 'place' ? (PLACE_PRESETS.find((p) => p.name === sun.placeName && p.latitude === sun.latitude && p.longitude === sun.longitude && p.timeZone === sun.timeZone && p.elevation === sun.elevation)?.key ?? 'own') : 'own';
  const compass = compassOf(out.face.azimuth);
  const skyLoss = skyLossOf(out);
  return (
    <>
      <NumberField field="exposure:absorptance" rule={{ label: 'Solar absorptance', unit: '', min: 0, max: 1 }} value={out.absorptance} onValue={(v) => patch({ absorptance: v! })} hint="Fraction of the sun on the face that the outer surface absorbs (0–1)" />
      <div className="w-full flex flex-wrap gap-3 items-start" role="group" aria-label="The face">
        <Select
          label="Face looks"
          testId="face-compass"
          value={compass ?? 'own'}
          hint="Where the face's outward normal points"
          onChange={(v) => {
            const hit = COMPASS.find(([, n]) => n === v);
            if (hit) {
              clearDraft('exposure:sun:azimuth');
              patchFace({ azimuth: hit[0] });
            }
          }}
        >
          {COMPASS.map(([a, n]) => (
            <option key={a} value={n}>
              {n} ({a}°)
            </option>
          ))}
          {compass === null ? <option value="own">own azimuth</option> : null}
        </Select>
        <NumberField field="exposure:sun:azimuth" rule={{ label: 'Azimuth', unit: '°', min: 0, max: 360, inclusive: true, extra: (v) => (v >= 360 ? 'Azimuth must be less than 360°' : null) }} value={out.face.azimuth} onValue={(v) => patchFace({ azimuth: v! })} hint="Of the face's outward normal, clockwise from north: 0 north, 90 east, 180 south, 270 west" width="w-20" />
        <NumberField field="exposure:sun:tilt" rule={{ label: 'Tilt', unit: '°', min: 0, max: 180 }} value={out.face.tilt} onValue={(v) => patchFace({ tilt: v! })} hint="From horizontal: 0 a flat roof, 90 a wall" width="w-20" />
      </div>
      <div className="w-full flex flex-col gap-2" role="group" aria-label="Sun on the face">
        <Choice
          label="Sun on the face"
          options={[
            ['place', 'Clear day by place and date'],
            ['custom', 'Custom half sine'],
          ]}
          value={sun.source}
          onChoose={(src) => {
            if (src === sun.source) return;
            clearSunDrafts();
            patch({ sun: src === 'place' ? defaultPlaceSun() : CUSTOM_SUN });
          }}
        />
        {sun.source === 'place' ? (
          <div className="flex flex-wrap gap-3 items-start">
            <Select
              label="Place"
              testId="place-preset"
              value={preset}
              hint="Named places of the job, or your own coordinates"
              onChange={(key) => {
                const p = PLACE_PRESETS.find((x) => x.key === key);
                if (!p) return;
                clearSunDrafts();
                patchSun({ placeName: p.name, latitude: p.latitude, longitude: p.longitude, timeZone: p.timeZone, elevation: p.elevation, climate: p.climate });
              }}
            >
              {PLACE_PRESETS.map((p) => (
                <option key={p.key} value={p.key}>
                  {p.name}
                </option>
              ))}
              {preset === 'own' ? <option value="own">{sun.placeName ? `${sun.placeName} (own)` : 'Own place'}</option> : null}
            </Select>
            <NumberField field="exposure:sun:latitude" rule={{ label: 'Latitude', unit: '° N', min: -66, max: 66 }} value={sun.latitude} onValue={(v) => patchSun({ latitude: v!, placeName: '' })} hint="Degrees north (south negative), within the polar circles" width="w-20" />
            <NumberField field="exposure:sun:longitude" rule={{ label: 'Longitude', unit: '° E', min: -180, max: 180 }} value={sun.longitude} onValue={(v) => patchSun({ longitude: v!, placeName: '' })} hint="Degrees east (west negative)" width="w-20" />
            <NumberField field="exposure:sun:timeZone" rule={{ label: 'Clock, UTC +', unit: 'h', min: -12, max: 14 }} value={sun.timeZone} onValue={(v) => patchSun({ timeZone: v!, placeName: '' })} hint="The clock the hours of the day are read in, as an offset from UTC: +1 for British Summer Time, 0 for GMT" width="w-16" />
            <NumberField field="exposure:sun:elevation" rule={{ label: 'Elevation', unit: 'm', min: 0, max: 2500 }} value={sun.elevation} onValue={(v) => patchSun({ elevation: v!, placeName: '' })} hint="Height of the site above sea level, for the clear-sky transmittance (Hottel's model holds below 2500 m)" width="w-20" />
            <DateField value={sun.date} onValue={(d) => patchSun({ date: d })} />
            <NumberField field="exposure:sun:groundReflectance" rule={{ label: 'Ground reflectance', unit: '', min: 0, max: 1 }} value={sun.groundReflectance} onValue={(v) => patchSun({ groundReflectance: v! })} hint="Share of the sun the ground in front of the face reflects: about 0.2 for grass and paving (common practice)" width="w-20" />
            <Select label="Clear sky (Hottel 1976)" value={sun.climate} onChange={(v) => patchSun({ climate: v })} hint="Hottel's (1976) clear-sky beam transmittance with Liu & Jordan's (1960) diffuse (Duffie & Beckman §2.8); the climate sets its correction factors (their table 2.8.1)">
              {HOTTEL_CLIMATE_NAMES.map((c) => (
                <option key={c} value={c}>
                  {CLIMATE_LABEL[c]}
                </option>
              ))}
            </Select>
            <Select label="Sky model on the face" value={sun.transposition} onChange={(v) => patchSun({ transposition: v })} hint="How sky diffuse reaches a tilted face: isotropic (Liu & Jordan 1963) or with circumsolar diffuse (Hay & Davies 1980)">
              <option value="isotropic">Isotropic (Liu–Jordan 1963)</option>
              <option value="hay-davies">Hay–Davies (1980)</option>
            </Select>
          </div>
        ) : (
          <div className="flex flex-wrap gap-3 items-start">
            <NumberField field="exposure:sun:peakIrradiance" rule={{ label: 'Peak irradiance on the face', unit: 'W/m²', min: 0, max: 1400 }} value={sun.peakIrradiance} onValue={(v) => patchSun({ peakIrradiance: v! })} hint="Highest irradiance on the wall's face in the day" />
            <NumberField
              field="exposure:sun:sunrise"
              rule={{ label: 'Sun on the face from', unit: 'h', min: 0, max: 24, inclusive: true, extra: (v) => (v >= sun.sunset ? `Sun on the face from must be before the sun leaves the face (${sun.sunset} h)` : null) }}
              value={sun.sunrise}
              onValue={(v) => patchSun({ sunrise: v! })}
              hint="Hour the sun starts to reach the face"
            />
            <NumberField
              field="exposure:sun:sunset"
              rule={{ label: 'Sun leaves the face at', unit: 'h', min: 0, max: 24, extra: (v) => (v <= sun.sunrise ? `Sun leaves the face at must be after the sun reaches it (${sun.sunrise} h)` : null) }}
              value={sun.sunset}
              onValue={(v) => patchSun({ sunset: v! })}
              hint="Hour the sun stops reaching the face"
            />
          </div>
        )}
      </div>
      <div className="w-full flex flex-wrap gap-3 items-end" role="group" aria-label="Long-wave loss to the sky">
        <label className="flex items-center gap-1.5 pb-1.5" title="The outer surface's net long-wave loss to a sky colder than the air, by ISO 13790 §11.4.6">
          <input type="checkbox" data-testid="sky-loss-toggle" disabled={readOnly} checked={out.skyLoss !== null} onChange={(e) => patch({ skyLoss: e.target.checked ? { emissivity: 0.9 } : null })} />
          <span>Long-wave loss to the sky</span>
        </label>
        {out.skyLoss ? (
          <NumberField field="exposure:sun:emissivity" rule={{ label: 'Emissivity', unit: '', min: 0, max: 1 }} value={out.skyLoss.emissivity} onValue={(v) => patch({ skyLoss: { emissivity: v! } })} hint="Long-wave emissivity of the outer surface: about 0.9 for building materials (ISO 13790 §11.4.6)" width="w-20" />
        ) : null}
        {skyLoss !== null ? <span className="sr-only">{skyLoss.toFixed(1)} W/m²</span> : null}
      </div>
      <SunOnFace outdoor={out} outsideSurfaceResistance={outsideSurfaceResistance} />
      <p className="w-full text-xs text-ink-faint">
        Sol-air temperature = air + R<sub>se</sub> × (absorptance × irradiance − long-wave loss to the sky).
      </p>
    </>
  );
}

/** the day of the clear-sky sun; a bad date keeps its text and message, the document keeps the last good one */
function DateField({ value, onValue }: { value: string; onValue(v: string): void }) {
  const id = useId();
  const readOnly = useContext(ReadOnly);
  const [text, setText] = useState(value);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    setText(value);
    setError(null);
  }, [value]);
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs text-ink-soft" title="The day of the year the clear sky is computed for">
        Date
      </label>
      <input
        id={id}
        type="date"
        data-testid="sun-date"
        min="1900-01-01"
        max="2200-12-31"
        readOnly={readOnly}
        className={`rounded border px-2 py-1 tabular ${readOnly ? 'bg-paper text-ink-soft' : 'bg-panel'} ${error ? 'border-danger' : 'border-line'}`}
        value={text}
        aria-invalid={error ? true : undefined}
        onChange={(e) => {
          const v = e.target.value;
          setText(v);
          if (/^\d{4}-\d{2}-\d{2}$/.test(v) && !Number.isNaN(Date.parse(v))) {
            setError(null);
            if (v !== value) onValue(v);
          } else setError('Date must be a day written YYYY-MM-DD');
        }}
      />
      {error ? (
        <span className="text-xs text-danger" role="alert">
          {error}
        </span>
      ) : null}
    </div>
  );
}
