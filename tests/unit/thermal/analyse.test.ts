import { describe, expect, it } from 'vitest';
import { analyse, analysisPeriod } from '../../../src/lib/thermal/analyse.ts';
import { constant, heavyWall, model } from './helpers.ts';

describe('analysisPeriod', () => {
  it('uses the outside sine’s period, else one day (contract)', () => {
    expect(analysisPeriod(model(heavyWall))).toBe(86400);
    const m = model(heavyWall, { outside: { surfaceResistance: 0.04, air: { kind: 'sine', mean: 0, amplitude: 1, period: 3600, peakTime: 0 } } });
    expect(analysisPeriod(m)).toBe(3600);
  });
});

describe('analyse', () => {
  it('returns steady, layer, lumped and periodic figures and the cell count without stepping', () => {
    const f = analyse(model(heavyWall, { inside: { surfaceResistance: 0.13, air: constant(21) } }));
    expect(f.steady.uValue).toBeCloseTo(1 / f.steady.totalResistance, 14);
    expect(f.layers).toHaveLength(4);
    expect(f.layers[2].fourier).toBeGreaterThan(0);
    expect(f.periodic.period).toBe(86400);
    expect(f.periodic.decrementFactor).toBeCloseTo(f.periodic.periodicTransmittance / f.steady.uValue, 14);
    expect(f.cells).toBe(4 + 24 + 43 + 4);
  });
});
