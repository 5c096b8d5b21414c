// the figures table of a run: simulated beside analytic, each with how it was computed
import type { RunDone } from '../../lib/workbench/runDocument';
import { effectiveWarmupDays, type Exposure } from '../../lib/schemas/workbench';
import { dayClock, ACCURACY_TOLERANCE } from '../../lib/workbench/figures';
import { MOISTURE_DEFERRAL } from '../../lib/moisture/index.ts';
import MonthlyBars from './MonthlyBars';

const H = 3600;

/** fixed decimals, a real minus sign, '–' for no value */
export function fixed(v: number | null | undefined, digits: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  const s = v.toFixed(digits);
  return s.startsWith('-') ? `\u2212${s.slice(1)}` : s;
}

interface Row {
  key: string;
  label: string;
  unit: string;
  simulated: string;
  analytic: string;
  note?: string;
  how: string;
  warn?: boolean;
}

export function figureRows(run: RunDone, exposure: Exposure): Row[] {
  const f = run.figures;
  const a = run.analytic;
  const lastDay = `the last simulated day (${dayClock(f.lastPeriodFrom - effectiveWarmupDays(exposure) * 86400)} to the end)`;
  const fitted = f.periodic.start === 'warm-up' ? ' (fitted, approximate: the series does not repeat)' : '';
  const drive = run.series.solAir.some((v, k) => v !== run.series.outsideAir[k]) ? 'sol-air temperature' : 'outdoor air temperature';
  const rows: Row[] = [
    {
      key: 'uValue',
      label: 'U-value',
      unit: 'W/m²K',
      simulated: '',
      analytic: fixed(a.steady.uValue, 3),
      how: 'Steady state: 1 / (R_se + Σ d/λ + R_si), ISO 6946.',
    },
    {
      key: 'decrementFactor',
      label: `Decrement factor${fitted ? ', fitted' : ''}`,
      unit: '–',
      simulated: fixed(f.decrementFactor.simulated, 3),
      analytic: fixed(f.decrementFactor.analytic, 3),
      how: `Simulated: amplitude of the first harmonic of the inside heat flux over ${lastDay}, divided by the amplitude of the first harmonic of the ${drive} and by the U-value${fitted}. Analytic: ISO 13786 transfer matrices, |Y₁₂| / U.`,
    },
    {
      key: 'timeLag',
      label: `Time lag${fitted ? ', fitted' : ''}`,
      unit: 'h',
      simulated: fixed(f.timeLag.simulated / H, 2),
      analytic: fixed(f.timeLag.analytic / H, 2),
      how: `Simulated: phase of the first harmonic of the inside heat flux minus that of the ${drive}, over ${lastDay}${fitted}. Analytic: ISO 13786, the phase of Y₁₂.`,
    },
    {
      key: 'periodicTransmittance',
      label: 'Periodic thermal transmittance',
      unit: 'W/m²K',
      simulated: fixed(f.periodicTransmittance.simulated, 3),
      analytic: fixed(f.periodicTransmittance.analytic, 3),
      how: 'Inside heat flux amplitude per kelvin of outdoor amplitude; simulated from the fitted harmonics, analytic |Y₁₂| of ISO 13786.',
    },
    {
      key: 'peakHeatGain',
      label: 'Peak heat gain',
      unit: 'W/m²',
      simulated: fixed(f.peakHeatGain.value, 2),
      analytic: '',
      note: Number.isFinite(f.peakHeatGain.time) ? dayClock(f.peakHeatGain.time) : 'no gain',
      how: 'Largest inside heat flux into the room at the output times of the reported days (0 when heat never enters the room).',
    },
    {
      key: 'peakHeatLoss',
      label: 'Peak heat loss',
      unit: 'W/m²',
      simulated: fixed(f.peakHeatLoss.value, 2),
      analytic: '',
      note: Number.isFinite(f.peakHeatLoss.time) ? dayClock(f.peakHeatLoss.time) : 'no loss',
      how: 'Largest inside heat flux out of the room at the output times of the reported days, as a positive number (0 when heat never leaves the room).',
    },
    {
      key: 'heatGained',
      label: 'Heat into the room, last day',
      unit: 'Wh/m²',
      simulated: fixed(f.heatGained, 1),
      analytic: '',
      how: `Time integral of the positive part of the inside heat flux over ${lastDay} (trapezoids split where the flux changes sign).`,
    },
    {
      key: 'heatLost',
      label: 'Heat out of the room, last day',
      unit: 'Wh/m²',
      simulated: fixed(f.heatLost, 1),
      analytic: '',
      how: `Time integral of the negative part of the inside heat flux over ${lastDay}, shown as a positive amount.`,
    },
    {
      key: 'totalHeatGained',
      label: 'Heat into the room, reported period',
      unit: 'kWh/m²',
      simulated: fixed(f.totalHeatGained, 3),
      analytic: '',
      note: `${exposure.days} d`,
      how: 'Time integral of the positive part of the inside heat flux over all the reported days (trapezoids split where the flux changes sign), in kWh per m² of wall.',
    },
    {
      key: 'totalHeatLost',
      label: 'Heat out of the room, reported period',
      unit: 'kWh/m²',
      simulated: fixed(f.totalHeatLost, 3),
      analytic: '',
      note: `${exposure.days} d`,
      how: 'Time integral of the negative part of the inside heat flux over all the reported days, shown as a positive amount, in kWh per m² of wall.',
    },
    {
      key: 'insideSurfaceMin',
      label: 'Inside surface, lowest',
      unit: '°C',
      simulated: fixed(f.insideSurfaceMin.value, 2),
      analytic: '',
      note: dayClock(f.insideSurfaceMin.time),
      how: 'Lowest inside surface temperature at the output times of the reported days.',
    },
    {
      key: 'insideSurfaceMax',
      label: 'Inside surface, highest',
      unit: '°C',
      simulated: fixed(f.insideSurfaceMax.value, 2),
      analytic: '',
      note: dayClock(f.insideSurfaceMax.time),
      how: 'Highest inside surface temperature at the output times of the reported days.',
    },
  ];
  if (f.lowestInterface) {
    rows.push({
      key: 'lowestInterface',
      label: 'Lowest interface temperature',
      unit: '°C',
      simulated: fixed(f.lowestInterface.value, 2),
      analytic: '',
      note: `${f.lowestInterface.name}, ${dayClock(f.lowestInterface.time)}`,
      how: 'Lowest temperature of any interface between two layers at the output times of the reported days.',
    });
  }
  const m = f.moisture;
  rows.push(
    m
      ? {
          key: 'moistureVerdict',
          label: 'Moisture, interstitial (ISO 13788)',
          unit: 'g/m²',
          simulated: m.verdict === 'none' ? '0' : fixed(m.maxAccumulated, m.maxAccumulated >= 100 ? 0 : 1),
          analytic: '',
          note: m.label + (m.maxAtPlane ? `, most at ${m.maxAtPlane}` : ''),
          how: 'Largest water held over the year by the ISO 13788 monthly Glaser method under the document’s monthly climate (steady months, vapour diffusion only, δ₀ = 2×10⁻¹⁰ kg/(m·s·Pa)); the Moisture pane shows the diagram and the months.',
          warn: m.verdict === 'accumulates',
        }
      : {
          key: 'moistureVerdict',
          label: 'Moisture, interstitial (ISO 13788)',
          unit: '',
          simulated: '–',
          analytic: '',
          note: 'no monthly climate: set one in the Moisture pane',
          how: 'The ISO 13788 monthly check needs twelve months of outdoor climate and the indoor air (the Moisture pane).',
        },
  );
  if (m) {
    rows.push({
      key: 'surfaceFactor',
      label: 'Inside surface temperature factor f_Rsi',
      unit: '–',
      simulated: fixed(m.fRsi, 3),
      analytic: '',
      note: m.fRsiMin === null ? 'no month loses heat' : `needs ${fixed(m.fRsiMin, 3)} against mould${m.mouldRisk ? ': mould risk' : ''}`,
      how: 'f_Rsi = 1 − R_si/R_T with R_si 0.25 m²K/W, against f_Rsi,min for 80 % surface humidity in the critical month (ISO 13788 clause 6).',
      warn: m.mouldRisk || m.condensationRisk,
    });
  }
  rows.push(
    {
      key: 'accuracyEstimate',
      label: 'Discretisation error, estimated',
      unit: '%',
      simulated: f.accuracy ? fixed(f.accuracy.relative * 100, 2) : '–',
      analytic: '',
      note: f.accuracy ? `±${fixed(f.accuracy.maxDifference, 3)} W/m² against ${f.accuracy.coarseCells} cells, step ${f.accuracy.coarseTimeStep} s` : 'not estimated',
      how: 'The same run again at twice the time step and twice the largest cell: the largest difference of the inside heat flux at their common output times over the reported days, relative to the inside heat flux amplitude (half its range). Both errors fall as the square of the step (Crank–Nicolson) and of the cell, so the run itself is about three times closer than this. Over 1 %: refine the step or the cells.',
      warn: f.accuracy ? f.accuracy.relative > ACCURACY_TOLERANCE : false,
    },
    {
      key: 'bookkeepingClosure',
      label: 'Energy bookkeeping closure',
      unit: '–',
      simulated: Number.isFinite(f.bookkeepingClosure) ? f.bookkeepingClosure.toExponential(1) : '–',
      analytic: '',
      how: '|heat in at the outside − heat out at the inside − change of stored heat| over the whole run, relative to the largest of the three. The scheme conserves energy by construction, so this only proves the bookkeeping; it says nothing of accuracy (see the estimated discretisation error).',
      warn: f.bookkeepingClosure > 1e-6,
    },
    {
      key: 'mesh',
      label: 'Mesh and step',
      unit: '',
      simulated: `${f.cells} cells`,
      analytic: '',
      note: `largest cell ${fixed(f.maxCellSize * 1000, 1)} mm, step ${f.timeStep} s, ${f.scheme}`,
      how: 'Each layer gets at least 4 cells and no cell thicker than the largest cell; the time step is the run setting; the scheme as the engine counted its steps.',
    },
  );
  return rows;
}

export default function FiguresTable({ run, exposure }: { run: RunDone; exposure: Exposure }) {
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
