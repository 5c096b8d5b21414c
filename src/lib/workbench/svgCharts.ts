// the charts of a run as SVG text, drawn on the server so they print, go into the PDF and read
// without JavaScript: the inside surface temperature, the inside heat flux, and the profile
// through the thickness at the hour of the peak inside heat flux. pure: strings out.
import type { RunDone } from './runDocument.ts';
import type { MaterialClass } from '../schemas/workbench.ts';
import { dayClock } from './figures.ts';
import { MAT_HEX } from './materialFills.ts';

const W = 720;
const H = 260;
const PAD = { left: 56, right: 16, top: 34, bottom: 58 };
/** the most points a line keeps (min and max of each bucket), so a year stays a small file */
const MAX_POINTS = 1200;

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const n1 = (v: number) => (Math.round(v * 10) / 10).toString();

/** "nice" tick values covering [lo, hi] */
function ticks(lo: number, hi: number, count = 5): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + 1e-9; v += step) out.push(Math.round(v / step) * step);
  return out;
}

const fmtTick = (v: number) => {
  const s = Math.abs(v) >= 10 || Number.isInteger(v) ? v.toFixed(0) : v.toFixed(1);
  return s.replace(/^-/, '\u2212');
};

/** indices to draw: every point when few, else the first, last, and min and max of each bucket */
function keep(values: ArrayLike<number>): number[] {
  const n = values.length;
  if (n <= MAX_POINTS) return Array.from({ length: n }, (_, i) => i);
  const buckets = Math.floor(MAX_POINTS / 2);
  const out: number[] = [];
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * n) / buckets);
    const to = Math.floor(((b + 1) * n) / buckets);
    let lo = from;
    let hi = from;
    for (let i = from; i < to; i++) {
      if (values[i] < values[lo]) lo = i;
      if (values[i] > values[hi]) hi = i;
    }
    out.push(Math.min(lo, hi), Math.max(lo, hi));
  }
  return out;
}

export interface Line {
  label: string;
  color: string;
  values: ArrayLike<number>;
  dash?: string;
  width?: number;
}

/** a line chart over x (hours, or mm for the profile) with a title, axes and a legend */
export function lineChart(opts: { title: string; x: ArrayLike<number>; xLabel: string; yLabel: string; lines: Line[]; bands?: { from: number; to: number; fill: string; label: string }[]; testId?: string }): string {
  const { x, lines } = opts;
  let ylo = Infinity;
  let yhi = -Infinity;
  for (const l of lines) for (let i = 0; i < l.values.length; i++) if (Number.isFinite(l.values[i])) (ylo = Math.min(ylo, l.values[i])), (yhi = Math.max(yhi, l.values[i]));
  if (!Number.isFinite(ylo)) (ylo = 0), (yhi = 1);
  if (yhi - ylo < 1e-6) (ylo -= 1), (yhi += 1);
  const margin = (yhi - ylo) * 0.06;
  ylo -= margin;
  yhi += margin;
  const xlo = x[0] ?? 0;
  const xhi = x[x.length - 1] ?? 1;
  const pw = W - PAD.left - PAD.right;
  const ph = H - PAD.top - PAD.bottom;
  const sx = (v: number) => PAD.left + ((v - xlo) / (xhi - xlo || 1)) * pw;
  const sy = (v: number) => PAD.top + (1 - (v - ylo) / (yhi - ylo)) * ph;
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="100%" role="img" aria-label="${esc(opts.title)}"${opts.testId ? ` data-testid="${opts.testId}"` : ''} font-family="'Source Sans 3', sans-serif" style="max-width:${W}px;height:auto">`);
  parts.push(`<text x="${PAD.left}" y="18" font-size="14" font-weight="600" fill="#23211d">${esc(opts.title)}</text>`);
  for (const b of opts.bands ?? []) {
    parts.push(`<rect x="${n1(sx(b.from))}" y="${PAD.top}" width="${n1(Math.max(0.5, sx(b.to) - sx(b.from)))}" height="${ph}" fill="${b.fill}" opacity="0.45"><title>${esc(b.label)}</title></rect>`);
  }
  for (const t of ticks(ylo, yhi)) {
    parts.push(`<line x1="${PAD.left}" x2="${W - PAD.right}" y1="${n1(sy(t))}" y2="${n1(sy(t))}" stroke="#dedad2" stroke-width="1"/>`);
    parts.push(`<text x="${PAD.left - 6}" y="${n1(sy(t) + 4)}" font-size="11" text-anchor="end" fill="#5d5850">${fmtTick(t)}</text>`);
  }
  for (const t of ticks(xlo, xhi, 8)) {
    parts.push(`<line x1="${n1(sx(t))}" x2="${n1(sx(t))}" y1="${PAD.top + ph}" y2="${PAD.top + ph + 4}" stroke="#5d5850"/>`);
    parts.push(`<text x="${n1(sx(t))}" y="${PAD.top + ph + 16}" font-size="11" text-anchor="middle" fill="#5d5850">${fmtTick(t)}</text>`);
  }
  parts.push(`<rect x="${PAD.left}" y="${PAD.top}" width="${pw}" height="${ph}" fill="none" stroke="#b9b3a7"/>`);
  parts.push(`<text x="${PAD.left + pw / 2}" y="${PAD.top + ph + 32}" font-size="11" text-anchor="middle" fill="#5d5850">${esc(opts.xLabel)}</text>`);
  parts.push(`<text transform="translate(14 ${PAD.top + ph / 2}) rotate(-90)" font-size="11" text-anchor="middle" fill="#5d5850">${esc(opts.yLabel)}</text>`);
  for (const l of lines) {
    const idx = keep(l.values);
    const d = idx.map((i, j) => `${j === 0 ? 'M' : 'L'}${n1(sx(x[i]))} ${n1(sy(l.values[i]))}`).join('');
    parts.push(`<path d="${d}" fill="none" stroke="${l.color}" stroke-width="${l.width ?? 1.5}"${l.dash ? ` stroke-dasharray="${l.dash}"` : ''}/>`);
  }
  // legend under the axis label
  let lx = PAD.left;
  for (const l of lines) {
    parts.push(`<line x1="${lx}" x2="${lx + 18}" y1="${H - 8}" y2="${H - 8}" stroke="${l.color}" stroke-width="2"${l.dash ? ` stroke-dasharray="${l.dash}"` : ''}/>`);
    parts.push(`<text x="${lx + 22}" y="${H - 4}" font-size="11" fill="#23211d">${esc(l.label)}</text>`);
    lx += 30 + l.label.length * 6;
  }
  parts.push('</svg>');
  return parts.join('');
}

export interface RunCharts {
  /** the title of each chart, as the chart shows it */
  titles: { surface: string; flux: string; profile: string };
  surface: string;
  flux: string;
  profile: string;
}

/** the three charts of a run; `classes` colour the layers behind the profile */
export function runCharts(run: RunDone, classes: MaterialClass[]): RunCharts {
  const s = run.series;
  const hours = Float64Array.from(s.time, (t) => t / 3600);
  const titles = {
    surface: 'Inside surface temperature over the reported days',
    flux: 'Inside heat flux over the reported days (positive into the room)',
    profile: '',
  };
  const surface = lineChart({
    title: titles.surface,
    x: hours,
    xLabel: 'hours from the start of the first reported day',
    yLabel: '°C',
    testId: 'chart-surface',
    lines: [
      { label: 'inside surface', color: '#bf5038', values: s.insideSurface, width: 2 },
      { label: 'indoor air', color: '#21646a', values: s.insideAir },
      { label: 'outdoor air', color: '#3f6ea8', values: s.outsideAir, dash: '4 3' },
    ],
  });
  const flux = lineChart({
    title: titles.flux,
    x: hours,
    xLabel: 'hours from the start of the first reported day',
    yLabel: 'W/m²',
    testId: 'chart-flux',
    lines: [{ label: 'inside heat flux', color: '#174a4f', values: s.insideFlux, width: 2 }],
  });
  // the profile at the output time of the peak inside heat flux
  let k = 0;
  for (let i = 1; i < run.nTimes; i++) if (s.insideFlux[i] > s.insideFlux[k]) k = i;
  titles.profile = `Temperature through the build-up at the peak inside heat flux (${dayClock(s.time[k])})`;
  const xmm = Float64Array.from(s.x, (v) => v * 1000);
  const row = s.profiles.subarray(k * run.nNodes, (k + 1) * run.nNodes);
  const bands = run.layerBounds.slice(0, -1).map((from, i) => ({
    from: from * 1000,
    to: run.layerBounds[i + 1] * 1000,
    fill: MAT_HEX[classes[i]] ?? '#eeeae2',
    label: `layer ${i + 1}`,
  }));
  const profile = lineChart({
    title: titles.profile,
    x: xmm,
    xLabel: 'mm from the outside face (outside at the left)',
    yLabel: '°C',
    testId: 'chart-profile',
    bands,
    lines: [{ label: 'temperature', color: '#bf5038', values: row, width: 2 }],
  });
  return { titles, surface, flux, profile };
}
