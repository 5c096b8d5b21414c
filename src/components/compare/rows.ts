// the rows of the compare table: what each figure is, how it is computed, which way is best,
// and the best of a row and each alternative's difference to the baseline
import type { CompareFigures } from '../../lib/workbench/compare';
import type { MoistureFigures } from '../../lib/moisture/index';
import { dayClock } from '../../lib/workbench/figures';

export interface CompareRowDef {
  key: string;
  label: string;
  unit: string;
  digits: number;
  /** the number compared (in the shown unit); NaN when there is none */
  value: (f: CompareFigures) => number;
  /** a note under the value (e.g. when the peak happens) */
  note?: (f: CompareFigures) => string;
  /** 'low' or 'high' is best; null: no best in this row */
  best: 'low' | 'high' | null;
  /** what "best" means in this row */
  bestMeans: string;
  how: (days: number) => string;
}

const per = (days: number) => `over the ${days} reported ${days === 1 ? 'day' : 'days'}`;

export const COMPARE_ROWS: CompareRowDef[] = [
  {
    key: 'uValue',
    label: 'U-value',
    unit: 'W/m²K',
    digits: 3,
    value: (f) => f.uValue,
    best: 'low',
    bestMeans: 'Lowest is best: the least heat passes through at steady state.',
    how: () => 'Steady state: 1 / (R_se + Σ d/λ + R_si), ISO 6946.',
  },
  {
    key: 'arealHeatCapacity',
    label: 'Areal heat capacity',
    unit: 'kJ/m²K',
    digits: 1,
    value: (f) => f.arealHeatCapacity / 1000,
    best: 'high',
    bestMeans: 'Highest is best here: the most heat stored per kelvin, which steadies the room.',
    how: () => 'Σ ρ·c·d over all layers: the heat stored per square metre per kelvin of uniform temperature rise.',
  },
  {
    key: 'decrementFactor',
    label: 'Decrement factor',
    unit: '–',
    digits: 3,
    value: (f) => f.decrementFactor,
    best: 'low',
    bestMeans: 'Lowest is best: the smallest share of the outdoor swing reaches the room (damps the swing most).',
    how: () =>
      'Simulated: amplitude of the first harmonic of the inside heat flux over the last simulated day, divided by that of the driving outdoor temperature (sol-air with sun) and by the U-value; as the workbench shows it.',
  },
  {
    key: 'timeLag',
    label: 'Time lag',
    unit: 'h',
    digits: 2,
    value: (f) => f.timeLag / 3600,
    best: 'high',
    bestMeans: 'Longest is marked: the inside heat flux peaks latest after the outdoor peak (reacts latest).',
    how: () => 'Simulated: phase of the first harmonic of the inside heat flux less that of the driving outdoor temperature, over the last simulated day.',
  },
  {
    key: 'peakGain',
    label: 'Peak heat gain',
    unit: 'W/m²',
    digits: 2,
    value: (f) => f.peakGain.value,
    note: (f) => (Number.isFinite(f.peakGain.time) ? dayClock(f.peakGain.time) : 'no heat enters the room'),
    best: 'low',
    bestMeans: 'Lowest is best: the smallest peak of heat into the room (cooling load).',
    how: (d) => `Largest inside heat flux into the room at the output times ${per(d)}, and when it happens; 0 when the flux never enters the room.`,
  },
  {
    key: 'peakLoss',
    label: 'Peak heat loss',
    unit: 'W/m²',
    digits: 2,
    value: (f) => f.peakLoss.value,
    note: (f) => (Number.isFinite(f.peakLoss.time) ? dayClock(f.peakLoss.time) : 'no heat leaves the room'),
    best: 'low',
    bestMeans: 'Lowest is best: the smallest peak of heat out of the room (heating load).',
    how: (d) => `Largest inside heat flux out of the room (shown as a positive number) at the output times ${per(d)}, and when it happens; 0 when the flux never leaves the room.`,
  },
  {
    key: 'heatGained',
    label: 'Heat gained, reported period',
    unit: 'kWh/m²',
    digits: 3,
    value: (f) => f.heatGained,
    best: 'low',
    bestMeans: 'Lowest is best: the least heat enters the room.',
    how: (d) => `Time integral of the inside heat flux into the room ${per(d)} (trapezoids split where the flux changes sign).`,
  },
  {
    key: 'heatLost',
    label: 'Heat lost, reported period',
    unit: 'kWh/m²',
    digits: 3,
    value: (f) => f.heatLost,
    best: 'low',
    bestMeans: 'Lowest is best: the least heat leaves the room (loses least heat).',
    how: (d) => `Time integral of the inside heat flux out of the room ${per(d)}, shown as a positive amount.`,
  },
  {
    key: 'lowestInterface',
    label: 'Lowest interface temperature',
    unit: '°C',
    digits: 2,
    value: (f) => f.lowestInterface?.value ?? NaN,
    note: (f) => (f.lowestInterface ? `${f.lowestInterface.name}, ${dayClock(f.lowestInterface.time)}` : 'one layer: no interface'),
    best: 'high',
    bestMeans: 'Highest is best: the coldest interface stays furthest above the dew point of the indoor air.',
    how: (d) => `Lowest temperature of any interface between two layers at the output times ${per(d)}.`,
  },
  {
    key: 'accuracy',
    label: 'Discretisation error, estimated',
    unit: '%',
    digits: 2,
    value: (f) => (f.accuracy ? f.accuracy.relative * 100 : NaN),
    note: (f) => (f.accuracy ? `±${f.accuracy.maxDifference.toFixed(3)} W/m² against ${f.accuracy.coarseCells} cells, ${f.accuracy.coarseTimeStep} s` : 'not made'),
    best: null,
    bestMeans: 'No best here: it says how far the simulated traces can be trusted, not which build-up is better.',
    how: () =>
      'The largest difference of the inside heat flux between this run and the same run at twice the time step and twice the largest cell, over the reported days, relative to the flux amplitude (an upper estimate of the discretisation error, as the workbench makes it).',
  },
];

/** the index of the best alternative(s) of a row: all that equal the best at the shown precision; none when all are equal or the row has no best */
export function bestOf(row: CompareRowDef, figures: CompareFigures[]): Set<number> {
  const best = new Set<number>();
  if (!row.best || figures.length < 2) return best;
  const shown = figures.map((f) => {
    const v = row.value(f);
    return Number.isFinite(v) ? Number(v.toFixed(row.digits)) : NaN;
  });
  const finite = shown.filter(Number.isFinite);
  if (finite.length === 0) return best;
  const target = row.best === 'low' ? Math.min(...finite) : Math.max(...finite);
  if (finite.every((v) => v === target)) return best;
  shown.forEach((v, i) => v === target && best.add(i));
  return best;
}

/** a signed difference with a real minus sign, or '–' */
export function signed(v: number, digits: number): string {
  if (!Number.isFinite(v)) return '–';
  const s = Math.abs(v).toFixed(digits);
  if (Number(s) === 0) return `±${s}`;
  return `${v < 0 ? '\u2212' : '+'}${s}`;
}

/** an ISO 13788 risk: water accumulates over the year (the check fails) or the surface check fails; drying out within the year passes */
export function moistureRisk(m: MoistureFigures | null): boolean {
  return !!m && (m.verdict === 'accumulates' || m.mouldRisk || m.condensationRisk);
}
