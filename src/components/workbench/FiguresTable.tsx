// the figures table of a run: simulated beside analytic, each with how it was computed
import type { RunDone } from '../../lib/workbench/runDocument';
import type { Exposure } from '../../lib/schemas/workbench';
import { PERIODIC_TOLERANCE } from '../../lib/workbench/figures';
import { figureRows } from '../../lib/workbench/figureRows';
import { fixed } from '../../lib/workbench/figureDefs';

export { fixed };

export default function FiguresTable({ run, exposure }: { run: RunDone; exposure: Exposure }) {
  const f = run.figures;
  const rows = figureRows(run, exposure);
  // the periodic-state check means something only for a repeating outdoor day
  const periodic = exposure.outdoor.mode !== 'series';
  return (
    <div className="flex flex-col gap-2">
      {periodic && f.periodic.checked && !f.periodic.reached ? (
        <p role="alert" className="rounded border border-warn/40 bg-warn-soft px-3 py-2" data-testid="periodic-warning">
          <strong>Not yet a periodic state.</strong> The inside surface temperature at the same time of the last two simulated days differs by up to {fixed(f.periodic.maxDifference, 3)} K
          (criterion: at most {PERIODIC_TOLERANCE} K). Add warm-up days before reading the simulated decrement factor and time lag.
        </p>
      ) : null}
      {periodic && !f.periodic.checked ? <p className="text-xs text-ink-soft">The periodic state is not checked: the run is shorter than two days.</p> : null}
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
      {f.dewPoint ? (
        <p className={`rounded border px-3 py-2 text-xs ${f.belowDewPoint ? 'border-danger/40 bg-danger-soft' : 'border-line bg-paper'}`} role="note" data-testid="condensation-caution">
          {f.belowDewPoint ? (
            <strong>An interface falls to or below the dew point of the indoor air. </strong>
          ) : (
            <strong>No interface falls to the dew point of the indoor air in this run. </strong>
          )}
          This screening assumes the indoor vapour reaches every interface unchanged; it models no vapour resistance, moisture storage or air leakage. Condensation risk must be
          assessed properly (for example by the EN ISO 13788 method) and against local codes.
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
