// one run of a workbench document: validate, build the engine model, simulate, pack the
// reported days into flat Float64Arrays (so a worker can transfer them) and compute the
// figures. pure: the worker, the report page and the tests all call this.
import { formatPath, parseModel, type ModelData } from '../schemas/model.ts';
import { workbenchDocumentSchema, toModel, type UploadedSeries, type WorkbenchDocument } from '../schemas/workbench.ts';
import { simulate, SimulationCancelled, analyse, compileSignal, signalAt, solAirTemperature } from '../thermal/index.ts';
import type { Figures as AnalyticFigures } from '../thermal/types.ts';
import { figures, type RunFigures } from './figures.ts';
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

/** runs a workbench document (the upload is needed when the outdoor air is an uploaded series) */
export function runDocument(input: unknown, upload?: UploadedSeries | null, options: RunOptions = {}): RunOutcome {
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
  let result;
  try {
    result = simulate(model, {
      onProgress: options.onProgress,
      shouldCancel: options.shouldCancel,
      // about a hundred progress reports, never fewer than 256 steps apart
      progressEvery: Math.max(256, Math.ceil(steps / 100)),
    });
  } catch (e) {
    if (e instanceof SimulationCancelled) return { kind: 'cancelled' };
    throw e;
  }

  const s = result.series;
  const reportStart = doc.exposure.warmupDays * DAY;
  let first = 0;
  while (first < s.time.length && s.time[first] < reportStart - 1e-6) first++;
  const nTimes = s.time.length - first;
  const nNodes = result.mesh.x.length;
  const nInterfaces = s.interfaces.length;

  const slice = (a: number[]): Float64Array => Float64Array.from(a.slice(first));
  const time = new Float64Array(nTimes);
  for (let k = 0; k < nTimes; k++) time[k] = s.time[first + k] - reportStart;

  // sol-air: air + absorptance · irradiance · R_se, from the model's own signals
  const solarFull = solAirSeries(model, s.time, s.outsideAir);
  const solAir = Float64Array.from(solarFull.subarray(first));

  const interfaces = new Float64Array(nInterfaces * nTimes);
  for (let j = 0; j < nInterfaces; j++) interfaces.set(s.interfaces[j].slice(first), j * nTimes);
  const profiles = new Float64Array(nTimes * nNodes);
  for (let k = 0; k < nTimes; k++) profiles.set(result.profiles[first + k], k * nNodes);

  const interfaceNames = doc.layers.slice(1).map((l, j) => `${doc.layers[j].name} / ${l.name}`);
  const layerBounds = [0];
  for (const l of doc.layers) layerBounds.push(layerBounds[layerBounds.length - 1] + l.thickness);

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
    energyBalanceError: result.energy.balanceError,
    cells: result.stats.cells,
    timeStep: model.timeStep,
    maxCellSize: doc.exposure.maxCellSize,
    moisture: moistureOf(doc),
    outdoorPeriodic: out.mode !== 'series',
    indoorConstant: doc.exposure.indoor.mode === 'constant',
  });

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
function moistureOf(doc: WorkbenchDocument) {
  const a = assessDocument(doc);
  return a ? moistureFigures(a) : null;
}

function solAirSeries(model: ModelData, time: number[], air: number[]): Float64Array {
  const out = Float64Array.from(air);
  const solar = model.outside.solar;
  if (!solar || model.outside.surfaceResistance === 0) return out;
  const irradiance = compileSignal(solar.irradiance);
  for (let k = 0; k < time.length; k++) {
    out[k] = solAirTemperature(air[k], solar.absorptance, signalAt(irradiance, time[k]), model.outside.surfaceResistance);
  }
  return out;
}
