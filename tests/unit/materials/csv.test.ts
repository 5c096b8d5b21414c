import { describe, it, expect } from 'vitest';
import { formatMaterialsCsv, parseMaterialsCsv } from '../../../src/lib/materials/csv';

const header = 'name,class,conductivity,density,specific heat,mu,source,notes';

describe('parseMaterialsCsv', () => {
  it('numbers lines as the file has them, also after a quoted field with a line break and a blank line', () => {
    const csv = [header, 'A,board,0.2,700,1000,10,sheet,"one', 'two"', '', 'B,board,zero,700,1000,10,sheet,'].join('\n');
    const { rows, problems } = parseMaterialsCsv(csv);
    expect(rows.map((r) => r.line)).toEqual([2]);
    expect(rows[0].material.notes).toBe('one\ntwo');
    expect(problems).toEqual([{ line: 5, field: 'Conductivity', message: 'Conductivity must be a number in W/(m·K)' }]);
  });

  it('reads a decimal comma, a byte-order mark and headers with units in brackets', () => {
    const csv = '\uFEFFName,Class,Conductivity [W/(m·K)],Density (kg/m³),Specific_heat,Vapour resistance factor μ [–],Source\n"A",insulation,"0,035",30,1400,50,x\n';
    const { rows, problems } = parseMaterialsCsv(csv);
    expect(problems).toEqual([]);
    expect(rows[0].material).toMatchObject({ conductivity: 0.035, materialClass: 'insulation', notes: '' });
  });

  it('rejects an empty file on line 1', () => {
    expect(parseMaterialsCsv('').problems[0]).toMatchObject({ line: 1 });
  });
});

describe('formatMaterialsCsv', () => {
  it('round-trips through parseMaterialsCsv', () => {
    const m = { name: 'Wool, "soft"', materialClass: 'insulation' as const, conductivity: 0.037, density: 20, specificHeat: 1030, vapourResistanceFactor: 1, source: 'EN 13162 declared value', notes: 'a\nb' };
    const parsed = parseMaterialsCsv(formatMaterialsCsv([m]));
    expect(parsed.problems).toEqual([]);
    expect(parsed.rows[0].material).toEqual(m);
  });
});
