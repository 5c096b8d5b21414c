// sensitivity of one alternative (or each in turn): every layer's thickness, conductivity,
// density and specific heat changed by ±δ, run in the worker pool with progress and cancel;
// a tornado chart per figure, the same as a table, and a CSV of all of it
import { useEffect, useRef, useState } from 'react';
import type { UploadedSeries, WorkbenchDocument } from '../../lib/schemas/workbench';
import type { CompareRunner } from '../../lib/workbench/compareRunner';
import { effectName, effectsCsv, fractionIssue, METRIC_KEYS, METRICS, perturbationPlan, PROPERTY_LABELS, sensitivityEffects, type Effect, type MetricKey } from '../../lib/workbench/sensitivity';
import Tornado from './Tornado';
import ProgressBar, { ProgressSignal } from './Progress';
import { signed } from './rows';
import { alternativeColour } from './palette';

export interface SensitivityAlternative {
  label: string;
  doc: WorkbenchDocument;
  upload: UploadedSeries | null;
}

export interface SensitivityResult {
  /** the document and fraction it ran */
  doc: WorkbenchDocument;
  fraction: number;
  effects: Record<MetricKey, Effect[]>;
  ms: number;
}

interface Props {
  alternatives: SensitivityAlternative[];
  runner: CompareRunner;
  results: (SensitivityResult | null)[];
  onResult: (index: number, result: SensitivityResult) => void;
}

function download(name: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'text/csv' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export default function SensitivityPanel({ alternatives, runner, results, onResult }: Props) {
  const [which, setWhich] = useState(0);
  const [percent, setPercent] = useState('10');
  const [metric, setMetric] = useState<MetricKey>('decrementFactor');
  const [all, setAll] = useState(false);
  const [running, setRunning] = useState<{ label: string; of: string } | null>(null);
  const progress = useRef(new ProgressSignal()).current;
  const [error, setError] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const cancelRef = useRef<(() => void) | null>(null);
  const stopAll = useRef(false);

  useEffect(() => {
    if (which >= alternatives.length) setWhich(0);
  }, [alternatives.length, which]);

  const fraction = Number(percent.replace(',', '.')) / 100;
  const fieldIssue = fractionIssue(fraction);
  const current = results[which] ?? null;
  const alt = alternatives[which];
  const upToDate = current && alt && current.doc === alt.doc && current.fraction === fraction;

  const runOne = async (i: number, position: string): Promise<boolean> => {
    const a = alternatives[i];
    const runs = perturbationPlan(a.doc.layers.length).length;
    setRunning({ label: a.label, of: `${runs} runs${position}` });
    progress.reset();
    const t0 = performance.now();
    const job = runner.sensitivity(a.doc, a.upload, fraction, (f) => progress.set(f));
    cancelRef.current = job.cancel;
    try {
      const metrics = await job.result;
      if (!metrics) return false;
      onResult(i, { doc: a.doc, fraction, effects: sensitivityEffects(a.doc, fraction, metrics), ms: performance.now() - t0 });
      return true;
    } catch (e) {
      setError(`The sensitivity of ${a.label} could not run: ${e instanceof Error ? e.message : String(e)}`);
      return false;
    }
  };

  const start = async (every: boolean) => {
    if (fieldIssue) return;
    setError(null);
    setNote(null);
    stopAll.current = false;
    const list = every ? alternatives.map((_, i) => i) : [which];
    for (let k = 0; k < list.length; k++) {
      const ok = await runOne(list[k], list.length > 1 ? `, alternative ${k + 1} of ${list.length}` : '');
      if (!ok || stopAll.current) break;
    }
    cancelRef.current = null;
    setRunning(null);
  };

  const cancel = () => {
    stopAll.current = true;
    cancelRef.current?.();
    cancelRef.current = null;
    setRunning(null);
    setNote('Sensitivity cancelled; the results shown before it are kept.');
  };

  const effects = current?.effects[metric] ?? [];
  const m = METRICS[metric];
  const limit = all ? effects.length : Math.min(12, effects.length);
  const pctShown = current ? `${+(current.fraction * 100).toFixed(3)} %` : '';

  return (
    <section aria-labelledby="sensitivity-title" className={`flex flex-col gap-3 rounded border border-line bg-panel p-3 break-before-page ${current ? '' : 'print:hidden'}`} data-testid="sensitivity">
      <div>
        <h2 id="sensitivity-title" className="text-lg font-semibold">
          What matters most: sensitivity
        </h2>
        <p className="text-sm text-ink-soft">
          Each layer’s thickness, conductivity, density and specific heat is lowered and raised by the same share, one at a time, under the compared exposure. The tornado orders them by how far they move the figure.
        </p>
      </div>
      <form
        className="flex flex-wrap items-end gap-3 text-sm no-print"
        onSubmit={(e) => {
          e.preventDefault();
          void start(false);
        }}
        noValidate
      >
        <label className="flex flex-col">
          <span className="font-semibold">Assembly</span>
          <select className="mt-1 rounded border border-line bg-panel px-2 py-1.5" value={which} onChange={(e) => setWhich(Number(e.target.value))} data-testid="sensitivity-which" disabled={!!running}>
            {alternatives.map((a, i) => (
              <option key={i} value={i}>
                {a.label} ({a.doc.layers.length} layers, {perturbationPlan(a.doc.layers.length).length} runs)
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col" htmlFor="sens-pct">
          <span className="font-semibold">Change (%)</span>
          <input
            id="sens-pct"
            inputMode="decimal"
            className={`mt-1 w-24 rounded border bg-panel px-2 py-1.5 tabular ${fieldIssue ? 'border-danger' : 'border-line'}`}
            value={percent}
            onChange={(e) => setPercent(e.target.value)}
            aria-invalid={!!fieldIssue}
            aria-describedby={fieldIssue ? 'sens-pct-error' : undefined}
            data-testid="sensitivity-percent"
            disabled={!!running}
          />
        </label>
        <button type="submit" className="rounded bg-accent px-3 py-1.5 text-white hover:bg-accent-strong disabled:opacity-50" disabled={!!running || !!fieldIssue || !alt} data-testid="sensitivity-run">
          Run sensitivity
        </button>
        {alternatives.length > 1 ? (
          <button type="button" className="rounded border border-line-strong bg-panel px-3 py-1.5 hover:bg-paper disabled:opacity-50" disabled={!!running || !!fieldIssue} onClick={() => void start(true)} data-testid="sensitivity-run-all">
            Run for all {alternatives.length}
          </button>
        ) : null}
        {fieldIssue ? (
          <span id="sens-pct-error" role="alert" className="basis-full text-xs text-danger">
            {fieldIssue}
          </span>
        ) : null}
      </form>
      {running ? (
        <div className="flex flex-wrap items-center gap-2 text-sm no-print" data-testid="sensitivity-progress">
          <span className="text-ink-soft">
            {running.label}: {running.of}
          </span>
          <ProgressBar signal={progress} label="Sensitivity progress" />
          <button type="button" className="rounded border border-line bg-panel px-2 py-1 hover:bg-paper" onClick={cancel} data-testid="sensitivity-cancel">
            Cancel
          </button>
        </div>
      ) : null}
      {note ? (
        <p className="text-sm text-ink-soft" role="status" data-testid="sensitivity-note">
          {note}
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="rounded border border-danger/40 bg-danger-soft px-3 py-2 text-sm">
          {error}
        </p>
      ) : null}
      {!current && !running ? <p className="text-sm text-ink-soft">No sensitivity yet for {alt?.label ?? 'this assembly'}: press Run sensitivity.</p> : null}
      {current ? (
        <div className="flex flex-col gap-3" data-testid="sensitivity-result">
          <div className="flex flex-wrap items-center gap-3 text-sm">
            <span className="inline-flex items-center gap-1.5 font-semibold">
              <span aria-hidden="true" className="inline-block h-2.5 w-5 rounded-sm" style={{ background: alternativeColour(which) }} />
              {alt?.label}
            </span>
            <span className="text-ink-soft tabular" data-testid="sensitivity-time">
              ±{pctShown}, {perturbationPlan(current.doc.layers.length).length} runs in {(current.ms / 1000).toFixed(2)} s
            </span>
            {!upToDate ? <span className="text-warn">The assembly, exposure or change differs from this result: run it again.</span> : null}
          </div>
          <div role="tablist" aria-label="Figure" className="flex flex-wrap gap-1 no-print">
            {METRIC_KEYS.map((k) => (
              <button
                key={k}
                type="button"
                role="tab"
                aria-selected={metric === k}
                className={`rounded border px-2.5 py-1 text-sm ${metric === k ? 'border-accent bg-accent text-white' : 'border-line bg-panel hover:bg-paper'}`}
                onClick={() => setMetric(k)}
                data-testid={`sensitivity-metric-${k}`}
              >
                {METRICS[k].label}
              </button>
            ))}
          </div>
          <p className="text-sm">
            <span className="font-semibold">{METRICS[metric].label}</span> <span className="text-ink-soft">({m.how})</span>
            {effects[0] && Number.isFinite(effects[0].reach) ? (
              <>
                {' '}
                Moved most by <strong data-testid="sensitivity-top">{effectName(effects[0])}</strong>.
              </>
            ) : null}
          </p>
          <Tornado metric={metric} effects={effects} fraction={current.fraction} limit={limit} />
          {effects.length > 12 ? (
            <button type="button" className="self-start text-sm text-accent-strong hover:underline no-print" onClick={() => setAll((v) => !v)}>
              {all ? 'Show the 12 strongest' : `Show all ${effects.length} bars`}
            </button>
          ) : null}
          <div className="overflow-x-auto">
            <table className="w-full text-sm tabular" data-testid="sensitivity-table">
              <caption className="sr-only">How each layer property moves the {m.phrase}</caption>
              <thead>
                <tr className="border-b border-line text-xs text-ink-soft">
                  <th className="py-1 pr-3 text-right font-normal">Rank</th>
                  <th className="py-1 pr-3 text-left font-normal">Layer</th>
                  <th className="py-1 pr-3 text-left font-normal">Property</th>
                  <th className="py-1 pr-3 text-right font-normal">At −{pctShown}</th>
                  <th className="py-1 pr-3 text-right font-normal">Base</th>
                  <th className="py-1 pr-3 text-right font-normal">At +{pctShown}</th>
                  <th className="py-1 pr-3 text-right font-normal">Change at −</th>
                  <th className="py-1 pr-3 text-right font-normal">Change at +</th>
                  <th className="py-1 text-right font-normal" title="Central difference (value at + less value at −) / (2 × change), per +1 % of the property">
                    Per +1 %
                  </th>
                </tr>
              </thead>
              <tbody>
                {effects.slice(0, limit).map((e, r) => (
                  <tr key={`${e.layer}-${e.property}`} className="border-b border-line/60" data-testid="sensitivity-row">
                    <td className="py-1 pr-3 text-right">{r + 1}</td>
                    <td className="py-1 pr-3">
                      {e.layer + 1}: {e.layerName}
                    </td>
                    <td className="py-1 pr-3">{PROPERTY_LABELS[e.property]}</td>
                    <td className="py-1 pr-3 text-right">{num(e.low * m.scale, m.digits)}</td>
                    <td className="py-1 pr-3 text-right">{num(e.base * m.scale, m.digits)}</td>
                    <td className="py-1 pr-3 text-right">{num(e.high * m.scale, m.digits)}</td>
                    <td className="py-1 pr-3 text-right">{signed(e.deltaLow * m.scale, m.digits)}</td>
                    <td className="py-1 pr-3 text-right">{signed(e.deltaHigh * m.scale, m.digits)}</td>
                    <td className="py-1 text-right">{signed((e.slope * m.scale) / 100, m.digits + 1)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-1 text-xs text-ink-soft">{m.unit === '–' ? 'The figure has no unit.' : `Values in ${m.unit}.`} Each property is changed alone; the others keep their values. A thickness change can also change the number of cells of that layer.</p>
          </div>
          <button
            type="button"
            className="self-start rounded border border-line bg-panel px-2.5 py-1 text-sm hover:bg-paper no-print"
            onClick={() => download(`${(alt?.label ?? 'assembly').replace(/[^\w.-]+/g, '-')}-sensitivity.csv`, effectsCsv(current.effects, current.fraction))}
            data-testid="sensitivity-csv"
          >
            Sensitivity as CSV (all five figures)
          </button>
        </div>
      ) : null}
    </section>
  );
}

function num(v: number, digits: number): string {
  if (!Number.isFinite(v)) return '–';
  const s = v.toFixed(digits);
  return s.startsWith('-') ? `\u2212${s.slice(1)}` : s;
}
