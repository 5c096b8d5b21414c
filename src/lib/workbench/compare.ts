// the figures of one compared alternative, from an engine result: what the compare table,
// the overlaid traces and the sensitivity need. pure: the compare worker and the tests call it.
// the periodic figures come from figures() (the same fit the workbench's figures table uses);
// the peaks and the heat are taken over the whole reported period.
import type { ModelData } from '../schemas/model.ts';
import { effectiveWarmupDays, isRepeatingExposure, type WorkbenchDocument } from '../schemas/workbench.ts';
import type { Result } from '../thermal/types.ts';
import { assessDocument, moistureFigures, type MoistureFigures } from '../moisture/index.ts';
import { figures, type AccuracyEstimate, type RunFigures, type TimedValue } from './figures.ts';
import { accuracyOf, schemeOf, solAirSeries } from './runDocument.ts';

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
  /** W/m² into the room, the workbench's peak heat gain over the reported days (0 at no time when the flux never enters the room) */
  peakGain: TimedValue;
  /** W/m² out of the room as a positive number, the workbench's peak heat loss (0 when none) */
  peakLoss: TimedValue;
  /** kWh/m² into the room over the reported period */
  heatGained: number;
  /** kWh/m² out of the room over the reported period (a positive number) */
  heatLost: number;
  /** days in the reported period */
  reportedDays: number;
  lowestInterface: RunFigures['lowestInterface'];
  /** the ISO 13788 check under the exposure's monthly climate; null without one */
  moisture: MoistureFigures | null;
  /** the discretisation estimate (the run against its twin at twice the step and cell); null when not made */
  accuracy: AccuracyEstimate | null;
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

export interface CompareOptions {
  /** the run's twin at twice the step and cell (coarserModel), for the discretisation estimate */
  coarse?: { model: ModelData; result: Result } | null;
  /** make the ISO 13788 check (default true) */
  moisture?: boolean;
  /** pack the traces (default true) */
  withSeries?: boolean;
}

/** s from the start of the run where the reported days begin, as the workbench counts it */
export function reportStartOf(doc: WorkbenchDocument): number {
  return effectiveWarmupDays(doc.exposure) * DAY;
}

function moistureOf(doc: WorkbenchDocument): MoistureFigures | null {
  try {
    const a = assessDocument(doc);
    return a ? moistureFigures(a) : null;
  } catch {
    // a layer without its vapour resistance: the workbench names it in the Moisture pane
    return null;
  }
}

/** the compare figures (and the traces) of one run of `doc` built as `model`, with the workbench's figures() */
export function compareRun(doc: WorkbenchDocument, model: ModelData, result: Result, options: CompareOptions = {}): CompareRun {
  const s = result.series;
  const reportStart = reportStartOf(doc);
  const interfaceNames = doc.layers.slice(1).map((l, j) => `${doc.layers[j].name} / ${l.name}`);
  const out = doc.exposure.outdoor;
  const coarse = options.coarse ?? null;
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
    moisture: options.moisture === false ? null : moistureOf(doc),
    outdoorPeriodic: isRepeatingExposure(doc.exposure) && out.mode !== 'series',
    scheme: schemeOf(result),
    accuracy: coarse ? accuracyOf(s.time, s.insideFlux, reportStart, coarse.result, coarse.model) : null,
    otherStart: null,
    indoorConstant: doc.exposure.indoor.mode === 'constant',
  });
  const end = s.time.length > 0 ? s.time[s.time.length - 1] : 0;
  const figs: CompareFigures = {
    uValue: result.steady.uValue,
    arealHeatCapacity: result.layers.reduce((a, l) => a + l.arealHeatCapacity, 0),
    decrementFactor: run.decrementFactor.simulated,
    timeLag: run.timeLag.simulated,
    decrementFactorAnalytic: result.periodic.decrementFactor,
    timeLagAnalytic: result.periodic.timeLag,
    peakGain: run.peakHeatGain,
    peakLoss: run.peakHeatLoss,
    heatGained: run.totalHeatGained,
    heatLost: run.totalHeatLost,
    reportedDays: (end - reportStart) / DAY,
    lowestInterface: run.lowestInterface,
    moisture: run.moisture,
    accuracy: run.accuracy,
    run,
  };
  let first = 0;
  while (first < s.time.length && s.time[first] < reportStart - 1e-6) first++;
  const n = options.withSeries === false ? 0 : s.time.length - first;
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
