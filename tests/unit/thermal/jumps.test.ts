import { describe, expect, it } from 'vitest';
import { insideBoundary, outsideBoundary } from '../../../src/lib/thermal/boundary.ts';
import { complex, mul, type Complex } from '../../../src/lib/thermal/complex.ts';
import { simulate, sideJumps, wallMatrix, transmittance, steadyFigures, type Layer, type Model, type Signal } from '../../../src/lib/thermal/index.ts';
import { heavyDemoWall, timberAnnexWall } from './walls.ts';

const sine: Signal = { kind: 'sine', mean: 12, amplitude: 6, period: 86400, peakTime: 15 * 3600 };
/** a clear day's irradiance on the face as a half-sine from 06:00 to 18:00, 600 W/m² at noon, sampled every 600 s */
const clearDay = Array.from({ length: 144 }, (_, i) => Math.max(0, 600 * Math.sin((Math.PI * (i * 600 - 6 * 3600)) / (12 * 3600))));
const solAirDay = (layers: Layer[], timeStep: number): Model => ({
  layers,
  outside: { surfaceResistance: 0.04, air: sine, solar: { absorptance: 0.6, irradiance: { kind: 'series', step: 600, values: clearDay, repeat: true } } },
  inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
  initial: { kind: 'periodic' },
  duration: 86400,
  timeStep,
  outputInterval: 600,
});

/**
 * the analytic periodic inside heat flux of a wall under the sol-air day: the drive's fourier series times the
 * ISO 13786 periodic transmittance of each harmonic (superposition of the standard's harmonic solution).
 * a series linear between samples has the coefficients of its samples' dft times sinc²(πk/M) (the transform of
 * the linear-interpolation triangle).
 */
function analyticInsideFlux(layers: Layer[], times: number[]): number[] {
  const P = 86400;
  const M = clearDay.length;
  const gain = 0.6 * 0.04;
  const u = steadyFigures(layers, 0.04, 0.13).uValue;
  const coefficient = (k: number): Complex => {
    // (1/P)∫ D e^{−ikωt} dt: the sine contributes at k = 1, the series at every k
    let re = 0;
    let im = 0;
    for (let j = 0; j < M; j++) {
      const a = (-2 * Math.PI * ((j * (k % M)) % M)) / M;
      re += clearDay[j] * Math.cos(a);
      im += clearDay[j] * Math.sin(a);
    }
    const x = (Math.PI * k) / M;
    const sinc2 = k === 0 ? 1 : (Math.sin(x) / x) ** 2;
    re *= (gain * sinc2) / M;
    im *= (gain * sinc2) / M;
    if (k === 0) re += sine.kind === 'sine' ? sine.mean : 0;
    if (k === 1 && sine.kind === 'sine') {
      re += 0.5 * sine.amplitude * Math.cos((2 * Math.PI * sine.peakTime) / P);
      im -= 0.5 * sine.amplitude * Math.sin((2 * Math.PI * sine.peakTime) / P);
    }
    return complex(re, im);
  };
  const harmonics: { k: number; y: Complex }[] = [];
  for (let k = 1; k <= 4 * M; k++) {
    const { matrix, logScale } = wallMatrix(layers, 0.04, 0.13, P / k);
    harmonics.push({ k, y: mul(transmittance(matrix, logScale), coefficient(k)) });
  }
  const mean = u * (coefficient(0).re - 20);
  return times.map((t) => {
    let q = mean;
    for (const { k, y } of harmonics) {
      const w = (2 * Math.PI * k * t) / P;
      q += 2 * (y.re * Math.cos(w) - y.im * Math.sin(w));
    }
    return q;
  });
}

const amplitude = (v: number[]): number => (Math.max(...v) - Math.min(...v)) / 2;

describe('jump detection on the driving temperature', () => {
  const side = (air: Signal, irradiance?: Signal) =>
    outsideBoundary({ surfaceResistance: 0.04, air, ...(irradiance ? { solar: { absorptance: 0.6, irradiance } } : {}) });

  it('finds none in a sine, an hourly series at hourly steps, or the 600 s sun at 300 s and 3600 s steps', () => {
    expect(sideJumps(side(sine), 3 * 86400, 3600)).toEqual([]);
    const hourly: Signal = { kind: 'series', step: 3600, values: Array.from({ length: 24 }, (_, h) => (h % 2 ? 30 : 0)), repeat: true };
    expect(sideJumps(side(hourly), 3 * 86400, 3600)).toEqual([]);
    const sun: Signal = { kind: 'series', step: 600, values: clearDay, repeat: true };
    expect(sideJumps(side(sine, sun), 3 * 86400, 300)).toEqual([]);
    expect(sideJumps(side(sine, sun), 3 * 86400, 3600)).toEqual([]);
  });

  it('finds none in a ramp over a whole step made of fine samples, whatever its phase', () => {
    for (const start of [0, 600, 1800]) {
      const values = Array.from({ length: 40 }, (_, i) => Math.min(20, Math.max(0, ((i * 300 - 3600 - start) / 3600) * 20)));
      expect(sideJumps(side({ kind: 'series', step: 300, values }), 40 * 300, 3600)).toEqual([]);
    }
  });

  it('finds a 20 K change within one minute, wherever it falls in the step, and nothing else', () => {
    const values = Array.from({ length: 600 }, (_, i) => (i < 250 ? 0 : 20)); // 60 s samples: the change is 249 → 250 min
    expect(sideJumps(side({ kind: 'series', step: 60, values }), 36000, 3600)).toEqual([249 * 60]);
  });

  it('ignores a change under 0.1 K and sees the sun in kelvin through absorptance and R_se', () => {
    const small = Array.from({ length: 100 }, (_, i) => (i < 50 ? 0 : 0.05));
    expect(sideJumps(side({ kind: 'series', step: 60, values: small }), 6000, 3600)).toEqual([]);
    // a 100 W/m² step of irradiance is 0.6 × 0.04 × 100 = 2.4 K of sol-air temperature: a jump
    const sun = Array.from({ length: 100 }, (_, i) => (i < 50 ? 0 : 100));
    expect(sideJumps(side({ kind: 'constant', value: 5 }, { kind: 'series', step: 60, values: sun }), 6000, 3600)).toEqual([49 * 60]);
    // inside: the inside air alone
    const inside = insideBoundary({ surfaceResistance: 0.13, air: { kind: 'series', step: 60, values: sun } });
    expect(sideJumps(inside, 6000, 3600)).toEqual([49 * 60]);
  });
});

describe('simulate: a sol-air day at coarse and fine steps', { timeout: 60_000 }, () => {
  for (const [label, layers] of [
    ['the heavy demo wall', heavyDemoWall],
    ['the timber annex wall', timberAnnexWall],
  ] as const) {
    it(`gives the same inside-flux amplitude within 2 % at 300 s and 3600 s steps, and the analytic one: ${label}`, () => {
      const fine = simulate(solAirDay(layers, 300), { storeProfiles: false });
      const coarse = simulate(solAirDay(layers, 3600), { storeProfiles: false });
      // a smooth day is no jump: no restarts, every step crank–nicolson
      expect(fine.stats.scheme).toMatchObject({ restarts: 0, backwardEulerSubSteps: 0, fullSteps: 288 });
      expect(coarse.stats.scheme).toMatchObject({ restarts: 0, backwardEulerSubSteps: 0, fullSteps: 24 });
      const a300 = amplitude(fine.series.insideFlux);
      const a3600 = amplitude(coarse.series.insideFlux);
      expect(Math.abs(a3600 / a300 - 1)).toBeLessThan(0.02);
      // against the ISO 13786 harmonic solution of the same drive
      const exact = amplitude(analyticInsideFlux(layers, fine.series.time));
      expect(Math.abs(a300 / exact - 1)).toBeLessThan(0.02);
      expect(Math.abs(a3600 / exact - 1)).toBeLessThan(0.02);
    });
  }
});

describe('simulate: a genuine step change', { timeout: 60_000 }, () => {
  // 1 m of dense concrete behind a 0.04 m²K/W film, outside air 0 °C then 20 °C at 10 h 10 min (mid-step)
  const values = Array.from({ length: 24 * 60 + 1 }, (_, i) => (i <= 610 ? 0 : 20));
  const stepModel = (timeStep: number, scheme: Model['scheme'] = 'crank-nicolson'): Model => ({
    layers: [{ name: 'Dense concrete', thickness: 1, conductivity: 1.65, density: 2300, specificHeat: 1000 }],
    outside: { surfaceResistance: 0.04, air: { kind: 'series', step: 60, values } },
    inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 0 } },
    initial: { kind: 'steady' },
    duration: 86400,
    timeStep,
    outputInterval: 3600,
    mesh: { maxCellSize: 0.005, minCellsPerLayer: 4 },
    scheme,
  });

  it('damps without ringing: the surface warms monotonically and follows a fine implicit reference', () => {
    const r = simulate(stepModel(3600));
    const ringing = simulate(stepModel(3600), { restart: false });
    // the reference: backward euler at 10 s, whose error is far below the tolerance here (common practice)
    const ref = simulate(stepModel(10, 'implicit'));
    const surface = r.series.outsideSurface;
    const off = (s: number[]) => Math.max(...s.map((v, k) => Math.abs(v - ref.series.outsideSurface[k])));
    for (let k = 12; k < surface.length; k++) expect(surface[k]).toBeGreaterThanOrEqual(surface[k - 1] - 1e-9);
    for (const v of surface) expect(v).toBeLessThanOrEqual(20 + 1e-9);
    expect(off(surface)).toBeLessThan(0.3); // of a 20 K step
    expect(off(ringing.series.outsideSurface)).toBeGreaterThan(2 * off(surface)); // without the restart it does ring
    // the account says what was done: one restart of four quarter steps and two more with a crank–nicolson half step
    expect(r.stats.scheme).toEqual({ scheme: 'crank-nicolson', fullSteps: 22, restarts: 1, backwardEulerSubSteps: 6, crankNicolsonSubSteps: 1 });
  });

  it('restarts in a short last step too', () => {
    const m: Model = { ...stepModel(3600), duration: 10 * 3600 + 1200, outputInterval: 600 };
    const r = simulate(m);
    expect(r.stats.steps).toBe(11);
    expect(r.stats.scheme.restarts).toBe(1);
    const ref = simulate({ ...m, timeStep: 10, scheme: 'implicit' });
    const last = r.series.outsideSurface.length - 1;
    expect(Math.abs(r.series.outsideSurface[last] - ref.series.outsideSurface[last])).toBeLessThan(0.3);
  });
});
