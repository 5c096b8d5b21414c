import { describe, it, expect } from 'vitest';
import { zlibSync } from 'fflate';
import { packRun, unpackRun, readPackedHeader, toBase64, fromBase64, MAX_PACKED_BYTES } from '../../../src/lib/workbench/keptRun';
import { runDocument, type RunDone } from '../../../src/lib/workbench/runDocument';
import { defaultExposure, type WorkbenchDocument } from '../../../src/lib/schemas/workbench';

// a two-layer wall: brick and mineral wool, typical values (from memory)
const doc: WorkbenchDocument = {
  version: 1,
  layers: [
    { id: 'a', name: 'Brick', materialRef: null, materialClass: 'masonry', thickness: 0.1, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: 10, source: 'typical (from memory)', note: '' },
    { id: 'b', name: 'Mineral wool', materialRef: null, materialClass: 'insulation', thickness: 0.1, conductivity: 0.035, density: 30, specificHeat: 1030, vapourResistanceFactor: 1, source: 'typical (from memory)', note: '' },
  ],
  exposure: { ...defaultExposure(), days: 2, warmupDays: 2 },
};
const run = runDocument(doc) as RunDone;

describe('packRun and unpackRun', () => {
  it('give back the figures exactly and the series to Float32 precision (about 7 significant digits, IEEE 754 single)', () => {
    expect(run.kind).toBe('done');
    const back = unpackRun(packRun(run));
    expect(back.figures).toEqual(run.figures);
    expect(back.analytic).toEqual(run.analytic);
    expect(back.nTimes).toBe(run.nTimes);
    expect(back.interfaceNames).toEqual(['Brick / Mineral wool']);
    expect(Array.from(back.series.time)).toEqual(Array.from(run.series.time));
    expect(Array.from(back.series.x)).toEqual(Array.from(run.series.x));
    for (const name of ['insideSurface', 'insideFlux', 'profiles', 'interfaces'] as const) {
      const a = run.series[name];
      const b = back.series[name];
      expect(b.length).toBe(a.length);
      let worst = 0;
      for (let i = 0; i < a.length; i++) worst = Math.max(worst, Math.abs(a[i] - b[i]) / Math.max(1, Math.abs(a[i])));
      expect(worst).toBeLessThan(1e-6);
    }
  });

  it('keeps NaN figures as NaN (JSON has none of its own)', () => {
    const f = { ...run, figures: { ...run.figures, periodic: { ...run.figures.periodic, maxDifference: NaN } } };
    expect(Number.isNaN(unpackRun(packRun(f)).figures.periodic.maxDifference)).toBe(true);
  });

  it('packs four days of a two-layer wall well under the size limit', () => {
    const packed = packRun(run);
    const raw = Object.values(run.series).reduce((s, a) => s + a.byteLength, 0);
    expect(packed.length).toBeLessThan(raw / 2);
    expect(packed.length).toBeLessThan(MAX_PACKED_BYTES);
  });

  it('refuses bytes that are not a packed run, a header whose lengths do not fit the run, and a body longer than its header says', () => {
    expect(() => readPackedHeader(new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8]))).toThrow(/not a packed run/);
    const packed = packRun(run);
    const { header, bodyFrom } = readPackedHeader(packed);
    const lying = { ...header, lengths: { ...header.lengths, profiles: header.lengths.profiles + 1 } };
    const head = new TextEncoder().encode(JSON.stringify(lying));
    const forged = new Uint8Array(8 + head.length + (packed.length - bodyFrom));
    forged.set(packed.subarray(0, 4));
    new DataView(forged.buffer).setUint32(4, head.length, true);
    forged.set(head, 8);
    forged.set(packed.subarray(bodyFrom), 8 + head.length);
    expect(() => readPackedHeader(forged)).toThrow(/wrong length/);
    // a body that unpacks to more than the header promises is caught without unpacking all of it
    const bigBody = zlibSync(new Uint8Array(4 * 1024 * 1024));
    const bomb = new Uint8Array(bodyFrom + bigBody.length);
    bomb.set(packed.subarray(0, bodyFrom));
    bomb.set(bigBody, bodyFrom);
    expect(() => unpackRun(bomb)).toThrow(/does not match its header/);
  });

  it('round-trips through base64', () => {
    const bytes = packRun(run);
    expect(Array.from(fromBase64(toBase64(bytes)))).toEqual(Array.from(bytes));
  });
});
