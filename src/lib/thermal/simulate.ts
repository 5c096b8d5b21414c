// simulate(): composes mesh, boundaries, operator and stepper into the contract's Result.
// the model is assumed valid (src/lib/schemas/model.ts checks it at every entry point).
import { analyse } from './analyse.ts';
import { drivingRate, drivingTemperature, insideBoundary, outsideBoundary, type BoundarySide } from './boundary.ts';
import { buildMesh, type Mesh } from './mesh.ts';
import { assembleTheta, boundaryTerm, type ThetaMatrices } from './operator.ts';
import { jumpSteps } from './jumps.ts';
import { periodicKick, periodicState, periodSampling } from './periodicStart.ts';
import { commonPeriod, signalAt } from './signals.ts';
import { steadyProfile } from './steady.ts';
import { factorise, thetaStep, type ThomasFactor } from './stepper.ts';
import type { Model, PeriodicStartStats, Result, SchemeAccount, SimulateOptions } from './types.ts';

/** thrown by simulate() when shouldCancel() returns true */
export class SimulationCancelled extends Error {
  constructor() {
    super('simulation cancelled');
    this.name = 'SimulationCancelled';
  }
}

// a monotonic clock without dom or node types: performance exists in browsers, workers and node
const clock = (globalThis as { performance?: { now(): number } }).performance;
export const now = (): number => (clock ? clock.now() : Date.now());

/** one step size with its matrices and factorisation */
export interface Stepping {
  dt: number;
  theta: number;
  matrices: ThetaMatrices;
  factor: ThomasFactor;
}

function stepping(mesh: Mesh, outside: BoundarySide, inside: BoundarySide, dt: number, theta: number): Stepping {
  const matrices = assembleTheta(mesh, outside, inside, dt, theta);
  return { dt, theta, matrices, factor: factorise(matrices.implicit) };
}

/** the steppings of one step size h: the scheme itself, and for a restart backward euler at h/4 and the scheme at h/2 */
export interface StepSet {
  main: Stepping;
  quarter: Stepping | null;
  half: Stepping | null;
}

function stepSet(mesh: Mesh, outside: BoundarySide, inside: BoundarySide, h: number, theta: number, restarts: boolean): StepSet {
  return {
    main: stepping(mesh, outside, inside, h, theta),
    quarter: restarts ? stepping(mesh, outside, inside, h / 4, 1) : null,
    half: restarts ? stepping(mesh, outside, inside, h / 2, theta) : null,
  };
}

/**
 * step kinds of the plan. a restart (rannacher start-up: R. Rannacher, "Finite element solution of diffusion
 * problems with irregular data", Numer. Math. 43 (1984) 309–327; M. Luskin & R. Rannacher, "On the smoothing
 * property of the Crank–Nicolson scheme", Applicable Anal. 14 (1982) 117–135) takes the step that holds the jump
 * as four backward-euler quarter steps, which damp the stiff modes the jump excites, and the next step as two more
 * quarter steps and one crank–nicolson half step, growing back to the full crank–nicolson step after it.
 */
export const STEP_FULL = 0;
export const STEP_RESTART = 1;
export const STEP_RECOVER = 2;

/** sub-steps of each kind: which stepping (0 main, 1 quarter, 2 half) and the fraction of the step reached */
export const SUBSTEPS: ReadonlyArray<ReadonlyArray<readonly [number, number]>> = [
  [[0, 1]],
  [
    [1, 0.25],
    [1, 0.5],
    [1, 0.75],
    [1, 1],
  ],
  [
    [1, 0.25],
    [1, 0.5],
    [2, 1],
  ],
];

/** mutable state of a run: arrays are preallocated, accumulators are plain numbers */
export interface RunState {
  mesh: Mesh;
  outside: BoundarySide;
  inside: BoundarySide;
  temperature: Float64Array;
  /** driving temperatures at the current time */
  outsideDrive: number;
  insideDrive: number;
  inOutside: number;
  outInside: number;
  // the step in progress: drives at its end, boundary terms, and the surface temperatures before (t0, t1, tm, tn:
  // the two outside nodes, the two inside nodes) and after it (a0, a1, am, an), set by the caller of beginStep/endStep
  oAfter: number;
  iAfter: number;
  b0: number;
  bN: number;
  t0: number;
  t1: number;
  tm: number;
  tn: number;
  a0: number;
  a1: number;
  am: number;
  an: number;
}

/**
 * first half of a step to tTo: drives and boundary terms (the caller has put the surface temperatures before it
 * in st.t0, t1, tm, tn; numbers pass through fields rather than arguments so nothing is boxed in the time loop)
 */
export function beginStep(st: RunState, s: Stepping, tTo: number): void {
  st.oAfter = drivingTemperature(st.outside, tTo);
  st.iAfter = drivingTemperature(st.inside, tTo);
  st.b0 = boundaryTerm(st.outside, s.theta, st.outsideDrive, st.oAfter);
  st.bN = boundaryTerm(st.inside, s.theta, st.insideDrive, st.iAfter);
}

/**
 * second half of a step, after the solve (the caller has put the surface temperatures after it in st.a0, a1, am,
 * an): the θ-weighted surface fluxes from each surface node's own energy equation, so the account closes to round-off
 */
export function endStep(st: RunState, s: Stepping): void {
  const a0 = st.a0;
  const a1 = st.a1;
  const am = st.am;
  const an = st.an;
  const last = st.temperature.length - 1;
  const mesh = st.mesh;
  const out = st.outside;
  const ins = st.inside;
  const theta = s.theta;
  const dt = s.dt;
  const oBefore = st.outsideDrive;
  const iBefore = st.insideDrive;
  const oAfter = st.oAfter;
  const iAfter = st.iAfter;
  const t0 = st.t0;
  const tn = st.tn;
  let qo: number;
  if (out.prescribed) {
    const g = mesh.conductance[0];
    qo = (mesh.capacity[0] * (a0 - t0)) / dt + g * (theta * (a0 - a1) + (1 - theta) * (t0 - st.t1));
  } else qo = out.h * (theta * (oAfter - a0) + (1 - theta) * (oBefore - t0));
  let qi: number;
  if (ins.prescribed) {
    const g = mesh.conductance[last - 1];
    qi = g * (theta * (am - an) + (1 - theta) * (st.tm - tn)) - (mesh.capacity[last] * (an - tn)) / dt;
  } else qi = ins.h * (theta * (an - iAfter) + (1 - theta) * (tn - iBefore));
  st.inOutside += qo * dt;
  st.outInside += qi * dt;
  st.outsideDrive = oAfter;
  st.insideDrive = iAfter;
}

/** advances the state by one step of s to time tTo */
export function advance(st: RunState, s: Stepping, tTo: number): void {
  const T = st.temperature;
  const last = T.length - 1;
  st.t0 = T[0];
  st.t1 = T[1];
  st.tm = T[last - 1];
  st.tn = T[last];
  beginStep(st, s, tTo);
  thetaStep(s.factor, s.matrices.explicit, T, st.b0, st.bN);
  st.a0 = T[0];
  st.a1 = T[1];
  st.am = T[last - 1];
  st.an = T[last];
  endStep(st, s);
}

/** the stepping a sub-step of kind `which` uses (0 main, 1 backward-euler quarter, 2 half) */
export function substepping(set: StepSet, which: number): Stepping {
  return which === 0 ? set.main : which === 1 ? (set.quarter as Stepping) : (set.half as Stepping);
}

/** a run set up and ready to step: everything simulate() and simulateBatch() share */
export interface Run {
  model: Model;
  started: number;
  figures: ReturnType<typeof analyse>;
  mesh: Mesh;
  nodes: number;
  theta: number;
  dt: number;
  duration: number;
  /** whole steps of dt, then one shorter step of remainder if the duration is not a multiple */
  fullSteps: number;
  remainder: number;
  steps: number;
  /** per step: STEP_FULL, STEP_RESTART or STEP_RECOVER */
  kinds: Uint8Array;
  full: StepSet;
  tail: StepSet | null;
  st: RunState;
  initial: Float64Array;
  account: SchemeAccount;
  periodicStart?: PeriodicStartStats;
  periodicStartMs: number;
  /** the profile at the start of the step in progress, kept when an output falls inside it */
  previous: Float64Array;
  /** outputs at k·interval ≤ duration */
  outputs: number;
  interval: number;
  nextOutput: number;
  record: (k: number, t: number, P: Float64Array) => void;
  recordWithin: (tFrom: number, tTo: number) => void;
  build: () => Omit<Result, 'energy' | 'stats'>;
}

/** a fresh state at t = 0 over the given temperatures */
function runState(mesh: Mesh, outside: BoundarySide, inside: BoundarySide, T: Float64Array): RunState {
  return {
    mesh,
    outside,
    inside,
    temperature: T,
    outsideDrive: drivingTemperature(outside, 0),
    insideDrive: drivingTemperature(inside, 0),
    inOutside: 0,
    outInside: 0,
    oAfter: 0,
    iAfter: 0,
    b0: 0,
    bN: 0,
    t0: 0,
    t1: 0,
    tm: 0,
    tn: 0,
    a0: 0,
    a1: 0,
    am: 0,
    an: 0,
  };
}

/** the step plan: restarts at a uniform start and at every jump of the driving temperatures */
function plan(
  model: Model,
  outside: BoundarySide,
  inside: BoundarySide,
  theta: number,
  dt: number,
  duration: number,
  steps: number,
  restarts: boolean,
  atStart = model.initial.kind === 'uniform',
): Uint8Array {
  const kinds = new Uint8Array(steps);
  if (!restarts || theta >= 1 || steps === 0) return kinds;
  const at = jumpSteps(outside, inside, duration, dt, steps);
  if (atStart) at.unshift(0);
  for (const n of at) {
    kinds[n] = STEP_RESTART;
    if (n + 1 < steps && kinds[n + 1] === STEP_FULL) kinds[n + 1] = STEP_RECOVER;
  }
  return kinds;
}

/** counts the steps by kind */
function schemeAccount(kinds: Uint8Array, theta: number): SchemeAccount {
  const a: SchemeAccount = {
    scheme: theta >= 1 ? 'implicit' : 'crank-nicolson',
    fullSteps: 0,
    restarts: 0,
    backwardEulerSubSteps: 0,
    crankNicolsonSubSteps: 0,
  };
  for (let n = 0; n < kinds.length; n++) {
    const k = kinds[n];
    if (k === STEP_FULL) a.fullSteps++;
    else if (k === STEP_RESTART) {
      a.restarts++;
      a.backwardEulerSubSteps += 4;
    } else {
      a.backwardEulerSubSteps += 2;
      a.crankNicolsonSubSteps++;
    }
  }
  return a;
}

/** sets up a run: mesh, boundaries, steppings, step plan, initial state (periodic start included) and outputs */
export function prepareRun(model: Model, options: SimulateOptions = {}): Run {
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
  const restarts = options.restart !== false && theta < 1;

  if (!(dt > 0) || !(duration >= 0) || !(model.outputInterval > 0)) throw new Error('invalid time settings');

  // whole steps, then one shorter step if the duration is not a multiple of the time step
  const fullSteps = Math.floor(duration / dt + 1e-9);
  let remainder = duration - fullSteps * dt;
  if (remainder <= 1e-9 * dt) remainder = 0;
  const steps = fullSteps + (remainder > 0 ? 1 : 0);

  const kinds = plan(model, outside, inside, theta, dt, duration, steps, restarts);
  const account = schemeAccount(kinds, theta);
  // restart steppings only where the plan (or the periodic start's own plan of one period) can use them
  const anyRestart = kinds.some((k) => k !== STEP_FULL);
  const full = stepSet(mesh, outside, inside, dt, theta, restarts && (anyRestart || model.initial.kind === 'periodic'));
  const tail = remainder > 0 ? stepSet(mesh, outside, inside, remainder, theta, restarts && kinds[steps - 1] !== STEP_FULL) : null;

  // initial state
  const T = new Float64Array(nodes);
  const st = runState(mesh, outside, inside, T);
  let periodicStart: PeriodicStartStats | undefined;
  let periodicStartMs = 0;
  if (model.initial.kind === 'uniform') T.fill(model.initial.temperature);
  else if (model.initial.kind === 'periodic') {
    const psStarted = now();
    periodicStart = startPeriodic(model, mesh, outside, inside, theta, dt, full, T);
    periodicStartMs = now() - psStarted;
  } else steadyProfile(mesh, outside, inside, st.outsideDrive, st.insideDrive, T);
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

  const eps = 1e-9 * Math.min(dt, interval);
  const run: Run = {
    model,
    started,
    figures,
    mesh,
    nodes,
    theta,
    dt,
    duration,
    fullSteps,
    remainder,
    steps,
    kinds,
    full,
    tail,
    st,
    initial,
    account,
    periodicStart,
    periodicStartMs,
    previous,
    outputs,
    interval,
    nextOutput: 0,
    record,
    // records every output in (tFrom, tTo], interpolating linearly inside the step
    recordWithin: (tFrom: number, tTo: number): void => {
      while (run.nextOutput < outputs) {
        const tOut = run.nextOutput * interval;
        if (tOut > tTo + eps) break;
        if (Math.abs(tOut - tTo) <= eps) record(run.nextOutput, tOut, T);
        else {
          const f = (tOut - tFrom) / (tTo - tFrom);
          for (let i = 0; i < nodes; i++) sample[i] = previous[i] + f * (T[i] - previous[i]);
          record(run.nextOutput, tOut, sample);
        }
        run.nextOutput++;
      }
    },
    build: () => ({
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
    }),
  };
  record(run.nextOutput++, 0, T);
  return run;
}

/** the periodic start: the discrete scheme's own periodic state at t = 0 (periodicStart.ts) */
function startPeriodic(
  model: Model,
  mesh: Mesh,
  outside: BoundarySide,
  inside: BoundarySide,
  theta: number,
  dt: number,
  full: StepSet,
  T: Float64Array,
): PeriodicStartStats {
  const common = commonPeriod(model);
  if (!common.ok) throw new Error(`initial.kind: ${common.message}`);
  if (common.period === null) {
    steadyProfile(mesh, outside, inside, drivingTemperature(outside, 0), drivingTemperature(inside, 0), T);
    return { period: 0, samples: 1, stepSize: dt, solves: 1, correctionPeriods: 0, elapsedMs: 0, costPeriods: 0 };
  }
  const P = common.period;
  const { samples, stepSize } = periodSampling(P, dt);
  const info = periodicState(mesh, outside, inside, theta, P, dt, T, stepSize === dt ? full.main.matrices : undefined);
  let correctionPeriods = 0;
  let solves = info.solves;
  if (stepSize === dt && full.quarter) {
    // restarts inside the period make the stepping time-varying: the schedule of a period in the middle of a
    // long run (jumps repeat with P), then one correction (periodicKick) from a period stepped with it
    const kinds = plan(model, outside, inside, theta, dt, 2 * P, 2 * samples, true, false).subarray(samples);
    if (kinds.some((k) => k !== STEP_FULL)) {
      // residual of one period from x0, the kick correction, and the residual from the corrected state; the
      // time-invariant (I − Φ)⁻¹ can misjudge stiff modes that the restarts damp, so keep whichever start repeats better
      const n = T.length;
      const onePeriod = (from: Float64Array): Float64Array => {
        const st = runState(mesh, outside, inside, Float64Array.from(from));
        for (let j = 0; j < samples; j++) stepWithKind(st, full, kinds[j], j * dt, (j + 1) * dt, dt);
        return st.temperature;
      };
      const x1 = onePeriod(T);
      const r = new Float64Array(n);
      for (let i = 0; i < n; i++) r[i] = x1[i] - T[i];
      const corrected = new Float64Array(n);
      solves += periodicKick(full.main.matrices, samples, r, corrected);
      for (let i = 0; i < n; i++) corrected[i] += T[i];
      const x2 = onePeriod(corrected);
      let before = 0;
      let after = 0;
      for (let i = 0; i < n; i++) {
        before = Math.max(before, Math.abs(r[i]));
        after = Math.max(after, Math.abs(x2[i] - corrected[i]));
      }
      T.set(after < before ? corrected : x1);
      correctionPeriods = 2;
    }
  }
  return { ...info, solves, correctionPeriods, elapsedMs: 0, costPeriods: 0 };
}

/** one step of the plan from tFrom to tTo (length h): the full step, or the restart sub-steps of its kind */
export function stepWithKind(st: RunState, set: StepSet, kind: number, tFrom: number, tTo: number, h: number): void {
  if (kind === STEP_FULL) {
    advance(st, set.main, tTo);
    return;
  }
  const subs = SUBSTEPS[kind];
  for (let j = 0; j < subs.length; j++) {
    const [which, f] = subs[j];
    advance(st, substepping(set, which), f === 1 ? tTo : tFrom + f * h);
  }
}

/** the tail of a run: energy account, stats and the Result */
export function finishRun(run: Run, steppingMs: number): Result {
  const { nodes, mesh, st, initial } = run;
  const T = st.temperature;
  let stored = 0;
  for (let i = 0; i < nodes; i++) {
    if (!Number.isFinite(T[i])) throw new Error('the simulation produced a non-finite temperature');
    stored += mesh.capacity[i] * (T[i] - initial[i]);
  }
  const { inOutside, outInside } = st;
  const balanceError =
    Math.abs(inOutside - outInside - stored) / Math.max(Math.abs(inOutside), Math.abs(outInside), Math.abs(stored), 1);
  let periodicStart: PeriodicStartStats | undefined;
  if (run.periodicStart) {
    // cost in periods' worth of this run's own stepping: wall time per step × steps per period
    const perStep = run.steps > 0 ? steppingMs / run.steps : 0;
    const perPeriod = perStep * (run.periodicStart.period / run.dt);
    periodicStart = {
      ...run.periodicStart,
      elapsedMs: run.periodicStartMs,
      costPeriods: perPeriod > 0 ? run.periodicStartMs / perPeriod : 0,
    };
  }

  return {
    ...run.build(),
    energy: { storedChange: stored, inOutside, outInside, balanceError },
    stats: {
      cells: mesh.cells,
      steps: run.steps,
      nodeSteps: mesh.cells * run.steps,
      elapsedMs: now() - run.started,
      scheme: run.account,
      ...(periodicStart ? { periodicStart } : {}),
    },
  };
}

/** runs the model and returns the contract's Result */
export function simulate(model: Model, options: SimulateOptions = {}): Result {
  const run = prepareRun(model, options);
  return finishRun(run, stepRun(run, options));
}

/** steps a prepared run to its end, recording its outputs; returns the wall time of the stepping, ms */
export function stepRun(run: Run, options: SimulateOptions = {}): number {
  const every = Math.max(1, Math.floor(options.progressEvery ?? 4096));
  const onProgress = options.onProgress;
  const shouldCancel = options.shouldCancel;
  const { st, kinds, fullSteps, dt, steps, previous, full } = run;
  const T = st.temperature;
  const steppingStarted = now();
  for (let n = 0; n < steps; n++) {
    const isTail = n === fullSteps;
    const set = isTail ? (run.tail as StepSet) : full;
    const h = isTail ? run.remainder : dt;
    const tFrom = n * dt;
    const tTo = isTail ? run.duration : (n + 1) * dt;
    const interior = run.nextOutput < run.outputs && run.nextOutput * run.interval < tTo - 1e-9 * Math.min(dt, run.interval);
    if (interior) previous.set(T);
    stepWithKind(st, set, kinds[n], tFrom, tTo, h);
    if (run.nextOutput < run.outputs && run.nextOutput * run.interval <= tTo + 1e-9 * Math.min(dt, run.interval)) {
      run.recordWithin(tFrom, tTo);
    }
    if ((n + 1) % every === 0) {
      if (shouldCancel && shouldCancel()) throw new SimulationCancelled();
      if (onProgress) onProgress((n + 1) / steps);
    }
  }
  const steppingMs = now() - steppingStarted;
  if (onProgress) onProgress(1);
  return steppingMs;
}
