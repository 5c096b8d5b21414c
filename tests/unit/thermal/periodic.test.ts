import { describe, expect, it } from 'vitest';
import { abs } from '../../../src/lib/thermal/complex.ts';
import { layerMatrix, periodicAnalysis, transmittance, wallMatrix } from '../../../src/lib/thermal/periodic.ts';
import { heavyWall, layer } from './helpers.ts';

const P = 86400;

describe('layerMatrix', () => {
  it('has determinant 1, as every ISO 13786 layer matrix does (reciprocity)', () => {
    const z = layerMatrix(layer('brick', 0.215, 0.77, 1700, 800), P);
    const det = { re: z.a.re * z.d.re - z.a.im * z.d.im - (z.b.re * z.c.re - z.b.im * z.c.im), im: z.a.re * z.d.im + z.a.im * z.d.re - (z.b.re * z.c.im + z.b.im * z.c.re) };
    expect(det.re).toBeCloseTo(1, 12);
    expect(det.im).toBeCloseTo(0, 12);
  });

  it('reduces to a pure resistance for a layer with negligible heat capacity', () => {
    const z = layerMatrix(layer('foil', 0.01, 0.05, 1e-6, 1), P);
    expect(z.b.re).toBeCloseTo(-0.2, 9);
    expect(z.a.re).toBeCloseTo(1, 9);
  });
});

describe('periodicAnalysis', () => {
  it('gives decrement factor 1 and no lag for a massless wall', () => {
    const wall = [layer('massless', 0.1, 0.04, 1e-6, 1)];
    const r = periodicAnalysis(wall, 0.04, 0.13, P, 1 / (0.04 + 2.5 + 0.13));
    expect(r.decrementFactor).toBeCloseTo(1, 9);
    expect(Math.min(r.timeLag, P - r.timeLag)).toBeLessThan(1e-3);
    expect(r.arealHeatCapacityInside).toBeLessThan(1e-3);
  });

  it('gives half the heat capacity ρcd/2 as κ for a thin layer without films', () => {
    // small-ξ expansion of ISO 13786's κ1 = T/(2π)|(Z11 − 1)/Z12|: Z11 ≈ 1 + i(d/δ)², Z12 ≈ −d/λ
    const thin = [layer('thin plaster', 0.002, 0.5, 1200, 1000)];
    const r = periodicAnalysis(thin, 0, 0, P, 0.5 / 0.002);
    expect(r.arealHeatCapacityInside / (0.5 * 1200 * 1000 * 0.002)).toBeCloseTo(1, 4);
  });

  it('matches the semi-infinite periodic solution for a thick layer without films', () => {
    // periodic heat wave in a semi-infinite solid (Carslaw & Jaeger, Conduction of Heat in Solids, §2.6; from memory):
    // surface admittance sqrt(ωλρc) with the flux leading by 45°, amplitude decaying as e^{−x/δ}, lag x/δ radians
    const k = 1.4;
    const rc = 2000 * 900;
    const d = 1.2;
    const r = periodicAnalysis([layer('thick concrete', d, k, 2000, 900)], 0, 0, P, k / d);
    const w = (2 * Math.PI) / P;
    expect(r.admittanceInside / Math.sqrt(w * k * rc)).toBeCloseTo(1, 6);
    const delta = Math.sqrt((k * P) / (Math.PI * rc));
    const xi = d / delta;
    // Y12 = λ(1+i)/δ / sinh(ξ(1+i)) ≈ 2√2 λ/δ e^{−ξ} at phase π/4 − ξ
    expect(r.periodicTransmittance / ((2 * Math.SQRT2 * k) / delta) / Math.exp(-xi)).toBeCloseTo(1, 5);
    const lag = ((((xi - Math.PI / 4) / w) % P) + P) % P;
    expect(Math.abs(r.timeLag - lag)).toBeLessThan(1);
  });

  it('stays finite for a wall many penetration depths thick', () => {
    const r = periodicAnalysis([layer('earth bank', 60, 1.5, 1800, 1000)], 0.04, 0.13, P, 1 / (0.17 + 40));
    expect(Number.isFinite(r.periodicTransmittance)).toBe(true);
    expect(Number.isFinite(r.admittanceInside)).toBe(true);
    expect(Number.isFinite(r.arealHeatCapacityInside)).toBe(true);
    expect(r.periodicTransmittance).toBeLessThan(1e-100);
  });

  it('reports a heavy insulated wall with a small decrement and a lag of hours', () => {
    const u = 1 / (0.04 + 0.012 / 0.7 + 0.12 / 0.035 + 0.215 / 0.77 + 0.013 / 0.4 + 0.13);
    const r = periodicAnalysis(heavyWall, 0.04, 0.13, P, u);
    expect(r.decrementFactor).toBeGreaterThan(0);
    expect(r.decrementFactor).toBeLessThan(1);
    expect(r.timeLag).toBeGreaterThan(3600);
    // κ1 cannot exceed T/(2π R_si): the film limits what the room can reach (bound from the definition)
    expect(r.arealHeatCapacityInside).toBeLessThan(P / (2 * Math.PI * 0.13));
    const { matrix, logScale } = wallMatrix(heavyWall, 0.04, 0.13, P);
    expect(abs(transmittance(matrix, logScale))).toBeCloseTo(r.periodicTransmittance, 14);
  });
});
