import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { materials } from '../db/schema';
import { BUILTIN_MATERIALS } from '../../materials/builtin';
import { materialFieldsOf } from '../../materials/schema';

/** the built-in library in the materials table (teamId null); upsert by builtinKey, so a new release refreshes the values */
export async function seedBuiltinMaterials(db: Database): Promise<void> {
  const rows = BUILTIN_MATERIALS.map((m) => ({
    teamId: null,
    builtinKey: m.key,
    ...materialFieldsOf(m),
  }));
  await db
    .insert(materials)
    .values(rows)
    .onDuplicateKeyUpdate({
      set: {
        name: sql`values(${materials.name})`,
        materialClass: sql`values(${materials.materialClass})`,
        conductivity: sql`values(${materials.conductivity})`,
        density: sql`values(${materials.density})`,
        specificHeat: sql`values(${materials.specificHeat})`,
        vapourResistanceFactor: sql`values(${materials.vapourResistanceFactor})`,
        source: sql`values(${materials.source})`,
        notes: sql`values(${materials.notes})`,
        updatedAt: sql`now(3)`,
      },
    });
}
