// jumps of the driving temperature that a time step cannot resolve.
//
// crank–nicolson damps the stiff modes of the wall hardly at all, so a drive that changes abruptly inside one step
// leaves an oscillation that rings for many steps. the stepper restarts after such a jump (simulate.ts). a change
// counts as a jump only when, in the combined driving temperature in kelvin (outside: air + R_se·(α·I − netLoss);
// inside: the inside air),
//   - it is concentrated: more than JUMP_CONCENTRATION of the variation over [t − dt/2, t + dt] happens
//     within [t, t + dt/2], so a ramp over a whole step (0.5), a sine, or an hourly series at hourly steps is none, so a ramp over a whole step, a sine, or an hourly series at hourly steps is none;
//   - and it is large: the variation within that half step is over JUMP_MIN_CHANGE kelvin.
// it is placed at the piece where it starts (a piece at least as steep as the half step ahead on average).
// only series finer than the step can change faster than the step; constants, sines and series at least one step
// apart are resolved by construction and are evaluated only as part of the combined drive.
import { drivingTemperature, type BoundarySide } from './boundary.ts';
import type { CompiledSignal } from './signals.ts';

/** K: smaller changes cannot make visible ringing (common practice: well below the accuracy of any input) */
export const JUMP_MIN_CHANGE = 0.1;
/** share of the variation over 1.5 steps that must fall within half a step */
export const JUMP_CONCENTRATION = 0.6;
/** bound on the breakpoints examined, so a pathological series cannot make the check expensive */
const MAX_BREAKPOINTS = 4_000_000;

function fineSeries(side: BoundarySide, dt: number): CompiledSignal[] {
  const out: CompiledSignal[] = [];
  for (const s of [side.air, side.irradiance, side.netLoss]) {
    if (s !== null && s.kind === 2 && s.values.length > 1 && s.step < dt) out.push(s);
  }
  return out;
}

/** sorted times in [0, duration) where the side's driving temperature jumps as seen by a step dt */
export function sideJumps(side: BoundarySide, duration: number, dt: number): number[] {
  const fine = fineSeries(side, dt);
  if (fine.length === 0) return [];
  // breakpoints of the fine series (where the drive changes slope), plus both ends
  const points: number[] = [0, duration];
  for (const s of fine) {
    const last = s.repeat ? Math.floor(duration / s.step) : Math.min(s.values.length - 1, Math.floor(duration / s.step));
    for (let k = 1; k <= last && points.length < MAX_BREAKPOINTS; k++) points.push(k * s.step);
  }
  const sorted = Float64Array.from(points).sort();
  const eps = 1e-9 * dt;
  let m = 0;
  for (let j = 0; j < sorted.length; j++) if (m === 0 || sorted[j] - sorted[m - 1] > eps) sorted[m++] = sorted[j];
  const tau = sorted.subarray(0, m);
  // variation of each piece and its prefix sums
  const prefix = new Float64Array(m);
  let prev = drivingTemperature(side, tau[0]);
  for (let j = 1; j < m; j++) {
    const d = drivingTemperature(side, tau[j]);
    prefix[j] = prefix[j - 1] + Math.abs(d - prev);
    prev = d;
  }
  // cumulative variation F(t), linear within each piece; p is a cursor that only moves forward
  const cumulative = (t: number, p: number): number => {
    if (t <= tau[0]) return 0;
    if (t >= tau[m - 1]) return prefix[m - 1];
    const w = tau[p + 1] - tau[p];
    return prefix[p] + ((t - tau[p]) / w) * (prefix[p + 1] - prefix[p]);
  };
  const out: number[] = [];
  let lo = 0; // piece holding t − dt/2
  let mid = 0; // piece holding t + dt/2
  let hi = 0; // piece holding t + dt
  const pieces = m - 1;
  for (let j = 0; j < pieces; j++) {
    const t = tau[j];
    if (t >= duration) break;
    while (lo < pieces - 1 && tau[lo + 1] <= t - dt / 2) lo++;
    while (mid < pieces - 1 && tau[mid + 1] <= t + dt / 2) mid++;
    while (hi < pieces - 1 && tau[hi + 1] <= t + dt) hi++;
    const at = prefix[j];
    const short = cumulative(t + dt / 2, mid) - at;
    if (short <= JUMP_MIN_CHANGE) continue;
    // the change must start here: this piece at least as steep as the half step ahead on average
    if ((prefix[j + 1] - at) * (dt / 2) < short * (tau[j + 1] - t)) continue;
    const long = cumulative(t + dt, hi) - cumulative(t - dt / 2, lo);
    if (short > JUMP_CONCENTRATION * long) out.push(t);
  }
  return out;
}

/** sorted, distinct indices of the steps (of size dt, the last possibly shorter) in which a jump starts */
export function jumpSteps(outside: BoundarySide, inside: BoundarySide, duration: number, dt: number, steps: number): number[] {
  const set = new Set<number>();
  for (const t of [...sideJumps(outside, duration, dt), ...sideJumps(inside, duration, dt)]) {
    set.add(Math.min(steps - 1, Math.floor(t / dt + 1e-9)));
  }
  return [...set].sort((a, b) => a - b);
}
