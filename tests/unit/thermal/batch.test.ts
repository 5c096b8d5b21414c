import { describe, expect, it } from 'vitest';
import { simulate, simulateBatch, SimulationCancelled, type Model, type Result } from '../../../src/lib/thermal/index.ts';
import { heavyDemoWall, timberAnnexWall } from './walls.ts';
import { heavyWall } from './helpers.ts';

const day = 86400;
const clearDay = Array.from({ length: 144 }, (_, i) => Math.max(0, 700 * Math.sin((Math.PI * (i * 600 - 6 * 3600)) / (12 * 3600))));
const base = (over: Partial<Model> = {}): Model => ({
  layers: heavyDemoWall,
  outside: {
    surfaceResistance: 0.04,
    air: { kind: 'sine', mean: 9, amplitude: 7, period: day, peakTime: 15 * 3600 },
    solar: { absorptance: 0.6, irradiance: { kind: 'series', step: 600, values: clearDay, repeat: true } },
    longWave: { netLoss: { kind: 'constant', value: 30 } },
  },
  inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
  initial: { kind: 'periodic' },
  duration: 2 * day,
  timeStep: 300,
  outputInterval: 1800,
  ...over,
});

/** the largest difference between two results over every number except the timings */
function difference(a: Result, b: Result): number {
  let worst = 0;
  const walk = (x: unknown, y: unknown, path: string): void => {
    if (path.endsWith('elapsedMs') || path.endsWith('costPeriods')) return;
    if (typeof x === 'number' && typeof y === 'number') {
      worst = Math.max(worst, x === y ? 0 : Math.abs(x - y));
      return;
    }
    if (Array.isArray(x) && Array.isArray(y)) {
      expect(y.length, path).toBe(x.length);
      x.forEach((v, i) => walk(v, y[i], `${path}[${i}]`));
      return;
    }
    if (x && y && typeof x === 'object' && typeof y === 'object') {
      expect(Object.keys(y as object).sort(), path).toEqual(Object.keys(x as object).sort());
      for (const k of Object.keys(x as object)) walk((x as Record<string, unknown>)[k], (y as Record<string, unknown>)[k], `${path}.${k}`);
      return;
    }
    expect(y, path).toEqual(x);
  };
  walk(a, b, 'result');
  return worst;
}

describe('simulateBatch', () => {
  it('agrees with simulate() to 1e-12 on several meshes, with sun, long-wave loss and every kind of start', () => {
    const schedule = Array.from({ length: 1440 }, (_, i) => (i >= 480 && i < 1080 ? 21 : 17));
    const models: Model[] = [
      base(),
      base({ layers: timberAnnexWall }),
      base({ layers: heavyWall, mesh: { maxCellSize: 0.002, minCellsPerLayer: 4 } }),
      base({ layers: heavyDemoWall.slice(2), initial: { kind: 'uniform', temperature: 12 } }),
      base({ layers: heavyDemoWall.map((l) => ({ ...l, thickness: l.thickness * 1.1 })), initial: { kind: 'steady' } }),
      // a jump inside the period: restarts and the periodic correction
      base({ inside: { surfaceResistance: 0.13, air: { kind: 'series', step: 60, values: schedule, repeat: true } } }),
      base({ inside: { surfaceResistance: 0.13, air: { kind: 'series', step: 60, values: schedule, repeat: true } }, layers: timberAnnexWall }),
      // a short last step, a prescribed outside surface, backward euler, a different step
      base({ duration: 2 * day + 1000 }),
      base({ duration: 2 * day + 1000, layers: timberAnnexWall }),
      base({ outside: { surfaceResistance: 0, air: { kind: 'sine', mean: 9, amplitude: 7, period: day, peakTime: 0 } }, layers: timberAnnexWall }),
      base({ scheme: 'implicit' }),
      base({ scheme: 'implicit', layers: timberAnnexWall }),
      base({ timeStep: 600, outputInterval: 900 }),
    ];
    const batch = simulateBatch(models);
    expect(batch).toHaveLength(models.length);
    models.forEach((m, i) => {
      const single = simulate(m);
      expect(difference(single, batch[i])).toBeLessThanOrEqual(1e-12);
    });
  }, 60_000);

  it('reports progress to 1 and stops when cancelled', () => {
    const models = [base(), base({ layers: timberAnnexWall }), base({ layers: heavyWall }), base()];
    const seen: number[] = [];
    simulateBatch(models, { onProgress: (f) => seen.push(f), progressEvery: 64, storeProfiles: false });
    expect(seen.length).toBeGreaterThan(4);
    expect(seen[seen.length - 1]).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    expect(() => simulateBatch(models, { shouldCancel: () => true, progressEvery: 16 })).toThrow(SimulationCancelled);
  }, 60_000);
});
