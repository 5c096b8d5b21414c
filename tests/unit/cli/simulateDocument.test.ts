import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { DEMO_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';
import { simulateDocument } from '../../../src/lib/workbench/runDocument';
import { documentOutput } from '../../../src/lib/workbench/documentOutput';

const root = fileURLToPath(new URL('../../..', import.meta.url));
const westWall = 'tests/fixtures/harrow-lane-west-wall.document.json';
const uploadDoc = 'tests/fixtures/harrow-lane-upload.document.json';
const csv = 'tests/fixtures/harrow-lane-july-air.csv';
const DAY = 86400;

function run(args: string[], input?: string) {
  const r = spawnSync('npx', ['tsx', 'src/cli/simulate.ts', ...args], { cwd: root, input, encoding: 'utf8', timeout: 60_000, maxBuffer: 256 * 1024 * 1024 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('simulate --document', () => {
  it('runs a sol-air document by place and prints { model, result, figures } built the way the workbench builds it', () => {
    const r = run(['--document', westWall]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out).sort()).toEqual(['figures', 'model', 'result']);
    expect(out.model.initial).toEqual({ kind: 'periodic' });
    expect(out.model.outside.solar.irradiance.values).toHaveLength(144);
    // ISO 13790 §11.4.6 on a wall: 0.5 × 5 × 0.9 × 11 K
    expect(out.model.outside.longWave.netLoss.value).toBeCloseTo(24.75, 9);
    // the same figures as the workbench's own run of the document (in-process)
    const local = simulateDocument(JSON.parse(readFileSync(`${root}/${westWall}`, 'utf8')));
    if (local.kind !== 'done') throw new Error('run failed');
    expect(out.figures).toEqual(JSON.parse(JSON.stringify(documentOutput(local).figures)));
    expect(out.figures.periodicStart).toBe('periodic');
    expect(typeof out.figures.accuracyEstimatePercent).toBe('number');
    expect(out.figures.scheme).toMatch(/Crank–Nicolson/);
  }, 60_000);

  it('exits 2 naming the field when a series document comes without --upload, and runs it with the CSV read as the import screen reads it', () => {
    const missing = run(['--document', uploadDoc]);
    expect(missing.code).toBe(2);
    expect(missing.stdout).toBe('');
    expect(missing.stderr).toMatch(/^exposure\.outdoor\.uploadId: .*--upload/);
    const r = run(['--document', uploadDoc, '--upload', csv]);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.model.initial).toEqual({ kind: 'steady' });
    // 7 warm-up days and 3 reported
    expect(out.model.duration).toBe(10 * DAY);
    expect(out.model.outside.air.values).toHaveLength(240);
    expect(out.figures.periodicStart).toBe('warm-up');
    expect(out.figures.periodicState).toMatch(/not periodic/);
    expect(out.figures.notes.join(' ')).toMatch(/fitted and approximate/);
  }, 60_000);

  it('exits 2 with path: message lines for a bad document and for a bad CSV', () => {
    const doc = JSON.parse(readFileSync(`${root}/${westWall}`, 'utf8'));
    doc.layers[1].conductivity = 0;
    doc.exposure.outdoor.sun.latitude = 88;
    const r = run(['--document', '-'], JSON.stringify(doc));
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.trim().split('\n');
    expect(lines).toContain('layers[1].conductivity: must be greater than 0 W/(m·K)');
    expect(lines).toContain('exposure.outdoor.sun.latitude: must be between −66 and 66° (north positive)');
    const badCsv = run(['--document', uploadDoc, '--upload', '-'], 'time,air\n2025-07-01 00:00,12\n2025-07-01 01:00,warm\n');
    expect(badCsv.code).toBe(2);
    expect(badCsv.stderr).toMatch(/^upload: line 3: air: "warm" is not a number/m);
  }, 60_000);
});

describe('the demo job under its default settings', () => {
  for (const a of DEMO_ASSEMBLIES) {
    it(`agrees with ISO 13786 within 1 % in decrement factor and 10 min in time lag: ${a.name}`, () => {
      const run = simulateDocument(a.doc);
      if (run.kind !== 'done') throw new Error('run failed');
      const f = run.figures;
      expect(Math.abs(f.decrementFactor.simulated / f.decrementFactor.analytic - 1)).toBeLessThan(0.01);
      const lag = Math.abs(f.timeLag.simulated - f.timeLag.analytic);
      expect(Math.min(lag, DAY - lag)).toBeLessThan(600);
      expect(f.accuracy!.relative).toBeLessThan(0.01);
    });
  }
});
