// the result of the moisture check: verdict, month strip, Glaser diagrams (to scale and against
// s_d), the table of months and the cautions. pure props, so the workbench and other pages can use it.
import { memo, useMemo, useRef } from 'react';
import {
  MOISTURE_CAUTIONS,
  MOISTURE_DEFERRAL,
  MONTH_NAMES,
  MONTH_SHORT,
  glaserDiagramSvg,
  moistureVerdictText,
  planeName,
  type MoistureAssessment,
} from '../../../lib/moisture/index.ts';
import Hint from '../Hint';
import { fixed } from '../format';

const TONE = {
  none: 'border-ok/40 bg-panel',
  driesOut: 'border-warn/40 bg-warn-soft',
  accumulates: 'border-danger/40 bg-danger-soft',
} as const;

/** the verdict in plain words, the surface check, and the deferral */
export function MoistureVerdict({ assessment }: { assessment: MoistureAssessment }) {
  const v = moistureVerdictText(assessment);
  return (
    <div className={`rounded border px-3 py-2 text-sm ${TONE[v.kind]}`} role="status" data-testid="moisture-verdict" data-verdict={v.kind}>
      <p>
        <strong className={v.kind === 'accumulates' ? 'text-danger' : v.kind === 'driesOut' ? 'text-warn' : 'text-ok'} data-testid="moisture-verdict-label">
          {v.label}.
        </strong>{' '}
        {v.text}
      </p>
      <p className={`mt-1 ${v.surfaceRisk !== 'none' ? 'font-semibold text-danger' : ''}`} data-testid="moisture-surface-verdict">
        {v.surface}
      </p>
      <p className="mt-1 text-xs text-ink-soft">{MOISTURE_DEFERRAL}</p>
    </div>
  );
}

export function MoistureCautions() {
  return (
    <aside className="rounded border border-warn/30 bg-warn-soft px-3 py-2 text-xs" role="note" aria-label="Limits of the moisture check" data-testid="moisture-cautions">
      <strong className="font-semibold">What this check leaves out (ISO 13788 monthly method).</strong>
      <ul className="mt-1 list-disc pl-5">
        {MOISTURE_CAUTIONS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
      <p className="mt-1 font-semibold">{MOISTURE_DEFERRAL}</p>
    </aside>
  );
}

const g = (v: number) => (v === 0 ? '0' : v < 10 ? fixed(v, 1) : fixed(v, 0));

function MoistureResult({ assessment, month, onMonth, fills }: { assessment: MoistureAssessment; month: number; onMonth(m: number): void; fills: string[] }) {
  const a = assessment;
  const m = a.glaser.months[month - 1];
  const s = a.surface.months[month - 1];
  const strip = useRef<HTMLDivElement>(null);
  const svgX = useMemo(() => glaserDiagramSvg(a, month, { axis: 'thickness', layerFills: fills, width: 560, height: 280 }), [a, month, fills]);
  const svgS = useMemo(() => glaserDiagramSvg(a, month, { axis: 'sd', layerFills: fills, width: 560, height: 280 }), [a, month, fills]);
  const n = a.layers.length;
  const where = (k: number[]) => (k.length === 0 ? '–' : k.map((p) => planeName(a.layers, p)).join('; '));
  const heldAt = (mm: (typeof a.glaser.months)[number]) =>
    mm.planes
      .map((p, k) => ({ p, k }))
      .filter(({ p }) => p.accumulated > 0)
      .map(({ k }) => k);

  const focusMonth = (next: number) => {
    onMonth(next);
    requestAnimationFrame(() => strip.current?.querySelector<HTMLButtonElement>(`[data-month="${next}"]`)?.focus());
  };

  return (
    <div className="space-y-3">
      <MoistureVerdict assessment={a} />

      <div
        ref={strip}
        role="radiogroup"
        aria-label="Month shown in the diagrams (arrow keys step through the year)"
        className="grid grid-cols-6 gap-1 sm:grid-cols-12"
        data-testid="month-strip"
        onKeyDown={(e) => {
          const step = e.key === 'ArrowRight' || e.key === 'ArrowDown' ? 1 : e.key === 'ArrowLeft' || e.key === 'ArrowUp' ? -1 : 0;
          if (step !== 0) {
            e.preventDefault();
            focusMonth(((month - 1 + step + 12) % 12) + 1);
          } else if (e.key === 'Home' || e.key === 'End') {
            e.preventDefault();
            focusMonth(e.key === 'Home' ? 1 : 12);
          }
        }}
      >
        {a.glaser.months.map((mm) => {
          const on = mm.month === month;
          const mark = mm.condensed > 0 ? 'condenses' : mm.evaporated > 0 ? 'dries' : mm.accumulated > 0 ? 'holds water' : '';
          const sm = a.surface.months[mm.month - 1];
          return (
            <button
              key={mm.month}
              type="button"
              role="radio"
              aria-checked={on}
              tabIndex={on ? 0 : -1}
              data-month={mm.month}
              aria-label={`${MONTH_NAMES[mm.month - 1]}${mark ? `: ${mark}` : ''}${sm.mouldRisk ? ', mould risk at the surface' : ''}`}
              onClick={() => onMonth(mm.month)}
              className={`flex flex-col items-center rounded border px-1 py-1 text-xs ${on ? 'border-accent bg-accent text-white' : 'border-line bg-panel hover:border-accent'}`}
            >
              <span className="font-semibold">{MONTH_SHORT[mm.month - 1]}</span>
              <span className="flex h-2 gap-0.5" aria-hidden="true">
                {mm.condensed > 0 ? <span className={`h-2 w-2 rounded-full ${on ? 'bg-white' : 'bg-danger'}`} title="condenses" /> : null}
                {mm.evaporated > 0 ? <span className={`h-2 w-2 rounded-full border ${on ? 'border-white' : 'border-accent'}`} title="dries" /> : null}
                {sm.mouldRisk ? <span className={`h-2 w-2 rotate-45 ${on ? 'bg-white' : 'bg-warn'}`} title="mould risk" /> : null}
              </span>
            </button>
          );
        })}
      </div>

      <p className="text-sm" data-testid="month-summary">
        <strong>{MONTH_NAMES[month - 1]}</strong>: outdoors {fixed(m.outsideTemperature, 1)} °C at {fixed(m.outsideRelativeHumidity, 0)} % ({fixed(m.outsideVapourPressure, 0)} Pa); indoors{' '}
        {fixed(m.insideTemperature, 1)} °C with {fixed(m.insideVapourPressure, 0)} Pa of vapour.{' '}
        {m.condensationPlanes.length > 0 ? (
          <span className="font-semibold text-danger">Condensation at {where(m.condensationPlanes)}.</span>
        ) : m.evaporated > 0 ? (
          <span>Drying out: {g(m.evaporated)} g/m² evaporates.</span>
        ) : (
          <span>No condensation this month.</span>
        )}
      </p>

      <div className="grid gap-3 xl:grid-cols-2">
        <figure className="min-w-0 rounded border border-line bg-panel p-2">
          <figcaption className="text-xs font-semibold text-ink-soft">
            <Hint text="Steady temperature profile of the month through the layers (ISO 6946 resistances; R_se 0.04 m²K/W, R_si 0.13 m²K/W for horizontal heat flow, 0.10 upward, 0.17 downward, by the Exposure pane's heat flow); saturation pressure by ISO 13788 at each depth; the vapour pressure line drawn taut under the saturation line from the outdoor to the indoor vapour pressure. Red bars mark where vapour condenses.">
              The section to scale
            </Hint>
          </figcaption>
          <div className="w-full overflow-x-auto [&>svg]:h-auto [&>svg]:w-full" data-testid="glaser-thickness" dangerouslySetInnerHTML={{ __html: svgX }} />
        </figure>
        <figure className="min-w-0 rounded border border-line bg-panel p-2">
          <figcaption className="text-xs font-semibold text-ink-soft">
            <Hint text="The same lines against the diffusion-equivalent air layer thickness s_d = μ·d: the vapour pressure line is straight wherever no vapour condenses, which is how the Glaser method is usually read.">
              Against s_d
            </Hint>
          </figcaption>
          <div className="w-full overflow-x-auto [&>svg]:h-auto [&>svg]:w-full" data-testid="glaser-sd" dangerouslySetInnerHTML={{ __html: svgS }} />
        </figure>
      </div>

      <div className="overflow-x-auto rounded border border-line bg-panel">
        <table className="w-full text-sm tabular" aria-label="Moisture by month" data-testid="moisture-months">
          <thead>
            <tr className="border-b border-line text-xs text-ink-soft">
              <th scope="col" className="px-2 py-1 text-left font-normal">Month</th>
              <th scope="col" className="px-2 py-1 text-right font-normal">
                <Hint text="Mean outdoor air temperature of the month, °C.">θ_e</Hint> °C
              </th>
              <th scope="col" className="px-2 py-1 text-right font-normal">
                <Hint text="Indoor vapour pressure: φ_i·p_sat(θ_i) for a fixed humidity, or p_e + 1.10·Δp for a humidity class (ISO 13788 Annex A).">p_i</Hint> Pa
              </th>
              <th scope="col" className="px-2 py-1 text-right font-normal">
                <Hint text="Vapour condensed in the month, g/m²: δ₀ = 2×10⁻¹⁰ kg/(m·s·Pa) times the change of slope of the vapour line at each condensation plane, over the days of the month.">Condensed</Hint> g/m²
              </th>
              <th scope="col" className="px-2 py-1 text-right font-normal">
                <Hint text="Water evaporated in the month from planes holding water (their vapour pressure is taken at saturation), g/m²; at most what they held.">Evaporated</Hint> g/m²
              </th>
              <th scope="col" className="px-2 py-1 text-right font-normal">
                <Hint align="right" text="Water held at the end of the month, g/m², counted from the ISO 13788 start month (the first month that condenses after one that does not).">Held</Hint> g/m²
              </th>
              <th scope="col" className="px-2 py-1 text-left font-normal">
                <Hint text="The interfaces (between two layers, named outside / inside) where vapour condenses in the month, or else where water is still held.">Where</Hint>
              </th>
              <th scope="col" className="px-2 py-1 text-right font-normal">
                <Hint align="right" text="f_Rsi,min for mould: (θ_si,min − θ_e)/(θ_i − θ_e), with θ_si,min the surface temperature at which the indoor vapour would make 80 % relative humidity (ISO 13788 clause 6). The build-up's f_Rsi uses R_si 0.25 m²K/W.">
                  f_Rsi,min
                </Hint>
              </th>
              <th scope="col" className="px-2 py-1 text-left font-normal">
                <Hint align="right" text="The surface check of the month: passes when the build-up's f_Rsi is at least f_Rsi,min for mould; mould risk when it is below; condensation when it is below the f_Rsi,min for 100 % surface humidity (the dew point of the indoor air).">
                  Surface
                </Hint>
              </th>
            </tr>
          </thead>
          <tbody>
            {a.glaser.months.map((mm) => {
              const sm = a.surface.months[mm.month - 1];
              const at = mm.condensationPlanes.length > 0 ? mm.condensationPlanes : heldAt(mm);
              return (
                <tr
                  key={mm.month}
                  className={`cursor-pointer border-b border-line/60 last:border-0 ${mm.month === month ? 'bg-accent-soft' : ''} ${a.glaser.startMonth === mm.month ? 'border-t-2 border-t-accent' : ''}`}
                  onClick={() => onMonth(mm.month)}
                  data-month-row={mm.month}
                >
                  <th scope="row" className="px-2 py-1 text-left font-normal">
                    {MONTH_NAMES[mm.month - 1]}
                    {a.glaser.startMonth === mm.month ? <span className="ml-1 text-xs text-accent">(start)</span> : null}
                  </th>
                  <td className="px-2 py-1 text-right">{fixed(mm.outsideTemperature, 1)}</td>
                  <td className="px-2 py-1 text-right">{fixed(mm.insideVapourPressure, 0)}</td>
                  <td className={`px-2 py-1 text-right ${mm.condensed > 0 ? 'font-semibold text-danger' : ''}`}>{g(mm.condensed)}</td>
                  <td className="px-2 py-1 text-right">{g(mm.evaporated)}</td>
                  <td className="px-2 py-1 text-right font-semibold">{g(mm.accumulated)}</td>
                  <td className="max-w-56 truncate px-2 py-1 text-xs text-ink-soft" title={where(at)}>
                    {at.length > 0 ? where(at) : '–'}
                  </td>
                  <td className="px-2 py-1 text-right">{sm.fRsiMinMould === null ? '–' : fixed(sm.fRsiMinMould, 3)}</td>
                  <td className={`px-2 py-1 text-xs ${sm.condensationRisk ? 'font-semibold text-danger' : sm.mouldRisk ? 'font-semibold text-warn' : 'text-ink-soft'}`}>
                    {sm.condensationRisk ? 'condensation' : sm.mouldRisk ? 'mould risk' : sm.fRsiMinMould === null ? 'no heat loss' : 'passes'}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-soft">
        Build-up f_Rsi = {fixed(a.surface.fRsi, 3)} (R_si 0.25 m²K/W for the surface check); {n} layers, total s_d {fixed(a.glaser.sd[n], a.glaser.sd[n] >= 100 ? 0 : 2)} m. Inside surface of the month:{' '}
        {fixed(s.surfaceTemperature, 1)} °C against {fixed(s.minimumSurfaceTemperatureMould, 1)} °C for 80 % surface humidity.
      </p>
      <MoistureCautions />
    </div>
  );
}

export default memo(MoistureResult);
