// boundary signals: constant, sine, series. evaluation is branch + arithmetic only, so it can sit in the time loop.
import type { Model, Signal } from './types.ts';

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

/** the period of a repeating signal, s: null for a constant (it repeats with any period), undefined when it does not repeat */
export function signalPeriod(signal: Signal): number | null | undefined {
  if (signal.kind === 'constant') return null;
  if (signal.kind === 'sine') return signal.period;
  if (signal.repeat === true) return signal.values.length * signal.step;
  return signal.values.length === 1 ? null : undefined;
}

/** every signal of a model with its path, outside first */
export function modelSignals(model: Pick<Model, 'outside' | 'inside'>): { path: string; signal: Signal }[] {
  const out: { path: string; signal: Signal }[] = [{ path: 'outside.air', signal: model.outside.air }];
  if (model.outside.solar) out.push({ path: 'outside.solar.irradiance', signal: model.outside.solar.irradiance });
  if (model.outside.longWave) out.push({ path: 'outside.longWave.netLoss', signal: model.outside.longWave.netLoss });
  out.push({ path: 'inside.air', signal: model.inside.air });
  return out;
}

/**
 * the common period P of a model's signals for a periodic start (engine contract, "Periodic start"):
 * every signal must repeat; P is the longest period and every other period divides it to 1e-9 relative.
 * period null: all signals are constant (the periodic state is the steady state).
 */
export function commonPeriod(
  model: Pick<Model, 'outside' | 'inside'>,
): { ok: true; period: number | null } | { ok: false; message: string } {
  const signals = modelSignals(model);
  let longest: number | null = null;
  for (const { path, signal } of signals) {
    const p = signalPeriod(signal);
    if (p === undefined) {
      return { ok: false, message: `"periodic" needs every signal to repeat, but ${path} is a series without "repeat": true` };
    }
    if (p !== null && (longest === null || p > longest)) longest = p;
  }
  if (longest === null) return { ok: true, period: null };
  for (const { path, signal } of signals) {
    const p = signalPeriod(signal);
    if (p === null || p === undefined) continue;
    const ratio = longest / p;
    if (Math.abs(ratio - Math.round(ratio)) > 1e-9 * ratio) {
      return {
        ok: false,
        message: `"periodic" needs every period to divide the longest (${longest} s), but ${path} repeats every ${p} s`,
      };
    }
  }
  return { ok: true, period: longest };
}
