import { describe, it, expect } from 'vitest';
import Papa from 'papaparse';
import { DEMO_ASSEMBLIES } from '../../../src/lib/server/seed/demoJob';
import { workbenchDocumentSchema, type WorkbenchDocument } from '../../../src/lib/schemas/workbench';
import { runDocument } from '../../../src/lib/workbench/runDocument';
import { compareApi } from '../../../src/lib/workbench/compareApi';
import {
  effectsCsv,
  fractionIssue,
  METRIC_KEYS,
  perturbationPlan,
  perturbedDocument,
  PROPERTIES,
  sensitivityEffects,
  type Metrics,
} from '../../../src/lib/workbench/sensitivity';

const DAY = 86400;

/** a demo build-up under a one-day report, so the workbench's last-day heat is the reported period's */
function oneDay(name: string): WorkbenchDocument {
  const a = DEMO_ASSEMBLIES.find((d) => d.name.startsWith(name))!;
  return workbenchDocumentSchema.parse({ ...a.doc, exposure: { ...a.doc.exposure, days: 1, warmupDays: 3 } });
}

/** the five metrics of one document from the workbench's own single run (runDocument calls simulate() once) */
function single(doc: WorkbenchDocument): Metrics {
  const run = runDocument(doc);
  if (run.kind !== 'done') throw new Error(`run failed: ${run.kind === 'invalid' ? run.issues.join('; ') : run.kind}`);
  return {
    uValue: run.analytic.steady.uValue,
    decrementFactor: run.figures.decrementFactor.simulated,
    timeLag: run.figures.timeLag.simulated,
    peakInsideFlux: run.figures.peakInsideFlux.value,
    // one reported day: the period's heat lost is the last day's (kWh/m² → Wh/m²)
    heatLost: run.figures.totalHeatLost * 1000,
  };
}

describe('perturbationPlan', () => {
  it('lists the base run first, then −δ and +δ of each of four properties of each layer: 1 + 8 × layers runs', () => {
    const plan = perturbationPlan(10);
    expect(plan).toHaveLength(81);
    expect(plan[0]).toBeNull();
    expect(plan[1]).toEqual({ layer: 0, property: 'thickness', sign: -1 });
    expect(plan[2]).toEqual({ layer: 0, property: 'thickness', sign: 1 });
    expect(plan[8]).toEqual({ layer: 0, property: 'specificHeat', sign: 1 });
    expect(plan[80]).toEqual({ layer: 9, property: 'specificHeat', sign: 1 });
  });
});

describe('perturbedDocument', () => {
  it('changes one property of one layer by the fraction and leaves the rest of the document as it was', () => {
    const doc = oneDay('West wall');
    const p = perturbedDocument(doc, { layer: 1, property: 'conductivity', sign: -1 }, 0.1);
    expect(p.layers[1].conductivity).toBeCloseTo(doc.layers[1].conductivity * 0.9, 15);
    expect(p.layers[1].thickness).toBe(doc.layers[1].thickness);
    expect(p.layers[0]).toBe(doc.layers[0]);
    expect(p.exposure).toBe(doc.exposure);
    expect(doc.layers[1].conductivity).toBe(DEMO_ASSEMBLIES[0].doc.layers[1].conductivity);
  });
});

describe('fractionIssue', () => {
  it('names the field and its unit for a change that is not usable, and accepts 10 %', () => {
    expect(fractionIssue(0.1)).toBeNull();
    for (const bad of [0, -0.1, 0.6, NaN, Infinity]) expect(fractionIssue(bad)).toMatch(/^Change \(%\) must be/);
  });
});

describe('sensitivity of a demo wall on the batched engine (the compare worker’s own call)', () => {
  const doc = oneDay('West wall');
  const fraction = 0.1;
  const plan = perturbationPlan(doc.layers.length);
  const batched = compareApi.sensitivity(doc, null, plan, fraction);
  const effects = sensitivityEffects(doc, fraction, batched);

  it('gives every tornado bar the central finite difference of two single simulate() runs (runDocument, one run each)', () => {
    const base = single(doc);
    for (const metric of METRIC_KEYS) expect(effects[metric][0].base).toBeCloseTo(base[metric], 9);
    for (let layer = 0; layer < doc.layers.length; layer++) {
      for (const property of PROPERTIES) {
        const low = single(perturbedDocument(doc, { layer, property, sign: -1 }, fraction));
        const high = single(perturbedDocument(doc, { layer, property, sign: 1 }, fraction));
        for (const metric of METRIC_KEYS) {
          const e = effects[metric].find((x) => x.layer === layer && x.property === property)!;
          const scale = Math.max(1e-9, Math.abs(base[metric]));
          // the same model through the batched and the single engine: equal to round-off (engine contract: 1e-12)
          expect(Math.abs(e.low - low[metric]) / scale, `${metric} ${layer} ${property} low`).toBeLessThan(1e-9);
          expect(Math.abs(e.high - high[metric]) / scale, `${metric} ${layer} ${property} high`).toBeLessThan(1e-9);
          const central = (high[metric] - low[metric]) / (2 * fraction);
          expect(Math.abs(e.slope - central) / scale, `${metric} ${layer} ${property} slope`).toBeLessThan(1e-8);
        }
      }
    }
  }, 120_000);

  it('moves the U-value as ISO 6946 says: 1 / (R_se + Σ d/λ + R_si) with one layer’s d or λ changed, and not at all for density or specific heat', () => {
    const { outsideSurfaceResistance: rse, insideSurfaceResistance: rsi } = doc.exposure;
    const rOf = (layers: { thickness: number; conductivity: number }[]) => rse + rsi + layers.reduce((a, l) => a + l.thickness / l.conductivity, 0);
    for (const e of effects.uValue) {
      const l = doc.layers[e.layer];
      const others = rOf(doc.layers) - l.thickness / l.conductivity;
      const at = (s: number) =>
        e.property === 'thickness' ? 1 / (others + (l.thickness * (1 + s * fraction)) / l.conductivity) : e.property === 'conductivity' ? 1 / (others + l.thickness / (l.conductivity * (1 + s * fraction))) : 1 / rOf(doc.layers);
      expect(e.low).toBeCloseTo(at(-1), 12);
      expect(e.high).toBeCloseTo(at(1), 12);
      if (e.property === 'density' || e.property === 'specificHeat') expect(e.reach).toBe(0);
    }
    // the insulation's conductivity or thickness moves the U-value most (it holds most of the resistance)
    expect(effects.uValue[0].layerName).toMatch(/wool/i);
    expect(['thickness', 'conductivity']).toContain(effects.uValue[0].property);
  });

  it('orders each figure’s bars by reach, largest first', () => {
    for (const metric of METRIC_KEYS) {
      const reach = effects[metric].map((e) => e.reach);
      for (let i = 1; i < reach.length; i++) expect(reach[i]).toBeLessThanOrEqual(reach[i - 1]);
    }
  });

  it('lowers the decrement factor with a thicker or denser brick, within 5 % of what the ISO 13786 transfer matrices give for the same change', async () => {
    const analytic = await analyticDecrement();
    const brick = doc.layers.findIndex((l) => /brick/i.test(l.name));
    for (const property of ['thickness', 'density'] as const) {
      const e = effects.decrementFactor.find((x) => x.layer === brick && x.property === property)!;
      const a = analytic(perturbedDocument(doc, { layer: brick, property, sign: 1 }, fraction)) - analytic(perturbedDocument(doc, { layer: brick, property, sign: -1 }, fraction));
      expect(e.slope).toBeLessThan(0);
      expect(a).toBeLessThan(0);
      // the run starts in its periodic state: simulated and analytic slopes agree within 5 %
      expect(Math.abs(e.slope - a / (2 * fraction)) / Math.abs(a / (2 * fraction)), property).toBeLessThan(0.05);
    }
  });
});

/** the analytic ISO 13786 decrement factor of a document (the engine's transfer-matrix analysis) */
async function analyticDecrement() {
  const { analyse } = await import('../../../src/lib/thermal/index');
  const { toModel } = await import('../../../src/lib/schemas/workbench');
  const { parseModel } = await import('../../../src/lib/schemas/model');
  return (d: WorkbenchDocument) => {
    const m = parseModel(toModel(d));
    if (!m.ok) throw new Error(m.issues.join('; '));
    return analyse(m.model).periodic.decrementFactor;
  };
}

describe('sensitivity of the light demo wall', () => {
  it('moves the simulated decrement factor within 5 % of the ISO 13786 transfer matrices for the strongest properties', async () => {
    const doc = oneDay('Stair tower');
    const fraction = 0.1;
    const effects = sensitivityEffects(doc, fraction, compareApi.sensitivity(doc, null, perturbationPlan(doc.layers.length), fraction));
    const analytic = await analyticDecrement();
    for (const e of effects.decrementFactor.slice(0, 3)) {
      const p = { layer: e.layer, property: e.property };
      const a = (analytic(perturbedDocument(doc, { ...p, sign: 1 }, fraction)) - analytic(perturbedDocument(doc, { ...p, sign: -1 }, fraction))) / (2 * fraction);
      // simulated: first harmonic of a 300 s Crank–Nicolson run of a wall that settles within its warm-up days
      expect(Math.abs(e.slope - a) / Math.abs(a), `${e.layerName} ${e.property}`).toBeLessThan(0.05);
    }
  });
});

describe('sensitivityEffects', () => {
  it('takes a time lag’s change the short way round the day (23.5 h → 0.5 h is +1 h)', () => {
    const doc = oneDay('Plant room');
    const n = perturbationPlan(doc.layers.length).length;
    const m = (lag: number): Metrics => ({ uValue: 1, decrementFactor: 0.5, timeLag: lag, peakInsideFlux: 1, heatLost: 1 });
    const results = Array.from({ length: n }, () => m(23.5 * 3600));
    results[1] = m(22.5 * 3600);
    results[2] = m(0.5 * 3600);
    const lag = sensitivityEffects(doc, 0.1, results, DAY).timeLag.find((e) => e.layer === 0 && e.property === 'thickness')!;
    expect(lag.deltaHigh).toBeCloseTo(3600, 9);
    expect(lag.deltaLow).toBeCloseTo(-3600, 9);
    expect(lag.slope).toBeCloseTo(7200 / 0.2, 6);
  });

  it('refuses results that do not match the plan', () => {
    expect(() => sensitivityEffects(oneDay('Plant room'), 0.1, [])).toThrow(/expected 25 results/);
  });
});

describe('effectsCsv', () => {
  it('writes one row per figure, layer and property with the values in the shown units', () => {
    const doc = oneDay('Plant room');
    const plan = perturbationPlan(doc.layers.length);
    const effects = sensitivityEffects(doc, 0.1, compareApi.sensitivity(doc, null, plan, 0.1));
    const parsed = Papa.parse<string[]>(effectsCsv(effects, 0.1), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header[0]).toBe('figure');
    expect(header).toContain('value at +10 %');
    expect(rows).toHaveLength(5 * doc.layers.length * 4);
    const lag = rows.find((r) => r[0] === 'Time lag')!;
    expect(lag[1]).toBe('h');
    expect(Number(lag[7])).toBeCloseTo(effects.timeLag[0].base / 3600, 4);
  });
});
