// one run of a workbench document: validate, build the engine model, simulate, pack the
// reported days into flat Float64Arrays (so a worker can transfer them) and compute the
// figures. pure: the worker, the report page and the tests all call this.
import { formatPath, parseModel, type ModelData } from '../schemas/model.ts';
import { workbenchDocumentSchema, toModel, effectiveWarmupDays, isRepeatingExposure, type UploadedSeries, type WorkbenchDocument } from '../schemas/workbench.ts';
import { simulate, SimulationCancelled, analyse, compileSignal, signalAt, solAirTemperature } from '../thermal/index.ts';
import type { Figures as AnalyticFigures, Result } from '../thermal/types.ts';
import { figures, type AccuracyEstimate, type RunFigures } from './figures.ts';
import { assessDocument, moistureFigures } from '../moisture/index.ts';

const DAY = 86400;

/** the reported days of a run, column-wise; every array has nTimes entries unless noted */
export interface RunSeries {
  /** s from midnight of the first reported day (the warm-up is left out) */
  time: Float64Array;
  outsideAir: Float64Array;
  /** sol-air temperature (equals the outside air without sun) */
  solAir: Float64Array;
  outsideSurface: Float64Array;
  insideSurface: Float64Array;
  insideAir: Float64Array;
  /** W/m², positive towards the inside */
  outsideFlux: Float64Array;
  /** W/m², positive into the room */
  insideFlux: Float64Array;
  /** nInterfaces × nTimes, one row per interface */
  interfaces: Float64Array;
  /** node positions from the outside face, m (nNodes) */
  x: Float64Array;
  /** nTimes × nNodes, one row per output time */
  profiles: Float64Array;
}

export interface RunDone {
  kind: 'done';
  nTimes: number;
  nNodes: number;
  nInterfaces: number;
  interfaceNames: string[];
  /** layer boundaries from the outside face, m (layers + 1 values) */
  layerBounds: number[];
  series: RunSeries;
  figures: RunFigures;
  analytic: AnalyticFigures;
  /** s between outputs */
  outputInterval: number;
  /** engine time, ms */
  elapsedMs: number;
  steps: number;
}

export interface RunInvalid {
  kind: 'invalid';
  /** `path: message` lines */
  issues: string[];
}

export interface RunCancelled {
  kind: 'cancelled';
}

export type RunOutcome = RunDone | RunInvalid | RunCancelled;

export interface RunOptions {
  /** fraction done, 0…1 */
  onProgress?: (fraction: number) => void;
  shouldCancel?: () => boolean;
}

/** the buffers of a finished run, for a structured-clone transfer */
export function transferables(outcome: RunOutcome): ArrayBuffer[] {
  if (outcome.kind !== 'done') return [];
  return Object.values(outcome.series).map((a: Float64Array) => a.buffer as ArrayBuffer);
}

/** a document simulated: the engine's model and whole result (warm-up included) beside the figures */
export interface DocumentRun {
  kind: 'done';
  doc: WorkbenchDocument;
  model: ModelData;
  result: Result;
  figures: RunFigures;
  /** s: where the reported days start in the run */
  reportStart: number;
  /** the sol-air temperature at the result's output times (the air without sun or sky) */
  solAir: Float64Array;
  interfaceNames: string[];
}

/**
 * Validates and simulates a workbench document the way the workbench does (the run, its
 * coarse twin for the accuracy estimate, and for an upload a second start), and computes
 * the figures. The command line prints what this returns; runDocument() packs it for the worker.
 */
export function simulateDocument(input: unknown, upload?: UploadedSeries | null, options: RunOptions = {}): DocumentRun | RunInvalid | RunCancelled {
  const parsedDoc = workbenchDocumentSchema.safeParse(input);
  if (!parsedDoc.success) {
    return { kind: 'invalid', issues: parsedDoc.error.issues.map((i) => `${formatPath(i.path)}: ${i.message}`) };
  }
  const doc: WorkbenchDocument = parsedDoc.data;
  if (doc.exposure.outdoor.mode === 'series' && !upload) {
    return { kind: 'invalid', issues: ['exposure.outdoor.uploadId: the uploaded series is not loaded; pick an upload of the team'] };
  }
  const parsed = parseModel(toModel(doc, upload ?? undefined));
  if (!parsed.ok) return { kind: 'invalid', issues: parsed.issues };
  const model = parsed.model;

  const steps = Math.ceil(model.duration / model.timeStep - 1e-9);
  const repeating = isRepeatingExposure(doc.exposure);
  // the share of the work each run takes, for one progress bar over all of them
  const coarseShare = 0.15;
  // the second start runs the warm-up and at most a week of the reported days (its effect only fades after that)
  const otherModel = repeating ? null : otherStartModel(model, effectiveWarmupDays(doc.exposure) * DAY + 7 * DAY);
  const otherShare = otherModel ? 0.6 * (otherModel.duration / model.duration) * (1 - coarseShare) : 0;
  const mainShare = 1 - coarseShare - otherShare;
  const progress = (from: number, share: number) => (options.onProgress ? (f: number) => options.onProgress!(from + share * f) : undefined);
  const run = (m: ModelData, from: number, share: number) =>
    simulate(m, {
      onProgress: progress(from, share),
      shouldCancel: options.shouldCancel,
      // about a hundred progress reports, never fewer than 256 steps apart
      progressEvery: Math.max(256, Math.ceil(steps / 100)),
    });
  let result: Result;
  let coarse: Result | null = null;
  let coarseModel: ModelData | null = null;
  let other: Result | null = null;
  try {
    result = run(model, 0, mainShare);
    coarseModel = coarserModel(model);
    coarse = coarseModel ? run(coarseModel, mainShare, coarseShare) : null;
    if (otherModel) other = run(otherModel, mainShare + coarseShare, otherShare);
  } catch (e) {
    if (e instanceof SimulationCancelled) return { kind: 'cancelled' };
    throw e;
  }

  const s = result.series;
  const reportStart = effectiveWarmupDays(doc.exposure) * DAY;
  // sol-air: air + R_se · (absorptance · irradiance − long-wave loss), from the model's own signals
  const solarFull = solAirSeries(model, s.time, s.outsideAir);
  const interfaceNames = doc.layers.slice(1).map((l, j) => `${doc.layers[j].name} / ${l.name}`);
  const out = doc.exposure.outdoor;
  const runFigures = figures({
    time: s.time,
    reportStart,
    period: result.periodic.period,
    outsideAir: s.outsideAir,
    solAir: solarFull,
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
    outdoorPeriodic: repeating && out.mode !== 'series',
    scheme: schemeOf(result),
    accuracy: coarse && coarseModel ? accuracyOf(s.time, s.insideFlux, reportStart, coarse, coarseModel) : null,
    otherStart: other ? { time: other.series.time, insideFlux: other.series.insideFlux } : null,
    indoorConstant: doc.exposure.indoor.mode === 'constant',
  });
  return { kind: 'done', doc, model, result, figures: runFigures, reportStart, solAir: solarFull, interfaceNames };
}

/** runs a workbench document (the upload is needed when the outdoor air is an uploaded series) and packs the reported days for the worker */
export function runDocument(input: unknown, upload?: UploadedSeries | null, options: RunOptions = {}): RunOutcome {
  const run = simulateDocument(input, upload, options);
  if (run.kind !== 'done') return run;
  const { doc, model, result, reportStart, interfaceNames, figures: runFigures } = run;
  const s = result.series;
  let first = 0;
  while (first < s.time.length && s.time[first] < reportStart - 1e-6) first++;
  const nTimes = s.time.length - first;
  const nNodes = result.mesh.x.length;
  const nInterfaces = s.interfaces.length;

  const slice = (a: number[]): Float64Array => Float64Array.from(a.slice(first));
  const time = new Float64Array(nTimes);
  for (let k = 0; k < nTimes; k++) time[k] = s.time[first + k] - reportStart;

  const solAir = Float64Array.from(run.solAir.subarray(first));

  const interfaces = new Float64Array(nInterfaces * nTimes);
  for (let j = 0; j < nInterfaces; j++) interfaces.set(s.interfaces[j].slice(first), j * nTimes);
  const profiles = new Float64Array(nTimes * nNodes);
  for (let k = 0; k < nTimes; k++) profiles.set(result.profiles[first + k], k * nNodes);

  const layerBounds = [0];
  for (const l of doc.layers) layerBounds.push(layerBounds[layerBounds.length - 1] + l.thickness);

  return {
    kind: 'done',
    nTimes,
    nNodes,
    nInterfaces,
    interfaceNames,
    layerBounds,
    series: {
      time,
      outsideAir: slice(s.outsideAir),
      solAir,
      outsideSurface: slice(s.outsideSurface),
      insideSurface: slice(s.insideSurface),
      insideAir: slice(s.insideAir),
      outsideFlux: slice(s.outsideFlux),
      insideFlux: slice(s.insideFlux),
      interfaces,
      x: Float64Array.from(result.mesh.x),
      profiles,
    },
    figures: runFigures,
    analytic: analyse(model),
    outputInterval: model.outputInterval,
    elapsedMs: result.stats.elapsedMs,
    steps: result.stats.steps,
  };
}

/** the ISO 13788 check of the document's layers under its monthly climate; null without a climate or a μ */
export function moistureOfDocument(doc: WorkbenchDocument): RunFigures['moisture'] {
  const a = assessDocument(doc);
  return a ? moistureFigures(a) : null;
}

/** the sol-air temperature at the output times (equals the outside air without sun); compare reuses it */
export function solAirSeries(model: ModelData, time: number[], air: number[]): Float64Array {
  const out = Float64Array.from(air);
  const solar = model.outside.solar;
  const longWave = model.outside.longWave;
  if ((!solar && !longWave) || model.outside.surfaceResistance === 0) return out;
  const irradiance = solar ? compileSignal(solar.irradiance) : null;
  const netLoss = longWave ? compileSignal(longWave.netLoss) : null;
  for (let k = 0; k < time.length; k++) {
    out[k] = solAirTemperature(air[k], solar?.absorptance ?? 0, irradiance ? signalAt(irradiance, time[k]) : 0, model.outside.surfaceResistance, netLoss ? signalAt(netLoss, time[k]) : 0);
  }
  return out;
}

/** the same run at twice the step and twice the largest cell (outputs on a grid both runs share); null when the step cannot double */
export function coarserModel(model: ModelData): ModelData | null {
  const timeStep = model.timeStep * 2;
  if (timeStep > model.duration) return null;
  const interval = lcm(Math.round(model.outputInterval), Math.round(timeStep));
  if (interval > model.duration) return null;
  return { ...model, timeStep, outputInterval: interval, mesh: { ...model.mesh, maxCellSize: model.mesh.maxCellSize * 2, minCellsPerLayer: Math.max(2, Math.floor(model.mesh.minCellsPerLayer / 2)) } };
}

/** the same run from a uniform start at the mean of the two air temperatures at time zero (a start as wrong as a plausible guess), up to `until` s */
function otherStartModel(model: ModelData, until: number): ModelData {
  const outside = compileSignal(model.outside.air);
  const inside = compileSignal(model.inside.air);
  const temperature = (signalAt(outside, 0) + signalAt(inside, 0)) / 2;
  return { ...model, initial: { kind: 'uniform', temperature }, duration: Math.min(model.duration, until) };
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}
const lcm = (a: number, b: number) => (a / gcd(a, b)) * b;

/** the largest difference of the inside flux between the run and its coarse twin over the reported days, absolute and relative to the amplitude */
export function accuracyOf(time: number[], insideFlux: number[], reportStart: number, coarse: Result, coarseModel: ModelData): AccuracyEstimate {
  const byTime = new Map<number, number>();
  for (let k = 0; k < time.length; k++) if (time[k] >= reportStart - 1e-6) byTime.set(Math.round(time[k]), insideFlux[k]);
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of byTime.values()) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  let maxDifference = 0;
  const c = coarse.series;
  for (let k = 0; k < c.time.length; k++) {
    const fine = byTime.get(Math.round(c.time[k]));
    if (fine !== undefined) maxDifference = Math.max(maxDifference, Math.abs(fine - c.insideFlux[k]));
  }
  const amplitude = Math.max((hi - lo) / 2, 1e-3);
  return { maxDifference, relative: maxDifference / amplitude, coarseTimeStep: coarseModel.timeStep, coarseCells: coarse.stats.cells };
}

/** the scheme as the engine ran it, from its stats: whole steps of the scheme and the start-up sub-steps after jumps */
export function schemeOf(result: Result): string {
  const a = result.stats.scheme;
  const name = a.scheme === 'implicit' ? 'backward Euler' : 'Crank–Nicolson';
  const parts = [`${a.fullSteps} ${name} steps`];
  if (a.restarts > 0) {
    const sub: string[] = [];
    if (a.backwardEulerSubSteps > 0) sub.push(`${a.backwardEulerSubSteps} backward-Euler quarter steps`);
    if (a.crankNicolsonSubSteps > 0) sub.push(`${a.crankNicolsonSubSteps} Crank–Nicolson half steps`);
    parts.push(`${a.restarts} start-up${a.restarts > 1 ? 's' : ''} after jumps (${sub.join(', ')})`);
  }
  if (result.stats.periodicStart) parts.push('periodic start');
  return parts.join(', ');
}
