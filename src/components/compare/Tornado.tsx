// a tornado chart: one bar per layer property, ordered by how far its change moves the figure;
// the lowered and raised halves on either side of the base value; numbers in each bar's tooltip
import { useState } from 'react';
import { effectName, METRICS, PROPERTY_LABELS, type Effect, type MetricKey } from '../../lib/workbench/sensitivity';
import { signed } from './rows';

const W = 760;
const LABEL_W = 300;
const RIGHT = 16;
const ROW = 26;
const TOP = 30;

export interface TornadoProps {
  metric: MetricKey;
  effects: Effect[];
  fraction: number;
  /** bars shown (the strongest first) */
  limit: number;
}

export default function Tornado({ metric, effects, fraction, limit }: TornadoProps) {
  const [hover, setHover] = useState<number | null>(null);
  const m = METRICS[metric];
  const shown = effects.slice(0, limit);
  const pct = `${+(fraction * 100).toFixed(3)} %`;
  const reach = Math.max(1e-300, ...shown.map((e) => (Number.isFinite(e.reach) ? e.reach : 0)));
  const plotW = W - LABEL_W - RIGHT;
  const x0 = LABEL_W + plotW / 2;
  const px = (d: number) => x0 + (Number.isFinite(d) ? (d / reach) * (plotW / 2 - 4) : 0);
  const height = TOP + shown.length * ROW + 34;
  // a dimensionless figure carries no unit after its numbers
  const unit = m.unit === '–' ? '' : ` ${m.unit}`;
  const value = (v: number) => `${Number.isFinite(v) ? (v * m.scale).toFixed(m.digits) : '–'}${unit}`;
  const change = (v: number) => `${signed(v * m.scale, m.digits)}${unit}`;
  const tip = (e: Effect) =>
    `${effectName(e)}. Base ${value(e.base)}. Lowered by ${pct}: ${value(e.low)} (${change(e.deltaLow)}). Raised by ${pct}: ${value(e.high)} (${change(e.deltaHigh)}). Central difference: ${signed((e.slope * m.scale) / 100, m.digits + 1)}${unit} per +1 % of the property.`;
  const h = hover !== null ? shown[hover] : null;
  return (
    <div className="relative" data-testid="tornado" data-metric={metric}>
      <svg viewBox={`0 0 ${W} ${height}`} width="100%" className="max-w-[760px] overflow-visible" role="group" aria-label={`Tornado chart: how each layer property moves the ${m.phrase} when changed by ${pct}`}>
        <g aria-hidden="true" className="text-[11px]">
          <rect x={LABEL_W} y={6} width={12} height={10} className="fill-t1" />
          <text x={LABEL_W + 16} y={15} className="fill-ink-soft">
            property lowered by {pct}
          </text>
          <rect x={LABEL_W + 190} y={6} width={12} height={10} className="fill-t6" />
          <text x={LABEL_W + 206} y={15} className="fill-ink-soft">
            raised by {pct}
          </text>
        </g>
        <line x1={x0} x2={x0} y1={TOP - 4} y2={TOP + shown.length * ROW} className="stroke-ink-soft" strokeWidth={1} />
        {shown.map((e, i) => {
          const y = TOP + i * ROW;
          const lowFirst = Math.abs(e.deltaLow) >= Math.abs(e.deltaHigh);
          const bar = (d: number, cls: string, key: string) => {
            const a = px(0);
            const b = px(d);
            return <rect key={key} x={Math.min(a, b)} y={y + 4} width={Math.max(1, Math.abs(b - a))} height={ROW - 8} className={`${cls} stroke-ink/30`} strokeWidth={0.5} />;
          };
          const bars = [bar(e.deltaLow, 'fill-t1', 'low'), bar(e.deltaHigh, 'fill-t6', 'high')];
          return (
            <g
              key={`${e.layer}-${e.property}`}
              tabIndex={0}
              role="img"
              aria-label={tip(e)}
              data-testid="tornado-bar"
              data-layer={e.layer}
              data-property={e.property}
              onPointerEnter={() => setHover(i)}
              onPointerLeave={() => setHover((c) => (c === i ? null : c))}
              onFocus={() => setHover(i)}
              onBlur={() => setHover((c) => (c === i ? null : c))}
              className="cursor-help outline-none"
            >
              <title>{tip(e)}</title>
              <rect x={0} y={y} width={W} height={ROW} className={hover === i ? 'fill-accent-soft' : 'fill-transparent'} />
              <text x={LABEL_W - 8} y={y + ROW / 2 + 4} textAnchor="end" className="fill-ink text-[12px]">
                {`${e.layer + 1}: ${truncate(e.layerName, 30)}, ${PROPERTY_LABELS[e.property]}`}
              </text>
              {lowFirst ? bars : bars.reverse()}
            </g>
          );
        })}
        <g aria-hidden="true" className="text-[11px]">
          {[-1, -0.5, 0, 0.5, 1].map((f) => (
            <g key={f}>
              <line x1={x0 + (f * (plotW / 2 - 4))} x2={x0 + (f * (plotW / 2 - 4))} y1={TOP + shown.length * ROW} y2={TOP + shown.length * ROW + 4} className="stroke-ink-soft" />
              <text x={x0 + f * (plotW / 2 - 4)} y={TOP + shown.length * ROW + 16} textAnchor="middle" className="fill-ink-soft tabular">
                {f === 0 ? value(shown[0]?.base ?? NaN) : signed(f * reach * m.scale, significant(reach * m.scale))}
              </text>
            </g>
          ))}
          <text x={x0} y={TOP + shown.length * ROW + 30} textAnchor="middle" className="fill-ink-soft">
            change of the {m.phrase} from its base value{unit ? `,${unit}` : ''}
          </text>
        </g>
      </svg>
      {h ? (
        <div
          role="tooltip"
          className="pointer-events-none absolute z-30 w-80 rounded border border-line-strong bg-ink px-2.5 py-1.5 text-xs leading-snug text-paper shadow-lg"
          style={{ left: `min(${((LABEL_W + 20) / W) * 100}%, calc(100% - 20rem))`, top: `${((TOP + (hover! + 1) * ROW) / height) * 100}%` }}
          data-testid="tornado-tooltip"
        >
          <strong className="block">{effectName(h)}</strong>
          <span className="block">Base: {value(h.base)}</span>
          <span className="block">
            Lowered by {pct}: {value(h.low)} ({change(h.deltaLow)})
          </span>
          <span className="block">
            Raised by {pct}: {value(h.high)} ({change(h.deltaHigh)})
          </span>
          <span className="block">
            Central difference: {signed((h.slope * m.scale) / 100, m.digits + 1)}
            {unit} per +1 % of the property
          </span>
        </div>
      ) : null}
    </div>
  );
}

function truncate(s: string, n: number): string {
  return s.length > n ? `${s.slice(0, n - 1)}…` : s;
}

/** decimals that show about two significant digits of v */
function significant(v: number): number {
  if (!(v > 0)) return 2;
  return Math.max(0, Math.min(6, 1 - Math.floor(Math.log10(v))));
}
