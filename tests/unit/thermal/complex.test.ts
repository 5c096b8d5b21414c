import { describe, expect, it } from 'vitest';
import { abs, arg, complex, cosh, div, matmul, mul, sinh } from '../../../src/lib/thermal/complex.ts';

describe('complex arithmetic', () => {
  it('multiplies and divides as (a + ib)(c + id) = (ac − bd) + i(ad + bc)', () => {
    const p = mul(complex(1, 2), complex(3, -1));
    expect(p).toEqual({ re: 5, im: 5 });
    const q = div(p, complex(3, -1));
    expect(q.re).toBeCloseTo(1, 14);
    expect(q.im).toBeCloseTo(2, 14);
    expect(abs(complex(3, 4))).toBe(5);
    expect(arg(complex(0, 1))).toBeCloseTo(Math.PI / 2, 14);
  });

  it('satisfies cosh² − sinh² = 1 for a complex argument (hyperbolic identity)', () => {
    const z = complex(0.7, -1.3);
    const c = cosh(z);
    const s = sinh(z);
    const one = { re: mul(c, c).re - mul(s, s).re, im: mul(c, c).im - mul(s, s).im };
    expect(one.re).toBeCloseTo(1, 13);
    expect(one.im).toBeCloseTo(0, 13);
  });

  it('multiplies 2×2 matrices row by column', () => {
    const m = { a: complex(1), b: complex(2), c: complex(3), d: complex(4) };
    const p = matmul(m, m);
    expect([p.a.re, p.b.re, p.c.re, p.d.re]).toEqual([7, 10, 15, 22]);
  });
});
