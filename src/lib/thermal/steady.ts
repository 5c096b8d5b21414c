// steady state: series resistances (the ISO 6946 method for homogeneous layers) and the steady profile
import type { BoundarySide } from './boundary.ts';
import type { Mesh } from './mesh.ts';
import { assembleConduction } from './operator.ts';
import { factorise, solve, tridiagonal } from './stepper.ts';
import type { Layer, SteadyResult } from './types.ts';

/** R_se + Σ d/λ + R_si and U = 1/R */
export function steadyFigures(layers: readonly Layer[], rse: number, rsi: number): SteadyResult {
  let r = rse + rsi;
  for (const l of layers) r += l.thickness / l.conductivity;
  return { totalResistance: r, uValue: 1 / r };
}

/**
 * the discrete steady profile K T = b for driving temperatures outside/inside (°C), written into out.
 * a prescribed surface takes its driving temperature directly.
 */
export function steadyProfile(
  mesh: Mesh,
  outside: BoundarySide,
  inside: BoundarySide,
  outsideTemperature: number,
  insideTemperature: number,
  out: Float64Array,
): void {
  const n = mesh.cells + 1;
  const k = tridiagonal(n);
  assembleConduction(mesh, outside, inside, k);
  out.fill(0);
  if (outside.prescribed) {
    k.diag[0] = 1;
    k.upper[0] = 0;
    out[0] = outsideTemperature;
  } else out[0] = outside.h * outsideTemperature;
  if (inside.prescribed) {
    k.diag[n - 1] = 1;
    k.lower[n - 1] = 0;
    out[n - 1] = insideTemperature;
  } else out[n - 1] += inside.h * insideTemperature;
  solve(factorise(k), out, out);
}
