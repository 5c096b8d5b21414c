import { describe, it, expect } from 'vitest';
import { BUILTIN_MATERIALS, ISO6946_TABLE8_HORIZONTAL, builtinMaterial } from '../../../src/lib/materials/builtin';
import { MATERIAL_CLASSES } from '../../../src/lib/schemas/workbench';

describe('BUILTIN_MATERIALS', () => {
  it('holds at least 40 materials with unique keys and names', () => {
    expect(BUILTIN_MATERIALS.length).toBeGreaterThanOrEqual(40);
    expect(new Set(BUILTIN_MATERIALS.map((m) => m.key)).size).toBe(BUILTIN_MATERIALS.length);
    expect(new Set(BUILTIN_MATERIALS.map((m) => m.name)).size).toBe(BUILTIN_MATERIALS.length);
  });

  it('covers every material class', () => {
    for (const cls of MATERIAL_CLASSES) expect(BUILTIN_MATERIALS.some((m) => m.materialClass === cls), cls).toBe(true);
  });

  it('gives every material positive finite values, μ of at least 1 and a named source', () => {
    for (const m of BUILTIN_MATERIALS) {
      for (const v of [m.conductivity, m.density, m.specificHeat, m.typicalThickness]) {
        expect(Number.isFinite(v) && v > 0, `${m.key}: ${v}`).toBe(true);
      }
      expect(m.vapourResistanceFactor, m.key).toBeGreaterThanOrEqual(1);
      // a source names a standard or handbook and its table
      expect(m.source, m.key).toMatch(/(ISO|EN|CIBSE|ASHRAE)[^,]*/);
      expect(m.source, m.key).toMatch(/table|annex/i);
    }
  });

  it('keeps values in the ranges the trade expects for each class (common practice)', () => {
    for (const m of BUILTIN_MATERIALS) {
      if (m.materialClass === 'insulation') expect(m.conductivity, m.key).toBeLessThan(0.06);
      if (m.materialClass === 'metal') expect(m.conductivity, m.key).toBeGreaterThan(10);
      if (m.materialClass === 'masonry' || m.materialClass === 'concrete') expect(m.density, m.key).toBeGreaterThan(500);
    }
  });

  it('looks a material up by its key', () => {
    expect(builtinMaterial('pir-32')?.conductivity).toBe(0.022);
    expect(builtinMaterial('no-such')).toBeUndefined();
  });
});

describe('air layers', () => {
  it('reproduce the resistance of ISO 6946:2017 Table 8 (unventilated, horizontal heat flow) at their own thickness', () => {
    const air = BUILTIN_MATERIALS.filter((m) => m.materialClass === 'air');
    expect(air.length).toBeGreaterThanOrEqual(4);
    for (const m of air) {
      const mm = Math.round(m.typicalThickness * 1000);
      // ISO 6946:2017 Table 8 (from memory): 10 mm 0.15, 15 mm 0.17, 25 mm and more 0.18 m²K/W
      const row = ISO6946_TABLE8_HORIZONTAL.find(([d]) => d === mm);
      expect(row, `${m.key}: ${mm} mm is a row of the table`).toBeDefined();
      expect(m.typicalThickness / m.conductivity).toBeCloseTo(row![1], 10);
      expect(m.notes).toMatch(/ISO 6946 governs/);
    }
  });

  it('hold the table rows recalled from ISO 6946:2017 Table 8', () => {
    // from memory: 5 mm 0.11, 7 mm 0.13, 10 mm 0.15, 15 mm 0.17, 25–300 mm 0.18 m²K/W (horizontal heat flow)
    expect(Object.fromEntries(ISO6946_TABLE8_HORIZONTAL)).toEqual({ 5: 0.11, 7: 0.13, 10: 0.15, 15: 0.17, 25: 0.18, 50: 0.18, 100: 0.18, 300: 0.18 });
  });
});
