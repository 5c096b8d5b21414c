// the compared alternatives' figures side by side: the best of each row marked (what "best"
// means is in the row's tooltip), each value's difference to the chosen baseline under it
import Hint from '../workbench/Hint';
import { fixed } from '../workbench/format';
import type { CompareFigures } from '../../lib/workbench/compare';
import { dayClock } from '../../lib/workbench/figures';
import { effectName, METRICS, type Effect, type MetricKey } from '../../lib/workbench/sensitivity';
import { COMPARE_ROWS, bestOf, moistureRisk, signed } from './rows';
import { alternativeColour } from './palette';

export interface CompareTableProps {
  labels: string[];
  figures: CompareFigures[];
  baseline: number;
  onBaseline: (i: number) => void;
  /** the strongest effect per alternative and metric, once a sensitivity ran for it */
  strongest: ({ [K in MetricKey]?: Effect | null } | null)[];
  /** % the sensitivity changed each property by */
  fraction: number;
}

const MOST_ROWS: MetricKey[] = ['decrementFactor', 'heatLost', 'uValue'];

export default function CompareTable({ labels, figures, baseline, onBaseline, strongest, fraction }: CompareTableProps) {
  const days = figures[0]?.reportedDays ?? 0;
  const daysShown = Math.round(days * 1000) / 1000;
  return (
    <div className="overflow-x-auto rounded border border-line bg-panel">
      <table className="w-full text-sm tabular" data-testid="compare-table">
        <caption className="sr-only">Figures of the compared alternatives side by side</caption>
        <thead>
          <tr className="border-b border-line align-bottom">
            <th scope="col" className="px-3 py-2 text-left text-xs font-normal text-ink-soft">
              Figure <span className="block">★ best of the row · Δ to the baseline</span>
            </th>
            {labels.map((l, i) => (
              <th key={l} scope="col" className="px-3 py-2 text-right font-semibold" data-alt={i}>
                <span className="inline-flex items-center gap-1.5">
                  <span aria-hidden="true" className="inline-block h-2.5 w-5 rounded-sm" style={{ background: alternativeColour(i) }} />
                  {l}
                </span>
                <label className="mt-1 flex items-center justify-end gap-1 text-xs font-normal text-ink-soft no-print">
                  <input type="radio" name="baseline" checked={baseline === i} onChange={() => onBaseline(i)} className="accent-accent" data-testid={`baseline-${i}`} />
                  baseline
                </label>
                {baseline === i ? <span className="hidden text-xs font-normal text-ink-soft print:block">baseline</span> : null}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {COMPARE_ROWS.map((row) => {
            const best = bestOf(row, figures);
            const base = row.value(figures[baseline]);
            return (
              <tr key={row.key} className="border-b border-line/60" data-row={row.key}>
                <th scope="row" className="px-3 py-1.5 text-left font-normal">
                  <Hint text={`${row.how(daysShown)} ${row.bestMeans}`}>{row.label}</Hint> <span className="text-xs text-ink-faint">{row.unit}</span>
                </th>
                {figures.map((f, i) => {
                  const v = row.value(f);
                  const isBest = best.has(i);
                  const delta = v - base;
                  return (
                    <td key={i} className={`px-3 py-1.5 text-right align-top ${isBest ? 'bg-accent-soft' : ''}`} data-alt={i} data-best={isBest ? 'true' : 'false'} data-value={fixed(v, row.digits)}>
                      <span className={isBest ? 'font-bold text-accent-strong' : 'font-semibold'}>
                        {isBest ? (
                          <span title={row.bestMeans} aria-label="best" className="mr-1">
                            ★
                          </span>
                        ) : null}
                        {fixed(v, row.digits)}
                      </span>
                      {row.note ? <span className="block text-xs text-ink-soft">{row.note(f)}</span> : null}
                      {i !== baseline ? (
                        <span className="block text-xs text-ink-soft" data-delta={signed(delta, row.digits)} title={`Difference to the baseline (${labels[baseline]}), ${row.unit}`}>
                          Δ {signed(delta, row.digits)}
                          {Number.isFinite(base) && Math.abs(base) > 1e-12 && Number.isFinite(delta) ? ` (${signed((100 * delta) / Math.abs(base), 0)} %)` : ''}
                        </span>
                      ) : null}
                    </td>
                  );
                })}
              </tr>
            );
          })}
          <tr className="border-b border-line/60" data-row="moisture">
            <th scope="row" className="px-3 py-1.5 text-left font-normal">
              <Hint text="ISO 13788 under the exposure's monthly climate: the interstitial check (monthly Glaser method: does vapour condense in the build-up, and does it dry out within the year) and the surface check (f_Rsi against the mould and condensation limits). Marked red where water accumulates over the year (the check fails) or the surface check finds a mould or condensation risk; condensation that dries out within the year passes the method and is shaded only. A steady monthly method: it models no moisture storage, rain or air leakage; assess against local codes.">
                Moisture (ISO 13788)
              </Hint>
            </th>
            {figures.map((f, i) => {
              const m = f.moisture;
              const risk = moistureRisk(m);
              return (
                <td key={i} className={`px-3 py-1.5 text-right text-xs ${risk ? 'bg-danger-soft text-danger' : m?.verdict === 'driesOut' ? 'bg-warn-soft' : ''}`} data-alt={i} data-risk={risk ? 'true' : 'false'} title={m ? `${m.text} ${m.surfaceText}` : undefined}>
                  {m ? (
                    <>
                      <span className="font-semibold">{m.label}</span>
                      <span className="block text-ink-soft">
                        surface {m.mouldRisk ? 'mould risk' : m.condensationRisk ? 'condensation risk' : 'passes'} (f_Rsi {fixed(m.fRsi, 2)})
                      </span>
                    </>
                  ) : (
                    <span className="text-ink-faint">no monthly climate or a layer without μ: not assessed</span>
                  )}
                </td>
              );
            })}
          </tr>
          {MOST_ROWS.map((m) => (
            <tr key={m} className="border-b border-line/60" data-row={`most-${m}`}>
              <th scope="row" className="px-3 py-1.5 text-left font-normal">
                <Hint text={`The layer property whose change by ±${fraction * 100} % moves the ${METRICS[m].phrase} most (the top bar of its tornado chart). Run the sensitivity below to fill it.`}>
                  Matters most for the {METRICS[m].phrase}
                </Hint>
              </th>
              {figures.map((_, i) => {
                const e = strongest[i]?.[m];
                return (
                  <td key={i} className="px-3 py-1.5 text-right text-xs" data-alt={i}>
                    {e ? (
                      <>
                        <span className="font-semibold">{effectName(e)}</span>
                        <span className="block text-ink-soft">
                          at −/+: {signed(e.deltaLow * METRICS[m].scale, METRICS[m].digits - 1)} / {signed(e.deltaHigh * METRICS[m].scale, METRICS[m].digits - 1)} {METRICS[m].unit === '–' ? '' : METRICS[m].unit}
                        </span>
                      </>
                    ) : strongest[i] ? (
                      '–'
                    ) : (
                      <span className="text-ink-faint">not run yet</span>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
          <tr data-row="mesh">
            <th scope="row" className="px-3 py-1.5 text-left font-normal">
              <Hint text="Each layer gets at least 4 cells and no cell thicker than the exposure's largest cell; the time step is the exposure's; the scheme as the engine ran it.">
                Mesh, step and scheme
              </Hint>
            </th>
            {figures.map((f, i) => (
              <td key={i} className="px-3 py-1.5 text-right text-xs text-ink-soft" data-alt={i}>
                {f.run.cells} cells, {f.run.timeStep} s
                <span className="block">{f.run.scheme}</span>
              </td>
            ))}
          </tr>
        </tbody>
      </table>
      <p className="px-3 py-2 text-xs text-ink-soft">
        Peaks and heat over the {daysShown} reported {daysShown === 1 ? 'day' : 'days'}; times as day and clock from midnight of the first reported day ({dayClock(0)}). Decrement factor and time lag are the simulated ones of the last day, as the
        workbench shows them.
      </p>
    </div>
  );
}
