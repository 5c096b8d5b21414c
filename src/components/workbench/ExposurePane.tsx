// the Exposure pane: outdoor and indoor conditions, surface films, run settings.
// every field keeps what was typed (a draft with its message) while the document keeps
// the last valid value, so a half-typed number never reaches the run.
import { createContext, useContext, useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { useWorkbench } from '../../lib/workbench/store';
import { HEAT_FLOW_DIRECTIONS, ISO6946_RSE, ISO6946_RSI, type Exposure, type Outdoor } from '../../lib/schemas/workbench';
import type { UploadSummary } from '../../lib/schemas/upload';
import CsvImport from './CsvImport';
import { MAX_RUN_DAYS, daysRule, parseNumber, warmupRule, type NumberRule } from './numberRule';

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

/** defaults for the sun when switching to a sol-air day: a west face in summer (our own choice) */
const SUN_DEFAULTS = { absorptance: 0.6, peakIrradiance: 550, sunrise: 11, sunset: 20 };

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
  const lastSine = useRef({ mean: 'mean' in out ? out.mean : 22, swing: 'swing' in out ? out.swing : 12, peakHour: 'peakHour' in out ? out.peakHour : 15 });
  if (out.mode !== 'series') lastSine.current = { mean: out.mean, swing: out.swing, peakHour: out.peakHour };

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
    for (const k of ['mean', 'swing', 'peakHour', 'absorptance', 'peakIrradiance', 'sunrise', 'sunset']) clearDraft(`exposure:${k}`);
    const sine = lastSine.current;
    if (m === 'sine') setOutdoor({ mode: 'sine', ...sine });
    else if (m === 'solair') setOutdoor({ mode: 'solair', ...sine, ...SUN_DEFAULTS, ...(out.mode === 'solair' ? out : {}) });
    // an uploaded series waits until an upload is picked
  };

  const patchOutdoor = (patch: Record<string, number>) => setOutdoor({ ...out, ...patch } as Outdoor);
  const num = (key: keyof Exposure, rule: NumberRule, hint?: string, width?: string) => (
    <NumberField field={`exposure:${key}`} rule={rule} value={exposure[key] as number | null} onValue={(v) => setExposure({ [key]: v } as Partial<Exposure>)} hint={hint} width={width} />
  );

  const sunrise = out.mode === 'solair' ? out.sunrise : 0;
  const sunset = out.mode === 'solair' ? out.sunset : 24;
  const totalDays = exposure.days + exposure.warmupDays;

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
            <NumberField field="exposure:swing" rule={{ label: 'Daily swing', unit: 'K', min: 0, max: 60 }} value={out.swing} onValue={(v) => patchOutdoor({ swing: v! })} hint="Maximum minus minimum of the day; the sine's amplitude is half of it" />
            <NumberField field="exposure:peakHour" rule={hourRule('Hour of peak')} value={out.peakHour} onValue={(v) => patchOutdoor({ peakHour: v! })} hint="Hour of the day when the outdoor air is warmest" />
          </>
        ) : null}
        {out.mode === 'solair' && mode === 'solair' ? (
          <>
            <NumberField field="exposure:absorptance" rule={{ label: 'Solar absorptance', unit: '', min: 0, max: 1 }} value={out.absorptance} onValue={(v) => patchOutdoor({ absorptance: v! })} hint="Fraction of the sun on the face that the outer surface absorbs (0–1)" />
            <NumberField field="exposure:peakIrradiance" rule={{ label: 'Peak irradiance on the face', unit: 'W/m²', min: 0, max: 1400 }} value={out.peakIrradiance} onValue={(v) => patchOutdoor({ peakIrradiance: v! })} hint="Highest irradiance on the wall's face in the day" />
            <NumberField
              field="exposure:sunrise"
              rule={{ label: 'Sun on the face from', unit: 'h', min: 0, max: 24, inclusive: true, extra: (v) => (v >= sunset ? `Sun on the face from must be before the sun leaves the face (${sunset} h)` : null) }}
              value={out.sunrise}
              onValue={(v) => patchOutdoor({ sunrise: v! })}
              hint="Hour the sun starts to reach the face"
            />
            <NumberField
              field="exposure:sunset"
              rule={{ label: 'Sun leaves the face at', unit: 'h', min: 0, max: 24, extra: (v) => (v <= sunrise ? `Sun leaves the face at must be after the sun reaches it (${sunrise} h)` : null) }}
              value={out.sunset}
              onValue={(v) => patchOutdoor({ sunset: v! })}
              hint="Hour the sun stops reaching the face"
            />
            <p className="w-full text-xs text-ink-faint">
              Clear-day irradiance: a half sine between the two hours, zero outside them (common practice). Sol-air temperature = air + absorptance × irradiance × R<sub>se</sub>.
            </p>
          </>
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
      </Group>

      <Group title="Run">
        {num('days', daysRule(exposure.warmupDays), `Days whose figures are reported; with the warm-up days at most ${MAX_RUN_DAYS} days (ten years) in all`)}
        {num('warmupDays', warmupRule(exposure.days), 'Days run first and left out of the figures, so the wall forgets its starting state')}
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
          {totalDays} days in all; {readOnly ? (totalDays <= 7 ? 'run once on opening; press Run to run them again.' : 'press Run to run them in your browser.') : totalDays <= 7 ? 'runs by itself after each edit.' : 'longer than 7 days: press Run after an edit.'}
        </p>
      </Group>
    </section>
    </ReadOnly.Provider>
  );
}
