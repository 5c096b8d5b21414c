import { describe, expect, it } from 'vitest';
import { dft } from '../../../src/lib/thermal/fourier.ts';

/** the definition X_k = Σ x_n e^{−2πikn/N}, summed directly */
function naive(re: number[], im: number[]): { re: number[]; im: number[] } {
  const n = re.length;
  const out = { re: new Array<number>(n).fill(0), im: new Array<number>(n).fill(0) };
  for (let k = 0; k < n; k++) {
    for (let j = 0; j < n; j++) {
      const a = (-2 * Math.PI * ((k * j) % n)) / n;
      out.re[k] += re[j] * Math.cos(a) - im[j] * Math.sin(a);
      out.im[k] += re[j] * Math.sin(a) + im[j] * Math.cos(a);
    }
  }
  return out;
}

// seeded generator (mulberry32)
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

describe('dft', () => {
  for (const n of [1, 2, 7, 24, 64, 144, 288, 1000]) {
    it(`matches the defining sum for N = ${n} (radix-2 or bluestein)`, () => {
      const r = rng(n);
      const re = Array.from({ length: n }, () => r() - 0.5);
      const im = Array.from({ length: n }, () => r() - 0.5);
      const want = naive(re, im);
      const xr = Float64Array.from(re);
      const xi = Float64Array.from(im);
      dft(xr, xi);
      for (let k = 0; k < n; k++) {
        expect(Math.abs(xr[k] - want.re[k])).toBeLessThan(1e-11 * n);
        expect(Math.abs(xi[k] - want.im[k])).toBeLessThan(1e-11 * n);
      }
    });
  }
});
