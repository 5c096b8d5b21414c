import { describe, expect, it } from 'vitest';
import { insideBoundary, outsideBoundary } from '../../../src/lib/thermal/boundary.ts';
import { buildMesh } from '../../../src/lib/thermal/mesh.ts';
import { assembleConduction, assembleTheta, boundaryTerm } from '../../../src/lib/thermal/operator.ts';
import { tridiagonal } from '../../../src/lib/thermal/stepper.ts';
import { layer } from './helpers.ts';

const mesh = buildMesh([layer('a', 0.02, 1, 1000, 1000), layer('b', 0.04, 0.04, 50, 1000)]);
const robin = outsideBoundary({ surfaceResistance: 0.04, air: { kind: 'constant', value: 0 } });
const inside = insideBoundary({ surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } });

describe('assembleConduction', () => {
  it('has zero row sums inside the wall, so a uniform field is in equilibrium without films', () => {
    const k = tridiagonal(mesh.cells + 1);
    assembleConduction(mesh, robin, inside, k);
    for (let i = 1; i < mesh.cells; i++) expect(Math.abs(k.lower[i] + k.diag[i] + k.upper[i])).toBeLessThan(1e-9);
    // the surface rows carry the film coefficients
    expect(k.diag[0] + k.upper[0]).toBeCloseTo(25, 9);
    expect(k.diag[mesh.cells] + k.lower[mesh.cells]).toBeCloseTo(1 / 0.13, 9);
  });
});

describe('assembleTheta', () => {
  it('forms M = C/dt + θK and E = C/dt − (1 − θ)K so that M − E = K', () => {
    const k = tridiagonal(mesh.cells + 1);
    assembleConduction(mesh, robin, inside, k);
    const { implicit, explicit } = assembleTheta(mesh, robin, inside, 300, 0.5);
    for (let i = 0; i <= mesh.cells; i++) {
      expect(implicit.diag[i] - explicit.diag[i]).toBeCloseTo(k.diag[i], 9);
      expect(implicit.diag[i] + explicit.diag[i]).toBeCloseTo((2 * mesh.capacity[i]) / 300, 9);
    }
  });

  it('makes a prescribed surface an identity row of M and a zero row of E', () => {
    const fixed = outsideBoundary({ surfaceResistance: 0, air: { kind: 'constant', value: 0 } });
    const { implicit, explicit } = assembleTheta(mesh, fixed, inside, 300, 0.5);
    expect([implicit.diag[0], implicit.upper[0], explicit.diag[0], explicit.upper[0]]).toEqual([1, 0, 0, 0]);
    expect(boundaryTerm(fixed, 0.5, 3, 7)).toBe(7);
    expect(boundaryTerm(robin, 0.5, 3, 7)).toBeCloseTo(25 * 5, 12);
  });
});
