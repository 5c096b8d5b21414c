// the rules of the Exposure pane's number fields and their one parser: the message of a
// rejected value always names the field and its unit. pure code, so unit tests can load it.

/** a number field's rule: label, unit, bounds; the message always names the field */
export interface NumberRule {
  label: string;
  unit: string;
  min?: number;
  max?: number;
  /** the bounds themselves are allowed (default true) */
  inclusive?: boolean;
  integer?: boolean;
  /** empty text means "none" (null) */
  optional?: boolean;
  /** UI value = model value × scale */
  scale?: number;
  extra?: (v: number) => string | null;
}

export function parseNumber(rule: NumberRule, raw: string): { ok: true; value: number | null } | { ok: false; error: string } {
  const unit = rule.unit ? ` ${rule.unit}` : '';
  const text = raw.trim().replace(',', '.');
  if (text === '') return rule.optional ? { ok: true, value: null } : { ok: false, error: `${rule.label} is required${unit ? ` (in${unit})` : ''}` };
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return { ok: false, error: `${rule.label} must be a number${unit ? ` in${unit}` : ''}` };
  const v = Number(text);
  if (rule.integer && !Number.isInteger(v)) return { ok: false, error: `${rule.label} must be a whole number${unit ? ` of${unit}` : ''}` };
  const inc = rule.inclusive !== false;
  if (rule.min !== undefined && (inc ? v < rule.min : v <= rule.min)) {
    return { ok: false, error: `${rule.label} must be ${inc ? 'at least' : 'greater than'} ${rule.min}${unit}` };
  }
  if (rule.max !== undefined && (inc ? v > rule.max : v >= rule.max)) {
    return { ok: false, error: `${rule.label} must be ${inc ? 'at most' : 'less than'} ${rule.max}${unit}` };
  }
  const extra = rule.extra?.(v);
  if (extra) return { ok: false, error: extra };
  return { ok: true, value: v / (rule.scale ?? 1) };
}
