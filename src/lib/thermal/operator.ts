// the discrete conduction operator of the mesh, C dT/dt = −K T + b(t), and its θ-method matrices
// M = C/dt + θK and E = C/dt − (1 − θ)K. a prescribed surface becomes an identity row of M and a zero row of E.
import type { BoundarySide } from './boundary.ts';
import type { Mesh } from './mesh.ts';
import { tridiagonal, type Tridiagonal } from './stepper.ts';

/** the θ-method pair for one (dt, θ) */
export interface ThetaMatrices {
  implicit: Tridiagonal;
  explicit: Tridiagonal;
}

/** writes K (conduction plus films on the surface rows) into k */
export function assembleConduction(mesh: Mesh, outside: BoundarySide, inside: BoundarySide, k: Tridiagonal): void {
  const n = mesh.cells + 1;
  const g = mesh.conductance;
  k.diag.fill(0);
  k.lower.fill(0);
  k.upper.fill(0);
  for (let c = 0; c < mesh.cells; c++) {
    k.diag[c] += g[c];
    k.diag[c + 1] += g[c];
    k.upper[c] = -g[c];
    k.lower[c + 1] = -g[c];
  }
  if (!outside.prescribed) k.diag[0] += outside.h;
  if (!inside.prescribed) k.diag[n - 1] += inside.h;
}

/** assembles M and E for a step dt with weight θ (½ crank-nicolson, 1 backward euler) */
export function assembleTheta(
  mesh: Mesh,
  outside: BoundarySide,
  inside: BoundarySide,
  dt: number,
  theta: number,
  out?: ThetaMatrices,
): ThetaMatrices {
  const n = mesh.cells + 1;
  const m = out ?? { implicit: tridiagonal(n), explicit: tridiagonal(n) };
  const k = m.explicit; // K is assembled into E first, then both are formed from it
  assembleConduction(mesh, outside, inside, k);
  const im = m.implicit;
  const cap = mesh.capacity;
  for (let i = 0; i < n; i++) {
    const c = cap[i] / dt;
    im.diag[i] = c + theta * k.diag[i];
    im.lower[i] = theta * k.lower[i];
    im.upper[i] = theta * k.upper[i];
    k.diag[i] = c - (1 - theta) * k.diag[i];
    k.lower[i] = -(1 - theta) * k.lower[i];
    k.upper[i] = -(1 - theta) * k.upper[i];
  }
  if (outside.prescribed) prescribeRow(m, 0);
  if (inside.prescribed) prescribeRow(m, n - 1);
  return m;
}

function prescribeRow(m: ThetaMatrices, i: number): void {
  m.implicit.diag[i] = 1;
  m.implicit.lower[i] = 0;
  m.implicit.upper[i] = 0;
  m.explicit.diag[i] = 0;
  m.explicit.lower[i] = 0;
  m.explicit.upper[i] = 0;
}

/**
 * right-hand side boundary term of a surface row for a step from driving temperature `before` to `after`:
 * the θ-weighted film input h(θ·after + (1 − θ)·before), or the prescribed value itself
 */
export function boundaryTerm(side: BoundarySide, theta: number, before: number, after: number): number {
  return side.prescribed ? after : side.h * (theta * after + (1 - theta) * before);
}
