// periodic steady state by the transfer-matrix method of ISO 13786, in complex arithmetic.
//
// sign convention: amplitudes are complex with time factor e^{+iωt}, so θ(t) = Re(θ̂ e^{iωt}).
// a matrix maps (temperature, heat flux) on one side of an element to the other side,
// [θ₂, q₂]ᵀ = Z [θ₁, q₁]ᵀ, with the flux positive in the direction from side 1 to side 2.
// the wall matrix runs from the INSIDE air (side 1) to the OUTSIDE air (side 2):
//   Z = Z_se · Z_layer0 · Z_layer1 · … · Z_layerN−1 · Z_si   (layer 0 is the outside layer)
// so a flux positive from inside to outside; the heat flux INTO the room per kelvin of outside air,
// with the inside air held, is Y12 = −1/Z12 (for a massless wall Y12 = +U, real).
import {
  abs,
  arg,
  complex,
  cosh,
  div,
  matmul,
  mul,
  scale,
  sinh,
  sub,
  type Complex,
  type Matrix2,
} from './complex.ts';
import type { Layer, PeriodicResult } from './types.ts';

/** ξ = d/δ of a layer, with δ = sqrt(λT/(πρc)) the periodic penetration depth */
export function layerXi(layer: Layer, period: number): number {
  const { thickness: d, conductivity: k, density: rho, specificHeat: c } = layer;
  return d / Math.sqrt((k * period) / (Math.PI * rho * c));
}

/**
 * ISO 13786 heat transfer matrix of one homogeneous layer at period T (s), multiplied by e^{−ξ}
 * when `scaled` is true (a thick layer would overflow cosh; the factor is carried separately)
 */
export function layerMatrix(layer: Layer, period: number, scaled = false): Matrix2 {
  const { thickness: d, conductivity: k, density: rho, specificHeat: c } = layer;
  const delta = Math.sqrt((k * period) / (Math.PI * rho * c)); // periodic penetration depth
  const xi = d / delta;
  const ch = scaled ? scaledCosh(xi) : cosh(complex(xi, xi)); // cosh(ξ(1 + i))
  const sh = scaled ? scaledSinh(xi) : sinh(complex(xi, xi));
  const onePlusI = complex(1, 1);
  return {
    a: ch,
    b: scale(div(sh, onePlusI), -delta / k), // −δ/(λ(1+i))·sinh(ξ(1+i))
    c: scale(mul(sh, onePlusI), -k / delta), // −λ(1+i)/δ·sinh(ξ(1+i))
    d: ch,
  };
}

// cosh and sinh of ξ(1 + i) times e^{−ξ}, finite for any ξ ≥ 0
function scaledCosh(xi: number): Complex {
  const e = Math.exp(-2 * xi);
  return { re: 0.5 * (1 + e) * Math.cos(xi), im: 0.5 * (1 - e) * Math.sin(xi) };
}
function scaledSinh(xi: number): Complex {
  const e = Math.exp(-2 * xi);
  return { re: 0.5 * (1 - e) * Math.cos(xi), im: 0.5 * (1 + e) * Math.sin(xi) };
}

/** a surface film (or any pure resistance R, m²K/W): [[1, −R], [0, 1]] */
export function resistanceMatrix(r: number): Matrix2 {
  return { a: complex(1), b: complex(-r), c: complex(0), d: complex(1) };
}

/**
 * the environment-to-environment matrix from the inside air to the outside air, as e^{logScale}·matrix
 * (logScale = Σξ; the unscaled matrix overflows for walls many penetration depths thick)
 */
export function wallMatrix(
  layers: readonly Layer[],
  rse: number,
  rsi: number,
  period: number,
): { matrix: Matrix2; logScale: number } {
  let z = resistanceMatrix(rse);
  let logScale = 0;
  for (const layer of layers) {
    z = matmul(z, layerMatrix(layer, period, true));
    logScale += layerXi(layer, period);
  }
  return { matrix: matmul(z, resistanceMatrix(rsi)), logScale };
}

/** complex inside heat flux (into the room, W/m²) per kelvin of outside air amplitude, inside air held */
export function transmittance(z: Matrix2, logScale = 0): Complex {
  return scale(div(complex(-1), z.b), Math.exp(-logScale));
}

/**
 * the periodic figures of the contract. the time lag is the delay of the inside flux peak after the outside
 * air peak: flux ∝ Re(Y e^{iω(t − t_peak)}) peaks at t − t_peak = −arg(Y)/ω, taken into [0, T).
 * admittance: |Y11| = |Z11/Z12| (flux into the wall per kelvin of inside air, outside air held).
 * areal heat capacity κ1 = T/(2π)·|(Z11 − 1)/Z12| with Z from environment to environment, as ISO 13786 defines it.
 */
export function periodicAnalysis(
  layers: readonly Layer[],
  rse: number,
  rsi: number,
  period: number,
  uValue: number,
): PeriodicResult {
  const { matrix: z, logScale } = wallMatrix(layers, rse, rsi, period);
  const y = transmittance(z, logScale);
  const periodicTransmittance = abs(y);
  let timeLag = (-arg(y) / (2 * Math.PI)) * period;
  timeLag = ((timeLag % period) + period) % period;
  if (timeLag >= period) timeLag = 0; // round-off of a tiny negative lag
  const admittanceInside = abs(div(z.a, z.b));
  const arealHeatCapacityInside = (period / (2 * Math.PI)) * abs(div(sub(z.a, complex(Math.exp(-logScale))), z.b));
  return {
    period,
    periodicTransmittance,
    decrementFactor: periodicTransmittance / uValue,
    timeLag,
    admittanceInside,
    arealHeatCapacityInside,
  };
}
