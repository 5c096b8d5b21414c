// θ-method stepping of a tridiagonal linear system  M x⁺ = E x + b0·e₀ + bN·e_N.
// knows no physics: the caller assembles M and E (operator.ts) and supplies the two boundary terms.

/** a tridiagonal matrix of order n: lower[0] and upper[n − 1] are unused */
export interface Tridiagonal {
  n: number;
  lower: Float64Array;
  diag: Float64Array;
  upper: Float64Array;
}

export function tridiagonal(n: number): Tridiagonal {
  return { n, lower: new Float64Array(n), diag: new Float64Array(n), upper: new Float64Array(n) };
}

/** a thomas factorisation of M, computed once while the time step and films stay constant */
export interface ThomasFactor {
  n: number;
  lower: Float64Array;
  /** modified upper diagonal c'ᵢ = uᵢ / denᵢ */
  upperPrime: Float64Array;
  /** 1 / denᵢ */
  inverse: Float64Array;
}

/** factorises M (thomas algorithm without pivoting: M must be diagonally dominant, which the heat operator is) */
export function factorise(m: Tridiagonal, out?: ThomasFactor): ThomasFactor {
  const n = m.n;
  const f = out ?? { n, lower: new Float64Array(n), upperPrime: new Float64Array(n), inverse: new Float64Array(n) };
  const { lower, diag, upper } = m;
  let cPrev = 0;
  for (let i = 0; i < n; i++) {
    const l = i === 0 ? 0 : lower[i];
    const den = diag[i] - l * cPrev;
    if (!(Math.abs(den) > 0) || !Number.isFinite(den)) throw new Error('tridiagonal system is singular');
    const inv = 1 / den;
    f.lower[i] = l;
    f.inverse[i] = inv;
    cPrev = i === n - 1 ? 0 : upper[i] * inv;
    f.upperPrime[i] = cPrev;
  }
  return f;
}

/** solves M x = rhs with a factorisation; rhs and x may be the same array */
export function solve(f: ThomasFactor, rhs: Float64Array, x: Float64Array): void {
  const n = f.n;
  const { lower, upperPrime, inverse } = f;
  let prev = 0;
  for (let i = 0; i < n; i++) {
    prev = (rhs[i] - lower[i] * prev) * inverse[i];
    x[i] = prev;
  }
  for (let i = n - 2; i >= 0; i--) x[i] -= upperPrime[i] * x[i + 1];
}

/**
 * one θ-step in place: x ← M⁻¹ (E x + b0·e₀ + bN·e_{n−1}).
 * the product E x is fused into the forward sweep; old values are kept in locals so x is overwritten safely.
 */
export function thetaStep(f: ThomasFactor, e: Tridiagonal, x: Float64Array, b0: number, bN: number): void {
  const n = f.n;
  const lower = f.lower;
  const upperPrime = f.upperPrime;
  const inverse = f.inverse;
  const el = e.lower;
  const ed = e.diag;
  const eu = e.upper;
  let xPrev = x[0];
  let xCur = x[1];
  let d = (ed[0] * xPrev + eu[0] * xCur + b0) * inverse[0];
  x[0] = d;
  const last = n - 1;
  for (let i = 1; i < last; i++) {
    const xNext = x[i + 1];
    const r = el[i] * xPrev + ed[i] * xCur + eu[i] * xNext;
    d = (r - lower[i] * d) * inverse[i];
    x[i] = d;
    xPrev = xCur;
    xCur = xNext;
  }
  const rLast = el[last] * xPrev + ed[last] * xCur + bN;
  x[last] = (rLast - lower[last] * d) * inverse[last];
  for (let i = last - 1; i >= 0; i--) x[i] -= upperPrime[i] * x[i + 1];
}
