// sensitivity of one assembly: which layer property moves each figure most. pure: the plan of
// perturbed documents (base + every layer's thickness, conductivity, density and specific heat
// changed by −δ and +δ), the effects from the runs' figures, and the CSV of them.
import Papa from 'papaparse';
import type { WorkbenchDocument } from '../schemas/workbench.ts';
import type { CompareFigures } from './compare.ts';

export const PROPERTIES = ['thickness', 'conductivity', 'density', 'specificHeat'] as const;
export type Property = (typeof PROPERTIES)[number];

/** the words a person reads for each property */
export const PROPERTY_LABELS: Record<Property, string> = {
  thickness: 'thickness',
  conductivity: 'conductivity',
  density: 'density',
  specificHeat: 'specific heat',
};

export const METRIC_KEYS = ['uValue', 'decrementFactor', 'timeLag', 'peakInsideFlux', 'heatLost'] as const;
export type MetricKey = (typeof METRIC_KEYS)[number];

export interface MetricInfo {
  label: string;
  /** the name inside a sentence ("matters most for the …") */
  phrase: string;
  /** the unit the numbers are shown in */
  unit: string;
  /** from the SI value to the shown unit */
  scale: number;
  digits: number;
  how: string;
}

export const METRICS: Record<MetricKey, MetricInfo> = {
  uValue: { label: 'U-value', phrase: 'U-value', unit: 'W/m²K', scale: 1, digits: 4, how: 'Steady state, 1 / (R_se + Σ d/λ + R_si), ISO 6946.' },
  decrementFactor: {
    label: 'Decrement factor',
    phrase: 'decrement factor',
    unit: '–',
    scale: 1,
    digits: 4,
    how: 'Simulated: first harmonic of the inside heat flux over the last simulated day, divided by that of the driving outdoor temperature and by the U-value.',
  },
  timeLag: {
    label: 'Time lag',
    phrase: 'time lag',
    unit: 'h',
    scale: 1 / 3600,
    digits: 3,
    how: 'Simulated: phase of the first harmonic of the inside heat flux less that of the driving outdoor temperature, over the last simulated day.',
  },
  peakInsideFlux: { label: 'Peak inside heat flux', phrase: 'peak inside heat flux', unit: 'W/m²', scale: 1, digits: 3, how: 'Largest inside heat flux at the output times of the reported days (positive into the room; negative when the flux never enters it), as the workbench shows it.' },
  heatLost: {
    label: 'Heat lost, reported period',
    phrase: 'heat lost over the reported period',
    unit: 'Wh/m²',
    scale: 1,
    digits: 2,
    how: 'Time integral of the inside heat flux out of the room over the reported days (trapezoids split where the flux changes sign).',
  },
};

/** one figure of every metric, SI (time lag in s) */
export type Metrics = Record<MetricKey, number>;

/** the metrics of one run, from its compare figures */
export function metricsOf(f: CompareFigures): Metrics {
  return { uValue: f.uValue, decrementFactor: f.decrementFactor, timeLag: f.timeLag, peakInsideFlux: f.run.peakInsideFlux.value, heatLost: f.heatLost * 1000 /* kWh → Wh */ };
}

/** one changed property of one layer; sign −1 lowers it by the fraction, +1 raises it */
export interface Perturbation {
  layer: number;
  property: Property;
  sign: -1 | 1;
}

/** the largest fraction the sensitivity accepts (a property halved or raised by half) */
export const MAX_FRACTION = 0.5;

/** a clear message naming the field when the fraction is not usable, else null */
export function fractionIssue(fraction: number): string | null {
  if (!Number.isFinite(fraction) || fraction <= 0 || fraction > MAX_FRACTION) return `Change (%) must be a number greater than 0 and at most ${MAX_FRACTION * 100} %`;
  return null;
}

/**
 * The runs of a sensitivity, in a fixed order: null (the base document) first, then for each
 * layer (outside to inside) and each property, −fraction then +fraction. 1 + 8 × layers runs.
 */
export function perturbationPlan(layers: number): (Perturbation | null)[] {
  const plan: (Perturbation | null)[] = [null];
  for (let layer = 0; layer < layers; layer++) {
    for (const property of PROPERTIES) {
      plan.push({ layer, property, sign: -1 }, { layer, property, sign: 1 });
    }
  }
  return plan;
}

/** the document with one property of one layer changed by sign × fraction (relative); null gives the document itself */
export function perturbedDocument(doc: WorkbenchDocument, p: Perturbation | null, fraction: number): WorkbenchDocument {
  if (!p) return doc;
  const layers = doc.layers.map((l, i) => (i === p.layer ? { ...l, [p.property]: l[p.property] * (1 + p.sign * fraction) } : l));
  return { ...doc, layers };
}

/** how one property of one layer moves one metric */
export interface Effect {
  metric: MetricKey;
  /** index from the outside face */
  layer: number;
  layerName: string;
  property: Property;
  /** the metric of the base document and with the property lowered and raised (SI) */
  base: number;
  low: number;
  high: number;
  /** low − base and high − base (a time lag's change is taken the short way round the period) */
  deltaLow: number;
  deltaHigh: number;
  /** central difference (high − low) / (2 · fraction): the change per unit relative change of the property */
  slope: number;
  /** the larger of |deltaLow| and |deltaHigh|: the bar's reach, the order of the tornado */
  reach: number;
}

/** the change from a to b, for a time lag the short way round a period of `period` s */
function change(metric: MetricKey, a: number, b: number, period: number): number {
  const d = b - a;
  if (metric !== 'timeLag' || !Number.isFinite(d)) return d;
  return d - period * Math.round(d / period);
}

/**
 * The effects of a finished plan, per metric, ordered by reach (largest first).
 * `results[i]` holds the metrics of the run `perturbationPlan(doc.layers.length)[i]`.
 */
export function sensitivityEffects(doc: WorkbenchDocument, fraction: number, results: Metrics[], period = 86400): Record<MetricKey, Effect[]> {
  const plan = perturbationPlan(doc.layers.length);
  if (results.length !== plan.length) throw new Error(`expected ${plan.length} results, got ${results.length}`);
  const base = results[0];
  const byMetric = {} as Record<MetricKey, Effect[]>;
  for (const metric of METRIC_KEYS) {
    const list: Effect[] = [];
    for (let i = 1; i < plan.length; i += 2) {
      const p = plan[i]!;
      const low = results[i][metric];
      const high = results[i + 1][metric];
      const deltaLow = change(metric, base[metric], low, period);
      const deltaHigh = change(metric, base[metric], high, period);
      list.push({
        metric,
        layer: p.layer,
        layerName: doc.layers[p.layer].name,
        property: p.property,
        base: base[metric],
        low,
        high,
        deltaLow,
        deltaHigh,
        slope: (deltaHigh - deltaLow) / (2 * fraction),
        reach: Math.max(Math.abs(deltaLow), Math.abs(deltaHigh)),
      });
    }
    // NaN reaches (a figure the run cannot give) sink to the end
    list.sort((a, b) => (Number.isFinite(b.reach) ? b.reach : -1) - (Number.isFinite(a.reach) ? a.reach : -1));
    byMetric[metric] = list;
  }
  return byMetric;
}

/** "2: Mineral wool, conductivity" */
export function effectName(e: Pick<Effect, 'layer' | 'layerName' | 'property'>): string {
  return `${e.layer + 1}: ${e.layerName}, ${PROPERTY_LABELS[e.property]}`;
}

/** the effect that moves a metric most, or null when no effect is finite */
export function strongest(effects: Effect[]): Effect | null {
  const e = effects[0];
  return e && Number.isFinite(e.reach) ? e : null;
}

/** the effects of every metric as CSV, in the metric's shown unit */
export function effectsCsv(byMetric: Record<MetricKey, Effect[]>, fraction: number): string {
  const pct = +(fraction * 100).toFixed(6);
  const fields = [
    'figure',
    'unit',
    'rank',
    'layer',
    'layer name',
    'property',
    `value at −${pct} %`,
    'base value',
    `value at +${pct} %`,
    `change at −${pct} %`,
    `change at +${pct} %`,
    'change per +1 % of the property (central difference)',
  ];
  const data: (string | number)[][] = [];
  for (const metric of METRIC_KEYS) {
    const m = METRICS[metric];
    const f = (v: number) => (Number.isFinite(v) ? (v * m.scale).toFixed(m.digits + 2) : '');
    byMetric[metric].forEach((e, rank) => {
      data.push([m.label, m.unit, rank + 1, e.layer + 1, e.layerName, PROPERTY_LABELS[e.property], f(e.low), f(e.base), f(e.high), f(e.deltaLow), f(e.deltaHigh), f(e.slope / 100)]);
    });
  }
  return Papa.unparse({ fields, data }, { newline: '\n' });
}
