// the figures table of a run: what the Response pane, the report and a saved run show.
// pure: series in, numbers out. the simulated periodic figures come from the LAST full
// simulated period (first harmonic by a discrete fourier sum), beside the analytic ones.
import type { PeriodicResult } from '../thermal/types.ts';
import type { MoistureFigures } from '../moisture/index.ts';

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
  /** the engine's energy bookkeeping closure, |in − out − stored| relative (Result.energy.balanceError) */
  bookkeepingClosure: number;
  cells: number;
  timeStep: number;
  /** m */
  maxCellSize: number;
  /** the ISO 13788 moisture check of the document (null without a climate), carried into the figures */
  moisture?: MoistureFigures | null;
  /** every signal repeats each day (sine or sol-air day): the run started in its periodic state */
  outdoorPeriodic: boolean;
  /** the time-stepping scheme as the engine ran it, in words (e.g. "Crank–Nicolson, 864 steps") */
  scheme?: string;
  /** the discretisation-error estimate, when the run made one */
  accuracy?: AccuracyEstimate | null;
  /** non-repeating series only: a second run from another start (the same output times from t = 0, possibly shorter), for the start-up memory */
  otherStart?: { time: ArrayLike<number>; insideFlux: ArrayLike<number> } | null;
  /** the indoor air is constant */
  indoorConstant: boolean;
}

/** the discretisation-error estimate: the same run at twice the step and twice the cell size */
export interface AccuracyEstimate {
  /** largest |inside flux − coarse run's inside flux| at their common times over the reported days, W/m² */
  maxDifference: number;
  /** maxDifference relative to the inside flux amplitude (half its range over the reported days) */
  relative: number;
  /** s, the coarse run's step */
  coarseTimeStep: number;
  /** cells of the coarse run's mesh */
  coarseCells: number;
}

/** heat through the inside surface in one month of the reported period, kWh/m² */
export interface MonthHeat {
  /** 1 for the month that starts with the first reported day */
  month: number;
  /** days of the reported period in this month */
  days: number;
  gained: number;
  lost: number;
}

/** the relative tolerance of the accuracy estimate and of the periodic / start-up checks (our own choice, stated in the warnings) */
export const ACCURACY_TOLERANCE = 0.01;

export interface RunFigures {
  /** the last full simulated period, s from the start of the run */
  lastPeriodFrom: number;
  decrementFactor: { simulated: number; analytic: number };
  /** s */
  timeLag: { simulated: number; analytic: number };
  /** W/m²K */
  periodicTransmittance: { simulated: number; analytic: number };
  /** W/m², over the reported days: the algebraic maximum (kept for older summaries; see peakHeatGain / peakHeatLoss) */
  peakInsideFlux: TimedValue;
  /** W/m² into the room: the largest positive inside flux over the reported days (0 when it never enters) */
  peakHeatGain: TimedValue;
  /** W/m² out of the room, as a positive number: the largest loss over the reported days (0 when none) */
  peakHeatLoss: TimedValue;
  /** kWh/m² into the room over the whole reported period */
  totalHeatGained: number;
  /** kWh/m² out of the room over the whole reported period, as a positive number */
  totalHeatLost: number;
  /** by months of the reported period (calendar month lengths from 1 January, as uploads carry no dates); empty under 28 days */
  monthly: MonthHeat[];
  /** Wh/m² into the room (positive part of the inside flux) over the last day */
  heatGained: number;
  /** Wh/m² out of the room (negative part), given as a positive number */
  heatLost: number;
  insideSurfaceMin: TimedValue;
  insideSurfaceMax: TimedValue;
  /** the coldest interface over the reported days; null with a single layer */
  lowestInterface: (TimedValue & { name: string }) | null;
  /** the ISO 13788 moisture check (interstitial and surface) under the document's monthly climate; null without one */
  moisture: MoistureFigures | null;
  /** the engine's energy bookkeeping closure: it closes by construction of the scheme, so it says nothing of accuracy */
  bookkeepingClosure: number;
  cells: number;
  timeStep: number;
  maxCellSize: number;
  /** the scheme as the engine ran it, in words */
  scheme: string;
  /** the discretisation-error estimate; null when not made */
  accuracy: AccuracyEstimate | null;
  /**
   * how periodic the last reported day is. start 'periodic': the run began in the periodic state
   * (checked on the last two days when there are two); start 'warm-up': a non-repeating series,
   * where `maxDifference` is how much the start still moves the last reported day's inside flux
   * (a second run from another start), relative to its amplitude; "reached" is never claimed.
   * `checkedDay` is the reported day (1-based) the difference was measured on: the last one, or for
   * runs longer than a week the seventh (the start's effect only fades after it: an upper bound).
   */
  periodic: { start: 'periodic' | 'warm-up'; checked: boolean; reached: boolean; maxDifference: number; criterion: string; checkedDay?: number };
  /** how far the simulated figures can be read as periodic ones */
  notes: string[];
}


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
  if (!input.outdoorPeriodic) notes.push('The outdoor air is an uploaded series: the decrement factor and time lag are fitted to its last reported day, which is not a repeating day, so they are fitted and approximate.');
  if (!input.indoorConstant) notes.push('The indoor air follows a schedule: the inside heat flux also answers the room\u2019s own swing, so the simulated decrement factor is not the wall\u2019s alone.');

  const heat = splitIntegral(time, input.insideFlux, lastFrom, end);
  const whole = splitIntegral(time, input.insideFlux, reportStart, end);

  const peak = extreme(time, input.insideFlux, reportStart, reportStart, 1);
  const low = extreme(time, input.insideFlux, reportStart, reportStart, -1);
  const peakHeatGain: TimedValue = peak.value > 0 ? peak : { value: 0, time: NaN };
  const peakHeatLoss: TimedValue = low.value < 0 ? { value: -low.value, time: low.time } : { value: 0, time: NaN };
  const sMin = extreme(time, input.insideSurface, reportStart, reportStart, -1);
  const sMax = extreme(time, input.insideSurface, reportStart, reportStart, 1);
  const fluxAmplitude = (peak.value - low.value) / 2;

  let lowest: (TimedValue & { name: string }) | null = null;
  input.interfaces.forEach((series, j) => {
    const m = extreme(time, series, reportStart, reportStart, -1);
    if (!lowest || m.value < lowest.value) lowest = { ...m, name: input.interfaceNames[j] ?? `interface ${j + 1}` };
  });

  // how periodic the last reported day is, on the inside heat flux relative to its amplitude
  const scale = Math.max(fluxAmplitude, 1e-3);
  const pct = `${ACCURACY_TOLERANCE * 100} %`;
  let periodic: RunFigures['periodic'];
  if (input.outdoorPeriodic) {
    const criterion = `the run starts in the periodic state of its repeating day; checked: the inside heat flux at the same time of the last two reported days differs by at most ${pct} of its amplitude`;
    if (end - reportStart < 2 * period - 1e-6) {
      periodic = { start: 'periodic', checked: false, reached: true, maxDifference: NaN, criterion: `${criterion} (not checked: one reported day)` };
    } else {
      const interval = n > 1 ? time[1] - time[0] : period;
      const back = Math.round(period / interval);
      let maxDiff = 0;
      for (let k = n - 1; k >= 0 && time[k] >= lastFrom - 1e-6 && k - back >= 0; k--) {
        maxDiff = Math.max(maxDiff, Math.abs(input.insideFlux[k] - input.insideFlux[k - back]));
      }
      const rel = maxDiff / scale;
      periodic = { start: 'periodic', checked: true, reached: rel <= ACCURACY_TOLERANCE, maxDifference: rel, criterion };
    }
  } else {
    const criterion = `a second run from another start (uniform at the mean of the two air temperatures at time zero) differs on the inside heat flux of the last reported day (of the seventh on longer runs, a bound for the later ones) by at most ${pct} of its amplitude`;
    const other = input.otherStart;
    if (!other || other.time.length < 2) periodic = { start: 'warm-up', checked: false, reached: false, maxDifference: NaN, criterion: `${criterion} (not checked)` };
    else {
      const otherEnd = other.time[other.time.length - 1];
      const from = otherEnd - period;
      let maxDiff = 0;
      for (let k = 0; k < Math.min(n, other.time.length); k++) {
        if (time[k] >= from - 1e-6 && Math.abs(time[k] - other.time[k]) < 1e-6) maxDiff = Math.max(maxDiff, Math.abs(input.insideFlux[k] - other.insideFlux[k]));
      }
      // never "reached": a non-repeating series has no periodic state; this says only that the start is forgotten
      periodic = { start: 'warm-up', checked: true, reached: false, maxDifference: maxDiff / scale, criterion, checkedDay: Math.round((otherEnd - reportStart) / period) };
    }
  }

  // months of the reported period: calendar lengths of a common year from the first reported day
  const monthly: MonthHeat[] = [];
  const reportedDays = (end - reportStart) / 86400;
  if (reportedDays >= 28 - 1e-9) {
    const lengths = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
    let from = reportStart;
    for (let m = 0; from < end - 1e-6; m++) {
      const to = Math.min(end, from + lengths[m % 12] * 86400);
      const part = splitIntegral(time, input.insideFlux, from, to);
      monthly.push({ month: m + 1, days: (to - from) / 86400, gained: part.positive / HOUR / 1000, lost: (0 - part.negative) / HOUR / 1000 });
      from = to;
    }
  }

  return {
    lastPeriodFrom: lastFrom,
    decrementFactor: { simulated: decrement, analytic: input.analytic.decrementFactor },
    timeLag: { simulated: lag, analytic: input.analytic.timeLag },
    periodicTransmittance: { simulated: transmittance, analytic: input.analytic.periodicTransmittance },
    peakInsideFlux: peak,
    peakHeatGain,
    peakHeatLoss,
    totalHeatGained: whole.positive / HOUR / 1000,
    totalHeatLost: (0 - whole.negative) / HOUR / 1000,
    monthly,
    heatGained: heat.positive / HOUR,
    heatLost: -heat.negative / HOUR,
    insideSurfaceMin: sMin,
    insideSurfaceMax: sMax,
    lowestInterface: lowest,
    moisture: input.moisture ?? null,
    bookkeepingClosure: input.bookkeepingClosure,
    cells: input.cells,
    timeStep: input.timeStep,
    maxCellSize: input.maxCellSize,
    scheme: input.scheme ?? 'Crank–Nicolson',
    accuracy: input.accuracy ?? null,
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

/** the flat summary a saved run keeps (runs.summary): numbers in the units named by the keys; also the command line's `figures` */
export function summaryOf(f: RunFigures): Record<string, number | string | null> {
  return {
    decrementFactorSimulated: round(f.decrementFactor.simulated, 4),
    decrementFactorAnalytic: round(f.decrementFactor.analytic, 4),
    timeLagSimulatedH: round(f.timeLag.simulated / HOUR, 3),
    timeLagAnalyticH: round(f.timeLag.analytic / HOUR, 3),
    periodicTransmittanceSimulatedWm2K: round(f.periodicTransmittance.simulated, 4),
    periodicTransmittanceAnalyticWm2K: round(f.periodicTransmittance.analytic, 4),
    peakInsideFluxWm2: round(f.peakInsideFlux.value, 3),
    peakInsideFluxAt: dayClock(f.peakInsideFlux.time),
    peakHeatGainWm2: round(f.peakHeatGain.value, 3),
    peakHeatGainAt: Number.isFinite(f.peakHeatGain.time) ? dayClock(f.peakHeatGain.time) : null,
    peakHeatLossWm2: round(f.peakHeatLoss.value, 3),
    peakHeatLossAt: Number.isFinite(f.peakHeatLoss.time) ? dayClock(f.peakHeatLoss.time) : null,
    heatGainedWhm2: round(f.heatGained, 2),
    heatLostWhm2: round(f.heatLost, 2),
    totalHeatGainedKWhm2: round(f.totalHeatGained, 4),
    totalHeatLostKWhm2: round(f.totalHeatLost, 4),
    insideSurfaceMinC: round(f.insideSurfaceMin.value, 3),
    insideSurfaceMaxC: round(f.insideSurfaceMax.value, 3),
    lowestInterfaceC: f.lowestInterface ? round(f.lowestInterface.value, 3) : null,
    lowestInterfaceAt: f.lowestInterface ? `${f.lowestInterface.name}, ${dayClock(f.lowestInterface.time)}` : null,
    moistureVerdict: f.moisture ? f.moisture.verdict : null,
    moistureMaxAccumulatedGm2: f.moisture ? round(f.moisture.maxAccumulated, 2) : null,
    moistureDriesOut: f.moisture ? (f.moisture.driesOut ? 'yes' : 'no') : null,
    moistureMaxAt: f.moisture?.maxAtPlane ?? null,
    moistureCondensingMonths: f.moisture ? f.moisture.condensingMonths : null,
    surfaceFRsi: f.moisture ? round(f.moisture.fRsi, 4) : null,
    surfaceFRsiMin: f.moisture?.fRsiMin != null ? round(f.moisture.fRsiMin, 4) : null,
    surfaceCriticalMonth: f.moisture?.criticalMonth ?? null,
    surfaceMouldRisk: f.moisture ? (f.moisture.mouldRisk ? 'yes' : 'no') : null,
    surfaceCondensationRisk: f.moisture ? (f.moisture.condensationRisk ? 'yes' : 'no') : null,
    bookkeepingClosure: Number.isFinite(f.bookkeepingClosure) ? f.bookkeepingClosure : null,
    accuracyEstimatePercent: f.accuracy ? round(f.accuracy.relative * 100, 3) : null,
    accuracyMaxDifferenceWm2: f.accuracy ? round(f.accuracy.maxDifference, 4) : null,
    cells: f.cells,
    timeStepS: f.timeStep,
    maxCellSizeMm: round(f.maxCellSize * 1000, 3),
    scheme: f.scheme,
    periodicStart: f.periodic.start,
    periodicState: f.periodic.start === 'warm-up' ? 'not periodic (uploaded series)' : f.periodic.checked ? (f.periodic.reached ? 'reached' : 'not reached') : 'periodic start, not checked',
    periodicMaxDifferencePercent: round(f.periodic.maxDifference * 100, 3),
  };
}

/** the monthly heat of a run as flat rows (kWh/m²), for the command line and exports */
export function monthlyOf(f: RunFigures): { month: number; days: number; heatGainedKWhm2: number; heatLostKWhm2: number }[] {
  return f.monthly.map((m) => ({ month: m.month, days: Number(m.days.toFixed(3)), heatGainedKWhm2: Number(m.gained.toFixed(4)), heatLostKWhm2: Number(m.lost.toFixed(4)) }));
}
