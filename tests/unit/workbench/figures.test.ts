import { describe, it, expect } from 'vitest';
import { firstHarmonic, splitIntegral, figures, dayClock, summaryOf, ACCURACY_TOLERANCE } from '../../../src/lib/workbench/figures';
import { dewPoint, defaultExposure, type WorkbenchDocument } from '../../../src/lib/schemas/workbench';
import { runDocument } from '../../../src/lib/workbench/runDocument';

const DAY = 86400;
const sampled = (n: number, step: number, f: (t: number) => number) => {
  const time = Array.from({ length: n }, (_, k) => k * step);
  return { time, values: time.map(f) };
};

describe('firstHarmonic', () => {
  it('recovers the mean, amplitude and peak time of a pure sine sampled every 15 minutes (exact for a sampled sine: discrete orthogonality)', () => {
    const { time, values } = sampled(3 * 96 + 1, 900, (t) => 17 + 6.5 * Math.cos((2 * Math.PI * (t - 15.25 * 3600)) / DAY));
    const h = firstHarmonic(time, values, DAY, 2 * DAY);
    expect(h.mean).toBeCloseTo(17, 10);
    expect(h.amplitude).toBeCloseTo(6.5, 10);
    expect(h.peakTime).toBeCloseTo(15.25 * 3600, 4);
  });

  it('ignores the second harmonic and the mean when fitting the first (orthogonality of the fourier basis)', () => {
    const { time, values } = sampled(97, 900, (t) => 3 + 2 * Math.cos((2 * Math.PI * (t - 3600)) / DAY) + 4 * Math.sin((4 * Math.PI * t) / DAY));
    const h = firstHarmonic(time, values, DAY, 0);
    expect(h.amplitude).toBeCloseTo(2, 10);
    expect(h.peakTime).toBeCloseTo(3600, 4);
  });

  it('gives NaN when fewer than four samples fall in the period', () => {
    expect(Number.isNaN(firstHarmonic([0, 1], [1, 2], DAY, 0).amplitude)).toBe(true);
  });
});

describe('splitIntegral', () => {
  it('integrates the positive and negative halves of a sine to ±A·P/π (analytic ∫ of |sin| over a half period)', () => {
    const { time, values } = sampled(24 * 60 + 1, 60, (t) => 10 * Math.sin((2 * Math.PI * t) / DAY));
    const { positive, negative } = splitIntegral(time, values, 0, DAY);
    expect(positive / ((10 * DAY) / Math.PI)).toBeCloseTo(1, 5);
    expect(negative / ((-10 * DAY) / Math.PI)).toBeCloseTo(1, 5);
  });

  it('splits a linear ramp through zero at the crossing (triangle areas)', () => {
    const { positive, negative } = splitIntegral([0, 10], [-2, 8], 0, 10);
    expect(positive).toBeCloseTo(0.5 * 8 * 8, 12);
    expect(negative).toBeCloseTo(-0.5 * 2 * 2, 12);
  });
});

describe('dewPoint (Magnus formula, Alduchov & Eskridge coefficients)', () => {
  it('gives 9.3 °C for air at 20 °C and 50 % relative humidity (psychrometric tables, from memory)', () => {
    expect(dewPoint(20, 50)).toBeCloseTo(9.3, 1);
  });
  it('equals the air temperature at 100 % relative humidity (definition of the dew point)', () => {
    expect(dewPoint(12.5, 100)).toBeCloseTo(12.5, 10);
  });
});

describe('dayClock', () => {
  it('reads seconds from midnight of the first reported day as day and hh:mm', () => {
    expect(dayClock(0)).toBe('day 1, 00:00');
    expect(dayClock(DAY + 15 * 3600)).toBe('day 2, 15:00');
    expect(dayClock(Number.NaN)).toBe('–');
  });
});

// a heavy single-layer wall (our own example: 200 mm of dense concrete, typical values from memory)
const concreteWall = (days: number, warmupDays: number): WorkbenchDocument => ({
  version: 2,
  layers: [
    { id: 'a', name: 'Dense concrete', materialRef: null, materialClass: 'concrete', thickness: 0.2, conductivity: 1.35, density: 2000, specificHeat: 1000, vapourResistanceFactor: null, source: 'typical value, from memory', note: '' },
    { id: 'b', name: 'Mineral wool', materialRef: null, materialClass: 'insulation', thickness: 0.1, conductivity: 0.035, density: 50, specificHeat: 1030, vapourResistanceFactor: null, source: 'typical value, from memory', note: '' },
  ],
  exposure: { ...defaultExposure(), days, warmupDays },
});

describe('figures of a simulated run', () => {
  it('matches the analytic ISO 13786 decrement factor within 1 % and time lag within 5 minutes from the periodic start, with no warm-up (engine contract accuracy)', () => {
    const out = runDocument(concreteWall(3, 6));
    if (out.kind !== 'done') throw new Error(JSON.stringify(out));
    const f = out.figures;
    expect(f.decrementFactor.simulated / f.decrementFactor.analytic).toBeGreaterThan(0.99);
    expect(f.decrementFactor.simulated / f.decrementFactor.analytic).toBeLessThan(1.01);
    const lagDiff = Math.abs(f.timeLag.simulated - f.timeLag.analytic);
    expect(Math.min(lagDiff, DAY - lagDiff)).toBeLessThan(300);
    expect(f.periodic.start).toBe('periodic');
    expect(f.periodic.checked).toBe(true);
    expect(f.periodic.reached).toBe(true);
    expect(f.bookkeepingClosure).toBeLessThan(1e-6);
    // the warm-up days of the document are ignored for a repeating day: the reported days start at t = 0
    expect(out.series.time[0]).toBe(0);
    expect(out.series.time[out.nTimes - 1]).toBe(3 * DAY);
    // the estimate at twice the step and cell is small for the default 300 s / 5 mm
    expect(f.accuracy).not.toBeNull();
    expect(f.accuracy!.relative).toBeLessThan(ACCURACY_TOLERANCE);
    expect(f.scheme).toMatch(/Crank–Nicolson/);
  });

  it('estimates the discretisation error from a run at twice the step and cell: it grows about fourfold when the step doubles (second order, Crank–Nicolson)', () => {
    const fine = concreteWall(2, 0);
    fine.exposure.timeStep = 900;
    fine.exposure.maxCellSize = 0.02;
    const coarse = structuredClone(fine);
    coarse.exposure.timeStep = 1800;
    coarse.exposure.maxCellSize = 0.04;
    const a = runDocument(fine);
    const b = runDocument(coarse);
    if (a.kind !== 'done' || b.kind !== 'done') throw new Error('run failed');
    const ratio = b.figures.accuracy!.maxDifference / a.figures.accuracy!.maxDifference;
    // observed order 2 in both step and cell: the difference grows by 2² = 4; the minimum of cells per layer keeps thin layers
    // from coarsening fully, so allow 2.2–6 (first order would give 2)
    expect(ratio).toBeGreaterThan(2.2);
    expect(ratio).toBeLessThan(6);
  });

  it('balances the day: heat gained minus heat lost equals the mean inside flux times a day (U·(mean outside − inside), steady part of a periodic state)', () => {
    const out = runDocument(concreteWall(2, 8));
    if (out.kind !== 'done') throw new Error('run failed');
    const f = out.figures;
    const e = defaultExposure();
    const u = out.analytic.steady.uValue;
    const meanOut = e.outdoor.mode === 'sine' ? e.outdoor.mean : NaN;
    const inside = e.indoor.mode === 'constant' ? e.indoor.value : NaN;
    const expected = (u * (meanOut - inside) * DAY) / 3600; // Wh/m²
    expect(f.heatGained - f.heatLost).toBeCloseTo(expected, 1);
  });

  it('for a non-repeating upload, reports how much the start still moves the last reported day and never claims a periodic state', () => {
    // ten days of hourly air with a weather drift (our own synthetic series)
    const air = Array.from({ length: 240 }, (_, h) => 12 + 0.4 * (h / 24) + 6 * Math.sin((2 * Math.PI * (h - 9)) / 24) + 3 * Math.sin(h / 37));
    const doc = concreteWall(2, 0);
    doc.exposure.outdoor = { mode: 'series', uploadId: 1, absorptance: 0.6 };
    const cold = runDocument(doc, { step: 3600, air });
    doc.exposure.warmupDays = 7;
    const warm = runDocument(doc, { step: 3600, air });
    if (cold.kind !== 'done' || warm.kind !== 'done') throw new Error('run failed');
    expect(cold.figures.periodic.start).toBe('warm-up');
    expect(cold.figures.periodic.checked).toBe(true);
    // a heavy wall with no warm-up still remembers its start after two days
    expect(cold.figures.periodic.maxDifference).toBeGreaterThan(ACCURACY_TOLERANCE);
    expect(warm.figures.periodic.maxDifference).toBeLessThan(cold.figures.periodic.maxDifference);
    expect(cold.figures.periodic.reached).toBe(false);
    expect(warm.figures.periodic.reached).toBe(false);
    expect(summaryOf(warm.figures).periodicState).toMatch(/not periodic/);
    expect(cold.figures.notes.join(' ')).toMatch(/fitted and approximate/);
  });

  it('finds the lowest interface and carries the ISO 13788 moisture check of a document with a climate into the figures and the summary', () => {
    const doc = concreteWall(1, 2);
    doc.exposure.outdoor = { mode: 'sine', mean: -5, amplitude: 3, peakHour: 14 };
    doc.exposure.indoor = { mode: 'constant', value: 20 };
    const out = runDocument(doc);
    if (out.kind !== 'done') throw new Error('run failed');
    expect(out.figures.lowestInterface?.name).toBe('Dense concrete / Mineral wool');
    // no μ and no climate: no moisture figures
    expect(out.figures.moisture).toBeNull();
    expect(summaryOf(out.figures).moistureVerdict).toBeNull();
    // insulation outside a vapour-tight concrete (μ 120) under a cold year: nothing condenses (common practice)
    doc.layers = [{ ...doc.layers[1], vapourResistanceFactor: 1 }, { ...doc.layers[0], vapourResistanceFactor: 120 }];
    doc.exposure.climate = { months: Array.from({ length: 12 }, (_, i) => ({ temperature: i < 3 || i > 9 ? -5 : 12, relativeHumidity: 85 })), indoor: { temperature: 20, relativeHumidity: 50 } };
    const wet = runDocument(doc);
    if (wet.kind !== 'done') throw new Error('run failed');
    expect(wet.figures.moisture?.verdict).toBe('none');
    const summary = summaryOf(wet.figures);
    expect(summary.moistureVerdict).toBe('none');
    expect(summary.moistureDriesOut).toBe('yes');
    expect(summary.surfaceMouldRisk).toBe('no');
    expect(summary.surfaceFRsi).toBeGreaterThan(0.9);
  });

  it('reports no simulated decrement factor when the outdoor air does not swing', () => {
    const doc = concreteWall(1, 1);
    doc.exposure.outdoor = { mode: 'sine', mean: 10, amplitude: 0, peakHour: 14 };
    const out = runDocument(doc);
    if (out.kind !== 'done') throw new Error('run failed');
    expect(Number.isNaN(out.figures.decrementFactor.simulated)).toBe(true);
    expect(out.figures.notes.join(' ')).toMatch(/does not swing/);
  });
});

describe('figures()', () => {
  it('fits a synthetic sine pair: the flux amplitude over the outdoor amplitude over U is the decrement factor, the phase difference is the lag', () => {
    const n = 2 * 96 + 1;
    const time = Array.from({ length: n }, (_, k) => k * 900);
    const air = time.map((t) => 20 + 5 * Math.cos((2 * Math.PI * (t - 14 * 3600)) / DAY));
    const flux = time.map((t) => 1 + 0.8 * Math.cos((2 * Math.PI * (t - 22 * 3600)) / DAY));
    const flat = time.map(() => 21);
    const f = figures({
      time, reportStart: 0, period: DAY, outsideAir: air, solAir: air, insideAir: flat, insideSurface: flat, insideFlux: flux,
      interfaces: [], interfaceNames: [], uValue: 0.4,
      analytic: { period: DAY, periodicTransmittance: 0.16, decrementFactor: 0.4, timeLag: 8 * 3600, admittanceInside: 0, arealHeatCapacityInside: 0 },
      bookkeepingClosure: 0, cells: 10, timeStep: 300, maxCellSize: 0.005, outdoorPeriodic: true, indoorConstant: true,
    });
    expect(f.periodicTransmittance.simulated).toBeCloseTo(0.16, 10);
    expect(f.decrementFactor.simulated).toBeCloseTo(0.4, 10);
    expect(f.timeLag.simulated).toBeCloseTo(8 * 3600, 3);
    expect(f.peakInsideFlux.value).toBeCloseTo(1.8, 10);
    // the flux swings 1 ± 0.8: it never leaves the room, so the peak loss is 0 and the peak gain 1.8 at 22:00
    expect(f.peakHeatGain.value).toBeCloseTo(1.8, 10);
    expect(f.peakHeatGain.time).toBeCloseTo(22 * 3600, 6);
    expect(f.peakHeatLoss.value).toBe(0);
    // two days of mean 1 W/m²: 48 Wh/m² in, nothing out (a cosine integrates to zero over whole periods)
    expect(f.totalHeatGained).toBeCloseTo(0.048, 6);
    expect(f.totalHeatLost).toBe(0);
    expect(f.monthly).toEqual([]);
    expect(f.periodic.reached).toBe(true);
    expect(f.moisture).toBeNull();
  });
});

describe('figures() of a long run', () => {
  it('splits the heat of a year into gained and lost, totals and calendar months, with the peak loss and gain apart', () => {
    // a flux of 2·cos(2π t / year) + 0.5·cos(2π t / day) W/m², hourly over 365 days (synthetic)
    const YEAR = 365 * DAY;
    const time = Array.from({ length: 365 * 24 + 1 }, (_, k) => k * 3600);
    const flux = time.map((t) => 2 * Math.cos((2 * Math.PI * t) / YEAR) + 0.5 * Math.cos((2 * Math.PI * t) / DAY));
    const flat = time.map(() => 20);
    const f = figures({
      time, reportStart: 0, period: DAY, outsideAir: flat, solAir: flat, insideAir: flat, insideSurface: flat, insideFlux: flux,
      interfaces: [], interfaceNames: [], uValue: 0.4,
      analytic: { period: DAY, periodicTransmittance: 0.16, decrementFactor: 0.4, timeLag: 8 * 3600, admittanceInside: 0, arealHeatCapacityInside: 0 },
      bookkeepingClosure: 0, cells: 10, timeStep: 3600, maxCellSize: 0.005, outdoorPeriodic: false, indoorConstant: true,
    });
    // the yearly cosine's positive half: ∫ 2 cos over half a year = 2·YEAR/π J/m² → kWh/m² (the daily ripple adds a little where both signs meet)
    const half = (2 * YEAR) / Math.PI / 3.6e6;
    expect(f.totalHeatGained).toBeGreaterThan(half);
    expect(f.totalHeatGained).toBeLessThan(half * 1.05);
    // the mean is zero: as much heat leaves as enters over the whole year
    expect(f.totalHeatGained - f.totalHeatLost).toBeCloseTo(0, 3);
    expect(f.monthly).toHaveLength(12);
    expect(f.monthly.map((m) => m.days)).toEqual([31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]);
    const sumGained = f.monthly.reduce((a, m) => a + m.gained, 0);
    expect(sumGained).toBeCloseTo(f.totalHeatGained, 9);
    // January gains, July loses
    expect(f.monthly[0].gained).toBeGreaterThan(f.monthly[0].lost);
    expect(f.monthly[6].lost).toBeGreaterThan(f.monthly[6].gained);
    expect(f.peakHeatGain.value).toBeCloseTo(2.5, 2);
    expect(f.peakHeatLoss.value).toBeCloseTo(2.5, 2);
    expect(f.peakHeatLoss.time).toBeGreaterThan(150 * DAY);
    expect(f.peakHeatLoss.time).toBeLessThan(215 * DAY);
    expect(f.periodic.start).toBe('warm-up');
    expect(f.periodic.reached).toBe(false);
  });
});
