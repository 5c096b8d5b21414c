// the material library in MariaDB: the built-ins (teamId null) and each team's own
import { and, asc, eq, isNull, or, sql } from 'drizzle-orm';
import { db } from './db';
import { teamsOf } from './access';
import { materials, type Material } from './db/schema';
import { materialFieldsOf, type MaterialFields } from '../materials/schema';
import type { LibraryMaterial } from '../materials/library';

export function toLibraryMaterial(m: Material): LibraryMaterial {
  return {
    id: m.id,
    teamId: m.teamId,
    builtinKey: m.builtinKey,
    ...materialFieldsOf(m),
  };
}

/** the built-ins and the team's own, built-ins first, each by class and name */
export async function listMaterials(teamId: number, scope: 'all' | 'team' | 'builtin' = 'all'): Promise<LibraryMaterial[]> {
  const where = scope === 'team' ? eq(materials.teamId, teamId) : scope === 'builtin' ? isNull(materials.teamId) : or(isNull(materials.teamId), eq(materials.teamId, teamId));
  const rows = await db
    .select()
    .from(materials)
    .where(where)
    .orderBy(sql`${materials.teamId} is not null`, asc(materials.materialClass), asc(materials.name));
  return rows.map(toLibraryMaterial);
}

export async function getMaterial(id: number): Promise<Material | null> {
  const rows = await db.select().from(materials).where(eq(materials.id, id)).limit(1);
  return rows[0] ?? null;
}

/** another of the team's materials already has this name (case-insensitive) */
export async function nameTaken(teamId: number, name: string, exceptId?: number): Promise<boolean> {
  const rows = await db
    .select({ id: materials.id })
    .from(materials)
    .where(and(eq(materials.teamId, teamId), sql`lower(${materials.name}) = ${name.toLowerCase()}`));
  return rows.some((r) => r.id !== exceptId);
}

export async function createMaterial(teamId: number, userId: string, fields: MaterialFields): Promise<LibraryMaterial> {
  const [row] = await db.insert(materials).values({ ...fields, teamId, builtinKey: null, createdBy: userId }).$returningId();
  return toLibraryMaterial((await getMaterial(row.id))!);
}

export async function updateMaterial(id: number, fields: Partial<MaterialFields>): Promise<LibraryMaterial> {
  await db.update(materials).set({ ...fields, updatedAt: new Date() }).where(eq(materials.id, id));
  return toLibraryMaterial((await getMaterial(id))!);
}

export async function deleteMaterial(id: number): Promise<void> {
  await db.delete(materials).where(eq(materials.id, id));
}

/** all rows or none: one transaction */
export async function importMaterials(teamId: number, userId: string, rows: MaterialFields[]): Promise<number> {
  await db.transaction(async (tx) => {
    for (let i = 0; i < rows.length; i += 200) {
      await tx.insert(materials).values(rows.slice(i, i + 200).map((m) => ({ ...m, teamId, builtinKey: null, createdBy: userId })));
    }
  });
  return rows.length;
}

/** the team a request is about: the one asked for, else the caller's first */
export async function teamFor(locals: App.Locals, teamId: number | undefined): Promise<number | null> {
  if (teamId !== undefined) return teamId;
  if (!locals.user) return null;
  return (await teamsOf(locals.user.id))[0]?.teamId ?? null;
}
