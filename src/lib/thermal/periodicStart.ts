// the periodic steady state of the DISCRETE θ-scheme, found in the frequency domain without time stepping.
//
// the θ-scheme  M x⁺ = E x + b(d_n, d_{n+1})  is linear and time-invariant. with the driving temperatures
// sampled at the step times of one period P = N·dt, write every sequence as an inverse dft,
// x_n = (1/N) Σ_k X_k z_kⁿ with z_k = e^{2πik/N}; the periodic solution then satisfies, harmonic by harmonic,
//   (z_k M − E) X_k = B_k,   B_k = h(θ z_k + 1 − θ) D_k  (a film)  or  z_k D_k  (a prescribed surface),
// where D_k is the dft of the driving temperature. each harmonic costs one complex tridiagonal solve, and
// x_0 = (1/N) Σ_k X_k is the state at t = 0; real drives need only k = 0 … N/2 (X_{N−k} = conj X_k).
// this is exact for the discrete scheme: stepping from x_0 repeats to round-off (the classical harmonic-balance
// or "frequency-domain periodic steady state" of a linear time-invariant recurrence, e.g. Oppenheim & Schafer,
// Discrete-Time Signal Processing, ch. 8, on the dft of periodic sequences).
// harmonics whose drive is negligible on both sides (1e-13 of the largest) are skipped, so a sine needs two solves;
// drives of constants and sines only have their coefficients written directly, without the transform.
import { drivingTemperature, type BoundarySide } from './boundary.ts';
import { dft } from './fourier.ts';
import type { Mesh } from './mesh.ts';
import { assembleTheta, type ThetaMatrices } from './operator.ts';
import type { CompiledSignal } from './signals.ts';

/** the largest number of samples per period the frequency-domain start uses; beyond it the step is coarsened */
export const MAX_PERIOD_SAMPLES = 1 << 18;

/** what the periodic start did */
export interface PeriodicStartInfo {
  /** P, s */
  period: number;
  /** samples per period N */
  samples: number;
  /** P/N, s: the run's time step when it divides P, else the nearest smaller step that does */
  stepSize: number;
  /** complex tridiagonal solves done (harmonics with a non-negligible drive) */
  solves: number;
}

/** samples per period and the step they imply: the run's step when it divides P (to 1e-9), else the next finer one */
export function periodSampling(period: number, dt: number): { samples: number; stepSize: number } {
  const ratio = period / dt;
  const nearest = Math.round(ratio);
  let samples = nearest >= 1 && Math.abs(ratio - nearest) <= 1e-9 * ratio ? nearest : Math.ceil(ratio);
  samples = Math.max(1, Math.min(samples, MAX_PERIOD_SAMPLES));
  return { samples, stepSize: period / samples };
}

/**
 * the dft of a side's sampled drive written directly when it is made of constants and sines only (the sampled
 * sine a·cos(w(t − p)) with w = 2πm/P has the single coefficient N·a/2·e^{−iwp} at k = m); false when it holds
 * a series or a sine at or above the sampling's nyquist harmonic, which the transform then handles
 */
function analyticDrive(side: BoundarySide, N: number, period: number, re: Float64Array, im: Float64Array): boolean {
  const parts: Array<[CompiledSignal, number]> = [[side.air, 1]];
  if (side.irradiance) parts.push([side.irradiance, side.solarGain]);
  if (side.netLoss) parts.push([side.netLoss, -side.lossGain]);
  for (const [signal] of parts) {
    if (signal.kind === 2) return false;
    if (signal.kind === 1 && 2 * Math.round((period * signal.w) / (2 * Math.PI)) >= N) return false;
  }
  for (const [signal, gain] of parts) {
    if (signal.kind === 0) re[0] += N * gain * signal.a;
    else {
      const m = Math.round((period * signal.w) / (2 * Math.PI));
      re[0] += N * gain * signal.a;
      re[m] += 0.5 * N * gain * signal.b * Math.cos(signal.w * signal.p);
      im[m] -= 0.5 * N * gain * signal.b * Math.sin(signal.w * signal.p);
    }
  }
  return true;
}

/**
 * writes into out the state at t = 0 of the periodic solution of the θ-scheme with step P/N.
 * matrices may be passed when the caller already has them for that step.
 */
export function periodicState(
  mesh: Mesh,
  outside: BoundarySide,
  inside: BoundarySide,
  theta: number,
  period: number,
  dt: number,
  out: Float64Array,
  matrices?: ThetaMatrices,
): PeriodicStartInfo {
  const { samples: N, stepSize } = periodSampling(period, dt);
  const m = matrices ?? assembleTheta(mesh, outside, inside, stepSize, theta);
  const n = mesh.cells + 1;

  const half = Math.floor(N / 2);
  const oRe = new Float64Array(half + 1);
  const oIm = new Float64Array(half + 1);
  const iRe = new Float64Array(half + 1);
  const iIm = new Float64Array(half + 1);
  if (!analyticDrive(outside, N, period, oRe, oIm) || !analyticDrive(inside, N, period, iRe, iIm)) {
    // drives at the step times, both sides in one complex transform (outside real, inside imaginary)
    const zr = new Float64Array(N);
    const zi = new Float64Array(N);
    for (let j = 0; j < N; j++) {
      const t = j * stepSize;
      zr[j] = drivingTemperature(outside, t);
      zi[j] = drivingTemperature(inside, t);
    }
    dft(zr, zi);
    // split: O_k = (Z_k + conj Z_{N−k})/2, I_k = (Z_k − conj Z_{N−k})/(2i)
    for (let k = 0; k <= half; k++) {
      const j = k === 0 ? 0 : N - k;
      oRe[k] = 0.5 * (zr[k] + zr[j]);
      oIm[k] = 0.5 * (zi[k] - zi[j]);
      iRe[k] = 0.5 * (zi[k] + zi[j]);
      iIm[k] = -0.5 * (zr[k] - zr[j]);
    }
  }
  let largest = 0;
  for (let k = 0; k <= half; k++) largest = Math.max(largest, Math.hypot(oRe[k], oIm[k]), Math.hypot(iRe[k], iIm[k]));
  const negligible = 1e-13 * largest;

  const ml = m.implicit.lower;
  const md = m.implicit.diag;
  const mu = m.implicit.upper;
  const el = m.explicit.lower;
  const ed = m.explicit.diag;
  const eu = m.explicit.upper;
  const cpr = new Float64Array(n); // modified upper diagonal c'
  const cpi = new Float64Array(n);
  const dpr = new Float64Array(n); // modified right-hand side d'
  const dpi = new Float64Array(n);
  out.fill(0);
  let solves = 0;
  for (let k = 0; k <= half; k++) {
    if (Math.hypot(oRe[k], oIm[k]) <= negligible && Math.hypot(iRe[k], iIm[k]) <= negligible) continue;
    solves++;
    const angle = (2 * Math.PI * k) / N;
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    // boundary terms B_k for each side
    let b0r: number;
    let b0i: number;
    if (outside.prescribed) {
      b0r = c * oRe[k] - s * oIm[k];
      b0i = c * oIm[k] + s * oRe[k];
    } else {
      const fr = outside.h * (theta * c + 1 - theta);
      const fi = outside.h * theta * s;
      b0r = fr * oRe[k] - fi * oIm[k];
      b0i = fr * oIm[k] + fi * oRe[k];
    }
    let bnr: number;
    let bni: number;
    if (inside.prescribed) {
      bnr = c * iRe[k] - s * iIm[k];
      bni = c * iIm[k] + s * iRe[k];
    } else {
      const fr = inside.h * (theta * c + 1 - theta);
      const fi = inside.h * theta * s;
      bnr = fr * iRe[k] - fi * iIm[k];
      bni = fr * iIm[k] + fi * iRe[k];
    }
    // forward sweep of the complex thomas algorithm on zM − E (complex symmetric with a positive definite
    // real part after scaling, so no pivoting is needed)
    let pcr = 0;
    let pci = 0;
    let pdr = 0;
    let pdi = 0;
    for (let i = 0; i < n; i++) {
      const lr = c * ml[i] - el[i];
      const li = s * ml[i];
      const dr = c * md[i] - ed[i] - (lr * pcr - li * pci);
      const di = s * md[i] - (lr * pci + li * pcr);
      const q = 1 / (dr * dr + di * di);
      const ir = dr * q; // 1/den
      const ii = -di * q;
      const ur = i === n - 1 ? 0 : c * mu[i] - eu[i];
      const ui = i === n - 1 ? 0 : s * mu[i];
      pcr = ur * ir - ui * ii;
      pci = ur * ii + ui * ir;
      let rr = i === 0 ? b0r : 0;
      let ri = i === 0 ? b0i : 0;
      if (i === n - 1) {
        rr += bnr;
        ri += bni;
      }
      rr -= lr * pdr - li * pdi;
      ri -= lr * pdi + li * pdr;
      pdr = rr * ir - ri * ii;
      pdi = rr * ii + ri * ir;
      cpr[i] = pcr;
      cpi[i] = pci;
      dpr[i] = pdr;
      dpi[i] = pdi;
    }
    const weight = k === 0 || 2 * k === N ? 1 : 2;
    let xr = dpr[n - 1];
    let xi = dpi[n - 1];
    out[n - 1] += weight * xr;
    for (let i = n - 2; i >= 0; i--) {
      const nr = dpr[i] - (cpr[i] * xr - cpi[i] * xi);
      const ni = dpi[i] - (cpr[i] * xi + cpi[i] * xr);
      xr = nr;
      xi = ni;
      out[i] += weight * xr;
    }
  }
  for (let i = 0; i < n; i++) out[i] /= N;
  return { period, samples: N, stepSize, solves };
}

/**
 * the correction for a period whose stepping is not time-invariant (restart sub-steps after jumps inside it).
 * with Φ the one-period map of the actual stepping, the periodic state is x* = x0 + (I − Φ)⁻¹ (x1 − x0), where x1
 * is x0 stepped through one period. (I − Φ)⁻¹ is taken from the time-invariant scheme, which differs from the
 * actual one only in the few sub-stepped steps: the periodic response to a kick r added once per period,
 * δ = x_1 of  M x_{n+1} = E x_n + [n ≡ 0] M r,  i.e. δ = (1/N) Σ_k z_k X_k with (z_k M − E) X_k = M r.
 * writes δ into out.
 */
export function periodicKick(matrices: ThetaMatrices, samples: number, r: Float64Array, out: Float64Array): number {
  const N = samples;
  const n = r.length;
  const ml = matrices.implicit.lower;
  const md = matrices.implicit.diag;
  const mu = matrices.implicit.upper;
  const el = matrices.explicit.lower;
  const ed = matrices.explicit.diag;
  const eu = matrices.explicit.upper;
  const rhs = new Float64Array(n); // M r
  for (let i = 0; i < n; i++) {
    rhs[i] = md[i] * r[i] + (i > 0 ? ml[i] * r[i - 1] : 0) + (i < n - 1 ? mu[i] * r[i + 1] : 0);
  }
  const cpr = new Float64Array(n);
  const cpi = new Float64Array(n);
  const dpr = new Float64Array(n);
  const dpi = new Float64Array(n);
  out.fill(0);
  const half = Math.floor(N / 2);
  for (let k = 0; k <= half; k++) {
    const angle = (2 * Math.PI * k) / N;
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    let pcr = 0;
    let pci = 0;
    let pdr = 0;
    let pdi = 0;
    for (let i = 0; i < n; i++) {
      const lr = c * ml[i] - el[i];
      const li = s * ml[i];
      const dr = c * md[i] - ed[i] - (lr * pcr - li * pci);
      const di = s * md[i] - (lr * pci + li * pcr);
      const q = 1 / (dr * dr + di * di);
      const ir = dr * q;
      const ii = -di * q;
      const ur = i === n - 1 ? 0 : c * mu[i] - eu[i];
      const ui = i === n - 1 ? 0 : s * mu[i];
      pcr = ur * ir - ui * ii;
      pci = ur * ii + ui * ir;
      const rr = rhs[i] - (lr * pdr - li * pdi);
      const ri = -(lr * pdi + li * pdr);
      pdr = rr * ir - ri * ii;
      pdi = rr * ii + ri * ir;
      cpr[i] = pcr;
      cpi[i] = pci;
      dpr[i] = pdr;
      dpi[i] = pdi;
    }
    const weight = k === 0 || 2 * k === N ? 1 : 2;
    let xr = dpr[n - 1];
    let xi = dpi[n - 1];
    out[n - 1] += weight * (c * xr - s * xi);
    for (let i = n - 2; i >= 0; i--) {
      const nr = dpr[i] - (cpr[i] * xr - cpi[i] * xi);
      const ni = dpi[i] - (cpr[i] * xi + cpi[i] * xr);
      xr = nr;
      xi = ni;
      out[i] += weight * (c * xr - s * xi);
    }
  }
  for (let i = 0; i < n; i++) out[i] /= N;
  return half + 1;
}
