// `npm run bench`: runs every benchmark group and prints one table with the targets.
// a browser benchmark can be added as tests/bench/browser.ts returning BenchRow[] and listed here.
import { engineBench, type BenchRow } from './engine.ts';
import { browserBench } from './browser.ts';
import { documentBench } from './document.ts';

function format(v: number, unit: string): string {
  if (unit === 'node-steps/s') return `${(v / 1e6).toFixed(1)} M node-steps/s`;
  if (unit === 'ms') return `${v.toFixed(1)} ms`;
  if (unit === '×') return `${v.toFixed(2)}×`;
  if (unit === 'p') return `p = ${v.toFixed(3)}`;
  if (unit === 'fps') return `${v.toFixed(1)} fps`;
  if (unit === 'count') return `${v.toFixed(0)}`;
  if (unit === 'periods') return `${v.toFixed(2)} periods`;
  return v < 0.01 ? v.toExponential(2) : v.toFixed(4);
}

export function printTable(rows: BenchRow[]): boolean {
  const nameWidth = Math.max(...rows.map((r) => r.name.length)) + 2;
  let allMet = true;
  let group = '';
  for (const r of rows) {
    if (r.group !== group) {
      group = r.group;
      console.log(`\n[${group}]`);
    }
    const status = r.met === undefined ? '' : r.met ? `  target ${r.target}: met` : `  target ${r.target}: NOT MET`;
    if (r.met === false) allMet = false;
    console.log(`  ${r.name.padEnd(nameWidth)}${format(r.value, r.unit).padStart(22)}${status}`);
  }
  return allMet;
}

const started = performance.now();
const rows: BenchRow[] = [...engineBench(), ...documentBench()];
// the browser section needs chromium and an app (given by WALLPULSE_BASE_URL + DATABASE_URL, else started here); BENCH_BROWSER=0 skips it
if (process.env.BENCH_BROWSER !== '0') {
  try {
    rows.push(...(await browserBench()));
  } catch (e) {
    console.error(`browser benchmark failed: ${e instanceof Error ? e.message : String(e)}`);
    rows.push({ group: 'browser (headless Chromium)', name: 'browser benchmark ran', value: 0, unit: 'count', target: 'runs', met: false });
  }
}
const allMet = printTable(rows);
console.log(`\n${allMet ? 'all targets met' : 'some targets NOT met'} (bench took ${((performance.now() - started) / 1000).toFixed(1)} s)`);
