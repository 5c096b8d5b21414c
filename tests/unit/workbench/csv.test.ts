import { describe, it, expect } from 'vitest';
import { parseCsv, validateCsv, guessMapping, parseTime, MAX_UPLOAD_HOURS } from '../../../src/lib/workbench/csv';
import { seriesCsv } from '../../../src/lib/workbench/exportCsv';
import { runDocument } from '../../../src/lib/workbench/runDocument';
import { defaultExposure } from '../../../src/lib/schemas/workbench';
import Papa from 'papaparse';

const hours = (n: number, f: (h: number) => string) =>
  Array.from({ length: n }, (_, h) => {
    const d = new Date(Date.UTC(2025, 6, 14, h));
    return `${d.toISOString().slice(0, 10)} ${String(d.getUTCHours()).padStart(2, '0')}:00,${f(h)}`;
  });

describe('parseCsv', () => {
  it('takes a first row with words as the header and keeps the file line of every row', () => {
    const csv = parseCsv('timestamp,air temp,solar\n2025-07-14 00:00,12.5,0\n\n2025-07-14 01:00,12.1,0\n');
    expect(csv.hasHeader).toBe(true);
    expect(csv.columns).toEqual(['timestamp', 'air temp', 'solar']);
    expect(csv.rows.map((r) => r.line)).toEqual([2, 4]);
  });

  it('reads a file without a header and names its columns', () => {
    const csv = parseCsv('2025-07-14 00:00;12,5\n2025-07-14 01:00;13,0\n');
    expect(csv.hasHeader).toBe(false);
    expect(csv.columns).toEqual(['Column 1', 'Column 2']);
    expect(csv.delimiter).toBe(';');
  });
});

describe('guessMapping', () => {
  it('finds the time, temperature and irradiance columns from their titles, and °F from the title', () => {
    const m = guessMapping(parseCsv('date time,dry bulb (°F),global solar W/m2\n2025-07-14 00:00,60,0\n'));
    expect(m).toEqual({ timeColumn: 0, temperatureColumn: 1, irradianceColumn: 2, temperatureUnit: 'F' });
  });
});

describe('parseTime', () => {
  it('reads a date and hour without a zone as UTC, and applies an offset', () => {
    expect(parseTime('2025-07-14 15:00')).toBe(Date.UTC(2025, 6, 14, 15) / 1000);
    expect(parseTime('2025-07-14T15:00+01:00')).toBe(Date.UTC(2025, 6, 14, 14) / 1000);
    expect(parseTime('7.5')).toBe(7.5 * 3600);
    expect(parseTime('yesterday')).toBeNull();
  });
});

describe('validateCsv', () => {
  const good = ['time,air', ...hours(48, (h) => (15 + Math.sin(h)).toFixed(2))];

  it('accepts a clean hourly file and returns the series in °C with a step of 3600 s', () => {
    const csv = parseCsv(good.join('\n'));
    const v = validateCsv(csv, guessMapping(csv));
    expect(v.ok).toBe(true);
    expect(v.series?.step).toBe(3600);
    expect(v.series?.air.length).toBe(48);
    expect(v.firstTime).toBe('2025-07-14 00:00');
  });

  it('converts °F to °C by (F − 32)·5/9 (definition of the Fahrenheit scale)', () => {
    const lines = ['time,air', ...hours(24, () => '212'), ];
    lines[1] = lines[1].replace(',212', ',32');
    const csv = parseCsv(lines.join('\n'));
    const v = validateCsv(csv, { timeColumn: 0, temperatureColumn: 1, irradianceColumn: null, temperatureUnit: 'F' });
    // 212 °F is 100 °C: outside the air range, so each such line is named
    expect(v.ok).toBe(false);
    expect(v.problems[0]).toEqual({ line: 3, message: 'air: 212 °F is outside -80…70 °C (100 °C)' });
    const ok = validateCsv(parseCsv(['t,air', ...hours(24, () => '50')].join('\n')), { timeColumn: 0, temperatureColumn: 1, irradianceColumn: null, temperatureUnit: 'F' });
    expect(ok.series?.air[0]).toBeCloseTo(10, 12);
  });

  it('names the line of a non-number, a missing value, a gap in time and an out-of-range irradiance', () => {
    const lines = ['time,air,sun', ...hours(30, (h) => `${(14 + h / 10).toFixed(1)},${h < 2 ? 0 : 300}`)];
    lines[5] = lines[5].replace(/,[^,]*,300$/, ',warm,300'); // line 6
    lines[8] = lines[8].replace(/,[^,]*,300$/, ',,300'); // line 9
    lines.splice(12, 1); // drops one hour: line 12 now jumps two hours
    lines[14] = lines[14].replace(/,300$/, ',1500'); // line 15
    const csv = parseCsv(lines.join('\n'));
    const v = validateCsv(csv, guessMapping(csv));
    expect(v.ok).toBe(false);
    const byLine = Object.fromEntries(v.problems.map((p) => [p.line, p.message]));
    expect(byLine[6]).toBe('air: "warm" is not a number');
    expect(byLine[9]).toBe('air: the temperature is missing (a gap in the series)');
    expect(byLine[13]).toMatch(/^time: a gap of 2 h after "2025-07-14 10:00"/);
    expect(byLine[15]).toBe('sun: 1500 W/m² is outside 0…1400 W/m²');
    expect(v.series).toBeNull();
  });

  it('refuses fewer than 24 hours and more than ten years', () => {
    const short = parseCsv(['t,air', ...hours(5, () => '10')].join('\n'));
    expect(validateCsv(short, guessMapping(short)).problems[0].message).toMatch(/too few rows/);
    const rows = Array.from({ length: MAX_UPLOAD_HOURS + 1 }, () => '10').join('\n');
    const long = parseCsv(rows);
    const v = validateCsv(long, { timeColumn: null, temperatureColumn: 0, irradianceColumn: null, temperatureUnit: 'C' });
    expect(v.problems[0]).toEqual({ line: MAX_UPLOAD_HOURS + 1, message: `too many rows: at most ${MAX_UPLOAD_HOURS} hours (ten years) may be uploaded` });
  });
});

describe('seriesCsv', () => {
  it('writes one row per output time with the interfaces named, parsable back to the same inside surface values', () => {
    const out = runDocument({
      version: 1,
      layers: [
        { id: 'a', name: 'Brick', materialRef: null, materialClass: 'masonry', thickness: 0.1, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: null, source: '', note: '' },
        { id: 'b', name: 'Wool', materialRef: null, materialClass: 'insulation', thickness: 0.1, conductivity: 0.035, density: 50, specificHeat: 1030, vapourResistanceFactor: null, source: '', note: '' },
      ],
      exposure: { ...defaultExposure(), days: 1, warmupDays: 1 },
    });
    if (out.kind !== 'done') throw new Error('run failed');
    const text = seriesCsv(out);
    const back = Papa.parse<Record<string, string>>(text, { header: true });
    expect(back.data.length).toBe(out.nTimes);
    expect(back.meta.fields).toContain('interface Brick / Wool (°C)');
    const k = 15 * 4; // 15:00 at 15-minute outputs
    expect(back.data[k]['time of day']).toBe('15:00');
    expect(Number(back.data[k]['inside surface (°C)'])).toBeCloseTo(out.series.insideSurface[k], 4);
  });
});
