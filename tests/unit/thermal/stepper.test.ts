import { describe, expect, it } from 'vitest';
import { factorise, solve, thetaStep, tridiagonal } from '../../../src/lib/thermal/stepper.ts';

// seeded generator (mulberry32) so every run sees the same matrices
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function randomDominant(n: number, r: () => number) {
  const m = tridiagonal(n);
  for (let i = 0; i < n; i++) {
    m.lower[i] = i > 0 ? -r() : 0;
    m.upper[i] = i < n - 1 ? -r() : 0;
    m.diag[i] = 2.5 + r();
  }
  return m;
}

function multiply(m: ReturnType<typeof tridiagonal>, x: Float64Array): Float64Array {
  const y = new Float64Array(m.n);
  for (let i = 0; i < m.n; i++) {
    y[i] = m.diag[i] * x[i] + (i > 0 ? m.lower[i] * x[i - 1] : 0) + (i < m.n - 1 ? m.upper[i] * x[i + 1] : 0);
  }
  return y;
}

describe('solve', () => {
  it('solves a diagonally dominant tridiagonal system to round-off (thomas algorithm)', () => {
    const r = rng(42);
    const m = randomDominant(200, r);
    const x = Float64Array.from({ length: 200 }, () => r() * 10 - 5);
    const b = multiply(m, x);
    const got = new Float64Array(200);
    solve(factorise(m), b, got);
    for (let i = 0; i < 200; i++) expect(Math.abs(got[i] - x[i])).toBeLessThan(1e-12);
  });

  it('refuses a singular matrix loudly', () => {
    const m = tridiagonal(2);
    expect(() => factorise(m)).toThrow(/singular/);
  });
});

describe('thetaStep', () => {
  it('equals solving M x⁺ = E x + b0 e₀ + bN e_N done the long way', () => {
    const r = rng(7);
    const n = 50;
    const m = randomDominant(n, r);
    const e = randomDominant(n, r);
    const x = Float64Array.from({ length: n }, () => r());
    const rhs = multiply(e, x);
    rhs[0] += 3;
    rhs[n - 1] -= 2;
    const expected = new Float64Array(n);
    const f = factorise(m);
    solve(f, rhs, expected);
    thetaStep(f, e, x, 3, -2);
    for (let i = 0; i < n; i++) expect(Math.abs(x[i] - expected[i])).toBeLessThan(1e-13);
  });
});
