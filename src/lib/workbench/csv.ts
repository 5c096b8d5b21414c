// import of an hourly outdoor series from a CSV file: parse (papaparse), map columns,
// convert °F, validate with the file's own line numbers, and give a preview.
import Papa from 'papaparse';

/** ten years of hourly values (years of 365.25 days), the most an upload may hold */
export const MAX_UPLOAD_HOURS = Math.round(10 * 365.25 * 24);
/** at least one day */
export const MIN_UPLOAD_HOURS = 24;
/** °C: the range a measured outdoor air temperature may take */
export const AIR_RANGE = { min: -80, max: 70 } as const;
/** W/m² on a face */
export const IRRADIANCE_RANGE = { min: 0, max: 1400 } as const;

export interface ParsedCsv {
  /** column titles: the header row, or "Column 1"… without one */
  columns: string[];
  hasHeader: boolean;
  /** data rows as text, with the 1-based line of the file each came from */
  rows: { line: number; cells: string[] }[];
  /** the delimiter papaparse detected */
  delimiter: string;
}

export interface CsvMapping {
  /** index of the time column, or null: rows are consecutive hours */
  timeColumn: number | null;
  temperatureColumn: number;
  /** W/m² on the wall's face, optional */
  irradianceColumn: number | null;
  temperatureUnit: 'C' | 'F';
}

export interface CsvProblem {
  /** 1-based line of the file */
  line: number;
  message: string;
}

export interface ValidatedSeries {
  ok: boolean;
  /** the series when ok: step 3600 s, °C and W/m² */
  series: { step: number; air: number[]; irradiance?: number[] } | null;
  problems: CsvProblem[];
  /** problems past the first 50 are counted, not listed */
  moreProblems: number;
  /** first and last time read from the time column, as written */
  firstTime: string | null;
  lastTime: string | null;
}

const isNumberText = (s: string) => /^[-+]?(\d+([.,]\d*)?|[.,]\d+)([eE][-+]?\d+)?$/.test(s.trim());

/** parses CSV text; a first row with any non-numeric cell is taken as the header */
export function parseCsv(text: string): ParsedCsv {
  const clean = text.replace(/^\uFEFF/, '');
  // a semicolon or tab in the first line wins over the comma (files with decimal commas)
  const firstLine = clean.slice(0, clean.search(/\r?\n|$/));
  const delimiter = firstLine.includes('\t') ? '\t' : firstLine.includes(';') ? ';' : undefined;
  const parsed = Papa.parse<string[]>(clean, { skipEmptyLines: false, ...(delimiter ? { delimiter } : { delimitersToGuess: [',', '|'] }) });
  const all = parsed.data;
  // each record was one line unless a quoted cell held a line break; count them
  const rows: { line: number; cells: string[] }[] = [];
  let line = 1;
  for (const cells of all) {
    const breaks = cells.reduce((n, c) => n + (c.match(/\r\n|\n|\r/g)?.length ?? 0), 0);
    if (!(cells.length === 1 && cells[0].trim() === '')) rows.push({ line, cells: cells.map((c) => c.trim()) });
    line += 1 + breaks;
  }
  const first = rows[0]?.cells ?? [];
  const hasHeader = first.length > 0 && first.some((c) => c !== '' && !isNumberText(c) && !looksLikeTime(c));
  const width = Math.max(0, ...rows.map((r) => r.cells.length));
  const columns = hasHeader ? first.map((c, i) => c || `Column ${i + 1}`) : Array.from({ length: width }, (_, i) => `Column ${i + 1}`);
  while (columns.length < width) columns.push(`Column ${columns.length + 1}`);
  return { columns, hasHeader, rows: hasHeader ? rows.slice(1) : rows, delimiter: parsed.meta.delimiter };
}

const looksLikeTime = (s: string) => /^\d{4}-\d{2}-\d{2}([ T]\d{1,2}(:\d{2}){0,2}(\.\d+)?(Z|[+-]\d{2}:?\d{2})?)?$/.test(s.trim());

/**
 * Seconds since 1970 for "2025-07-14 15:00", "2025-07-14T15:00:00Z", "2025-07-14T15:00+01:00"
 * (no zone: read as UTC, so that no daylight-saving change makes a false gap), or a plain number of hours.
 */
export function parseTime(s: string): number | null {
  const t = s.trim();
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[ T](\d{1,2})(?::(\d{2}))?(?::(\d{2}))?(?:\.\d+)?(Z|[+-]\d{2}:?\d{2})?)?$/.exec(t);
  if (m) {
    const [, y, mo, d, h = '0', mi = '0', se = '0', zone] = m;
    let ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, +se);
    if (+mo < 1 || +mo > 12 || +d < 1 || +d > 31 || +h > 24 || +mi > 59 || +se > 59) return null;
    if (zone && zone !== 'Z') {
      const sign = zone[0] === '-' ? -1 : 1;
      const digits = zone.slice(1).replace(':', '');
      ms -= sign * (+digits.slice(0, 2) * 60 + +digits.slice(2, 4)) * 60_000;
    }
    return ms / 1000;
  }
  if (isNumberText(t)) return readNumber(t) * 3600;
  return null;
}

/** a number with a point, or a decimal comma when the file is not comma-delimited */
function readNumber(s: string): number {
  return Number(s.trim().replace(',', '.'));
}

const fmt = (v: number) => (Number.isInteger(v) ? String(v) : v.toFixed(2));

/** maps the columns, converts °F to °C and checks every row; problems name the file's line */
export function validateCsv(csv: ParsedCsv, mapping: CsvMapping): ValidatedSeries {
  const problems: CsvProblem[] = [];
  let more = 0;
  const problem = (line: number, message: string) => {
    if (problems.length < 50) problems.push({ line, message });
    else more++;
  };
  const air: number[] = [];
  const irradiance: number[] = [];
  const unit = mapping.temperatureUnit === 'F' ? '°F' : '°C';
  const tName = csv.columns[mapping.temperatureColumn] ?? `column ${mapping.temperatureColumn + 1}`;
  const iName = mapping.irradianceColumn === null ? '' : (csv.columns[mapping.irradianceColumn] ?? `column ${mapping.irradianceColumn + 1}`);
  const timeName = mapping.timeColumn === null ? '' : (csv.columns[mapping.timeColumn] ?? `column ${mapping.timeColumn + 1}`);
  let previous: { time: number; text: string } | null = null;
  let firstTime: string | null = null;
  let lastTime: string | null = null;

  if (csv.rows.length > MAX_UPLOAD_HOURS) {
    problem(csv.rows[MAX_UPLOAD_HOURS].line, `too many rows: at most ${MAX_UPLOAD_HOURS} hours (ten years) may be uploaded`);
  }
  for (const { line, cells } of csv.rows.slice(0, MAX_UPLOAD_HOURS)) {
    if (mapping.timeColumn !== null) {
      const text = cells[mapping.timeColumn] ?? '';
      const t = text === '' ? null : parseTime(text);
      if (t === null) problem(line, text === '' ? `${timeName}: the time is missing` : `${timeName}: "${text}" is not a time (write 2025-07-14 15:00 or hours as a number)`);
      else {
        if (previous && t - previous.time !== 3600) {
          const gap = (t - previous.time) / 3600;
          problem(
            line,
            gap > 1
              ? `${timeName}: a gap of ${fmt(gap)} h after "${previous.text}" (the series must be hourly without gaps)`
              : `${timeName}: "${text}" is ${gap <= 0 ? 'not after' : 'less than an hour after'} "${previous.text}" (the series must be hourly)`,
          );
        }
        previous = { time: t, text };
        firstTime ??= text;
        lastTime = text;
      }
    }
    const tText = cells[mapping.temperatureColumn] ?? '';
    if (tText === '') problem(line, `${tName}: the temperature is missing (a gap in the series)`);
    else if (!isNumberText(tText)) problem(line, `${tName}: "${tText}" is not a number`);
    else {
      const raw = readNumber(tText);
      const c = mapping.temperatureUnit === 'F' ? ((raw - 32) * 5) / 9 : raw;
      if (c < AIR_RANGE.min || c > AIR_RANGE.max) {
        problem(line, `${tName}: ${tText} ${unit} is outside ${AIR_RANGE.min}…${AIR_RANGE.max} °C${mapping.temperatureUnit === 'F' ? ` (${fmt(c)} °C)` : ''}`);
      }
      air.push(c);
    }
    if (mapping.irradianceColumn !== null) {
      const iText = cells[mapping.irradianceColumn] ?? '';
      if (iText === '') problem(line, `${iName}: the irradiance is missing (a gap in the series)`);
      else if (!isNumberText(iText)) problem(line, `${iName}: "${iText}" is not a number`);
      else {
        const v = readNumber(iText);
        if (v < IRRADIANCE_RANGE.min || v > IRRADIANCE_RANGE.max) problem(line, `${iName}: ${iText} W/m² is outside ${IRRADIANCE_RANGE.min}…${IRRADIANCE_RANGE.max} W/m²`);
        irradiance.push(v);
      }
    }
  }
  if (problems.length === 0 && csv.rows.length < MIN_UPLOAD_HOURS) {
    problem(csv.rows[csv.rows.length - 1]?.line ?? 1, `too few rows: ${csv.rows.length} hours; at least ${MIN_UPLOAD_HOURS} (one day) are needed`);
  }
  const ok = problems.length === 0;
  return {
    ok,
    series: ok ? { step: 3600, air, ...(mapping.irradianceColumn !== null ? { irradiance } : {}) } : null,
    problems,
    moreProblems: more,
    firstTime,
    lastTime,
  };
}

/** a first guess at the mapping from the column titles */
export function guessMapping(csv: ParsedCsv): CsvMapping {
  const find = (re: RegExp) => {
    const i = csv.columns.findIndex((c) => re.test(c));
    return i >= 0 ? i : null;
  };
  const sample = csv.rows[0]?.cells ?? [];
  let timeColumn = find(/time|date|hour|stamp/i);
  if (timeColumn === null && sample[0] && looksLikeTime(sample[0])) timeColumn = 0;
  let temperatureColumn = find(/temp|air|dry|°c|°f|deg/i);
  if (temperatureColumn === null) temperatureColumn = csv.columns.findIndex((_, i) => i !== timeColumn && isNumberText(sample[i] ?? '')) ;
  if (temperatureColumn < 0) temperatureColumn = 0;
  const irradianceColumn = find(/irrad|solar|sun|w\/m|ghi|radiation/i);
  const unitF = /°?f\b|fahrenheit/i.test(csv.columns[temperatureColumn] ?? '') && !/°?c\b/i.test(csv.columns[temperatureColumn] ?? '');
  return { timeColumn, temperatureColumn, irradianceColumn: irradianceColumn === temperatureColumn ? null : irradianceColumn, temperatureUnit: unitF ? 'F' : 'C' };
}
