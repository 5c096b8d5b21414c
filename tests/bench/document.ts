// the workbench's own run of a document, timed in node: the heavy wall of issue 9 (render, 120 mm stone
// wool, 215 mm brick, 150 mm dense concrete, plaster) for 3 days from its periodic start, with the accuracy
// estimate; and a year of hourly upload with its warm-up, second start and estimate.
import { runDocument } from '../../src/lib/workbench/runDocument.ts';
import { defaultExposure, type WorkbenchDocument } from '../../src/lib/schemas/workbench.ts';
import type { BenchRow } from './engine.ts';

const GROUP = 'workbench document run (node)';

const layer = (id: string, name: string, materialClass: WorkbenchDocument['layers'][number]['materialClass'], thickness: number, conductivity: number, density: number, specificHeat: number) => ({
  id, name, materialRef: null, materialClass, thickness, conductivity, density, specificHeat, vapourResistanceFactor: null, source: 'typical value, from memory', note: '',
});

export const HEAVY_WALL: WorkbenchDocument = {
  version: 2,
  layers: [
    layer('r', 'Render', 'render', 0.02, 1.0, 1800, 1000),
    layer('w', 'Stone wool', 'insulation', 0.12, 0.035, 140, 1030),
    layer('b', 'Clay brick', 'masonry', 0.215, 0.77, 1700, 800),
    layer('c', 'Dense concrete', 'concrete', 0.15, 2.0, 2400, 1000),
    layer('p', 'Gypsum plaster', 'render', 0.013, 0.57, 1300, 1000),
  ],
  exposure: defaultExposure(),
};

const median = (a: number[]) => a.slice().sort((x, y) => x - y)[Math.floor(a.length / 2)];

export function documentBench(): BenchRow[] {
  const rows: BenchRow[] = [];
  const times: number[] = [];
  let out = runDocument(HEAVY_WALL);
  for (let i = 0; i < 9; i++) {
    const t0 = performance.now();
    out = runDocument(HEAVY_WALL);
    times.push(performance.now() - t0);
  }
  if (out.kind !== 'done') throw new Error('the heavy wall did not run');
  rows.push({ group: GROUP, name: 'heavy wall, 3 days: periodic start + run + accuracy estimate (median)', value: median(times), unit: 'ms', target: '< 50 ms', met: median(times) < 50 });
  const f = out.figures;
  rows.push({ group: GROUP, name: 'heavy wall: decrement factor, simulated / ISO 13786 − 1', value: Math.abs(f.decrementFactor.simulated / f.decrementFactor.analytic - 1), unit: '', target: '< 0.01', met: Math.abs(f.decrementFactor.simulated / f.decrementFactor.analytic - 1) < 0.01 });
  const lagMin = Math.abs(f.timeLag.simulated - f.timeLag.analytic) / 60;
  rows.push({ group: GROUP, name: 'heavy wall: time lag, |simulated − ISO 13786| (min)', value: lagMin, unit: 'count', target: '< 10 min', met: lagMin < 10 });
  rows.push({ group: GROUP, name: 'heavy wall: estimated discretisation error (% of flux amplitude)', value: (f.accuracy?.relative ?? NaN) * 100, unit: '', target: '< 1 %', met: (f.accuracy?.relative ?? 1) < 0.01 });

  // a year of hourly upload (seeded synthetic weather), 365 days reported after 7 warm-up
  let seed = 7;
  const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5;
  const air = Array.from({ length: 8760 }, (_, h) => 10 - 8 * Math.cos((2 * Math.PI * h) / 8760) + 4 * Math.sin((2 * Math.PI * (h - 9)) / 24) + 2 * rand());
  const year: WorkbenchDocument = { ...HEAVY_WALL, exposure: { ...HEAVY_WALL.exposure, outdoor: { mode: 'series', uploadId: 1, absorptance: 0.6 }, days: 358, warmupDays: 7, timeStep: 900 } };
  const t0 = performance.now();
  const y = runDocument(year, { step: 3600, air });
  const yearMs = performance.now() - t0;
  if (y.kind !== 'done') throw new Error('the year did not run');
  rows.push({ group: GROUP, name: 'a year of hourly upload at 900 s: run + second start + estimate', value: yearMs, unit: 'ms' });
  return rows;
}
