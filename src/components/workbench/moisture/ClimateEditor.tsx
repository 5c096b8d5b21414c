// the monthly climate of the moisture check: twelve months of outdoor temperature and humidity,
// the indoor air (fixed humidity or an ISO 13788 humidity class), demo climates and CSV paste or file.
import { useId, useState } from 'react';
import { useWorkbench } from '../../../lib/workbench/store';
import type { ClimateData } from '../../../lib/schemas/workbench';
import { DEMO_CLIMATES, HUMIDITY_CLASS_LABELS, MONTH_NAMES, MONTH_SHORT, demoClimate, type HumidityClass } from '../../../lib/moisture/index.ts';
import { parseNumber, type NumberRule } from '../numberRule';
import { climateToCsv, parseClimateCsv } from './climateCsv';

const show = (v: number) => String(Number(v.toPrecision(10)));

const TEMPERATURE: NumberRule = { label: 'Outdoor temperature', unit: '°C', min: -60, max: 60 };
const HUMIDITY: NumberRule = { label: 'Outdoor relative humidity', unit: '%', min: 0, max: 100, extra: (v) => (v <= 0 ? 'Outdoor relative humidity must be greater than 0 %' : null) };
const INDOOR_T: NumberRule = { label: 'Indoor temperature', unit: '°C', min: 0, max: 40 };
const INDOOR_RH: NumberRule = { label: 'Indoor relative humidity', unit: '%', min: 0, max: 100, extra: (v) => (v <= 0 ? 'Indoor relative humidity must be greater than 0 %' : null) };

/** a number input that keeps what is typed (a draft with its message) and commits only valid values */
function Cell({ field, rule, value, onValue, readOnly, label, width = 'w-20' }: { field: string; rule: NumberRule; value: number; onValue(v: number): void; readOnly: boolean; label: string; width?: string }) {
  const id = useId();
  const draft = useWorkbench((s) => s.drafts[field]);
  const setDraft = useWorkbench((s) => s.setDraft);
  const clearDraft = useWorkbench((s) => s.clearDraft);
  const error = draft?.error ?? null;
  return (
    <span className="inline-flex flex-col">
      <input
        id={id}
        aria-label={label}
        inputMode="decimal"
        className={`${width} rounded border px-1.5 py-0.5 text-right tabular ${readOnly ? 'bg-paper text-ink-soft' : 'bg-panel'} ${error ? 'border-danger' : 'border-line'}`}
        value={draft ? draft.raw : show(value)}
        readOnly={readOnly}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        onChange={(e) => {
          if (readOnly) return;
          const parsed = parseNumber(rule, e.target.value);
          if (!parsed.ok) setDraft(field, e.target.value, parsed.error);
          else {
            setDraft(field, e.target.value, null);
            if (parsed.value !== null && parsed.value !== value) onValue(parsed.value);
          }
        }}
        onBlur={() => {
          if (draft && draft.error === null) clearDraft(field);
        }}
      />
      {error ? (
        <span id={`${id}-err`} role="alert" className="max-w-40 text-xs text-danger">
          {error}
        </span>
      ) : null}
    </span>
  );
}

export default function ClimateEditor({ climate, readOnly }: { climate: ClimateData; readOnly: boolean }) {
  const setExposure = useWorkbench((s) => s.setExposure);
  const [pasting, setPasting] = useState(false);
  const [text, setText] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const [note, setNote] = useState('');
  const clearDraft = useWorkbench((s) => s.clearDraft);
  const set = (next: ClimateData) => setExposure({ climate: next });
  /** new months from a paste, a file or a demo: what was typed into the month cells gives way */
  const replaceMonths = (next: ClimateData) => {
    for (let i = 0; i < 12; i++) {
      clearDraft(`climate:t:${i}`);
      clearDraft(`climate:rh:${i}`);
    }
    set(next);
  };
  const setMonth = (i: number, patch: Partial<ClimateData['months'][number]>) => set({ ...climate, months: climate.months.map((m, k) => (k === i ? { ...m, ...patch } : m)) });
  const indoor = climate.indoor;
  const byClass = 'humidityClass' in indoor;

  const applyCsv = (source: string, from: string) => {
    const r = parseClimateCsv(source);
    if (!r.ok) {
      setProblems(r.problems);
      setNote('');
      return;
    }
    setProblems([]);
    replaceMonths({ ...climate, months: r.months });
    setNote(`Twelve months read from ${from}.`);
    setPasting(false);
    setText('');
  };

  return (
    <div className="space-y-3" data-testid="climate-editor">
      {!readOnly ? (
        <div className="flex flex-wrap items-end gap-2 text-sm">
          <label className="flex flex-col text-xs text-ink-soft">
            Replace with a demo climate
            <select
              className="mt-0.5 rounded border border-line bg-panel px-2 py-1 text-sm text-ink"
              value=""
              onChange={(e) => {
                if (!e.target.value) return;
                replaceMonths(demoClimate(e.target.value));
                setNote(`${DEMO_CLIMATES.find((d) => d.key === e.target.value)?.name ?? 'Demo climate'} set.`);
              }}
            >
              <option value="">Choose…</option>
              {DEMO_CLIMATES.map((d) => (
                <option key={d.key} value={d.key}>
                  {d.name}
                </option>
              ))}
            </select>
          </label>
          <button type="button" className="rounded border border-line bg-panel px-3 py-1 hover:border-accent" onClick={() => setPasting((p) => !p)} aria-expanded={pasting}>
            Paste or read a CSV…
          </button>
          <button
            type="button"
            className="rounded border border-line bg-panel px-3 py-1 hover:border-accent"
            onClick={() => {
              void navigator.clipboard?.writeText(climateToCsv(climate.months)).then(
                () => setNote('The twelve months are on the clipboard as CSV.'),
                () => setNote('The clipboard is not available in this browser.'),
              );
            }}
          >
            Copy as CSV
          </button>
          <button type="button" className="ml-auto rounded border border-line bg-panel px-3 py-1 text-danger hover:border-danger" onClick={() => setExposure({ climate: undefined })} data-testid="climate-remove">
            Remove the climate
          </button>
        </div>
      ) : null}
      {note ? (
        <p role="status" className="text-xs text-ok">
          {note}
        </p>
      ) : null}
      {pasting && !readOnly ? (
        <div className="space-y-2 rounded border border-line bg-panel p-2">
          <label className="block text-xs text-ink-soft" htmlFor="climate-csv">
            Twelve rows, January to December: <code>temperature, relative humidity</code> (°C, %) or <code>month, temperature, relative humidity</code>; a header row is allowed; comma,
            semicolon or tab between values.
          </label>
          <textarea id="climate-csv" className="h-32 w-full rounded border border-line px-2 py-1 font-mono text-xs" value={text} onChange={(e) => setText(e.target.value)} data-testid="climate-csv" />
          <div className="flex flex-wrap items-center gap-2">
            <button type="button" className="rounded bg-accent px-3 py-1 text-sm font-semibold text-white" onClick={() => applyCsv(text, 'the pasted text')} data-testid="climate-csv-apply">
              Read the pasted months
            </button>
            <label className="rounded border border-line px-3 py-1 text-sm hover:border-accent">
              Read a file…
              <input
                type="file"
                accept=".csv,.txt,text/csv,text/plain"
                className="sr-only"
                onChange={async (e) => {
                  const f = e.target.files?.[0];
                  if (f) applyCsv(await f.text(), f.name);
                  e.target.value = '';
                }}
              />
            </label>
          </div>
        </div>
      ) : null}
      {problems.length > 0 ? (
        <ul role="alert" className="rounded border border-danger/40 bg-danger-soft px-3 py-2 text-xs text-danger" data-testid="climate-csv-problems">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
          <li className="text-ink-soft">Nothing was changed: the climate keeps its months.</li>
        </ul>
      ) : null}

      <div className="flex flex-wrap items-start gap-4 text-sm">
        <div className="flex flex-col gap-0.5">
          <span className="text-xs text-ink-soft">Indoor temperature (°C)</span>
          <Cell field="climate:indoor:t" rule={INDOOR_T} value={indoor.temperature} label="Indoor temperature (°C)" readOnly={readOnly} onValue={(v) => set({ ...climate, indoor: { ...indoor, temperature: v } })} />
        </div>
        <div className="flex flex-col gap-0.5">
          <span className="text-xs text-ink-soft" title="ISO 13788 lets the indoor humidity be a fixed relative humidity, or an internal humidity class whose moisture supply is added to the outdoor vapour pressure (times 1.10) as it gets colder outside.">
            Indoor humidity
          </span>
          <div role="radiogroup" aria-label="Indoor humidity" className="flex gap-1">
            {(
              [
                ['rh', 'Fixed relative humidity'],
                ['class', 'Humidity class'],
              ] as const
            ).map(([k, t]) => (
              <button
                key={k}
                type="button"
                role="radio"
                aria-checked={(k === 'class') === byClass}
                disabled={readOnly}
                className={`rounded border px-2.5 py-1 ${(k === 'class') === byClass ? 'border-accent bg-accent text-white' : 'border-line bg-panel enabled:hover:bg-paper'}`}
                onClick={() => set({ ...climate, indoor: k === 'class' ? { temperature: indoor.temperature, humidityClass: 3 } : { temperature: indoor.temperature, relativeHumidity: 50 } })}
              >
                {t}
              </button>
            ))}
          </div>
        </div>
        {byClass ? (
          <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
            Humidity class (ISO 13788)
            <select
              className="rounded border border-line bg-panel px-2 py-1 text-sm text-ink"
              value={indoor.humidityClass}
              disabled={readOnly}
              onChange={(e) => set({ ...climate, indoor: { temperature: indoor.temperature, humidityClass: Number(e.target.value) as HumidityClass } })}
              data-testid="humidity-class"
            >
              {([1, 2, 3, 4, 5] as const).map((c) => (
                <option key={c} value={c}>
                  {HUMIDITY_CLASS_LABELS[c]}
                </option>
              ))}
            </select>
          </label>
        ) : (
          <div className="flex flex-col gap-0.5">
            <span className="text-xs text-ink-soft">Indoor relative humidity (%)</span>
            <Cell
              field="climate:indoor:rh"
              rule={INDOOR_RH}
              value={indoor.relativeHumidity}
              label="Indoor relative humidity (%)"
              readOnly={readOnly}
              onValue={(v) => set({ ...climate, indoor: { temperature: indoor.temperature, relativeHumidity: v } })}
            />
          </div>
        )}
      </div>

      <div className="overflow-x-auto">
        <table className="text-sm tabular" aria-label="Outdoor climate by month">
          <thead>
            <tr className="text-xs text-ink-soft">
              <th scope="row" className="pr-2 text-left font-normal">
                Month
              </th>
              {MONTH_SHORT.map((m, i) => (
                <th key={m} scope="col" className="px-0.5 font-normal" title={MONTH_NAMES[i]}>
                  {m}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <tr>
              <th scope="row" className="whitespace-nowrap pr-2 text-left text-xs font-normal text-ink-soft">
                Temperature (°C)
              </th>
              {climate.months.map((m, i) => (
                <td key={i} className="px-0.5 align-top">
                  <Cell field={`climate:t:${i}`} rule={TEMPERATURE} value={m.temperature} label={`${MONTH_NAMES[i]} outdoor temperature (°C)`} width="w-14" readOnly={readOnly} onValue={(v) => setMonth(i, { temperature: v })} />
                </td>
              ))}
            </tr>
            <tr>
              <th scope="row" className="whitespace-nowrap pr-2 text-left text-xs font-normal text-ink-soft">
                Relative humidity (%)
              </th>
              {climate.months.map((m, i) => (
                <td key={i} className="px-0.5 align-top">
                  <Cell field={`climate:rh:${i}`} rule={HUMIDITY} value={m.relativeHumidity} label={`${MONTH_NAMES[i]} outdoor relative humidity (%)`} width="w-14" readOnly={readOnly} onValue={(v) => setMonth(i, { relativeHumidity: v })} />
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
    </div>
  );
}
