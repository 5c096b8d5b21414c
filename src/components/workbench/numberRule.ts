// the rules of the Exposure pane's number fields and their one parser: the message of a
// rejected value always names the field and its unit. pure code, so unit tests can load it.
import { MAX_DURATION } from '../../lib/schemas/model';

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

/** the most days a run may take in all (reported plus warm-up): the engine's ten years, whole days */
export const MAX_RUN_DAYS = Math.floor(MAX_DURATION / 86400); // 3652
const TOTAL_DAYS_MESSAGE = `Days to report plus warm-up days must be at most ${MAX_RUN_DAYS} (ten years)`;
/** the rule of "Days to report", given the warm-up days in the document */
export const daysRule = (warmupDays: number): NumberRule => ({
  label: 'Days to report',
  unit: 'd',
  min: 1,
  max: 3660,
  integer: true,
  extra: (v) =>
    v + warmupDays > MAX_RUN_DAYS
      ? warmupDays === 0
        ? `Days to report must be at most ${MAX_RUN_DAYS} (ten years)`
        : `${TOTAL_DAYS_MESSAGE}; with ${warmupDays} warm-up days, at most ${MAX_RUN_DAYS - warmupDays} days to report`
      : null,
});
/** the rule of "Warm-up days", given the days to report in the document */
export const warmupRule = (days: number): NumberRule => ({
  label: 'Warm-up days',
  unit: 'd',
  min: 0,
  max: 60,
  integer: true,
  extra: (v) => (v + days > MAX_RUN_DAYS ? `${TOTAL_DAYS_MESSAGE}; with ${days} days to report, at most ${MAX_RUN_DAYS - days} warm-up days` : null),
});

