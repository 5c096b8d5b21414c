// a tiny complex arithmetic for the periodic analysis (a handful of values per call, so plain objects are fine)

/** a complex number re + i·im */
export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });
export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const scale = (a: Complex, s: number): Complex => ({ re: a.re * s, im: a.im * s });
export function div(a: Complex, b: Complex): Complex {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}
export const abs = (a: Complex): number => Math.hypot(a.re, a.im);
export const arg = (a: Complex): number => Math.atan2(a.im, a.re);
export const cosh = (z: Complex): Complex => ({ re: Math.cosh(z.re) * Math.cos(z.im), im: Math.sinh(z.re) * Math.sin(z.im) });
export const sinh = (z: Complex): Complex => ({ re: Math.sinh(z.re) * Math.cos(z.im), im: Math.cosh(z.re) * Math.sin(z.im) });

/** a 2×2 complex matrix [[a, b], [c, d]] */
export interface Matrix2 {
  a: Complex;
  b: Complex;
  c: Complex;
  d: Complex;
}

export function matmul(x: Matrix2, y: Matrix2): Matrix2 {
  return {
    a: add(mul(x.a, y.a), mul(x.b, y.c)),
    b: add(mul(x.a, y.b), mul(x.b, y.d)),
    c: add(mul(x.c, y.a), mul(x.d, y.c)),
    d: add(mul(x.c, y.b), mul(x.d, y.d)),
  };
}
