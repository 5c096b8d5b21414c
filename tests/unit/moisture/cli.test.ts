import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { DEMO_MOISTURE_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';
import { moistureFromDocument } from '../../../src/lib/moisture/index.ts';

const root = fileURLToPath(new URL('../../..', import.meta.url));

function run(input: string) {
  const r = spawnSync('npx', ['tsx', 'src/cli/simulate.ts', '--document', '-'], { cwd: root, input, encoding: 'utf8', timeout: 90_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('simulate --document with a climate', () => {
  const doc = DEMO_MOISTURE_ASSEMBLIES[0].doc; // the timber frame without a vapour control layer, Harrow Lane climate

  it('adds the top-level moisture object in the documented shape, months in calendar order', () => {
    const r = run(JSON.stringify(doc));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(['model', 'result', 'figures', 'moisture']);
    const m = out.moisture;
    expect(Object.keys(m).sort()).toEqual(['driesOut', 'maxAccumulated', 'months', 'surface']);
    expect(m.months).toHaveLength(12);
    expect(m.months.map((x: { month: number }) => x.month)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    for (const month of m.months) {
      expect(Object.keys(month).sort()).toEqual(
        ['accumulated', 'condensationInterfaces', 'condensed', 'evaporated', 'insideTemperature', 'insideVapourPressure', 'month', 'outsideRelativeHumidity', 'outsideTemperature'].sort(),
      );
    }
    expect(Object.keys(m.surface).sort()).toEqual(['condensationRisk', 'criticalMonth', 'fRsi', 'fRsiMin', 'mouldRisk']);
    // the month's climate as the document gives it, and the ISO 13788 result (see glaser.test.ts, worked by hand):
    // the plywood face (interface 0) condenses in January and water accumulates over the year
    expect(m.months[0].outsideTemperature).toBe(doc.exposure.climate!.months[0].temperature);
    expect(m.months[0].outsideRelativeHumidity).toBe(doc.exposure.climate!.months[0].relativeHumidity);
    expect(m.months[0].insideTemperature).toBe(20);
    expect(m.months[0].condensationInterfaces).toEqual([0]);
    expect(m.driesOut).toBe(false);
    // the same object as the library function gives in process
    expect(m).toEqual(JSON.parse(JSON.stringify(moistureFromDocument(doc))));
    // and the kept-run figures carry the verdict
    expect(out.figures.moistureVerdict).toBe('accumulates');
  }, 90_000);

  it('leaves moisture out without a climate, and exits 2 naming a layer without μ when there is one', () => {
    const bare = structuredClone(doc);
    delete bare.exposure.climate;
    const r = run(JSON.stringify(bare));
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).moisture).toBeUndefined();
    const noMu = structuredClone(doc);
    noMu.layers[2].vapourResistanceFactor = null;
    const bad = run(JSON.stringify(noMu));
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr.trim()).toBe("layers[2].vapourResistanceFactor: is needed for the moisture check (the document has a climate); give the layer's μ (at least 1)");
  }, 90_000);
});
