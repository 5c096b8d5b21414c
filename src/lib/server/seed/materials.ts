import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { materials } from '../db/schema';
import { BUILTIN_MATERIALS } from '../../materials/builtin';

/** the built-in library in the materials table (teamId null); upsert by builtinKey, so a new release refreshes the values */
export async function seedBuiltinMaterials(db: Database): Promise<void> {
  const rows = BUILTIN_MATERIALS.map((m) => ({
    teamId: null,
    builtinKey: m.key,
    name: m.name,
    materialClass: m.materialClass,
    conductivity: m.conductivity,
    density: m.density,
    specificHeat: m.specificHeat,
    vapourResistanceFactor: m.vapourResistanceFactor,
    source: m.source,
    notes: m.notes,
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
