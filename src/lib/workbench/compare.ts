// the figures of one compared alternative, from an engine result: what the compare table,
// the overlaid traces and the sensitivity need. pure: the compare worker and the tests call it.
// the periodic figures come from figures() (the same fit the workbench's figures table uses);
// the peaks and the heat are taken over the whole reported period.
import type { ModelData } from '../schemas/model.ts';
import type { WorkbenchDocument } from '../schemas/workbench.ts';
import type { Result } from '../thermal/types.ts';
import { figures, splitIntegral, type RunFigures, type TimedValue } from './figures.ts';
import { moistureOfDocument, schemeOf, solAirSeries } from './runDocument.ts';

const DAY = 86400;
const HOUR = 3600;

/** the figures of one alternative under the compared exposure */
export interface CompareFigures {
  /** W/m²K, ISO 6946 */
  uValue: number;
  /** J/m²K: Σ ρ·c·d over all layers */
  arealHeatCapacity: number;
  /** simulated (first harmonic of the last day), as the workbench's figures table shows it */
  decrementFactor: number;
  /** s, simulated */
  timeLag: number;
  /** ISO 13786 transfer matrices */
  decrementFactorAnalytic: number;
  /** s, ISO 13786 */
  timeLagAnalytic: number;
  /** W/m², the largest inside heat flux into the room over the reported period, and when (s from midnight of the first reported day); 0 at no time when the flux never enters the room */
  peakGain: TimedValue;
  /** W/m², the largest heat flux out of the room (a positive number), and when; 0 at no time when the flux never leaves the room */
  peakLoss: TimedValue;
  /** Wh/m² into the room over the reported period */
  heatGained: number;
  /** Wh/m² out of the room over the reported period (a positive number) */
  heatLost: number;
  /** days in the reported period */
  reportedDays: number;
  /** the ISO 13788 moisture check under the document's monthly climate; null without a climate */
  moisture: RunFigures['moisture'];
  lowestInterface: RunFigures['lowestInterface'];
  /** the workbench's own figures of the run, for what the table does not repeat */
  run: RunFigures;
}

/** one alternative's traces over the reported period, column-wise */
export interface CompareSeries {
  /** h from midnight of the first reported day */
  hours: Float64Array;
  insideSurface: Float64Array;
  /** W/m², positive into the room */
  insideFlux: Float64Array;
}

export interface CompareRun {
  figures: CompareFigures;
  series: CompareSeries;
}

/** s from the start of the run where the reported days begin: the run's end less the reported days */
export function reportStartOf(doc: WorkbenchDocument, model: Pick<ModelData, 'duration'>): number {
  return Math.max(0, model.duration - doc.exposure.days * DAY);
}

function extreme(time: ArrayLike<number>, values: ArrayLike<number>, from: number, sign: 1 | -1): TimedValue {
  let best = NaN;
  let at = NaN;
  for (let k = 0; k < time.length; k++) {
    if (time[k] < from - 1e-6) continue;
    if (Number.isNaN(best) || sign * values[k] > sign * best) {
      best = values[k];
      at = time[k] - from;
    }
  }
  return { value: best, time: at };
}

/** the compare figures (and, unless `withSeries` is false, the traces) of one run of `doc` built as `model` */
export function compareRun(doc: WorkbenchDocument, model: ModelData, result: Result, withSeries = true): CompareRun {
  const s = result.series;
  const reportStart = reportStartOf(doc, model);
  const end = s.time.length > 0 ? s.time[s.time.length - 1] : 0;
  const interfaceNames = doc.layers.slice(1).map((l, j) => `${doc.layers[j].name} / ${l.name}`);
  const out = doc.exposure.outdoor;
  const run = figures({
    time: s.time,
    reportStart,
    period: result.periodic.period,
    outsideAir: s.outsideAir,
    solAir: solAirSeries(model, s.time, s.outsideAir),
    insideAir: s.insideAir,
    insideSurface: s.insideSurface,
    insideFlux: s.insideFlux,
    interfaces: s.interfaces,
    interfaceNames,
    uValue: result.steady.uValue,
    analytic: result.periodic,
    bookkeepingClosure: result.energy.balanceError,
    cells: result.stats.cells,
    timeStep: model.timeStep,
    maxCellSize: doc.exposure.maxCellSize,
    moisture: moistureOfDocument(doc),
    outdoorPeriodic: out.mode !== 'series',
    scheme: schemeOf(result),
    indoorConstant: doc.exposure.indoor.mode === 'constant',
  });
  const gain = extreme(s.time, s.insideFlux, reportStart, 1);
  const loss = extreme(s.time, s.insideFlux, reportStart, -1);
  const heat = splitIntegral(s.time, s.insideFlux, reportStart, end);
  const figs: CompareFigures = {
    uValue: result.steady.uValue,
    arealHeatCapacity: result.layers.reduce((a, l) => a + l.arealHeatCapacity, 0),
    decrementFactor: run.decrementFactor.simulated,
    timeLag: run.timeLag.simulated,
    decrementFactorAnalytic: result.periodic.decrementFactor,
    timeLagAnalytic: result.periodic.timeLag,
    peakGain: gain.value > 0 ? gain : { value: 0, time: NaN },
    peakLoss: loss.value < 0 ? { value: -loss.value, time: loss.time } : { value: 0, time: NaN },
    heatGained: heat.positive / HOUR,
    heatLost: -heat.negative / HOUR,
    reportedDays: (end - reportStart) / DAY,
    moisture: run.moisture,
    lowestInterface: run.lowestInterface,
    run,
  };
  let first = 0;
  while (first < s.time.length && s.time[first] < reportStart - 1e-6) first++;
  const n = withSeries ? s.time.length - first : 0;
  const hours = new Float64Array(n);
  const insideSurface = new Float64Array(n);
  const insideFlux = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    hours[k] = (s.time[first + k] - reportStart) / HOUR;
    insideSurface[k] = s.insideSurface[first + k];
    insideFlux[k] = s.insideFlux[first + k];
  }
  return { figures: figs, series: { hours, insideSurface, insideFlux } };
}
