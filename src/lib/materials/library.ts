// one material as the workbench and the library screen see it, whether built in or the team's own
import type { MaterialFields } from './schema';
import { builtinMaterial, CLASS_TYPICAL_THICKNESS } from './builtin';

/** a material's values (units as in materialFieldsSchema) and where it is kept */
export interface LibraryMaterial extends MaterialFields {
  /** database id */
  id: number;
  /** null for a built-in */
  teamId: number | null;
  builtinKey: string | null;
}

/** the built-ins and the team's own, as GET /api/materials answers; a failed answer throws its message */
export async function fetchMaterials(teamId: number): Promise<LibraryMaterial[]> {
  const r = await fetch(`/api/materials?teamId=${teamId}`, { headers: { accept: 'application/json' } });
  const body = (await r.json().catch(() => null)) as { materials?: LibraryMaterial[]; error?: { message?: string } } | null;
  if (!r.ok || !body?.materials) throw new Error(body?.error?.message ?? `The library could not be loaded (HTTP ${r.status}).`);
  return body.materials;
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
