import { describe, expect, it } from 'vitest';
import { layerFigures, lumpedFigures } from '../../../src/lib/thermal/diagnostics.ts';
import { layer } from './helpers.ts';

describe('layerFigures', () => {
  const [brick] = layerFigures([layer('brick', 0.1, 0.77, 1700, 800)], 0.04, 0.13, 86400);

  it('computes resistance, diffusivity, areal heat capacity and penetration depth from their definitions', () => {
    expect(brick.resistance).toBeCloseTo(0.1 / 0.77, 14);
    expect(brick.diffusivity).toBeCloseTo(0.77 / (1700 * 800), 18);
    expect(brick.arealHeatCapacity).toBeCloseTo(1700 * 800 * 0.1, 8);
    // periodic penetration depth sqrt(aP/π) (ISO 13786 δ)
    expect(brick.penetrationDepth).toBeCloseTo(Math.sqrt(((0.77 / (1700 * 800)) * 86400) / Math.PI), 14);
  });

  it('gives the Fourier number a·P/d² and a layer Biot number with its lumped flag', () => {
    expect(brick.fourier).toBeCloseTo(((0.77 / (1700 * 800)) * 86400) / 0.01, 12);
    const h = (25 + 1 / 0.13) / 2;
    expect(brick.biot).toBeCloseTo((h * 0.05) / 0.77, 12);
    expect(brick.lumped).toBe(false);
  });
});

describe('lumpedFigures', () => {
  it('treats 1 mm of steel between two films as lumped with τ = ρcd/(h₁ + h₂)', () => {
    // lumped capacitance (Incropera, Fundamentals of Heat and Mass Transfer, §5.1–5.2; Bi < 0.1 common practice)
    const r = lumpedFigures([layer('steel sheet', 0.001, 50, 7850, 460)], 0.1, 0.1);
    expect(r.characteristicLength).toBeCloseTo(0.0005, 15);
    expect(r.biot).toBeCloseTo((10 * 0.0005) / 50, 15);
    expect(r.valid).toBe(true);
    expect(r.timeConstant).toBeCloseTo((7850 * 460 * 0.001) / 20, 9);
  });

  it('uses the effective conductivity of the layers in series', () => {
    const r = lumpedFigures([layer('a', 0.1, 1, 1000, 1000), layer('b', 0.1, 0.04, 30, 1000)], 0.04, 0.13);
    const kEff = 0.2 / (0.1 + 2.5);
    expect(r.biot).toBeCloseTo((((25 + 1 / 0.13) / 2) * 0.1) / kEff, 10);
    expect(r.valid).toBe(false);
  });

  it('reports an infinite Biot number and no time constant for a prescribed surface', () => {
    const r = lumpedFigures([layer('a', 0.1, 1, 1000, 1000)], 0, 0.13);
    expect(r.biot).toBe(Infinity);
    expect(r.valid).toBe(false);
    expect(r.timeConstant).toBe(0);
  });
});
