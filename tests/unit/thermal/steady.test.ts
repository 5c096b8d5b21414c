import { describe, expect, it } from 'vitest';
import { insideBoundary, outsideBoundary } from '../../../src/lib/thermal/boundary.ts';
import { buildMesh } from '../../../src/lib/thermal/mesh.ts';
import { steadyFigures, steadyProfile } from '../../../src/lib/thermal/steady.ts';
import { heavyWall } from './helpers.ts';

describe('steadyFigures', () => {
  it('adds the series resistances R_se + Σ d/λ + R_si (ISO 6946 method for homogeneous layers)', () => {
    // ISO 6946 conventional surface resistances for horizontal heat flow: R_se = 0.04, R_si = 0.13 m²K/W
    const expected = 0.04 + 0.012 / 0.7 + 0.12 / 0.035 + 0.215 / 0.77 + 0.013 / 0.4 + 0.13;
    const s = steadyFigures(heavyWall, 0.04, 0.13);
    expect(Math.abs(s.totalResistance - expected) / expected).toBeLessThan(1e-12);
    expect(Math.abs(s.uValue * expected - 1)).toBeLessThan(1e-12);
  });
});

describe('steadyProfile', () => {
  it('divides the temperature drop in proportion to the resistances (ISO 6946 steady profile)', () => {
    const mesh = buildMesh(heavyWall);
    const out = outsideBoundary({ surfaceResistance: 0.04, air: { kind: 'constant', value: -5 } });
    const ins = insideBoundary({ surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } });
    const T = new Float64Array(mesh.cells + 1);
    steadyProfile(mesh, out, ins, -5, 20, T);
    const R = steadyFigures(heavyWall, 0.04, 0.13).totalResistance;
    const q = 25 / R;
    expect(T[0]).toBeCloseTo(-5 + q * 0.04, 10);
    expect(T[mesh.cells]).toBeCloseTo(20 - q * 0.13, 10);
    // interface between the mineral wool and the brick
    expect(T[mesh.layerStart[2]]).toBeCloseTo(-5 + q * (0.04 + 0.012 / 0.7 + 0.12 / 0.035), 10);
  });

  it('holds a prescribed surface at its temperature', () => {
    const mesh = buildMesh(heavyWall);
    const out = outsideBoundary({ surfaceResistance: 0, air: { kind: 'constant', value: -5 } });
    const ins = insideBoundary({ surfaceResistance: 0, air: { kind: 'constant', value: 20 } });
    const T = new Float64Array(mesh.cells + 1);
    steadyProfile(mesh, out, ins, -5, 20, T);
    expect(T[0]).toBe(-5);
    expect(T[mesh.cells]).toBe(20);
  });
});
