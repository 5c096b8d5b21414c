import { describe, expect, it } from 'vitest';
import { periodSampling, simulate, type Model, type Signal } from '../../../src/lib/thermal/index.ts';
import { fundamental } from './helpers.ts';
import { heavyDemoWall, timberAnnexWall } from './walls.ts';

const day = 86400;
const sine: Signal = { kind: 'sine', mean: 8, amplitude: 7, period: day, peakTime: 15 * 3600 };
const periodicModel = (over: Partial<Model> = {}): Model => ({
  layers: heavyDemoWall,
  outside: { surfaceResistance: 0.04, air: sine },
  inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
  initial: { kind: 'periodic' },
  duration: day,
  timeStep: 300,
  outputInterval: 600,
  ...over,
});

/** largest |s(t + P) − s(t)| over the outputs, for a series sampled every outputInterval */
function repeatError(values: number[], perPeriod: number): number {
  let e = 0;
  for (let k = 0; k + perPeriod < values.length; k++) e = Math.max(e, Math.abs(values[k + perPeriod] - values[k]));
  return e;
}

/** the contract's tolerance: 0.1 % of the inside-flux amplitude or 0.001 W/m², whichever is larger */
const tolerance = (flux: number[]): number => Math.max(0.001, 0.001 * ((Math.max(...flux) - Math.min(...flux)) / 2));

describe('periodic start', { timeout: 60_000 }, () => {
  it('gives the heavy wall the ISO 13786 decrement within 1 % and lag within 10 min with no warm-up', () => {
    // heavy: about 590 kJ/m²K, decay over weeks; the first simulated day is read directly
    const r = simulate(periodicModel());
    const areal = heavyDemoWall.reduce((a, l) => a + l.thickness * l.density * l.specificHeat, 0);
    expect(areal).toBeGreaterThan(500_000);
    const times = r.series.time.slice(0, -1);
    const flux = r.series.insideFlux.slice(0, -1);
    const f = fundamental(times, flux, day);
    const decrement = f.amplitude / sine.amplitude / r.steady.uValue;
    // ISO 13786 transfer-matrix figures (src/lib/thermal/periodic.ts, checked against the standard's annex there)
    expect(Math.abs(decrement / r.periodic.decrementFactor - 1)).toBeLessThan(0.01);
    const lag = (((f.peakTime - sine.peakTime) % day) + day) % day;
    let dLag = Math.abs(lag - r.periodic.timeLag);
    dLag = Math.min(dLag, day - dLag);
    expect(dLag).toBeLessThan(600);
    expect(r.stats.periodicStart).toMatchObject({ period: day, samples: 288, stepSize: 300, solves: 2, correctionPeriods: 0 });
  });

  it('makes every series repeat with period P from t = 0: sol-air day, long-wave loss and a 24-hour schedule', () => {
    const clearDay = Array.from({ length: 144 }, (_, i) => Math.max(0, 650 * Math.sin((Math.PI * (i * 600 - 6 * 3600)) / (12 * 3600))));
    const schedule = Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 18 ? 21 : 17));
    for (const layers of [heavyDemoWall, timberAnnexWall]) {
      const r = simulate(
        periodicModel({
          layers,
          outside: {
            surfaceResistance: 0.04,
            air: sine,
            solar: { absorptance: 0.7, irradiance: { kind: 'series', step: 600, values: clearDay, repeat: true } },
            longWave: { netLoss: { kind: 'sine', mean: 35, amplitude: 15, period: day, peakTime: 3 * 3600 } },
          },
          inside: { surfaceResistance: 0.13, air: { kind: 'series', step: 3600, values: schedule, repeat: true } },
          duration: 3 * day,
        }),
      );
      const s = r.series;
      const tol = tolerance(s.insideFlux);
      for (const series of [s.insideFlux, s.outsideFlux, s.insideSurface, s.outsideSurface, ...s.interfaces]) {
        expect(repeatError(series, 144)).toBeLessThan(tol);
      }
      expect(r.stats.scheme.restarts).toBe(0);
    }
  });

  it('is the state a long warm-up reaches (the periodic state is the limit of any start)', () => {
    const light = periodicModel({ layers: timberAnnexWall, duration: day });
    const start = simulate(light).profiles[0];
    const warm = simulate({ ...light, initial: { kind: 'uniform', temperature: 20 }, duration: 20 * day, outputInterval: day });
    const end = warm.profiles[warm.profiles.length - 1];
    for (let i = 0; i < start.length; i++) expect(Math.abs(start[i] - end[i])).toBeLessThan(1e-6);
  });

  it('repeats to the scheme’s own error when the step does not divide the period', () => {
    expect(periodSampling(day, 700)).toEqual({ samples: 124, stepSize: day / 124 });
    const r = simulate(periodicModel({ timeStep: 700, duration: 3 * day }));
    const tol = tolerance(r.series.insideFlux);
    expect(repeatError(r.series.insideFlux, 144)).toBeLessThan(tol);
  });

  it('corrects for restarts inside the period (a schedule that jumps within a minute)', () => {
    const values = Array.from({ length: 1440 }, (_, i) => (i >= 480 && i < 1080 ? 21 : 16));
    for (const timeStep of [300, 3600]) {
      const r = simulate(
        periodicModel({
          inside: { surfaceResistance: 0.13, air: { kind: 'series', step: 60, values, repeat: true } },
          duration: 3 * day,
          timeStep,
          outputInterval: 3600,
        }),
        { storeProfiles: false },
      );
      expect(r.stats.scheme.restarts).toBe(6);
      expect(r.stats.periodicStart?.correctionPeriods).toBe(2);
      expect(repeatError(r.series.insideFlux, 24)).toBeLessThan(tolerance(r.series.insideFlux));
    }
  });

  it('starts in the steady state when every signal is constant', () => {
    const r = simulate(periodicModel({ outside: { surfaceResistance: 0.04, air: { kind: 'constant', value: -5 } } }));
    // U·ΔT (ISO 6946 series resistances) from t = 0; positive towards the room, so a loss here
    expect(Math.abs(r.series.insideFlux[0] - r.steady.uValue * (-5 - 20))).toBeLessThan(1e-9);
  });
});
