import { describe, it, expect } from 'vitest';
import { MAX_RUN_DAYS, daysRule, parseNumber, warmupRule } from '../../../src/components/workbench/numberRule';
import { MAX_DURATION } from '../../../src/lib/schemas/model';

describe('the run length rules of the Exposure pane', () => {
  it('allow as many whole days in all as fit in the engine ten-year duration limit', () => {
    // the engine's limit is ten years of 365.25 days (src/lib/schemas/model.ts)
    expect(MAX_RUN_DAYS).toBe(3652);
    expect(MAX_RUN_DAYS * 86400).toBeLessThanOrEqual(MAX_DURATION);
    expect((MAX_RUN_DAYS + 1) * 86400).toBeGreaterThan(MAX_DURATION);
  });

  it('accept days to report that, with the warm-up days, stay within ten years', () => {
    expect(parseNumber(daysRule(4), '3648')).toEqual({ ok: true, value: 3648 });
    expect(parseNumber(warmupRule(3592), '60')).toEqual({ ok: true, value: 60 });
  });

  it('reject days to report that pass ten years with the warm-up days, with a message naming both fields', () => {
    const r = parseNumber(daysRule(60), '3600');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error).toMatch(/^Days to report plus warm-up days must be at most 3652 \(ten years\)/);
      expect(r.error).toContain('at most 3592 days to report');
      expect(r.error).not.toMatch(/duration/);
    }
  });

  it('reject warm-up days that push the days to report past ten years', () => {
    const r = parseNumber(warmupRule(3650), '5');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/^Days to report plus warm-up days must be at most 3652 \(ten years\); with 3650 days to report, at most 2 warm-up days$/);
  });

  it('still give the field own bounds and whole-number messages first', () => {
    expect(parseNumber(daysRule(4), '0')).toEqual({ ok: false, error: 'Days to report must be at least 1 d' });
    expect(parseNumber(daysRule(4), '2.5')).toEqual({ ok: false, error: 'Days to report must be a whole number of d' });
    expect(parseNumber(warmupRule(3), '61')).toEqual({ ok: false, error: 'Warm-up days must be at most 60 d' });
  });
});
