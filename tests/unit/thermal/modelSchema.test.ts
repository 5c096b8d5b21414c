import { describe, expect, it } from 'vitest';
import { formatIssues, MAX_DURATION, modelSchema, parseModel } from '../../../src/lib/schemas/model.ts';
import fixture from '../../fixtures/harrow-lane-timber-annex.json' with { type: 'json' };

const issuesOf = (mutate: (m: any) => void): string[] => {
  const m = structuredClone(fixture) as any;
  mutate(m);
  const r = parseModel(m);
  return r.ok ? [] : r.issues;
};

describe('modelSchema', () => {
  it('accepts the fixture and fills the defaults', () => {
    const m = structuredClone(fixture) as any;
    delete m.mesh;
    delete m.scheme;
    const r = parseModel(m);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.model.mesh).toEqual({ maxCellSize: 0.005, minCellsPerLayer: 4 });
      expect(r.model.scheme).toBe('crank-nicolson');
    }
  });

  it('allows the app’s extra layer fields', () => {
    expect(issuesOf((m) => Object.assign(m.layers[0], { materialId: 'mat-12', materialClass: 'timber', note: 'site-cut' }))).toEqual([]);
  });

  const cases: Array<[string, (m: any) => void, string]> = [
    ['zero thickness', (m) => (m.layers[1].thickness = 0), 'layers[1].thickness: must be greater than 0 m'],
    ['negative conductivity', (m) => (m.layers[0].conductivity = -0.1), 'layers[0].conductivity: must be greater than 0 W/(m·K)'],
    ['zero density', (m) => (m.layers[2].density = 0), 'layers[2].density: must be greater than 0 kg/m³'],
    ['zero specific heat', (m) => (m.layers[3].specificHeat = 0), 'layers[3].specificHeat: must be greater than 0 J/(kg·K)'],
    ['NaN', (m) => (m.layers[1].thickness = NaN), 'layers[1].thickness: must be a finite number in m (got NaN)'],
    ['Infinity', (m) => (m.duration = Infinity), 'duration: must be a finite number in s (got Infinity)'],
    ['a string for a number', (m) => (m.timeStep = '300'), 'timeStep: must be a number in s (got string)'],
    ['an unknown signal kind', (m) => (m.outside.air = { kind: 'cosine', value: 1 }), 'outside.air.kind: must be one of "constant", "sine" or "series" (got "cosine")'],
    ['a series without values', (m) => (m.inside.air = { kind: 'series', step: 3600, values: [] }), 'inside.air.values: must hold at least one value'],
    ['a series step of zero', (m) => (m.inside.air = { kind: 'series', step: 0, values: [1] }), 'inside.air.step: must be greater than 0 s'],
    ['a zero time step', (m) => (m.timeStep = 0), 'timeStep: must be greater than 0 s'],
    ['a zero output interval', (m) => (m.outputInterval = 0), 'outputInterval: must be greater than 0 s'],
    ['a duration over ten years', (m) => (m.duration = MAX_DURATION + 1), 'duration: must be at most ten years (315576000 s, years of 365.25 days)'],
    ['a negative surface resistance', (m) => (m.inside.surfaceResistance = -0.01), 'inside.surfaceResistance: must be at least 0 m²K/W'],
    ['an absorptance above 1', (m) => (m.outside.solar = { absorptance: 1.5, irradiance: { kind: 'constant', value: 0 } }), 'outside.solar.absorptance: must be between 0 and 1'],
    ['no layers', (m) => (m.layers = []), 'layers: must hold at least one layer'],
    ['a missing inside air', (m) => delete m.inside.air, 'inside.air: is required'],
    ['an unknown initial kind', (m) => (m.initial = { kind: 'warm' }), 'initial.kind: must be "uniform", "steady" or "periodic" (got "warm")'],
    ['an unknown scheme', (m) => (m.scheme = 'explicit'), 'scheme: must be "crank-nicolson" or "implicit" (got "explicit")'],
    ['a long-wave loss of NaN', (m) => (m.outside.longWave = { netLoss: { kind: 'constant', value: NaN } }), 'outside.longWave.netLoss.value: must be a finite number (got NaN)'],
    [
      'a periodic start with a series that does not repeat',
      (m) => Object.assign(m, { initial: { kind: 'periodic' }, inside: { ...m.inside, air: { kind: 'series', step: 3600, values: [18, 21] } } }),
      'initial.kind: "periodic" needs every signal to repeat, but inside.air is a series without "repeat": true',
    ],
    [
      'a periodic start whose periods do not divide the longest',
      (m) =>
        Object.assign(m, {
          initial: { kind: 'periodic' },
          outside: { ...m.outside, air: { kind: 'sine', mean: 5, amplitude: 8, period: 86400, peakTime: 0 } },
          inside: { ...m.inside, air: { kind: 'series', step: 3600, values: Array(25).fill(20), repeat: true } },
        }),
      'initial.kind: "periodic" needs every period to divide the longest (90000 s), but outside.air repeats every 86400 s',
    ],
    ['fractional layer cells', (m) => (m.layers[0].cells = 2.5), 'layers[0].cells: must be a whole number of cells'],
  ];
  for (const [label, mutate, line] of cases) {
    it(`rejects ${label} with a path: message line`, () => {
      expect(issuesOf(mutate)).toContain(line);
    });
  }

  it('accepts a periodic start when every period divides the longest (a week of hourly values and a daily sine)', () => {
    const lines = issuesOf((m) =>
      Object.assign(m, {
        initial: { kind: 'periodic' },
        outside: {
          ...m.outside,
          air: { kind: 'sine', mean: 5, amplitude: 8, period: 86400, peakTime: 0 },
          longWave: { netLoss: { kind: 'series', step: 600, values: Array(144).fill(40), repeat: true } },
        },
        inside: { ...m.inside, air: { kind: 'series', step: 3600, values: Array(168).fill(20), repeat: true } },
      }),
    );
    expect(lines).toEqual([]);
  });

  it('rejects a mesh over 20,000 cells and says how many the rule would make', () => {
    const lines = issuesOf((m) => (m.mesh = { maxCellSize: 0.00001, minCellsPerLayer: 4 }));
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^mesh: the mesh would have 25450 cells; at most 20000/);
  });

  it('formats nested paths with [i] indices through formatIssues', () => {
    const r = modelSchema.safeParse({ ...fixture, layers: [fixture.layers[0], { ...fixture.layers[1], thickness: -1 }] });
    expect(r.success).toBe(false);
    if (!r.success) expect(formatIssues(r.error)).toEqual(['layers[1].thickness: must be greater than 0 m']);
  });

  it('names the whole model when it is not an object', () => {
    const r = parseModel(42);
    expect(r.ok ? [] : r.issues).toEqual(['model: must be a model object']);
  });
});
