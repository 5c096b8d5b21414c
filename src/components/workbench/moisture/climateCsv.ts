// twelve months of outdoor climate from CSV text (a file or a paste): parsed by papaparse, each
// problem named with the line of the text it is on, the field and the unit.
import Papa from 'papaparse';
import { MONTH_NAMES, type MonthClimate } from '../../../lib/moisture/index.ts';

export type ClimateCsvResult = { ok: true; months: MonthClimate[] } | { ok: false; problems: string[] };

const NUMBER = /^[-+\u2212]?(\d+([.,]\d*)?|[.,]\d+)$/;
const toNumber = (s: string): number => Number(s.trim().replace('\u2212', '-').replace(',', '.'));

/** 1…12 for "1", "01", "Jan", "January" (any case); null otherwise */
function monthOf(cell: string): number | null {
  const t = cell.trim().toLowerCase();
  if (/^\d{1,2}$/.test(t)) {
    const n = Number(t);
    return n >= 1 && n <= 12 ? n : null;
  }
  const i = MONTH_NAMES.findIndex((m) => t.length >= 3 && m.toLowerCase().startsWith(t));
  return i >= 0 ? i + 1 : null;
}

/**
 * reads twelve rows of `temperature, relative humidity` (°C, %), or `month, temperature, relative humidity`
 * with the months in calendar order; a first row that is not numbers is a header. separators: comma,
 * semicolon or tab (a semicolon or tab allows decimal commas).
 */
export function parseClimateCsv(text: string): ClimateCsvResult {
  const clean = text.replace(/^\uFEFF/, '');
  const firstLine = clean.slice(0, Math.max(0, clean.search(/\r?\n|$/)));
  const delimiter = firstLine.includes('\t') ? '\t' : firstLine.includes(';') ? ';' : ',';
  const parsed = Papa.parse<string[]>(clean, { delimiter, skipEmptyLines: false });
  const problems: string[] = [];
  const months: MonthClimate[] = [];
  let headerSeen = false;
  let dataRows = 0;
  parsed.data.forEach((raw, index) => {
    const line = index + 1;
    const cells = raw.map((c) => c.trim());
    if (cells.every((c) => c === '')) return;
    const numeric = cells.filter((c) => NUMBER.test(c)).length;
    if (!headerSeen && months.length === 0 && problems.length === 0 && numeric === 0) {
      headerSeen = true;
      return;
    }
    dataRows += 1;
    let tCell: string;
    let rhCell: string;
    if (cells.length === 2) {
      [tCell, rhCell] = cells;
    } else if (cells.length === 3) {
      const m = monthOf(cells[0]);
      if (m === null) {
        problems.push(`line ${line}: month "${cells[0]}" is not a month (1–12 or a month name)`);
        return;
      }
      if (m !== dataRows) {
        problems.push(`line ${line}: month ${MONTH_NAMES[m - 1]} is out of order (expected ${MONTH_NAMES[Math.min(11, dataRows - 1)]}); give the months January to December`);
        return;
      }
      [, tCell, rhCell] = cells;
    } else {
      problems.push(`line ${line}: expected 2 values (temperature °C, relative humidity %) or 3 (month, temperature °C, relative humidity %), found ${cells.length}`);
      return;
    }
    const bad: string[] = [];
    const t = NUMBER.test(tCell) ? toNumber(tCell) : NaN;
    const rh = NUMBER.test(rhCell) ? toNumber(rhCell) : NaN;
    if (!Number.isFinite(t)) bad.push(`temperature "${tCell}" is not a number in °C`);
    else if (t < -60 || t > 60) bad.push(`temperature ${t} °C must be between −60 and 60 °C`);
    if (!Number.isFinite(rh)) bad.push(`relative humidity "${rhCell}" is not a number in %`);
    else if (!(rh > 0 && rh <= 100)) bad.push(`relative humidity ${rh} % must be between 0 and 100 %`);
    if (bad.length > 0) {
      problems.push(`line ${line}: ${bad.join('; ')}`);
      return;
    }
    months.push({ temperature: t, relativeHumidity: rh });
  });
  if (problems.length === 0 && months.length !== 12) problems.push(`found ${months.length} month${months.length === 1 ? '' : 's'}; give exactly 12 rows, January to December`);
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, months };
}

/** the months as CSV text with a header, for copying out */
export function climateToCsv(months: MonthClimate[]): string {
  return ['month,temperature °C,relative humidity %', ...months.map((m, i) => `${MONTH_NAMES[i]},${m.temperature},${m.relativeHumidity}`)].join('\n');
}
