// one material as the workbench and the library screen see it, whether built in or the team's own
import type { MaterialClass } from '../schemas/workbench';
import { builtinMaterial, CLASS_TYPICAL_THICKNESS } from './builtin';

export interface LibraryMaterial {
  /** database id */
  id: number;
  /** null for a built-in */
  teamId: number | null;
  builtinKey: string | null;
  name: string;
  materialClass: MaterialClass;
  /** W/(m·K) */
  conductivity: number;
  /** kg/m³ */
  density: number;
  /** J/(kg·K) */
  specificHeat: number;
  /** μ, dimensionless */
  vapourResistanceFactor: number;
  source: string;
  notes: string;
}

/** what a layer records as its origin: "builtin:<key>" or "team:<id>" */
export function materialRef(m: Pick<LibraryMaterial, 'id' | 'builtinKey'>): string {
  return m.builtinKey ? `builtin:${m.builtinKey}` : `team:${m.id}`;
}

/** the thickness a new layer of this material starts with, m */
export function startingThickness(m: Pick<LibraryMaterial, 'builtinKey' | 'materialClass'>): number {
  const builtin = m.builtinKey ? builtinMaterial(m.builtinKey) : undefined;
  return builtin?.typicalThickness ?? CLASS_TYPICAL_THICKNESS[m.materialClass];
}
