import { describe, it, expect } from 'vitest';
import { runnerApi } from '../../../src/lib/workbench/runnerApi';
import { defaultExposure, type WorkbenchDocument } from '../../../src/lib/schemas/workbench';

// the worker's API called directly in node, without a Worker: the same object comlink exposes
const wall = (days: number, warmupDays: number): WorkbenchDocument => ({
  version: 2,
  layers: [
    { id: 'r', name: 'Lime render', materialRef: null, materialClass: 'render', thickness: 0.02, conductivity: 0.8, density: 1600, specificHeat: 1000, vapourResistanceFactor: null, source: 'typical value', note: '' },
    { id: 'b', name: 'Clay brick', materialRef: null, materialClass: 'masonry', thickness: 0.215, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: null, source: 'typical value', note: '' },
    { id: 'p', name: 'Gypsum plaster', materialRef: null, materialClass: 'render', thickness: 0.013, conductivity: 0.4, density: 1000, specificHeat: 1000, vapourResistanceFactor: null, source: 'typical value', note: '' },
  ],
  exposure: { ...defaultExposure(), days, warmupDays },
});

describe('runnerApi.run', () => {
  it('returns the reported days as flat Float64Arrays: nTimes per series, nInterfaces × nTimes, nTimes × nNodes profiles', () => {
    const out = runnerApi.run({ id: 1, document: wall(3, 4) });
    if (out.kind !== 'done') throw new Error(JSON.stringify(out));
    const s = out.series;
    expect(out.nTimes).toBe(3 * 96 + 1); // 15-minute outputs over three days, both ends
    for (const key of ['time', 'outsideAir', 'solAir', 'outsideSurface', 'insideSurface', 'insideAir', 'outsideFlux', 'insideFlux'] as const) {
      expect(s[key]).toBeInstanceOf(Float64Array);
      expect(s[key].length).toBe(out.nTimes);
    }
    expect(out.nInterfaces).toBe(2);
    expect(s.interfaces.length).toBe(2 * out.nTimes);
    expect(s.x.length).toBe(out.nNodes);
    expect(s.profiles.length).toBe(out.nTimes * out.nNodes);
    // the reported window starts at midnight after the warm-up
    expect(s.time[0]).toBe(0);
    expect(s.time[out.nTimes - 1]).toBe(3 * 86400);
    // the profile row k holds the surfaces at its ends
    const k = 40;
    expect(s.profiles[k * out.nNodes]).toBeCloseTo(s.outsideSurface[k], 12);
    expect(s.profiles[(k + 1) * out.nNodes - 1]).toBeCloseTo(s.insideSurface[k], 12);
    expect(out.layerBounds[3]).toBeCloseTo(0.248, 12);
  });

  it('reports progress that rises to 1', () => {
    const seen: number[] = [];
    const out = runnerApi.run({ id: 2, document: wall(20, 10) }, (id, f) => {
      expect(id).toBe(2);
      seen.push(f);
    });
    expect(out.kind).toBe('done');
    expect(seen.length).toBeGreaterThan(5);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    expect(seen[seen.length - 1]).toBe(1);
  });

  it('stops a run when cancelled from its progress callback, and runs the next one normally', () => {
    let calls = 0;
    const out = runnerApi.run({ id: 3, document: wall(60, 0) }, () => {
      calls++;
      runnerApi.cancel(3);
    });
    expect(out.kind).toBe('cancelled');
    expect(calls).toBe(1);
    expect(runnerApi.run({ id: 4, document: wall(1, 0) }).kind).toBe('done');
  });

  it('stops a run when its shared cancel flag is set', () => {
    const flag = new Int32Array(1);
    const out = runnerApi.run({ id: 5, document: wall(60, 0) }, () => Atomics.store(flag, 0, 1), flag);
    expect(out.kind).toBe('cancelled');
  });

  it('answers a document the schema rejects with path: message lines, never a throw', () => {
    const doc = wall(1, 0) as unknown as { layers: { thickness: number }[]; exposure: { timeStep: number } };
    doc.layers[1].thickness = -0.1;
    doc.exposure.timeStep = 7;
    const out = runnerApi.run({ id: 6, document: doc });
    expect(out.kind).toBe('invalid');
    if (out.kind !== 'invalid') return;
    expect(out.issues).toContain('layers[1].thickness: must be greater than 0 m');
    expect(out.issues.some((l) => l.startsWith('exposure.timeStep: '))).toBe(true);
  });

  it('asks for the upload when the outdoor air is an uploaded series and none is given', () => {
    const doc = wall(1, 0);
    doc.exposure.outdoor = { mode: 'series', uploadId: 9, absorptance: 0.6 };
    const out = runnerApi.run({ id: 7, document: doc });
    expect(out.kind).toBe('invalid');
    if (out.kind === 'invalid') expect(out.issues[0]).toMatch(/^exposure\.outdoor\.uploadId: /);
  });

  it('runs an uploaded hourly series with irradiance and adds the sol-air rise absorptance·I·R_se (engine contract)', () => {
    const doc = wall(2, 1);
    doc.exposure.outdoor = { mode: 'series', uploadId: 9, absorptance: 0.5 };
    const air = Array.from({ length: 72 }, (_, h) => 15 + 5 * Math.sin((2 * Math.PI * h) / 24));
    const irradiance = Array.from({ length: 72 }, (_, h) => Math.max(0, 500 * Math.sin((2 * Math.PI * (h - 6)) / 24)));
    const out = runnerApi.run({ id: 8, document: doc, upload: { step: 3600, air, irradiance } });
    if (out.kind !== 'done') throw new Error(JSON.stringify(out));
    // reported day 1 starts at hour 24 of the series; at 12:00 the irradiance is 500 W/m²
    const k = Array.from(out.series.time).indexOf(12 * 3600);
    expect(out.series.outsideAir[k]).toBeCloseTo(air[36], 9);
    expect(out.series.solAir[k] - out.series.outsideAir[k]).toBeCloseTo(0.5 * 500 * 0.04, 9);
    expect(out.figures.notes.join(' ')).toMatch(/uploaded series/);
  });
});
