// the figures table of a run: what the Response pane, the report and a saved run show.
// pure: series in, numbers out. the simulated periodic figures come from the LAST full
// simulated period (first harmonic by a discrete fourier sum), beside the analytic ones.
import type { PeriodicResult } from '../thermal/types.ts';
import { dewPoint } from '../schemas/workbench.ts';

const HOUR = 3600;

/** first harmonic of a sampled signal: y ≈ mean + amplitude·cos(2π(t − peakTime)/period) */
export interface Harmonic {
  mean: number;
  /** half the peak-to-peak of the fitted cosine, in the signal's unit */
  amplitude: number;
  /** s in [0, period): when the fitted cosine peaks, counted from t = 0 */
  peakTime: number;
}

/**
 * Fits the first harmonic over the samples with from ≤ t < from + period, each weighted
 * by the time it stands for (exact for a pure sine sampled uniformly over whole periods).
 */
export function firstHarmonic(time: ArrayLike<number>, values: ArrayLike<number>, period: number, from: number): Harmonic {
  const w = (2 * Math.PI) / period;
  const to = from + period;
  const eps = 1e-6 * period;
  let s0 = 0;
  let sc = 0;
  let ss = 0;
  let total = 0;
  let n = 0;
  for (let k = 0; k < time.length; k++) {
    const t = time[k];
    if (t < from - eps || t >= to - eps) continue;
    // weight: the half-gaps to the neighbours (uniform samples give equal weights)
    const prev = k > 0 ? time[k - 1] : t;
    const next = k + 1 < time.length ? time[k + 1] : t;
    const dt = k > 0 && k + 1 < time.length ? (next - prev) / 2 : k > 0 ? t - prev : next - t;
    const y = values[k];
    s0 += y * dt;
    sc += y * Math.cos(w * t) * dt;
    ss += y * Math.sin(w * t) * dt;
    total += dt;
    n++;
  }
  if (n < 4 || total <= 0) return { mean: NaN, amplitude: NaN, peakTime: NaN };
  const a = (2 * sc) / total;
  const b = (2 * ss) / total;
  let peakTime = Math.atan2(b, a) / w;
  peakTime = ((peakTime % period) + period) % period;
  return { mean: s0 / total, amplitude: Math.hypot(a, b), peakTime };
}

/** a value and when it happened (s from midnight of the first reported day) */
export interface TimedValue {
  value: number;
  time: number;
}

/** what figures() needs: the whole run (warm-up included), sampled at the output times */
export interface FigureInput {
  /** s from the start of the run (midnight of the first warm-up day) */
  time: ArrayLike<number>;
  /** s: the warm-up that is left out of the reported figures (whole days) */
  reportStart: number;
  /** s: the analysis period (a day) */
  period: number;
  outsideAir: ArrayLike<number>;
  /** the temperature that drives the outside surface: sol-air with sun, else the air */
  solAir: ArrayLike<number>;
  insideAir: ArrayLike<number>;
  insideSurface: ArrayLike<number>;
  /** W/m², positive into the room */
  insideFlux: ArrayLike<number>;
  interfaces: ArrayLike<number>[];
  /** "Render / Mineral wool" … one per interface */
  interfaceNames: string[];
  uValue: number;
  analytic: PeriodicResult;
  energyBalanceError: number;
  cells: number;
  timeStep: number;
  /** m */
  maxCellSize: number;
  /** %, null leaves the dew-point check out */
  indoorRelativeHumidity: number | null;
  /** the outdoor signal repeats every day (sine or sol-air day) */
  outdoorPeriodic: boolean;
  /** the indoor air is constant */
  indoorConstant: boolean;
}

export interface RunFigures {
  /** the last full simulated period, s from the start of the run */
  lastPeriodFrom: number;
  decrementFactor: { simulated: number; analytic: number };
  /** s */
  timeLag: { simulated: number; analytic: number };
  /** W/m²K */
  periodicTransmittance: { simulated: number; analytic: number };
  /** W/m², over the reported days */
  peakInsideFlux: TimedValue;
  /** Wh/m² into the room (positive part of the inside flux) over the last day */
  heatGained: number;
  /** Wh/m² out of the room (negative part), given as a positive number */
  heatLost: number;
  insideSurfaceMin: TimedValue;
  insideSurfaceMax: TimedValue;
  /** the coldest interface over the reported days; null with a single layer */
  lowestInterface: (TimedValue & { name: string }) | null;
  /** Magnus dew point of the indoor air at its mean temperature and the given humidity */
  dewPoint: { value: number; airTemperature: number; relativeHumidity: number } | null;
  /** lowest interface (or the inside surface with one layer) at or below the dew point */
  belowDewPoint: boolean;
  energyBalanceError: number;
  cells: number;
  timeStep: number;
  maxCellSize: number;
  /** the periodic-state check: inside surface at the same times of the last two days */
  periodic: { checked: boolean; reached: boolean; maxDifference: number; criterion: string };
  /** how far the simulated figures can be read as periodic ones */
  notes: string[];
}

/** the tolerance of the periodic-state check, K (our own choice, stated in the warning) */
export const PERIODIC_TOLERANCE = 0.05;

function extreme(time: ArrayLike<number>, values: ArrayLike<number>, from: number, offset: number, sign: 1 | -1): TimedValue {
  let best = NaN;
  let at = NaN;
  for (let k = 0; k < time.length; k++) {
    if (time[k] < from - 1e-6) continue;
    const v = values[k];
    if (Number.isNaN(best) || sign * v > sign * best) {
      best = v;
      at = time[k] - offset;
    }
  }
  return { value: best, time: at };
}

/** ∫ of the positive and the negative parts (trapezoids split at zero crossings), value·s */
export function splitIntegral(time: ArrayLike<number>, values: ArrayLike<number>, from: number, to: number): { positive: number; negative: number } {
  let positive = 0;
  let negative = 0;
  for (let k = 1; k < time.length; k++) {
    const t0 = time[k - 1];
    const t1 = time[k];
    if (t0 < from - 1e-6 || t1 > to + 1e-6) continue;
    const a = values[k - 1];
    const b = values[k];
    const dt = t1 - t0;
    if (a >= 0 && b >= 0) positive += ((a + b) / 2) * dt;
    else if (a <= 0 && b <= 0) negative += ((a + b) / 2) * dt;
    else {
      // crossing: the part on each side of the zero is a triangle
      const f = a / (a - b);
      const left = (a / 2) * f * dt;
      const right = (b / 2) * (1 - f) * dt;
      if (a > 0) {
        positive += left;
        negative += right;
      } else {
        negative += left;
        positive += right;
      }
    }
  }
  return { positive, negative };
}

/** the figures table of one run */
export function figures(input: FigureInput): RunFigures {
  const { time, period, reportStart } = input;
  const n = time.length;
  const end = n > 0 ? time[n - 1] : 0;
  const lastFrom = Math.max(0, end - period);
  const notes: string[] = [];

  const drive = firstHarmonic(time, input.solAir, period, lastFrom);
  const flux = firstHarmonic(time, input.insideFlux, period, lastFrom);
  const transmittance = drive.amplitude > 1e-9 ? flux.amplitude / drive.amplitude : NaN;
  const decrement = transmittance / input.uValue;
  let lag = flux.peakTime - drive.peakTime;
  lag = ((lag % period) + period) % period;
  if (!(drive.amplitude > 1e-9)) {
    notes.push('The outdoor temperature does not swing, so there is no simulated decrement factor or time lag.');
    lag = NaN;
  }
  if (!input.outdoorPeriodic) notes.push('The outdoor air is an uploaded series: the decrement factor and time lag are fitted to its last day, which is not a repeating day, so they are approximate.');
  if (!input.indoorConstant) notes.push('The indoor air follows a schedule: the inside heat flux also answers the room\u2019s own swing, so the simulated decrement factor is not the wall\u2019s alone.');

  const heat = splitIntegral(time, input.insideFlux, lastFrom, end);

  const peak = extreme(time, input.insideFlux, reportStart, reportStart, 1);
  const sMin = extreme(time, input.insideSurface, reportStart, reportStart, -1);
  const sMax = extreme(time, input.insideSurface, reportStart, reportStart, 1);

  let lowest: (TimedValue & { name: string }) | null = null;
  input.interfaces.forEach((series, j) => {
    const m = extreme(time, series, reportStart, reportStart, -1);
    if (!lowest || m.value < lowest.value) lowest = { ...m, name: input.interfaceNames[j] ?? `interface ${j + 1}` };
  });

  let dew: RunFigures['dewPoint'] = null;
  let below = false;
  if (input.indoorRelativeHumidity !== null) {
    let sum = 0;
    let count = 0;
    for (let k = 0; k < n; k++) {
      if (time[k] < reportStart - 1e-6) continue;
      sum += input.insideAir[k];
      count++;
    }
    const air = count > 0 ? sum / count : NaN;
    dew = { value: dewPoint(air, input.indoorRelativeHumidity), airTemperature: air, relativeHumidity: input.indoorRelativeHumidity };
    const coldest = (lowest as (TimedValue & { name: string }) | null)?.value ?? sMin.value;
    below = coldest <= dew.value;
  }

  // periodic state: inside surface at the same times of the last two days
  let periodic: RunFigures['periodic'];
  const criterion = `inside surface temperature at the same time of the last two simulated days differs by at most ${PERIODIC_TOLERANCE} K`;
  if (!input.outdoorPeriodic) {
    // an uploaded series does not repeat daily: there is no periodic state to reach
    periodic = { checked: false, reached: false, maxDifference: NaN, criterion: `${criterion} (not checked: the outdoor series does not repeat daily)` };
  } else if (end - period * 2 < -1e-6) {
    periodic = { checked: false, reached: false, maxDifference: NaN, criterion: `${criterion} (not checked: the run is shorter than two days)` };
  } else {
    // samples are uniform: the sample one period earlier is a fixed number of indices back
    const interval = n > 1 ? time[1] - time[0] : period;
    const back = Math.round(period / interval);
    let maxDiff = 0;
    for (let k = n - 1; k >= 0 && time[k] >= lastFrom - 1e-6 && k - back >= 0; k--) {
      maxDiff = Math.max(maxDiff, Math.abs(input.insideSurface[k] - input.insideSurface[k - back]));
    }
    periodic = { checked: true, reached: maxDiff <= PERIODIC_TOLERANCE, maxDifference: maxDiff, criterion };
  }

  return {
    lastPeriodFrom: lastFrom,
    decrementFactor: { simulated: decrement, analytic: input.analytic.decrementFactor },
    timeLag: { simulated: lag, analytic: input.analytic.timeLag },
    periodicTransmittance: { simulated: transmittance, analytic: input.analytic.periodicTransmittance },
    peakInsideFlux: peak,
    heatGained: heat.positive / HOUR,
    heatLost: -heat.negative / HOUR,
    insideSurfaceMin: sMin,
    insideSurfaceMax: sMax,
    lowestInterface: lowest,
    dewPoint: dew,
    belowDewPoint: below,
    energyBalanceError: input.energyBalanceError,
    cells: input.cells,
    timeStep: input.timeStep,
    maxCellSize: input.maxCellSize,
    periodic,
    notes,
  };
}

/** "day 2, 15:00" for s from midnight of the first reported day */
export function dayClock(seconds: number): string {
  if (!Number.isFinite(seconds)) return '–';
  const minutes = Math.round(seconds / 60);
  const day = Math.floor(minutes / 1440);
  const m = minutes - day * 1440;
  return `day ${day + 1}, ${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
}

const round = (v: number, digits: number): number | null => (Number.isFinite(v) ? Number(v.toFixed(digits)) : null);

/** the flat summary a saved run keeps (runs.summary): numbers in the units named by the keys */
export function summaryOf(f: RunFigures): Record<string, number | string | null> {
  return {
    decrementFactorSimulated: round(f.decrementFactor.simulated, 4),
    decrementFactorAnalytic: round(f.decrementFactor.analytic, 4),
    timeLagSimulatedH: round(f.timeLag.simulated / HOUR, 3),
    timeLagAnalyticH: round(f.timeLag.analytic / HOUR, 3),
    peakInsideFluxWm2: round(f.peakInsideFlux.value, 3),
    peakInsideFluxAt: dayClock(f.peakInsideFlux.time),
    heatGainedWhm2: round(f.heatGained, 2),
    heatLostWhm2: round(f.heatLost, 2),
    insideSurfaceMinC: round(f.insideSurfaceMin.value, 3),
    insideSurfaceMaxC: round(f.insideSurfaceMax.value, 3),
    lowestInterfaceC: f.lowestInterface ? round(f.lowestInterface.value, 3) : null,
    lowestInterfaceAt: f.lowestInterface ? `${f.lowestInterface.name}, ${dayClock(f.lowestInterface.time)}` : null,
    dewPointC: f.dewPoint ? round(f.dewPoint.value, 3) : null,
    energyBalanceError: Number.isFinite(f.energyBalanceError) ? f.energyBalanceError : null,
    cells: f.cells,
    timeStepS: f.timeStep,
    maxCellSizeMm: round(f.maxCellSize * 1000, 3),
    periodicState: f.periodic.checked ? (f.periodic.reached ? 'reached' : 'not reached') : 'not checked',
    periodicMaxDifferenceK: round(f.periodic.maxDifference, 4),
  };
}
