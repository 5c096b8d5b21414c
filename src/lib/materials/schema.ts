// the fields of a team material, validated the same way in the library form, the API and CSV import
import { z } from 'zod';
import { MATERIAL_CLASSES } from '../schemas/workbench';

const bounded = (unit: string, min: number, max: number, minInclusive = false) =>
  z
    .number({ error: (i) => (i.input === undefined || i.input === null || i.input === '' ? 'is required' : `must be a number${unit ? ` in ${unit}` : ''}`) })
    .refine(Number.isFinite, { error: `must be a finite number${unit ? ` in ${unit}` : ''}` })
    .refine((v) => (minInclusive ? v >= min : v > min), { error: `must be ${minInclusive ? 'at least' : 'greater than'} ${min}${unit ? ` ${unit}` : ''}` })
    .refine((v) => v <= max, { error: `must be at most ${max.toLocaleString('en-GB')}${unit ? ` ${unit}` : ''}` });

export const materialFieldsSchema = z.object({
  name: z
    .string({ error: 'is required' })
    .trim()
    .min(1, { error: 'must not be empty' })
    .max(160, { error: 'must be at most 160 characters' }),
  materialClass: z.enum(MATERIAL_CLASSES, { error: `must be one of ${MATERIAL_CLASSES.join(', ')}` }),
  /** W/(m·K) */
  conductivity: bounded('W/(m·K)', 0, 1000),
  /** kg/m³ */
  density: bounded('kg/m³', 0, 25000),
  /** J/(kg·K) */
  specificHeat: bounded('J/(kg·K)', 0, 10000),
  /** μ, dimensionless */
  vapourResistanceFactor: bounded('', 1, 10_000_000, true),
  source: z
    .string({ error: 'is required' })
    .trim()
    .min(1, { error: 'must say where the values come from (a product data sheet, a standard’s table)' })
    .max(2000, { error: 'must be at most 2000 characters' }),
  notes: z.string().trim().max(2000, { error: 'must be at most 2000 characters' }).default(''),
});
export type MaterialFields = z.output<typeof materialFieldsSchema>;

/** just the material's values, off anything that carries them (a database row, a built-in, a library entry) */
export function materialFieldsOf(m: MaterialFields): MaterialFields {
  return {
    name: m.name,
    materialClass: m.materialClass,
    conductivity: m.conductivity,
    density: m.density,
    specificHeat: m.specificHeat,
    vapourResistanceFactor: m.vapourResistanceFactor,
    source: m.source,
    notes: m.notes,
  };
}

export const FIELD_LABELS: Record<keyof MaterialFields, string> = {
  name: 'Name',
  materialClass: 'Class',
  conductivity: 'Conductivity',
  density: 'Density',
  specificHeat: 'Specific heat',
  vapourResistanceFactor: 'Vapour resistance factor μ',
  source: 'Source',
  notes: 'Notes',
};
