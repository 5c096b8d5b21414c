import { describe, it, expect } from 'vitest';
import { FIGURE_DEFS, formatFigure, labelOf, summaryRows, wordsOf } from '../../../src/lib/workbench/figureDefs';
import { summaryOf } from '../../../src/lib/workbench/figures';
import { figureRows } from '../../../src/lib/workbench/figureRows';
import { runDocument, type RunDone } from '../../../src/lib/workbench/runDocument';
import { defaultExposure, type WorkbenchDocument } from '../../../src/lib/schemas/workbench';
import { exposureLines } from '../../../src/lib/workbench/exposureText';
import { csvComments, seriesCsv } from '../../../src/lib/workbench/exportCsv';
import { runCharts } from '../../../src/lib/workbench/svgCharts';
import Papa from 'papaparse';

const CAMEL = /\b[a-z]+[A-Z][A-Za-z0-9]*\b/;
const doc: WorkbenchDocument = {
  version: 1,
  layers: [{ id: 'a', name: 'Brick', materialRef: null, materialClass: 'masonry', thickness: 0.215, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: null, source: 'typical (from memory)', note: '' }],
  exposure: { ...defaultExposure(), days: 1, warmupDays: 2 },
};
const run = runDocument(doc) as RunDone;

describe('the figure definitions', () => {
  it('define every key a kept run has, with a label, a unit and how it is computed, none of them a program key', () => {
    const keys = Object.keys(summaryOf(run.figures));
    for (const k of keys) {
      const def = FIGURE_DEFS.find((d) => d.key === k);
      expect(def, k).toBeDefined();
      expect(def!.how.length).toBeGreaterThan(20);
      expect(def!.label).not.toMatch(CAMEL);
    }
  });

  it('define the keys the exposure and moisture work adds to kept runs, and write their codes in words', () => {
    for (const k of ['totalHeatGainedKWhm2', 'accuracyEstimatePercent', 'bookkeepingClosure', 'moistureVerdict', 'surfaceFRsi', 'surfaceCriticalMonth', 'periodicStart']) expect(labelOf(k), k).not.toBe(wordsOf(k));
    expect(formatFigure('moistureVerdict', 'driesOut')).toBe('condenses, dries out within the year');
    expect(formatFigure('surfaceCriticalMonth', 1)).toBe('January');
  });

  it('write a key no definition names in words', () => {
    expect(wordsOf('heatLostYearWhm2')).toBe('Heat lost year whm2');
    expect(labelOf('somethingNew')).toBe('Something new');
  });

  it('format each value with its decimals and a real minus sign', () => {
    expect(formatFigure('insideSurfaceMinC', -1.2345)).toBe('\u22121.23');
    expect(formatFigure('energyBalanceError', 1.5e-12)).toBe('1.5e-12');
    expect(formatFigure('periodicState', 'reached')).toBe('reached');
  });

  it('leave the engine figures out of what a guest sees', () => {
    const all = summaryRows(summaryOf(run.figures));
    const client = summaryRows(summaryOf(run.figures), { client: true });
    expect(all.some((r) => r.label === 'Mesh cells')).toBe(true);
    expect(client.some((r) => r.label === 'Mesh cells')).toBe(false);
    expect(client.some((r) => r.label === 'Decrement factor, simulated')).toBe(true);
  });

  it('give the figures table rows with a unit and a how for each', () => {
    for (const r of figureRows(run, doc.exposure)) {
      expect(r.how.length).toBeGreaterThan(20);
      expect(r.label).not.toMatch(CAMEL);
    }
  });
});

describe('exposureLines', () => {
  it('names no absorptance for an upload without irradiance, and names it with one', () => {
    const e = { ...doc.exposure, outdoor: { mode: 'series' as const, uploadId: 1, absorptance: 0.6 } };
    expect(exposureLines(e, { hasIrradiance: false }).map(([, v]) => v).join(' ')).not.toMatch(/absorptance/);
    expect(exposureLines(e, { hasIrradiance: true }).map(([, v]) => v).join(' ')).toMatch(/absorptance 0.60/);
  });
});

describe('seriesCsv', () => {
  it('starts with comment lines for the assembly, revision, exposure and engine settings, and the data still parses', () => {
    const text = seriesCsv(run, { assembly: 'North wall, option A', revision: 3, doc });
    const lines = text.split('\n');
    expect(lines[0]).toBe('# Assembly: North wall; option A');
    expect(lines[1]).toBe('# Revision: 3');
    expect(text).toMatch(/^# Engine: Crank–Nicolson; time step 300 s/m);
    expect(text).toMatch(/^# Outdoor air: daily sine/m);
    expect(csvComments({ assembly: null, revision: null, doc }).every((l) => !l.includes(','))).toBe(true);
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(run.nTimes);
  });
});

describe('runCharts', () => {
  it('draws the three charts as SVG with their titles, the profile at the hour of the peak inside heat flux', () => {
    const c = runCharts(run, ['masonry']);
    for (const svg of [c.surface, c.flux, c.profile]) expect(svg.startsWith('<svg')).toBe(true);
    expect(c.surface).toContain('Inside surface temperature over the reported days');
    expect(c.profile).toContain('Temperature through the build-up at the peak inside heat flux');
    expect(c.titles.profile).toMatch(/\(day 1, \d\d:\d\d\)$/);
  });
});
