import { describe, expect, it } from 'vitest';
import { climateToCsv, parseClimateCsv } from '../../../src/components/workbench/moisture/climateCsv';
import { workbenchDocumentSchema, defaultExposure } from '../../../src/lib/schemas/workbench';

const rows = (n = 12) => Array.from({ length: n }, (_, i) => `${i + 1},${(i - 2) * 1.5},${80 - i}`).join('\n');

describe('parseClimateCsv', () => {
  it('reads twelve months with a header and a month column', () => {
    const r = parseClimateCsv(`month,temperature,rh\n${rows()}`);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.months).toHaveLength(12);
      expect(r.months[0]).toEqual({ temperature: -3, relativeHumidity: 80 });
    }
  });

  it('reads two columns with semicolons and decimal commas, and its own export back', () => {
    const r = parseClimateCsv(Array.from({ length: 12 }, () => '4,5;85').join('\n'));
    expect(r.ok && r.months[11]).toEqual({ temperature: 4.5, relativeHumidity: 85 });
    const months = Array.from({ length: 12 }, (_, i) => ({ temperature: i - 0.5, relativeHumidity: 70 + i }));
    const back = parseClimateCsv(climateToCsv(months));
    expect(back.ok && back.months).toEqual(months);
  });

  it('names a bad line by its number in the text, with the field and the unit', () => {
    const lines = `month,temperature,rh\n${rows()}`.split('\n');
    lines[5] = '5,warm,140'; // line 6 of the text
    const r = parseClimateCsv(lines.join('\n'));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toHaveLength(1);
      expect(r.problems[0]).toBe('line 6: temperature "warm" is not a number in °C; relative humidity 140 % must be between 0 and 100 %');
    }
  });

  it('says how many months it found when there are not twelve', () => {
    const r = parseClimateCsv(rows(11));
    expect(!r.ok && r.problems).toEqual(['found 11 months; give exactly 12 rows, January to December']);
  });
});

describe('exposure.climate in the workbench document', () => {
  const base = {
    version: 1,
    layers: [{ id: 'a', name: 'Brick', materialClass: 'masonry', thickness: 0.1, conductivity: 0.77, density: 1700, specificHeat: 800 }],
    exposure: defaultExposure(),
  };
  const months = Array.from({ length: 12 }, () => ({ temperature: 5, relativeHumidity: 80 }));
  it('is optional, and takes a fixed indoor humidity or a humidity class', () => {
    expect(workbenchDocumentSchema.safeParse(base).success).toBe(true);
    const a = workbenchDocumentSchema.parse({ ...base, exposure: { ...base.exposure, climate: { months, indoor: { temperature: 20, humidityClass: 3 } } } });
    expect(a.exposure.climate?.indoor).toEqual({ temperature: 20, humidityClass: 3 });
    const b = workbenchDocumentSchema.parse({ ...base, exposure: { ...base.exposure, climate: { months, indoor: { temperature: 21, relativeHumidity: 55 } } } });
    expect(b.exposure.climate?.indoor).toEqual({ temperature: 21, relativeHumidity: 55 });
  });
  it('names each bad field with its unit', () => {
    const r = workbenchDocumentSchema.safeParse({
      ...base,
      exposure: { ...base.exposure, climate: { months: months.map((m, i) => (i === 3 ? { temperature: 5, relativeHumidity: 0 } : m)), indoor: { temperature: 20, humidityClass: 6 } } },
    });
    expect(r.success).toBe(false);
    const lines = r.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    expect(lines).toContain('exposure.climate.months.3.relativeHumidity: must be between 0 and 100 %');
    expect(lines).toContain('exposure.climate.indoor.humidityClass: must be a whole number from 1 to 5');
  });
});
