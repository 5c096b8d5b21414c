// the editable fields of a layer card: how the UI shows them and how typed text becomes a model value
import type { DocLayer } from '../schemas/workbench';

export type LayerField = 'name' | 'thickness' | 'conductivity' | 'density' | 'specificHeat' | 'vapourResistanceFactor';

export interface FieldSpec {
  label: string;
  /** the unit the UI shows */
  unit: string;
  /** UI value = model value × scale */
  scale: number;
  min: number;
  /** the minimum itself is allowed */
  minInclusive: boolean;
  max: number;
  /** empty text means "not given" (null) */
  optional?: boolean;
  /** significant digits shown */
  digits: number;
}

export const FIELD_SPECS: Record<Exclude<LayerField, 'name'>, FieldSpec> = {
  thickness: { label: 'Thickness', unit: 'mm', scale: 1000, min: 0, minInclusive: false, max: 2000, digits: 4 },
  conductivity: { label: 'Conductivity', unit: 'W/(m·K)', scale: 1, min: 0, minInclusive: false, max: 1000, digits: 4 },
  density: { label: 'Density', unit: 'kg/m³', scale: 1, min: 0, minInclusive: false, max: 25000, digits: 5 },
  specificHeat: { label: 'Specific heat', unit: 'J/(kg·K)', scale: 1, min: 0, minInclusive: false, max: 10000, digits: 5 },
  vapourResistanceFactor: { label: 'Vapour resistance factor μ', unit: '–', scale: 1, min: 1, minInclusive: true, max: 10_000_000, optional: true, digits: 6 },
};

export type ParsedField = { ok: true; value: string | number | null } | { ok: false; error: string };

const fmtLimit = (v: number) => (Math.abs(v) >= 10000 ? v.toLocaleString('en-GB') : String(v));

/** typed text to a model value, or a message that names the field, the problem and the unit */
export function parseLayerField(field: LayerField, raw: string): ParsedField {
  if (field === 'name') {
    const name = raw.trim();
    if (!name) return { ok: false, error: 'Name must not be empty' };
    if (name.length > 160) return { ok: false, error: 'Name must be at most 160 characters' };
    return { ok: true, value: name };
  }
  const spec = FIELD_SPECS[field];
  const unit = spec.unit === '–' ? '' : ` ${spec.unit}`;
  const text = raw.trim().replace(',', '.');
  if (!text) {
    if (spec.optional) return { ok: true, value: null };
    return { ok: false, error: `${spec.label} is required (in ${spec.unit})` };
  }
  // Number('') is 0 and Number('1e3') is fine; reject anything that is not a plain decimal number
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) {
    return { ok: false, error: `${spec.label} must be a number${unit ? ` in${unit}` : ''}` };
  }
  const shown = Number(text);
  if (!Number.isFinite(shown)) return { ok: false, error: `${spec.label} must be a finite number${unit ? ` in${unit}` : ''}` };
  if (spec.minInclusive ? shown < spec.min : shown <= spec.min) {
    return { ok: false, error: `${spec.label} must be ${spec.minInclusive ? 'at least' : 'greater than'} ${fmtLimit(spec.min)}${unit}` };
  }
  if (shown > spec.max) return { ok: false, error: `${spec.label} must be at most ${fmtLimit(spec.max)}${unit}` };
  return { ok: true, value: shown / spec.scale };
}

/** a model value as the UI shows it in an input */
export function showLayerField(layer: DocLayer, field: LayerField): string {
  if (field === 'name') return layer.name;
  const spec = FIELD_SPECS[field];
  const v = layer[field];
  if (v === null || v === undefined) return '';
  const shown = v * spec.scale;
  // trim binary noise (0.1 * 1000 = 100.00000000000001) without rounding real input
  return String(Number(shown.toPrecision(12)));
}

export const draftKey = (layerId: string, field: LayerField) => `layer:${layerId}:${field}`;
