// simulate(): composes mesh, boundaries, operator and stepper into the contract's Result.
// the model is assumed valid (src/lib/schemas/model.ts checks it at every entry point).
import { analyse } from './analyse.ts';
import { drivingRate, drivingTemperature, insideBoundary, outsideBoundary, type BoundarySide } from './boundary.ts';
import { buildMesh, type Mesh } from './mesh.ts';
import { assembleTheta, boundaryTerm, type ThetaMatrices } from './operator.ts';
import { jumpTimes, signalAt } from './signals.ts';
import { steadyProfile } from './steady.ts';
import { factorise, thetaStep, type ThomasFactor } from './stepper.ts';
import type { Model, Result, SimulateOptions } from './types.ts';

/** thrown by simulate() when shouldCancel() returns true */
export class SimulationCancelled extends Error {
  constructor() {
    super('simulation cancelled');
    this.name = 'SimulationCancelled';
  }
}

// a monotonic clock without dom or node types: performance exists in browsers, workers and node
const clock = (globalThis as { performance?: { now(): number } }).performance;
const now = (): number => (clock ? clock.now() : Date.now());

/** one step size with its matrices and factorisation */
interface Stepping {
  dt: number;
  theta: number;
  matrices: ThetaMatrices;
  factor: ThomasFactor;
}

function stepping(mesh: Mesh, outside: BoundarySide, inside: BoundarySide, dt: number, theta: number): Stepping {
  const matrices = assembleTheta(mesh, outside, inside, dt, theta);
  return { dt, theta, matrices, factor: factorise(matrices.implicit) };
}

/** mutable state of a run: arrays are preallocated, accumulators are plain numbers */
interface RunState {
  mesh: Mesh;
  outside: BoundarySide;
  inside: BoundarySide;
  temperature: Float64Array;
  /** driving temperatures at the current time */
  outsideDrive: number;
  insideDrive: number;
  inOutside: number;
  outInside: number;
}

/** advances the state by one step of s from time tFrom, accumulating the θ-weighted surface fluxes */
function advance(st: RunState, s: Stepping, tTo: number): void {
  const T = st.temperature;
  const last = T.length - 1;
  const mesh = st.mesh;
  const out = st.outside;
  const ins = st.inside;
  const theta = s.theta;
  const dt = s.dt;
  const oBefore = st.outsideDrive;
  const iBefore = st.insideDrive;
  const oAfter = drivingTemperature(out, tTo);
  const iAfter = drivingTemperature(ins, tTo);
  const t0 = T[0];
  const t1 = T[1];
  const tm = T[last - 1];
  const tn = T[last];
  thetaStep(s.factor, s.matrices.explicit, T, boundaryTerm(out, theta, oBefore, oAfter), boundaryTerm(ins, theta, iBefore, iAfter));
  // surface fluxes from each surface node's own energy equation, so the account closes to round-off
  let qo: number;
  if (out.prescribed) {
    const g = mesh.conductance[0];
    qo = (mesh.capacity[0] * (T[0] - t0)) / dt + g * (theta * (T[0] - T[1]) + (1 - theta) * (t0 - t1));
  } else qo = out.h * (theta * (oAfter - T[0]) + (1 - theta) * (oBefore - t0));
  let qi: number;
  if (ins.prescribed) {
    const g = mesh.conductance[last - 1];
    qi = g * (theta * (T[last - 1] - T[last]) + (1 - theta) * (tm - tn)) - (mesh.capacity[last] * (T[last] - tn)) / dt;
  } else qi = ins.h * (theta * (T[last] - iAfter) + (1 - theta) * (tn - iBefore));
  st.inOutside += qo * dt;
  st.outInside += qi * dt;
  st.outsideDrive = oAfter;
  st.insideDrive = iAfter;
}

/** runs the model and returns the contract's Result */
export function simulate(model: Model, options: SimulateOptions = {}): Result {
  const started = now();
  const figures = analyse(model);
  const mesh = buildMesh(model.layers, model.mesh);
  const nodes = mesh.cells + 1;
  const outside = outsideBoundary(model.outside);
  const inside = insideBoundary(model.inside);
  const theta = model.scheme === 'implicit' ? 1 : 0.5;
  const dt = model.timeStep;
  const duration = model.duration;
  const storeProfiles = options.storeProfiles !== false;
  const every = Math.max(1, Math.floor(options.progressEvery ?? 4096));
  const onProgress = options.onProgress;
  const shouldCancel = options.shouldCancel;
  // rannacher start-up: backward-euler half-steps (an even number, covering whole steps) at the start and after jumps
  const halfSteps = theta < 1 ? 2 * Math.ceil(Math.max(0, options.startupHalfSteps ?? 4) / 2) : 0;

  if (!(dt > 0) || !(duration >= 0) || !(model.outputInterval > 0)) throw new Error('invalid time settings');

  // whole steps, then one shorter step if the duration is not a multiple of the time step
  const fullSteps = Math.floor(duration / dt + 1e-9);
  let remainder = duration - fullSteps * dt;
  if (remainder <= 1e-9 * dt) remainder = 0;
  const steps = fullSteps + (remainder > 0 ? 1 : 0);

  const main = stepping(mesh, outside, inside, dt, theta);
  const half = halfSteps > 0 ? stepping(mesh, outside, inside, dt / 2, 1) : null;
  const tail = remainder > 0 ? stepping(mesh, outside, inside, remainder, theta) : null;

  // jumps of the signals, sorted; a whole step containing one restarts with half-steps
  const jumps: number[] = [];
  if (halfSteps > 0) {
    jumps.push(...jumpTimes(model.outside.air, duration, dt), ...jumpTimes(model.inside.air, duration, dt));
    if (model.outside.solar && model.outside.surfaceResistance > 0) jumps.push(...jumpTimes(model.outside.solar.irradiance, duration, dt));
    jumps.sort((a, b) => a - b);
  }

  // initial state
  const T = new Float64Array(nodes);
  const st: RunState = {
    mesh,
    outside,
    inside,
    temperature: T,
    outsideDrive: drivingTemperature(outside, 0),
    insideDrive: drivingTemperature(inside, 0),
    inOutside: 0,
    outInside: 0,
  };
  if (model.initial.kind === 'uniform') T.fill(model.initial.temperature);
  else steadyProfile(mesh, outside, inside, st.outsideDrive, st.insideDrive, T);
  const initial = Float64Array.from(T);

  // outputs at k·outputInterval ≤ duration
  const interval = model.outputInterval;
  const outputs = Math.floor(duration / interval + 1e-9) + 1;
  const time = new Float64Array(outputs);
  const outsideAir = new Float64Array(outputs);
  const outsideSurface = new Float64Array(outputs);
  const insideSurface = new Float64Array(outputs);
  const insideAir = new Float64Array(outputs);
  const outsideFlux = new Float64Array(outputs);
  const insideFlux = new Float64Array(outputs);
  const interfaceNodes = Array.from(mesh.layerStart.subarray(1, model.layers.length));
  const interfaces = interfaceNodes.map(() => new Float64Array(outputs));
  const profiles: number[][] = [];
  const sample = new Float64Array(nodes); // interpolated profile at an output inside a step
  const previous = new Float64Array(nodes);
  const rateWidth = 1e-3 * dt;

  const record = (k: number, t: number, P: Float64Array): void => {
    const last = nodes - 1;
    time[k] = t;
    outsideAir[k] = signalAt(outside.air, t);
    insideAir[k] = signalAt(inside.air, t);
    outsideSurface[k] = P[0];
    insideSurface[k] = P[last];
    for (let j = 0; j < interfaceNodes.length; j++) interfaces[j][k] = P[interfaceNodes[j]];
    // instantaneous surface fluxes: through the film, or from the surface node's balance when prescribed
    outsideFlux[k] = outside.prescribed
      ? mesh.capacity[0] * drivingRate(outside, t, rateWidth) + mesh.conductance[0] * (P[0] - P[1])
      : outside.h * (drivingTemperature(outside, t) - P[0]);
    insideFlux[k] = inside.prescribed
      ? mesh.conductance[last - 1] * (P[last - 1] - P[last]) - mesh.capacity[last] * drivingRate(inside, t, rateWidth)
      : inside.h * (P[last] - drivingTemperature(inside, t));
    if (storeProfiles) profiles.push(Array.from(P));
  };

  let nextOutput = 0;
  const eps = 1e-9 * Math.min(dt, interval);
  record(nextOutput++, 0, T);

  // records every output in (tFrom, tTo], interpolating linearly inside the step
  const recordWithin = (tFrom: number, tTo: number): void => {
    while (nextOutput < outputs) {
      const tOut = nextOutput * interval;
      if (tOut > tTo + eps) break;
      if (Math.abs(tOut - tTo) <= eps) record(nextOutput, tOut, T);
      else {
        const f = (tOut - tFrom) / (tTo - tFrom);
        for (let i = 0; i < nodes; i++) sample[i] = previous[i] + f * (T[i] - previous[i]);
        record(nextOutput, tOut, sample);
      }
      nextOutput++;
    }
  };

  let halfLeft = halfSteps;
  let jump = 0;
  for (let n = 0; n < fullSteps; n++) {
    const tFrom = n * dt;
    const tTo = (n + 1) * dt;
    while (jump < jumps.length && jumps[jump] < tTo - eps) {
      if (jumps[jump] >= tFrom - eps) halfLeft = halfSteps;
      jump++;
    }
    const interior = nextOutput < outputs && nextOutput * interval < tTo - eps;
    if (interior) previous.set(T);
    if (halfLeft > 0 && half) {
      advance(st, half, tFrom + 0.5 * dt);
      advance(st, half, tTo);
      halfLeft -= 2;
    } else advance(st, main, tTo);
    if (nextOutput < outputs && nextOutput * interval <= tTo + eps) recordWithin(tFrom, tTo);
    if ((n + 1) % every === 0) {
      if (shouldCancel && shouldCancel()) throw new SimulationCancelled();
      if (onProgress) onProgress((n + 1) / steps);
    }
  }
  if (tail) {
    const tFrom = fullSteps * dt;
    previous.set(T);
    advance(st, tail, duration);
    recordWithin(tFrom, duration);
  }
  if (onProgress) onProgress(1);

  let stored = 0;
  for (let i = 0; i < nodes; i++) {
    if (!Number.isFinite(T[i])) throw new Error('the simulation produced a non-finite temperature');
    stored += mesh.capacity[i] * (T[i] - initial[i]);
  }
  const { inOutside, outInside } = st;
  const balanceError =
    Math.abs(inOutside - outInside - stored) / Math.max(Math.abs(inOutside), Math.abs(outInside), Math.abs(stored), 1);

  return {
    steady: figures.steady,
    layers: figures.layers.map((l) => ({
      name: l.name,
      resistance: l.resistance,
      diffusivity: l.diffusivity,
      arealHeatCapacity: l.arealHeatCapacity,
      penetrationDepth: l.penetrationDepth,
    })),
    lumped: figures.lumped,
    periodic: figures.periodic,
    mesh: { x: Array.from(mesh.x) },
    series: {
      time: Array.from(time),
      outsideAir: Array.from(outsideAir),
      outsideSurface: Array.from(outsideSurface),
      insideSurface: Array.from(insideSurface),
      insideAir: Array.from(insideAir),
      interfaces: interfaces.map((a) => Array.from(a)),
      outsideFlux: Array.from(outsideFlux),
      insideFlux: Array.from(insideFlux),
    },
    profiles,
    energy: { storedChange: stored, inOutside, outInside, balanceError },
    stats: { cells: mesh.cells, steps, nodeSteps: mesh.cells * steps, elapsedMs: now() - started },
  };
}
