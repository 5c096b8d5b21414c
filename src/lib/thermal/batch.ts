// simulateBatch(): K independent models advanced through the same time steps, interleaved four at a time.
//
// a thomas solve is one dependent chain of multiply-subtracts per node, so a single model leaves most of the
// cpu's pipeline idle. four independent chains in one hand-unrolled loop overlap their latencies. models with
// the same step schedule (time step, duration, output interval, scheme and restart sub-steps) form a group; a
// group runs in quads, its models padded to a common node count with their coefficients packed [node][lane].
// each lane does exactly the arithmetic thetaStep() does for its model, in the same order, so every result is
// identical to simulate() of that model (the periodic start, outputs and energy account are shared code).
import {
  beginStep,
  endStep,
  finishRun,
  now,
  prepareRun,
  stepRun,
  SimulationCancelled,
  STEP_FULL,
  SUBSTEPS,
  substepping,
  type Run,
  type StepSet,
  type Stepping,
} from './simulate.ts';
import type { Model, Result, SimulateOptions } from './types.ts';

/** models interleaved in one loop */
export const LANES = 4;

/** one stepping of up to four models, packed row by row ([node][coefficient][lane]) and padded */
export interface Packed {
  /** the coefficients; per row either six blocks of four lanes (lower, 1/den, upper′, E lower, E diag, E upper) or,
   * when E lower = −M lower everywhere (crank–nicolson: both are ½ of the conductance), five without E lower */
  c: Float64Array;
  five: boolean;
}

/**
 * packs the steppings of up to four models, so one row's numbers sit in a few cache lines. rows past a model's
 * inside node are empty (zero inverse), and the explicit upper coefficient of its inside node is 1 so the inside
 * boundary term can ride in the next row's slot of x (thetaStep adds bN there; 1·bN adds exactly the same number).
 */
export function pack(steppings: ReadonlyArray<Stepping | null>, rows: number): Packed {
  let five = true;
  for (const s of steppings) {
    if (!s) continue;
    const lower = s.factor.lower;
    const el = s.matrices.explicit.lower;
    for (let i = 1; i < s.factor.n; i++) if (el[i] !== -lower[i]) five = false;
  }
  const width = five ? 5 * LANES : 6 * LANES;
  const c = new Float64Array(width * (rows + 1));
  for (let k = 0; k < steppings.length; k++) {
    const s = steppings[k];
    if (!s) continue;
    const n = s.factor.n;
    const { lower, inverse, upperPrime } = s.factor;
    const e = s.matrices.explicit;
    for (let i = 0; i < n; i++) {
      const q = width * i + k;
      c[q] = lower[i];
      c[q + 4] = inverse[i];
      c[q + 8] = upperPrime[i];
      const eu = i === n - 1 ? 1 : e.upper[i];
      if (five) {
        c[q + 12] = e.diag[i];
        c[q + 16] = eu;
      } else {
        c[q + 12] = e.lower[i];
        c[q + 16] = e.diag[i];
        c[q + 20] = eu;
      }
    }
  }
  return { c, five };
}

/**
 * one θ-step of four packed models in place: x ← M⁻¹(E x + b0 e₀ + bN e_last) per lane, with the operations of
 * thetaStep() in the same order, so each lane's result is identical to it. x is packed [node][lane];
 * x[LANES·n_k + k] must hold lane k's bN on entry (it is 0 again on exit). the old values of x ride in registers
 * (previous, current, next per lane) as in thetaStep().
 */
export function packedStep(p: Packed, x: Float64Array, rows: number, b0: Float64Array): void {
  if (p.five) packedStepFive(p.c, x, rows, b0);
  else packedStepSix(p.c, x, rows, b0);
}

// six coefficients a row: r = el·x₋ + ed·x + eu·x₊, d = (r − lower·d₋)/den, as thetaStep()
function packedStepSix(c: Float64Array, x: Float64Array, rows: number, b0: Float64Array): void {
  let xp0 = x[0];
  let xp1 = x[1];
  let xp2 = x[2];
  let xp3 = x[3];
  let xc0 = x[4];
  let xc1 = x[5];
  let xc2 = x[6];
  let xc3 = x[7];
  let d0 = (c[16] * xp0 + c[20] * xc0 + b0[0]) * c[4];
  let d1 = (c[17] * xp1 + c[21] * xc1 + b0[1]) * c[5];
  let d2 = (c[18] * xp2 + c[22] * xc2 + b0[2]) * c[6];
  let d3 = (c[19] * xp3 + c[23] * xc3 + b0[3]) * c[7];
  x[0] = d0;
  x[1] = d1;
  x[2] = d2;
  x[3] = d3;
  let b = LANES;
  let q = 6 * LANES;
  for (let i = 1; i < rows; i++, b += LANES, q += 6 * LANES) {
    const xn0 = x[b + 4];
    const xn1 = x[b + 5];
    const xn2 = x[b + 6];
    const xn3 = x[b + 7];
    d0 = (c[q + 12] * xp0 + c[q + 16] * xc0 + c[q + 20] * xn0 - c[q] * d0) * c[q + 4];
    d1 = (c[q + 13] * xp1 + c[q + 17] * xc1 + c[q + 21] * xn1 - c[q + 1] * d1) * c[q + 5];
    d2 = (c[q + 14] * xp2 + c[q + 18] * xc2 + c[q + 22] * xn2 - c[q + 2] * d2) * c[q + 6];
    d3 = (c[q + 15] * xp3 + c[q + 19] * xc3 + c[q + 23] * xn3 - c[q + 3] * d3) * c[q + 7];
    x[b] = d0;
    x[b + 1] = d1;
    x[b + 2] = d2;
    x[b + 3] = d3;
    xp0 = xc0;
    xp1 = xc1;
    xp2 = xc2;
    xp3 = xc3;
    xc0 = xn0;
    xc1 = xn1;
    xc2 = xn2;
    xc3 = xn3;
  }
  backSubstitute(c, x, rows, 6 * LANES);
}

// five coefficients a row: el = −lower exactly, so el·x₋ + ed·x is written ed·x − lower·x₋ (the same number:
// (−a)·b = −(a·b) and a + (−b) = a − b exactly in ieee arithmetic) and one load a lane is saved
function packedStepFive(c: Float64Array, x: Float64Array, rows: number, b0: Float64Array): void {
  let xp0 = x[0];
  let xp1 = x[1];
  let xp2 = x[2];
  let xp3 = x[3];
  let xc0 = x[4];
  let xc1 = x[5];
  let xc2 = x[6];
  let xc3 = x[7];
  let d0 = (c[12] * xp0 + c[16] * xc0 + b0[0]) * c[4];
  let d1 = (c[13] * xp1 + c[17] * xc1 + b0[1]) * c[5];
  let d2 = (c[14] * xp2 + c[18] * xc2 + b0[2]) * c[6];
  let d3 = (c[15] * xp3 + c[19] * xc3 + b0[3]) * c[7];
  x[0] = d0;
  x[1] = d1;
  x[2] = d2;
  x[3] = d3;
  let b = LANES;
  let q = 5 * LANES;
  for (let i = 1; i < rows; i++, b += LANES, q += 5 * LANES) {
    const xn0 = x[b + 4];
    const xn1 = x[b + 5];
    const xn2 = x[b + 6];
    const xn3 = x[b + 7];
    const l0 = c[q];
    const l1 = c[q + 1];
    const l2 = c[q + 2];
    const l3 = c[q + 3];
    d0 = (c[q + 12] * xc0 - l0 * xp0 + c[q + 16] * xn0 - l0 * d0) * c[q + 4];
    d1 = (c[q + 13] * xc1 - l1 * xp1 + c[q + 17] * xn1 - l1 * d1) * c[q + 5];
    d2 = (c[q + 14] * xc2 - l2 * xp2 + c[q + 18] * xn2 - l2 * d2) * c[q + 6];
    d3 = (c[q + 15] * xc3 - l3 * xp3 + c[q + 19] * xn3 - l3 * d3) * c[q + 7];
    x[b] = d0;
    x[b + 1] = d1;
    x[b + 2] = d2;
    x[b + 3] = d3;
    xp0 = xc0;
    xp1 = xc1;
    xp2 = xc2;
    xp3 = xc3;
    xc0 = xn0;
    xc1 = xn1;
    xc2 = xn2;
    xc3 = xn3;
  }
  backSubstitute(c, x, rows, 5 * LANES);
}

// x_i −= upper′_i · x_{i+1}, bottom to top, four lanes at a time
function backSubstitute(c: Float64Array, x: Float64Array, rows: number, width: number): void {
  let b = LANES * (rows - 2);
  let q = width * (rows - 2) + 8;
  for (; b >= 0; b -= LANES, q -= width) {
    x[b] -= c[q] * x[b + 4];
    x[b + 1] -= c[q + 1] * x[b + 5];
    x[b + 2] -= c[q + 2] * x[b + 6];
    x[b + 3] -= c[q + 3] * x[b + 7];
  }
}

/** the key that decides which runs may step together */
function scheduleKey(run: Run): string {
  const restarts: number[] = [];
  for (let n = 0; n < run.kinds.length; n++) if (run.kinds[n] !== STEP_FULL) restarts.push(n, run.kinds[n]);
  return [run.dt, run.duration, run.interval, run.theta, run.remainder, restarts.join(',')].join('|');
}

/** four (or fewer, the rest empty) runs of one schedule stepped together */
function runQuad(runs: Run[], options: SimulateOptions, progress: (steps: number) => void): number {
  const first = runs[0];
  const { steps, fullSteps, dt, remainder, duration, outputs, interval } = first;
  const rows = Math.max(...runs.map((r) => r.nodes)) + 1; // one spare row for the inside boundary terms
  const sets = (which: (r: Run) => StepSet | null): Packed[] => {
    const present = which(first);
    if (!present) return [];
    return [0, 1, 2].map((kind) =>
      kind === 0 || present.quarter ? pack(runs.map((r) => substepping(which(r) as StepSet, kind)), rows) : pack([], rows),
    );
  };
  const fullPacked = sets((r) => r.full);
  const tailPacked = sets((r) => r.tail);
  const x = new Float64Array(LANES * (rows + 1));
  const b0 = new Float64Array(LANES);
  const lanes = runs.length;
  for (let k = 0; k < lanes; k++) {
    const T = runs[k].st.temperature;
    for (let i = 0; i < T.length; i++) x[LANES * i + k] = T[i];
  }
  const unpack = (k: number, into: Float64Array): void => {
    for (let i = 0; i < into.length; i++) into[i] = x[LANES * i + k];
  };
  const every = Math.max(1, Math.floor(options.progressEvery ?? 4096));
  const shouldCancel = options.shouldCancel;
  const eps = 1e-9 * Math.min(dt, interval);

  // per set (full, tail), per sub-step kind, per lane: the stepping; and each lane's state and node count
  const laneSteppings = [first.full, first.tail].map((present, t) =>
    present ? [0, 1, 2].map((which) => runs.map((r) => (which === 0 || present.quarter ? substepping((t === 0 ? r.full : r.tail) as StepSet, which) : null))) : [],
  );
  const states = runs.map((r) => r.st);
  const lastRow = runs.map((r) => r.nodes - 1);
  // lanes under the very same boundaries (a compare or a sensitivity study: one exposure, several walls) have the
  // same drives and boundary terms: computed once, for the first lane, and copied (the same numbers)
  const boundaries = (r: Run): string => JSON.stringify([r.model.outside, r.model.inside]);
  const shared = runs.every((r) => boundaries(r) === boundaries(first));

  const started = now();
  for (let n = 0; n < steps; n++) {
    const isTail = n === fullSteps;
    const packed = isTail ? tailPacked : fullPacked;
    const stepping = laneSteppings[isTail ? 1 : 0];
    const h = isTail ? remainder : dt;
    const tFrom = n * dt;
    const tTo = isTail ? duration : (n + 1) * dt;
    const next = first.nextOutput;
    const interior = next < outputs && next * interval < tTo - eps;
    if (interior) for (let k = 0; k < lanes; k++) unpack(k, runs[k].previous);
    const subs = SUBSTEPS[first.kinds[n]];
    for (let j = 0; j < subs.length; j++) {
      const which = subs[j][0];
      const f = subs[j][1];
      const tSub = f === 1 ? tTo : tFrom + f * h;
      const lane = stepping[which];
      if (shared) beginStep(states[0], lane[0] as Stepping, tSub);
      const lead = states[0];
      for (let k = 0; k < lanes; k++) {
        const st = states[k];
        const last = lastRow[k];
        st.t0 = x[k];
        st.t1 = x[LANES + k];
        st.tm = x[LANES * (last - 1) + k];
        st.tn = x[LANES * last + k];
        if (!shared) beginStep(st, lane[k] as Stepping, tSub);
        else if (k > 0) {
          st.oAfter = lead.oAfter;
          st.iAfter = lead.iAfter;
          st.b0 = lead.b0;
          st.bN = lead.bN;
        }
        b0[k] = st.b0;
        x[LANES * (last + 1) + k] = st.bN;
      }
      packedStep(packed[which], x, rows, b0);
      for (let k = 0; k < lanes; k++) {
        const last = lastRow[k];
        const st = states[k];
        st.a0 = x[k];
        st.a1 = x[LANES + k];
        st.am = x[LANES * (last - 1) + k];
        st.an = x[LANES * last + k];
        endStep(st, lane[k] as Stepping);
      }
    }
    if (next < outputs && next * interval <= tTo + eps) {
      for (let k = 0; k < lanes; k++) {
        unpack(k, runs[k].st.temperature);
        runs[k].recordWithin(tFrom, tTo);
      }
    }
    if ((n + 1) % every === 0) {
      if (shouldCancel && shouldCancel()) throw new SimulationCancelled();
      progress(every * lanes);
    }
  }
  const elapsed = now() - started;
  for (let k = 0; k < lanes; k++) unpack(k, runs[k].st.temperature);
  progress((steps % every) * lanes);
  return elapsed;
}

/**
 * runs every model and returns their results in input order, each identical to simulate() of that model.
 * models that share a step schedule are stepped four at a time; a model left alone runs through simulate().
 */
export function simulateBatch(models: readonly Model[], options: SimulateOptions = {}): Result[] {
  const results: Result[] = new Array(models.length);
  const runs = models.map((m) => prepareRun(m, options));
  const totalSteps = runs.reduce((a, r) => a + r.steps, 0);
  let done = 0;
  const onProgress = options.onProgress;
  const progress = (steps: number): void => {
    done += steps;
    if (onProgress && totalSteps > 0) onProgress(Math.min(1, done / totalSteps));
  };
  // groups of one schedule, each sorted by node count so a quad pads as little as possible
  const groups = new Map<string, number[]>();
  runs.forEach((r, i) => {
    const key = scheduleKey(r);
    const g = groups.get(key);
    if (g) g.push(i);
    else groups.set(key, [i]);
  });
  for (const indices of groups.values()) {
    indices.sort((a, b) => runs[a].nodes - runs[b].nodes);
    for (let q = 0; q < indices.length; q += LANES) {
      const members = indices.slice(q, q + LANES);
      if (members.length === 1) {
        const i = members[0];
        const ms = stepRun(runs[i], { ...options, onProgress: undefined });
        progress(runs[i].steps);
        results[i] = finishRun(runs[i], ms);
        continue;
      }
      const quad = members.map((i) => runs[i]);
      const ms = runQuad(quad, options, progress);
      // each model's share of the stepping time, for its periodic-start cost
      members.forEach((i, k) => (results[i] = finishRun(quad[k], ms / members.length)));
    }
  }
  if (onProgress) onProgress(1);
  return results;
}
