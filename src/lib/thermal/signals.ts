// boundary signals: constant, sine, series. evaluation is branch + arithmetic only, so it can sit in the time loop.
import type { Signal } from './types.ts';

const KIND_CONSTANT = 0;
const KIND_SINE = 1;
const KIND_SERIES = 2;

/** a signal flattened for cheap evaluation (no allocation when evaluated) */
export interface CompiledSignal {
  kind: number;
  // constant: a = value. sine: a = mean, b = amplitude, w = 2π/period, p = peakTime.
  // series: b = 1/step, values, repeat.
  a: number;
  b: number;
  w: number;
  p: number;
  values: Float64Array;
  repeat: boolean;
  step: number;
}

/** flattens a signal once, before the time loop */
export function compileSignal(signal: Signal): CompiledSignal {
  const empty = new Float64Array(0);
  switch (signal.kind) {
    case 'constant':
      return { kind: KIND_CONSTANT, a: signal.value, b: 0, w: 0, p: 0, values: empty, repeat: false, step: 0 };
    case 'sine':
      return {
        kind: KIND_SINE,
        a: signal.mean,
        b: signal.amplitude,
        w: (2 * Math.PI) / signal.period,
        p: signal.peakTime,
        values: empty,
        repeat: false,
        step: signal.period,
      };
    case 'series':
      return {
        kind: KIND_SERIES,
        a: 0,
        b: 1 / signal.step,
        w: 0,
        p: 0,
        values: Float64Array.from(signal.values),
        repeat: signal.repeat === true,
        step: signal.step,
      };
    default:
      throw new Error(`unknown signal kind: ${(signal as { kind: unknown }).kind}`);
  }
}

/** value of a compiled signal at time t (s) */
export function signalAt(s: CompiledSignal, t: number): number {
  if (s.kind === KIND_CONSTANT) return s.a;
  if (s.kind === KIND_SINE) return s.a + s.b * Math.cos(s.w * (t - s.p));
  const v = s.values;
  const n = v.length;
  if (n === 1) return v[0];
  let u = t * s.b; // time in samples
  if (s.repeat) {
    u = u % n; // repeating period is n samples: the last value ramps back to the first
    if (u < 0) u += n;
    const i = Math.floor(u);
    const f = u - i;
    const j = i + 1 === n ? 0 : i + 1;
    return v[i] + f * (v[j] - v[i]);
  }
  if (u <= 0) return v[0];
  if (u >= n - 1) return v[n - 1];
  const i = Math.floor(u);
  const f = u - i;
  return v[i] + f * (v[i + 1] - v[i]);
}

/** time derivative at t by a central difference of width h (s); used only at output times */
export function signalRate(s: CompiledSignal, t: number, h: number): number {
  if (s.kind === KIND_CONSTANT) return 0;
  if (s.kind === KIND_SINE) return -s.b * s.w * Math.sin(s.w * (t - s.p));
  return (signalAt(s, t + h) - signalAt(s, t - h)) / (2 * h);
}

/**
 * a change larger than this (K or W/m²) within one time step counts as a jump:
 * crank-nicolson cannot resolve it and rings, so the stepper restarts with implicit half-steps.
 */
export const JUMP_THRESHOLD = 1;

/**
 * times in (0, duration) where the signal jumps as seen by a stepper of step dt.
 * constant and sine signals are smooth; a series is continuous but a change of more than
 * JUMP_THRESHOLD between samples no more than dt apart is unresolved, so its sample time counts as a jump.
 */
export function jumpTimes(signal: Signal, duration: number, dt: number): number[] {
  if (signal.kind !== 'series' || signal.step > dt || signal.values.length < 2) return [];
  const out: number[] = [];
  const v = signal.values;
  const n = v.length;
  const limit = signal.repeat ? Math.ceil(duration / signal.step) : n - 1;
  for (let k = 1; k <= limit; k++) {
    const t = k * signal.step;
    if (t >= duration) break;
    const prev = v[(k - 1) % n];
    const cur = signal.repeat ? v[k % n] : v[k];
    if (Math.abs(cur - prev) > JUMP_THRESHOLD) out.push(t - signal.step); // the ramp starts at the previous sample
    if (out.length > 100000) break; // a pathological series: enough restarts to damp it, bounded work
  }
  return out;
}
