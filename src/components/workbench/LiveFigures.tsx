import { memo, useEffect, useRef, useState, type ReactNode } from 'react';
import type { Figures } from '../../lib/thermal/index.ts';
import type { DocLayer, Exposure } from '../../lib/schemas/workbench';
import { useWorkbench } from '../../lib/workbench/store';
import Hint from './Hint';
import { fixed, mm } from './format';

interface Props {
  layers: DocLayer[];
  exposure: Exposure;
  figures: Figures | null;
}

function Figure({ label, hint, value, unit, testId, align = 'left' }: { label: string; hint: string; value: string; unit: string; testId: string; align?: 'left' | 'right' }) {
  return (
    <div className="rounded border border-line bg-panel px-3 py-2">
      <dt className="text-xs font-semibold text-ink-soft">
        <Hint text={hint} align={align}>
          {label}
        </Hint>
      </dt>
      <dd className="mt-0.5 flex items-baseline gap-1">
        <span className="text-xl font-semibold tabular text-ink" data-testid={testId}>
          {value}
        </span>
        <span className="text-xs text-ink-soft">{unit}</span>
      </dd>
    </div>
  );
}

/** s_d in m with about three significant figures */
const sdText = (sd: number): string => (sd >= 100 ? fixed(sd, 0) : sd >= 1 ? fixed(sd, 2) : fixed(sd, 3));

/** the unit under a column heading */
const Unit = ({ children }: { children: string }) => <span className="block text-[10px] font-normal text-ink-faint">{children}</span>;

/**
 * a box that scrolls sideways when its table is wider than it: it then shows a fade on the side
 * with more columns and a line saying so, and takes keyboard focus so the arrow keys scroll it
 */
function ScrollBox({ label, children }: { label: string; children: ReactNode }) {
  const box = useRef<HTMLDivElement>(null);
  const [more, setMore] = useState({ left: false, right: false });
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const measure = () => {
      const left = el.scrollLeft > 1;
      const right = el.scrollLeft + el.clientWidth < el.scrollWidth - 1;
      setMore((m) => (m.left === left && m.right === right ? m : { left, right }));
    };
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    if (el.firstElementChild) ro.observe(el.firstElementChild);
    el.addEventListener('scroll', measure, { passive: true });
    return () => {
      ro.disconnect();
      el.removeEventListener('scroll', measure);
    };
  }, []);
  const scrolls = more.left || more.right;
  return (
    <div>
      <div className="relative rounded border border-line bg-panel">
        <div
          ref={box}
          className="overflow-x-auto"
          data-testid="layer-figures-box"
          data-overflow={scrolls ? 'true' : 'false'}
          tabIndex={scrolls ? 0 : undefined}
          role={scrolls ? 'region' : undefined}
          aria-label={scrolls ? `${label}, scrolls sideways` : undefined}
        >
          {children}
        </div>
        {more.left ? <div aria-hidden="true" className="pointer-events-none absolute inset-y-0 left-0 w-6 rounded-l bg-linear-to-r from-ink/15 to-transparent" /> : null}
        {more.right ? <div aria-hidden="true" className="pointer-events-none absolute inset-y-0 right-0 w-6 rounded-r bg-linear-to-l from-ink/15 to-transparent" /> : null}
      </div>
      {scrolls ? (
        <p className="mt-1 text-right text-xs text-ink-faint" data-testid="layer-figures-scroll-note">
          {more.right ? 'More columns to the right: scroll the table sideways →' : '← more columns to the left'}
        </p>
      ) : null}
    </div>
  );
}

/** the figures of the build-up, recomputed by analyse() on every edit */
function LiveFigures({ layers, exposure, figures }: Props) {
  const highlightedId = useWorkbench((s) => s.highlightedId);
  const setHighlighted = useWorkbench((s) => s.setHighlighted);
  if (!figures || layers.length === 0) {
    return (
      <section aria-label="Live figures" className="rounded border border-dashed border-line-strong bg-paper px-4 py-6 text-center text-sm text-ink-soft">
        Add a layer from the library to see the U-value, decrement factor and time lag.
      </section>
    );
  }
  const rse = exposure.outsideSurfaceResistance;
  const rsi = exposure.insideSurfaceResistance;
  const sumR = figures.layers.reduce((a, l) => a + l.resistance, 0);
  const thickness = layers.reduce((a, l) => a + l.thickness, 0);
  const kappa = figures.layers.reduce((a, l) => a + l.arealHeatCapacity, 0);
  const p = figures.periodic;
  const periodH = p.period / 3600;
  const hBar = (1 / rse + 1 / rsi) / 2;
  return (
    <section aria-label="Live figures" className="space-y-3">
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3" aria-live="polite">
        <Figure label="Total thickness" testId="fig-thickness" value={mm(thickness)} unit="mm" hint="Σ d: the sum of the layer thicknesses." />
        <Figure
          label="Total resistance R"
          testId="fig-resistance"
          value={fixed(figures.steady.totalResistance, 3)}
          unit="m²K/W"
          hint={`R = R_se + Σ d/λ + R_si = ${fixed(rse, 2)} + ${fixed(sumR, 3)} + ${fixed(rsi, 2)} m²K/W (surface resistances from the exposure; ISO 6946 conventions).`}
        />
        <Figure
          align="right"
          label="U-value"
          testId="fig-u"
          value={fixed(figures.steady.uValue, 3)}
          unit="W/m²K"
          hint="U = 1 / R for plane homogeneous layers (ISO 6946, total resistance of homogeneous layers); no corrections for fixings, air gaps or thermal bridges."
        />
        <Figure
          label="Areal heat capacity"
          testId="fig-kappa"
          value={fixed(kappa / 1000, 1)}
          unit="kJ/m²K"
          hint="Σ ρ·c·d over all layers: the heat stored per square metre per kelvin of uniform temperature rise."
        />
        <Figure
          label="Decrement factor"
          testId="fig-decrement"
          value={fixed(p.decrementFactor, 3)}
          unit="–"
          hint={`f = |Y₁₂| / U for a ${fixed(periodH, 0)} h sine, by the ISO 13786 transfer matrices (analytic, no time stepping): the share of the outdoor swing's heat flux that reaches the room. |Y₁₂| = ${fixed(p.periodicTransmittance, 3)} W/m²K.`}
        />
        <Figure
          align="right"
          label="Time lag"
          testId="fig-lag"
          value={fixed(p.timeLag / 3600, 1)}
          unit="h"
          hint={`φ: hours from the outdoor air peak to the inside heat flux peak for a ${fixed(periodH, 0)} h sine, from the phase of Y₁₂ (ISO 13786), in [0, ${fixed(periodH, 0)}) h.`}
        />
      </dl>

      <ScrollBox label="Figures per layer">
        <table className="w-full text-sm tabular" aria-label="Figures per layer">
          <thead>
            <tr className="border-b border-line text-left text-xs text-ink-soft">
              <th scope="col" className="px-1.5 py-1.5 align-bottom font-semibold">#</th>
              <th scope="col" className="px-1.5 py-1.5 align-bottom font-semibold">Layer</th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint text="Layer thickness d, mm.">d</Hint>
                <Unit>mm</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint text="Thermal resistance R = d / λ, m²K/W.">R</Hint>
                <Unit>m²K/W</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint text="Thermal diffusivity a = λ / (ρ·c), shown in 10⁻⁷ m²/s (0.1 mm²/s).">a</Hint>
                <Unit>10⁻⁷ m²/s</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint text={`Periodic penetration depth δ = √(a·P/π) for P = ${fixed(periodH, 0)} h, mm: the depth at which a surface swing falls to 1/e of its amplitude in a thick layer.`} align="right">
                  δ
                </Hint>
                <Unit>mm</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint text={`Fourier number for one period, Fo = a·P / d² with P = ${fixed(periodH, 0)} h (dimensionless): above about 1 the layer follows the daily swing through its whole thickness.`} align="right">
                  Fo
                </Hint>
                <Unit>–</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint
                  align="right"
                  text={`Layer Biot number Bi = h̄·(d/2)/λ, with h̄ = (1/R_se + 1/R_si)/2 = ${fixed(hBar, 1)} W/m²K the mean film coefficient of the assembly (the engine's layer definition). Bi < 0.1 marks a layer that behaves as one lumped temperature (common practice).`}
                >
                  Bi
                </Hint>
                <Unit>–</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint align="right" text="Water-vapour resistance factor μ of the layer's material (dimensionless): how many times more a layer resists vapour diffusion than still air of the same thickness. Empty when the layer has none; the moisture check needs it.">
                  μ
                </Hint>
                <Unit>–</Unit>
              </th>
              <th scope="col" className="whitespace-nowrap px-1.5 py-1.5 text-right align-bottom font-semibold">
                <Hint align="right" text="Diffusion-equivalent air layer thickness s_d = μ·d, m (ISO 13788): the thickness of still air that resists vapour as much as the layer does.">
                  s_d
                </Hint>
                <Unit>m</Unit>
              </th>
              <th scope="col" className="px-1.5 py-1.5 align-bottom font-semibold">
                <Hint align="right" text="Lumped: Bi < 0.1, so the temperature across the layer is nearly uniform at any moment (common practice).">
                  Lumped
                </Hint>
              </th>
            </tr>
          </thead>
          <tbody>
            {figures.layers.map((f, i) => {
              const layer = layers[i];
              if (!layer) return null;
              return (
                <tr
                  key={layer.id}
                  data-testid="layer-figures"
                  onPointerEnter={() => setHighlighted(layer.id)}
                  onPointerLeave={() => setHighlighted(null)}
                  className={`border-b border-line/60 last:border-0 ${highlightedId === layer.id ? 'bg-accent-soft' : ''}`}
                >
                  <td className="px-1.5 py-1 text-ink-faint">{i + 1}</td>
                  <td className="max-w-40 truncate px-1.5 py-1" title={layer.name}>
                    {layer.name}
                  </td>
                  <td className="px-1.5 py-1 text-right">{mm(layer.thickness)}</td>
                  <td className="px-1.5 py-1 text-right">{fixed(f.resistance, 3)}</td>
                  <td className="px-1.5 py-1 text-right">{fixed(f.diffusivity * 1e7, 2)}</td>
                  <td className="px-1.5 py-1 text-right">{fixed(f.penetrationDepth * 1000, 0)}</td>
                  <td className="px-1.5 py-1 text-right">{f.fourier >= 1000 ? f.fourier.toExponential(1) : fixed(f.fourier, 2)}</td>
                  <td className="px-1.5 py-1 text-right">{f.biot < 0.001 ? f.biot.toExponential(1) : fixed(f.biot, 3)}</td>
                  <td className="px-1.5 py-1 text-right" data-cell="mu">{layer.vapourResistanceFactor === null ? '–' : layer.vapourResistanceFactor >= 1e5 ? layer.vapourResistanceFactor.toExponential(0) : fixed(layer.vapourResistanceFactor, 0)}</td>
                  <td className="px-1.5 py-1 text-right" data-cell="sd">{layer.vapourResistanceFactor === null ? '–' : sdText(layer.vapourResistanceFactor * layer.thickness)}</td>
                  <td className="px-1.5 py-1">{f.lumped ? <span className="rounded bg-accent-soft px-1.5 text-xs font-semibold text-accent-strong">lumped</span> : <span className="text-ink-faint">–</span>}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </ScrollBox>
    </section>
  );
}

export default memo(LiveFigures);
