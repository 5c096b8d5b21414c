// the Glaser diagram of one month as an SVG string (no DOM): the layers as bands, the temperature
// line (right axis, °C) and the saturation and vapour pressure lines (left axis, Pa), against the
// thickness to scale or against the diffusion-equivalent air layer thickness s_d.
import { MONTH_NAMES } from './climate.ts';
import type { MoistureAssessment } from './assess.ts';
import { saturationPressure } from './saturation.ts';

export interface DiagramOptions {
  /** 'thickness': the section to scale; 'sd': against s_d (how the method is usually read) */
  axis?: 'thickness' | 'sd';
  width?: number;
  height?: number;
  /** a fill per layer (CSS colour); light greys by default */
  layerFills?: string[];
  /** the svg's accessible title; a default names the month */
  title?: string;
}

/** the colours of the lines, chosen for Wallpulse (read in grey too: solid, dashed, dotted) */
export const DIAGRAM_COLOURS = { temperature: '#bf5038', saturation: '#2b4c7e', vapour: '#21646a', condensation: '#a1302a', ink: '#23211d', soft: '#5d5850', line: '#dedad2' } as const;

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const r1 = (v: number): string => (Math.round(v * 10) / 10).toString();

/** round "nice" step for an axis spanning `span` with about `count` ticks */
function niceStep(span: number, count: number): number {
  const raw = span / Math.max(1, count);
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 2.5 ? 2.5 : m <= 5 ? 5 : 10) * p;
}

/** the Glaser diagram of month (1…12) of an assessment, as an SVG document string */
export function glaserDiagramSvg(a: MoistureAssessment, month: number, options: DiagramOptions = {}): string {
  const axis = options.axis ?? 'thickness';
  const width = options.width ?? 640;
  const height = options.height ?? 300;
  const m = a.glaser.months[month - 1];
  const planes = m.planes;
  const n = a.layers.length;
  const pos = planes.map((p) => (axis === 'sd' ? p.sd : p.x));
  const total = pos[n] > 0 ? pos[n] : 1;
  const left = 56;
  const right = 48;
  const top = 26;
  const bottom = 40;
  const plotW = width - left - right;
  const plotH = height - top - bottom;
  const X = (v: number) => left + (v / total) * plotW;

  // pressure axis: 0 … a round value above every pressure shown
  const pMax = Math.max(...planes.map((p) => Math.max(p.saturation, p.vapour)), m.insideVapourPressure);
  const pStep = niceStep(pMax, 5);
  const pTop = Math.ceil((pMax * 1.05) / pStep) * pStep;
  const YP = (p: number) => top + plotH * (1 - p / pTop);
  // temperature axis: a round range covering both airs
  const tLow = Math.min(m.outsideTemperature, m.insideTemperature);
  const tHigh = Math.max(m.outsideTemperature, m.insideTemperature);
  const tStep = niceStep(Math.max(1, tHigh - tLow), 5);
  const tMin = Math.floor(tLow / tStep) * tStep - (tHigh - tLow < 1 ? tStep : 0);
  const tMax = Math.ceil(tHigh / tStep) * tStep + (tHigh - tLow < 1 ? tStep : 0);
  const YT = (t: number) => top + plotH * (1 - (t - tMin) / (tMax - tMin || 1));

  const fills = options.layerFills ?? a.layers.map((_, i) => (i % 2 === 0 ? '#ece9e2' : '#f6f4ef'));
  const parts: string[] = [];
  const title = options.title ?? `Glaser diagram, ${MONTH_NAMES[month - 1]}, against ${axis === 'sd' ? 's_d' : 'the thickness'}`;
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${esc(title)}" font-family="'Source Sans 3', sans-serif" font-size="11">`);
  parts.push(`<title>${esc(title)}</title>`);
  // layer bands
  for (let i = 0; i < n; i++) {
    const x0 = X(pos[i]);
    const x1 = X(pos[i + 1]);
    parts.push(`<rect x="${r1(x0)}" y="${top}" width="${r1(Math.max(0.5, x1 - x0))}" height="${plotH}" fill="${esc(fills[i] ?? '#eee')}" stroke="${DIAGRAM_COLOURS.line}" stroke-width="0.5"><title>${esc(a.layers[i].name)}</title></rect>`);
  }
  // grid and axes
  for (let p = 0; p <= pTop + 1e-9; p += pStep) {
    const y = YP(p);
    parts.push(`<line x1="${left}" x2="${left + plotW}" y1="${r1(y)}" y2="${r1(y)}" stroke="${DIAGRAM_COLOURS.line}" stroke-width="0.5"/>`);
    parts.push(`<text x="${left - 4}" y="${r1(y + 3.5)}" text-anchor="end" fill="${DIAGRAM_COLOURS.soft}">${Math.round(p)}</text>`);
  }
  for (let t = tMin; t <= tMax + 1e-9; t += tStep) {
    parts.push(`<text x="${left + plotW + 4}" y="${r1(YT(t) + 3.5)}" fill="${DIAGRAM_COLOURS.temperature}">${(Math.round(t * 10) / 10).toString().replace('-', '\u2212')}</text>`);
  }
  parts.push(`<text x="${left - 4}" y="${top - 10}" text-anchor="end" fill="${DIAGRAM_COLOURS.soft}">Pa</text>`);
  parts.push(`<text x="${left + plotW + 4}" y="${top - 10}" fill="${DIAGRAM_COLOURS.temperature}">°C</text>`);
  parts.push(`<rect x="${left}" y="${top}" width="${plotW}" height="${plotH}" fill="none" stroke="${DIAGRAM_COLOURS.soft}" stroke-width="0.8"/>`);
  // s_d is written with a true subscript (no program-like token on screen); nothing here comes from the user
  const axisLabel = axis === 'sd' ? `s<tspan baseline-shift="sub" font-size="8">d</tspan> from the outside surface, m (total ${total >= 100 ? total.toFixed(0) : total.toFixed(2)} m)` : esc(`thickness from the outside surface, mm (total ${(total * 1000).toFixed(0)} mm)`);
  parts.push(`<text x="${left}" y="${height - 8}" fill="${DIAGRAM_COLOURS.soft}">outside</text>`);
  parts.push(`<text x="${left + plotW}" y="${height - 8}" text-anchor="end" fill="${DIAGRAM_COLOURS.soft}">inside</text>`);
  parts.push(`<text x="${left + plotW / 2}" y="${height - 8}" text-anchor="middle" fill="${DIAGRAM_COLOURS.soft}">${axisLabel}</text>`);

  // saturation: sampled inside each layer (the temperature is linear in both x and s_d within a layer)
  const sat: string[] = [];
  for (let i = 0; i < n; i++) {
    const steps = 12;
    for (let j = i === 0 ? 0 : 1; j <= steps; j++) {
      const f = j / steps;
      const v = pos[i] + f * (pos[i + 1] - pos[i]);
      const t = planes[i].temperature + f * (planes[i + 1].temperature - planes[i].temperature);
      sat.push(`${r1(X(v))},${r1(YP(saturationPressure(t)))}`);
    }
  }
  const temp = planes.map((p, k) => `${r1(X(pos[k]))},${r1(YT(p.temperature))}`);
  const vap = planes.map((p, k) => `${r1(X(pos[k]))},${r1(YP(p.vapour))}`);
  parts.push(`<polyline data-line="temperature" points="${temp.join(' ')}" fill="none" stroke="${DIAGRAM_COLOURS.temperature}" stroke-width="1.5" stroke-dasharray="2 3"/>`);
  parts.push(`<polyline data-line="saturation" points="${sat.join(' ')}" fill="none" stroke="${DIAGRAM_COLOURS.saturation}" stroke-width="1.8"/>`);
  parts.push(`<polyline data-line="vapour" points="${vap.join(' ')}" fill="none" stroke="${DIAGRAM_COLOURS.vapour}" stroke-width="1.8" stroke-dasharray="7 4"/>`);
  // condensation planes
  for (const k of m.condensationPlanes) {
    const x = X(pos[k]);
    parts.push(`<line data-condensation="${k}" x1="${r1(x)}" x2="${r1(x)}" y1="${top}" y2="${top + plotH}" stroke="${DIAGRAM_COLOURS.condensation}" stroke-width="2"/>`);
    parts.push(`<circle cx="${r1(x)}" cy="${r1(YP(planes[k].vapour))}" r="4" fill="${DIAGRAM_COLOURS.condensation}"/>`);
  }
  // legend
  const lx = left + 6;
  const legend: [string, string, string][] = [
    ['saturation pressure', DIAGRAM_COLOURS.saturation, ''],
    ['vapour pressure', DIAGRAM_COLOURS.vapour, '7 4'],
    ['temperature', DIAGRAM_COLOURS.temperature, '2 3'],
  ];
  legend.forEach(([label, colour, dash], i) => {
    const x = lx + i * 150;
    parts.push(`<line x1="${x}" x2="${x + 22}" y1="${top - 12}" y2="${top - 12}" stroke="${colour}" stroke-width="1.8"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
    parts.push(`<text x="${x + 26}" y="${top - 8}" fill="${DIAGRAM_COLOURS.ink}">${label}</text>`);
  });
  parts.push('</svg>');
  return parts.join('');
}
