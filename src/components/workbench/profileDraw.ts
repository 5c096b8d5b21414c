// draws the temperature profile through the thickness at one moment of a run, on a canvas:
// layer bands behind, the curve, and the two air temperatures at the ends (the films dashed).
import type { RunDone } from '../../lib/workbench/runDocument';
import type { MaterialClass } from '../../lib/schemas/workbench';
import { dayClock } from '../../lib/workbench/figures';

export interface ProfileStyle {
  fills: Record<MaterialClass, string>;
  ink: string;
  soft: string;
  faint: string;
  line: string;
  panel: string;
  outdoor: string;
  indoor: string;
  curve: string;
}

const css = (name: string, fallback: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

/** the theme's colours, read once from the CSS variables */
export function profileStyle(): ProfileStyle {
  const classes: MaterialClass[] = ['masonry', 'concrete', 'timber', 'insulation', 'board', 'metal', 'membrane', 'air', 'render'];
  const fills = Object.fromEntries(classes.map((c) => [c, css(`--color-mat-${c}`, '#e6e0d3')])) as Record<MaterialClass, string>;
  return {
    fills,
    ink: css('--color-ink', '#23211d'),
    soft: css('--color-ink-soft', '#5d5850'),
    faint: css('--color-ink-faint', '#8b857a'),
    line: css('--color-line', '#dedad2'),
    panel: css('--color-panel', '#ffffff'),
    outdoor: css('--color-t1', '#3f6ea8'),
    indoor: css('--color-t7', '#bf5038'),
    curve: css('--color-ink', '#23211d'),
  };
}

/** the temperature range over the whole run, so the axis stands still while the curve moves */
export function profileRange(run: RunDone): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  const scan = (a: Float64Array) => {
    for (let i = 0; i < a.length; i++) {
      const v = a[i];
      if (v < min) min = v;
      if (v > max) max = v;
    }
  };
  scan(run.series.profiles);
  scan(run.series.outsideAir);
  scan(run.series.solAir);
  scan(run.series.insideAir);
  const pad = Math.max(0.5, (max - min) * 0.06);
  return { min: Math.floor(min - pad), max: Math.ceil(max + pad) };
}

function niceStep(span: number, target: number): number {
  const raw = span / target;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

/**
 * draws the profile at fractional output index `pos` (linear between outputs).
 * `scratch` is a reusable buffer of nNodes values (no allocation per frame).
 */
export function drawProfile(
  ctx: CanvasRenderingContext2D,
  width: number,
  height: number,
  run: RunDone,
  classes: MaterialClass[],
  range: { min: number; max: number },
  pos: number,
  style: ProfileStyle,
  scratch: Float64Array,
): void {
  const { series: s, nNodes, nTimes, layerBounds } = run;
  const k0 = Math.max(0, Math.min(nTimes - 1, Math.floor(pos)));
  const k1 = Math.min(nTimes - 1, k0 + 1);
  const f = Math.max(0, Math.min(1, pos - k0));
  const p = s.profiles;
  for (let i = 0; i < nNodes; i++) scratch[i] = p[k0 * nNodes + i] + f * (p[k1 * nNodes + i] - p[k0 * nNodes + i]);
  const lerp = (a: Float64Array) => a[k0] + f * (a[k1] - a[k0]);
  const tOut = lerp(s.solAir);
  const airOut = lerp(s.outsideAir);
  const tIn = lerp(s.insideAir);
  const time = lerp(s.time);

  const left = 86;
  const right = width - 86;
  const top = 22;
  const bottom = height - 30;
  const total = layerBounds[layerBounds.length - 1];
  const X = (x: number) => left + (x / total) * (right - left);
  const Y = (t: number) => bottom - ((t - range.min) / (range.max - range.min)) * (bottom - top);

  ctx.save();
  ctx.fillStyle = style.panel;
  ctx.fillRect(0, 0, width, height);
  ctx.font = '12px "Source Sans 3", sans-serif';

  // layer bands
  for (let j = 0; j < classes.length; j++) {
    ctx.fillStyle = style.fills[classes[j]] ?? style.line;
    ctx.globalAlpha = 0.55;
    ctx.fillRect(X(layerBounds[j]), top, X(layerBounds[j + 1]) - X(layerBounds[j]), bottom - top);
  }
  ctx.globalAlpha = 1;
  ctx.strokeStyle = style.line;
  ctx.lineWidth = 1;
  for (const b of layerBounds) {
    ctx.beginPath();
    ctx.moveTo(Math.round(X(b)) + 0.5, top);
    ctx.lineTo(Math.round(X(b)) + 0.5, bottom);
    ctx.stroke();
  }

  // temperature grid and labels
  const step = niceStep(range.max - range.min, 6);
  ctx.fillStyle = style.soft;
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (let t = Math.ceil(range.min / step) * step; t <= range.max + 1e-9; t += step) {
    const y = Math.round(Y(t)) + 0.5;
    ctx.strokeStyle = style.line;
    ctx.setLineDash([2, 3]);
    ctx.beginPath();
    ctx.moveTo(left - 40, y);
    ctx.lineTo(right + 40, y);
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.fillText(`${Number(t.toFixed(6))}`, left - 44, y);
  }
  ctx.save();
  ctx.translate(12, (top + bottom) / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.textAlign = 'center';
  ctx.fillText('temperature (°C)', 0, 0);
  ctx.restore();

  // thickness axis, mm
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  const mm = total * 1000;
  const xs = niceStep(mm, 6);
  for (let v = 0; v <= mm + 1e-9; v += xs) ctx.fillText(`${Number(v.toFixed(3))}`, X(v / 1000), bottom + 4);
  ctx.fillText('mm from the outside face', (left + right) / 2, bottom + 16);

  // films: air to surface, dashed
  const end = (xAir: number, tAir: number, xSurf: number, tSurf: number, colour: string, label: string, align: CanvasTextAlign) => {
    ctx.strokeStyle = colour;
    ctx.setLineDash([4, 3]);
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    ctx.moveTo(xAir, Y(tAir));
    ctx.lineTo(xSurf, Y(tSurf));
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.fillStyle = colour;
    ctx.beginPath();
    ctx.arc(xAir, Y(tAir), 5, 0, Math.PI * 2);
    ctx.fill();
    ctx.textAlign = align;
    ctx.textBaseline = 'bottom';
    ctx.fillText(label, align === 'left' ? 4 : width - 4, Y(tAir) - 8);
  };
  end(left - 30, tOut, X(0), scratch[0], style.outdoor, `${tOut !== airOut ? 'sol-air' : 'outdoor'} ${tOut.toFixed(1)} °C`, 'left');
  end(right + 30, tIn, X(total), scratch[nNodes - 1], style.indoor, `indoor ${tIn.toFixed(1)} °C`, 'right');
  if (tOut !== airOut) {
    ctx.strokeStyle = style.outdoor;
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    ctx.arc(left - 30, Y(airOut), 4, 0, Math.PI * 2);
    ctx.stroke();
  }

  // the profile
  ctx.strokeStyle = style.curve;
  ctx.lineWidth = 2.5;
  ctx.lineJoin = 'round';
  ctx.beginPath();
  const x = s.x;
  for (let i = 0; i < nNodes; i++) {
    const px = X(x[i]);
    const py = Y(scratch[i]);
    if (i === 0) ctx.moveTo(px, py);
    else ctx.lineTo(px, py);
  }
  ctx.stroke();

  ctx.fillStyle = style.ink;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'top';
  ctx.font = '600 12px "Source Sans 3", sans-serif';
  ctx.fillText(dayClock(time), left, 4);
  ctx.restore();
}
