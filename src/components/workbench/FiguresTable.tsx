// the figures table of a run: simulated beside analytic, each with how it was computed
import { memo } from 'react';
import type { RunDone } from '../../lib/workbench/runDocument';
import type { Exposure } from '../../lib/schemas/workbench';
import { ACCURACY_TOLERANCE } from '../../lib/workbench/figures';
import { figureRows } from '../../lib/workbench/figureRows';
import { fixed } from '../../lib/workbench/figureDefs';
import MonthlyBars from './MonthlyBars';
import { MOISTURE_DEFERRAL } from '../../lib/moisture/index.ts';

export { fixed };

function FiguresTable({ run, exposure }: { run: RunDone; exposure: Exposure }) {
  const f = run.figures;
  const rows = figureRows(run, exposure);
  return (
    <div className="flex flex-col gap-2">
      {f.periodic.start === 'periodic' && f.periodic.checked && !f.periodic.reached ? (
        <p role="alert" className="rounded border border-warn/40 bg-warn-soft px-3 py-2" data-testid="periodic-warning">
          <strong>Not quite periodic.</strong> The inside heat flux at the same time of the last two reported days differs by up to {fixed(f.periodic.maxDifference * 100, 2)} % of its amplitude
          (criterion: at most {ACCURACY_TOLERANCE * 100} %), although the run started in its periodic state: refine the time step.
        </p>
      ) : null}
      {f.periodic.start === 'warm-up' ? (
        <p role={f.periodic.checked && f.periodic.maxDifference > ACCURACY_TOLERANCE ? 'alert' : 'note'} className={`rounded border px-3 py-2 text-xs ${f.periodic.checked && f.periodic.maxDifference > ACCURACY_TOLERANCE ? 'border-warn/40 bg-warn-soft' : 'border-line bg-paper'}`} data-testid="startup-memory">
          {f.periodic.checked ? (
            <>
              <strong>{f.periodic.maxDifference > ACCURACY_TOLERANCE ? 'The start still shows in the last reported day. ' : 'The start is forgotten by the last reported day. '}</strong>
              A second run from another start differs {f.periodic.checkedDay !== undefined && f.periodic.checkedDay < exposure.days ? `on reported day ${f.periodic.checkedDay} (a bound for the later days, as the start's effect only fades)` : 'there'} by up to {fixed(f.periodic.maxDifference * 100, 2)} % of the inside heat flux amplitude (criterion: at most {ACCURACY_TOLERANCE * 100} %)
              {f.periodic.maxDifference > ACCURACY_TOLERANCE ? '; add warm-up days.' : '.'} An uploaded series does not repeat, so no periodic state is claimed.
            </>
          ) : (
            'An uploaded series does not repeat, so no periodic state is claimed.'
          )}
        </p>
      ) : null}
      {f.accuracy && f.accuracy.relative > ACCURACY_TOLERANCE ? (
        <p role="alert" className="rounded border border-warn/40 bg-warn-soft px-3 py-2" data-testid="accuracy-warning">
          <strong>The mesh and step may be too coarse.</strong> At twice the step and cell the inside heat flux moves by up to {fixed(f.accuracy.relative * 100, 2)} % of its amplitude (criterion: at most {ACCURACY_TOLERANCE * 100} %). Use a shorter step or smaller cells.
        </p>
      ) : null}
      <table className="w-full text-sm tabular" data-testid="figures">
        <thead>
          <tr className="border-b border-line text-ink-soft text-xs">
            <th className="text-left font-normal py-1">Figure</th>
            <th className="text-right font-normal py-1 pr-3">Simulated</th>
            <th className="text-right font-normal py-1 pr-3">Analytic</th>
            <th className="text-left font-normal py-1">Unit</th>
            <th className="text-left font-normal py-1">When, where</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className={`border-b border-line/60 ${r.warn ? 'bg-warn-soft' : ''}`} data-figure={r.key}>
              <th scope="row" className="text-left font-normal py-1">
                <span title={r.how} className="underline decoration-dotted decoration-ink-faint underline-offset-2 cursor-help" tabIndex={0}>
                  {r.label}
                </span>
              </th>
              <td className="text-right py-1 pr-3 font-semibold" data-cell="simulated">
                {r.simulated}
              </td>
              <td className="text-right py-1 pr-3" data-cell="analytic">
                {r.analytic}
              </td>
              <td className="py-1 text-ink-soft">{r.unit}</td>
              <td className="py-1 text-ink-soft text-xs">{r.note ?? ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {f.monthly.length >= 2 ? <MonthlyBars months={f.monthly} /> : null}
      {f.moisture ? (
        <p className={`rounded border px-3 py-2 text-xs ${f.moisture.verdict === 'accumulates' || f.moisture.mouldRisk ? 'border-danger/40 bg-danger-soft' : 'border-line bg-paper'}`} role="note" data-testid="moisture-figures-note">
          <strong>{f.moisture.label}. </strong>
          {f.moisture.text} {f.moisture.surfaceText} The monthly method is steady, models vapour diffusion only (no liquid transport, moisture storage, air leakage or rain). {MOISTURE_DEFERRAL}
        </p>
      ) : null}
      {f.notes.length > 0 ? (
        <ul className="text-xs text-ink-soft list-disc pl-5">
          {f.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

// a run's table is the same for as long as the run is: progress frames of the next run do not redraw it
export default memo(FiguresTable);
