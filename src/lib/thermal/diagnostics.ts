// diagnostics the workbench shows live: per-layer figures and the lumped-body check
import type { Layer, LayerExtraFigures, LumpedFigures } from './types.ts';

/** Bi below this counts as lumped (common practice) */
export const LUMPED_BIOT_LIMIT = 0.1;

/** mean film coefficient h̄ = (1/R_se + 1/R_si)/2, W/m²K; Infinity when a surface is prescribed */
export function meanFilmCoefficient(rse: number, rsi: number): number {
  return (1 / rse + 1 / rsi) / 2;
}

/**
 * per layer: resistance d/λ, diffusivity λ/(ρc), areal heat capacity ρcd, penetration depth sqrt(a·P/π),
 * Fourier number a·P/d² for one period P, and a layer Biot number h̄·(d/2)/λ with its lumped flag
 */
export function layerFigures(layers: readonly Layer[], rse: number, rsi: number, period: number): LayerExtraFigures[] {
  const h = meanFilmCoefficient(rse, rsi);
  return layers.map((l) => {
    const diffusivity = l.conductivity / (l.density * l.specificHeat);
    const biot = (h * l.thickness) / (2 * l.conductivity);
    return {
      name: l.name,
      resistance: l.thickness / l.conductivity,
      diffusivity,
      arealHeatCapacity: l.density * l.specificHeat * l.thickness,
      penetrationDepth: Math.sqrt((diffusivity * period) / Math.PI),
      fourier: (diffusivity * period) / (l.thickness * l.thickness),
      biot,
      lumped: biot < LUMPED_BIOT_LIMIT,
    };
  });
}

/**
 * the assembly as one body between the two air temperatures: Lc = total thickness / 2 (two faces exposed),
 * Bi = h̄·Lc/k_eff with k_eff = total thickness / Σ d/λ, valid when Bi < 0.1, τ = Σρcd / (1/R_se + 1/R_si).
 * a prescribed surface (R = 0) makes h̄ infinite: Bi = Infinity, τ = 0, not valid.
 */
export function lumpedFigures(layers: readonly Layer[], rse: number, rsi: number): LumpedFigures {
  let thickness = 0;
  let resistance = 0;
  let capacity = 0;
  for (const l of layers) {
    thickness += l.thickness;
    resistance += l.thickness / l.conductivity;
    capacity += l.density * l.specificHeat * l.thickness;
  }
  const characteristicLength = thickness / 2;
  const h = meanFilmCoefficient(rse, rsi);
  const kEff = thickness / resistance;
  const biot = (h * characteristicLength) / kEff;
  const hSum = 1 / rse + 1 / rsi;
  return {
    characteristicLength,
    biot,
    valid: biot < LUMPED_BIOT_LIMIT,
    timeConstant: Number.isFinite(hSum) ? capacity / hSum : 0,
  };
}
