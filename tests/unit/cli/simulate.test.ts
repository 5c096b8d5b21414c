import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../../..', import.meta.url));
const fixture = 'tests/fixtures/harrow-lane-brick-recladding.json';

function run(args: string[], input?: string) {
  const r = spawnSync('npx', ['tsx', 'src/cli/simulate.ts', ...args], { cwd: root, input, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('simulate command line', () => {
  it('prints one JSON result and exits 0 for a valid model file', () => {
    const r = run([fixture]);
    expect(r.code).toBe(0);
    const result = JSON.parse(r.stdout);
    expect(result.steady.uValue).toBeGreaterThan(0);
    expect(result.series.time.length).toBe(121);
    expect(r.stdout).not.toMatch(/NaN/);
    expect(r.stdout.trim().split('\n')).toHaveLength(1);
  }, 60_000);

  it('reads the model from standard input with -', () => {
    const r = run(['-'], readFileSync(`${root}/tests/fixtures/harrow-lane-timber-annex.json`, 'utf8'));
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).layers).toHaveLength(5);
  }, 60_000);

  it('exits 2 with empty stdout and path: message lines for an invalid model', () => {
    const m = JSON.parse(readFileSync(`${root}/${fixture}`, 'utf8'));
    m.layers[1].thickness = 0;
    m.timeStep = -5;
    m.outside.air = { kind: 'gust' };
    const r = run(['-'], JSON.stringify(m));
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.trim().split('\n');
    expect(lines).toContain('layers[1].thickness: must be greater than 0 m');
    expect(lines).toContain('timeStep: must be greater than 0 s');
    expect(lines).toContain('outside.air.kind: must be one of "constant", "sine" or "series" (got "gust")');
    for (const line of lines) expect(line).toMatch(/^[\w.[\]]+: \S/);
  }, 60_000);

  it('exits 2 with an initial.kind line for a periodic start whose signals do not repeat', () => {
    const m = JSON.parse(readFileSync(`${root}/${fixture}`, 'utf8'));
    m.initial = { kind: 'periodic' };
    m.inside.air = { kind: 'series', step: 3600, values: [18, 21, 19] };
    const r = run(['-'], JSON.stringify(m));
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toEqual(['initial.kind: "periodic" needs every signal to repeat, but inside.air is a series without "repeat": true']);
  }, 60_000);

  it('runs a periodic start with sun and long-wave loss and prints a result that repeats from t = 0', () => {
    const m = JSON.parse(readFileSync(`${root}/${fixture}`, 'utf8'));
    m.initial = { kind: 'periodic' };
    m.outside.solar = { absorptance: 0.6, irradiance: { kind: 'series', step: 3600, values: Array.from({ length: 24 }, (_, h) => Math.max(0, 600 * Math.sin((Math.PI * (h - 6)) / 12))), repeat: true } };
    m.outside.longWave = { netLoss: { kind: 'constant', value: 40 } };
    m.duration = 2 * 86400;
    m.outputInterval = 3600;
    const r = run(['-'], JSON.stringify(m));
    expect(r.code).toBe(0);
    const q: number[] = JSON.parse(r.stdout).series.insideFlux;
    // contract, "Periodic start": every series repeats with period P from t = 0
    for (let k = 0; k + 24 < q.length; k++) expect(Math.abs(q[k + 24] - q[k])).toBeLessThan(1e-3);
  }, 60_000);

  it('treats malformed JSON as an invalid model', () => {
    const r = run(['-'], '{"layers": [');
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^model: not valid JSON \(/);
  }, 60_000);

  it('exits 1 with one line and no stack trace for a missing file', () => {
    const r = run(['tests/fixtures/no-such-wall.json']);
    expect(r.code).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).not.toMatch(/\bat .*\(/);
  }, 60_000);
});
