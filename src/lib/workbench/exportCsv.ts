// the series of a run as CSV: one row per output time of the reported days
import Papa from 'papaparse';
import type { RunDone } from './runDocument.ts';

const clock = (s: number) => {
  const m = Math.round(s / 60) % 1440;
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
};

/** CSV text: time, day and hh:mm, temperatures in °C, heat flux in W/m² (4 decimals) */
export function seriesCsv(run: Pick<RunDone, 'nTimes' | 'nInterfaces' | 'interfaceNames' | 'series'>): string {
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
  return Papa.unparse({ fields, data }, { newline: '\n' });
}
