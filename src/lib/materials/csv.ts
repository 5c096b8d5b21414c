// CSV of team materials: the export writes the columns below with units in the headers; the import
// reads them back (or the short names) and reports each problem with its line number
import Papa from 'papaparse';
import { materialFieldsSchema, FIELD_LABELS, type MaterialFields } from './schema';

export const CSV_COLUMNS: { key: keyof MaterialFields; header: string }[] = [
  { key: 'name', header: 'name' },
  { key: 'materialClass', header: 'class' },
  { key: 'conductivity', header: 'conductivity [W/(m·K)]' },
  { key: 'density', header: 'density [kg/m³]' },
  { key: 'specificHeat', header: 'specific heat [J/(kg·K)]' },
  { key: 'vapourResistanceFactor', header: 'vapour resistance factor μ [–]' },
  { key: 'source', header: 'source' },
  { key: 'notes', header: 'notes' },
];

/** header text → field, ignoring case, units in brackets and spacing */
function fieldOfHeader(header: string): keyof MaterialFields | null {
  const h = header
    .replace(/\[.*?\]|\(.*?\)/g, '')
    .replace(/μ/g, '')
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, ' ');
  if (h === 'name') return 'name';
  if (h === 'class' || h === 'material class') return 'materialClass';
  if (h.startsWith('conductivity') || h === 'lambda') return 'conductivity';
  if (h.startsWith('density')) return 'density';
  if (h.startsWith('specific heat')) return 'specificHeat';
  if (h.startsWith('vapour resistance factor') || h.startsWith('vapor resistance factor') || h === 'mu') return 'vapourResistanceFactor';
  if (h === 'source') return 'source';
  if (h === 'notes' || h === 'note') return 'notes';
  return null;
}

export interface CsvRow {
  /** line of the file the row starts on, 1 = the header */
  line: number;
  material: MaterialFields;
}

export interface CsvProblem {
  line: number;
  /** the column label, or null for a problem of the whole line or file */
  field: string | null;
  message: string;
}

export const MAX_IMPORT_ROWS = 2000;

const NUMERIC: (keyof MaterialFields)[] = ['conductivity', 'density', 'specificHeat', 'vapourResistanceFactor'];

/** parse and validate a whole file; nothing is accepted unless problems is empty */
export function parseMaterialsCsv(text: string): { rows: CsvRow[]; problems: CsvProblem[] } {
  const rows: CsvRow[] = [];
  const problems: CsvProblem[] = [];
  const records: { line: number; cells: string[] }[] = [];
  // count lines as papaparse moves through the text, so a quoted field with a line break keeps the numbering right
  let consumed = 0;
  let line = 1;
  const body = text.replace(/^\uFEFF/, '');
  Papa.parse<string[]>(body, {
    skipEmptyLines: false,
    step(result) {
      const start = line;
      const end = result.meta.cursor;
      for (let i = consumed; i < end; i++) if (body.charCodeAt(i) === 10) line++;
      consumed = end;
      for (const e of result.errors) problems.push({ line: start, field: null, message: `the line cannot be read as CSV (${e.message})` });
      const cells = result.data;
      if (cells.length === 1 && cells[0].trim() === '') return;
      records.push({ line: start, cells });
    },
  });
  if (records.length === 0) return { rows, problems: [{ line: 1, field: null, message: 'the file is empty: it needs a header line and at least one material' }] };
  const [header, ...data] = records;
  const columns = header.cells.map(fieldOfHeader);
  const missing = CSV_COLUMNS.filter((c) => c.key !== 'notes' && !columns.includes(c.key)).map((c) => `“${c.header}”`);
  if (missing.length) {
    problems.push({ line: header.line, field: null, message: `the header lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}` });
    return { rows, problems };
  }
  if (data.length === 0) problems.push({ line: header.line, field: null, message: 'the file has a header but no materials' });
  if (data.length > MAX_IMPORT_ROWS) {
    problems.push({ line: data[MAX_IMPORT_ROWS].line, field: null, message: `at most ${MAX_IMPORT_ROWS} materials can be imported at once` });
    return { rows, problems };
  }
  const seen = new Map<string, number>();
  for (const rec of data) {
    const raw: Record<string, unknown> = {};
    columns.forEach((key, i) => {
      if (!key) return;
      const cell = (rec.cells[i] ?? '').trim();
      if (NUMERIC.includes(key)) raw[key] = cell === '' ? undefined : /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell.replace(',', '.')) ? Number(cell.replace(',', '.')) : cell;
      else raw[key] = cell;
    });
    const parsed = materialFieldsSchema.safeParse(raw);
    if (!parsed.success) {
      const reported = new Set<string>();
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0]) as keyof MaterialFields;
        if (reported.has(key)) continue;
        reported.add(key);
        problems.push({ line: rec.line, field: FIELD_LABELS[key] ?? key, message: `${FIELD_LABELS[key] ?? key} ${issue.message}` });
      }
      continue;
    }
    const nameKey = parsed.data.name.toLowerCase();
    const earlier = seen.get(nameKey);
    if (earlier !== undefined) {
      problems.push({ line: rec.line, field: 'Name', message: `Name “${parsed.data.name}” is also on line ${earlier}` });
      continue;
    }
    seen.set(nameKey, rec.line);
    rows.push({ line: rec.line, material: parsed.data });
  }
  return { rows, problems };
}

/** the materials as CSV with units in the headers; readable by parseMaterialsCsv */
export function formatMaterialsCsv(materials: MaterialFields[]): string {
  return Papa.unparse(
    {
      fields: CSV_COLUMNS.map((c) => c.header),
      data: materials.map((m) => CSV_COLUMNS.map((c) => m[c.key])),
    },
    { newline: '\r\n' },
  );
}
