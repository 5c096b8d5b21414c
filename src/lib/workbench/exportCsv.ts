// the series of a run as CSV: comment lines saying what ran (assembly, revision, exposure,
// engine settings), then one row per output time of the reported days. papaparse writes it.
import Papa from 'papaparse';
import type { RunDone } from './runDocument.ts';
import type { WorkbenchDocument } from '../schemas/workbench.ts';
import { exposureLines, runLines, type UploadFacts } from './exposureText.ts';

const clock = (s: number) => {
  const m = Math.round(s / 60) % 1440;
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
};

/** what the comment lines name */
export interface CsvContext {
  assembly: string | null;
  /** the revision number, or null for a run of an unsaved build-up */
  revision: number | null;
  /** the document that ran */
  doc: WorkbenchDocument;
  upload?: UploadFacts | null;
}

/** the comment lines ("# label: text"); commas and quotes become semicolons and apostrophes so each line stays one field */
export function csvComments(ctx: CsvContext): string[] {
  const lines: [string, string][] = [
    ['Assembly', ctx.assembly ?? 'not saved'],
    ['Revision', ctx.revision === null ? 'not saved (a run of the build-up on screen)' : String(ctx.revision)],
    ['Build-up (outside first)', ctx.doc.layers.map((l) => `${l.name} ${(l.thickness * 1000).toFixed(1)} mm`).join(' | ')],
    ...exposureLines(ctx.doc.exposure, ctx.upload ?? null),
    ...runLines(ctx.doc.exposure),
  ];
  return lines.map(([k, v]) => `# ${k}: ${v}`.replace(/,/g, ';').replace(/"/g, "'"));
}

/** CSV text: comment lines, then time, day and hh:mm, temperatures in °C, heat flux in W/m² (4 decimals) */
export function seriesCsv(run: Pick<RunDone, 'nTimes' | 'nInterfaces' | 'interfaceNames' | 'series'>, ctx?: CsvContext): string {
  const s = run.series;
  const fields = [
    'time (s)',
    'day',
    'time of day',
    'outdoor air (°C)',
    'sol-air (°C)',
    'outside surface (°C)',
    ...run.interfaceNames.map((n) => `interface ${n} (°C)`),
    'inside surface (°C)',
    'indoor air (°C)',
    'outside heat flux (W/m²)',
    'inside heat flux (W/m²)',
  ];
  const f = (v: number) => (Number.isFinite(v) ? v.toFixed(4) : '');
  const data: (string | number)[][] = [];
  for (let k = 0; k < run.nTimes; k++) {
    const t = s.time[k];
    const row: (string | number)[] = [t, Math.floor(t / 86400 + 1e-9) + 1, clock(t), f(s.outsideAir[k]), f(s.solAir[k]), f(s.outsideSurface[k])];
    for (let j = 0; j < run.nInterfaces; j++) row.push(f(s.interfaces[j * run.nTimes + k]));
    row.push(f(s.insideSurface[k]), f(s.insideAir[k]), f(s.outsideFlux[k]), f(s.insideFlux[k]));
    data.push(row);
  }
  const comments = ctx ? Papa.unparse(csvComments(ctx).map((c) => [c]), { newline: '\n', quotes: false }) + '\n' : '';
  return comments + Papa.unparse({ fields, data }, { newline: '\n' });
}
