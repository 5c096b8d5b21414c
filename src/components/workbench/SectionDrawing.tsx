import { memo } from 'react';
import { useWorkbench } from '../../lib/workbench/store';
import type { DocLayer } from '../../lib/schemas/workbench';
import { CLASS_LABELS } from '../../lib/materials/builtin';
import { MAT_FILL } from './materialStyle';
import { mm } from './format';

const WIDTH = 128;
const BAND_X = 26;
const BAND_W = 74;
const TOP = 22;
/** drawing height of the whole build-up, px: about the height of the cards beside it */
const drawHeight = (layers: number) => Math.min(560, Math.max(240, layers * 80));
/** a layer thinner than this many px is drawn at it, so it can be seen and pointed at */
const MIN_PX = 3;

/** a round scale bar length, mm, about a fifth of the total */
function scaleBarMm(totalMm: number): number {
  const target = totalMm / 5;
  const steps = [1, 2, 5, 10, 20, 25, 50, 100, 200, 250, 500, 1000];
  return steps.reduce((best, s) => (Math.abs(s - target) < Math.abs(best - target) ? s : best), steps[0]);
}

/**
 * the build-up to scale, outside at the top and inside at the bottom like the cards;
 * layers under MIN_PX are drawn at MIN_PX (the drawing says so)
 */
function SectionDrawing({ layers, pxPerMm }: { layers: DocLayer[]; /** a fixed scale, px per mm, so several drawings share one (compare); default: fit the height */ pxPerMm?: number }) {
  const highlightedId = useWorkbench((s) => s.highlightedId);
  const setHighlighted = useWorkbench((s) => s.setHighlighted);
  const total = layers.reduce((a, l) => a + l.thickness, 0);
  if (layers.length === 0 || total <= 0) return null;
  const scale = pxPerMm ?? drawHeight(layers.length) / (total * 1000); // px per mm
  let y = TOP;
  let widened = false;
  const bands = layers.map((l) => {
    const natural = l.thickness * 1000 * scale;
    const h = Math.max(MIN_PX, natural);
    if (natural < MIN_PX) widened = true;
    const band = { layer: l, y, h };
    y += h;
    return band;
  });
  const bottom = y;
  const barMm = scaleBarMm(total * 1000);
  const barPx = barMm * scale;
  const height = bottom + 48;
  const focusCard = (id: string) => {
    const input = document.querySelector<HTMLInputElement>(`[data-layer-id="${id}"] input[data-field="name"]`);
    input?.focus();
    input?.scrollIntoView({ block: 'nearest' });
  };
  return (
    <figure className="sticky top-2" aria-label="Section drawing to scale">
      <svg width={WIDTH} height={height} viewBox={`0 0 ${WIDTH} ${height}`} role="group" aria-label={`Section to scale, ${mm(total)} mm from outside (top) to inside (bottom)`} data-testid="section-drawing">
        <text x={BAND_X + BAND_W / 2} y={14} textAnchor="middle" className="fill-ink-soft text-[11px] font-semibold">
          Outside
        </text>
        {bands.map(({ layer, y: by, h }, i) => {
          const on = highlightedId === layer.id;
          return (
            <g
              key={layer.id}
              tabIndex={0}
              role="button"
              aria-label={`${i + 1}: ${layer.name}, ${mm(layer.thickness)} mm, ${CLASS_LABELS[layer.materialClass]}`}
              data-testid="section-band"
              data-layer-id={layer.id}
              onPointerEnter={() => setHighlighted(layer.id)}
              onPointerLeave={() => setHighlighted(null)}
              onFocus={() => setHighlighted(layer.id)}
              onBlur={() => setHighlighted(null)}
              onClick={() => focusCard(layer.id)}
              onKeyDown={(e) => {
                if (e.key === 'Enter' || e.key === ' ') {
                  e.preventDefault();
                  focusCard(layer.id);
                }
              }}
              className="cursor-pointer outline-none"
            >
              <title>{`${layer.name}: ${mm(layer.thickness)} mm`}</title>
              <rect x={BAND_X} y={by} width={BAND_W} height={h} className={`${MAT_FILL[layer.materialClass]} stroke-ink/40`} strokeWidth={0.5} />
              {layer.materialClass === 'insulation' && h > 8 ? (
                <path
                  d={zigzag(BAND_X, by, BAND_W, h)}
                  className="fill-none stroke-ink/25"
                  strokeWidth={0.8}
                  pointerEvents="none"
                />
              ) : null}
              {on ? <rect x={BAND_X - 3} y={by - 1} width={BAND_W + 6} height={h + 2} className="fill-none stroke-accent" strokeWidth={2.5} /> : null}
              {on ? (
                <text x={BAND_X - 5} y={by + h / 2 + 4} textAnchor="end" className="fill-accent-strong text-[10px] font-semibold">
                  {i + 1}
                </text>
              ) : null}
            </g>
          );
        })}
        <text x={BAND_X + BAND_W / 2} y={bottom + 14} textAnchor="middle" className="fill-ink-soft text-[11px] font-semibold">
          Inside
        </text>
        <g aria-hidden="true">
          <line x1={BAND_X} x2={BAND_X + barPx} y1={bottom + 28} y2={bottom + 28} className="stroke-ink" strokeWidth={2} />
          <line x1={BAND_X} x2={BAND_X} y1={bottom + 24} y2={bottom + 32} className="stroke-ink" />
          <line x1={BAND_X + barPx} x2={BAND_X + barPx} y1={bottom + 24} y2={bottom + 32} className="stroke-ink" />
          <text x={BAND_X} y={bottom + 43} className="fill-ink-soft text-[10px]">
            {barMm} mm
          </text>
        </g>
      </svg>
      {widened ? <figcaption className="mt-1 w-32 text-[11px] leading-tight text-ink-faint">Layers under {fixedMm(MIN_PX / scale)} mm are drawn {MIN_PX} px wide so they stay visible.</figcaption> : null}
    </figure>
  );
}

function fixedMm(v: number): string {
  return v < 1 ? v.toFixed(1) : Math.round(v).toString();
}

/** a zig-zag across the band: the usual section mark of soft insulation */
function zigzag(x: number, y: number, w: number, h: number): string {
  const n = Math.max(2, Math.round(h / 10));
  const step = h / n;
  let d = `M${x} ${y}`;
  for (let i = 0; i < n; i++) {
    d += ` L${x + w} ${y + step * (i + 0.5)} L${x} ${y + step * (i + 1)}`;
  }
  return d;
}

export default memo(SectionDrawing);
