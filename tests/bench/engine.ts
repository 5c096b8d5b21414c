// engine benchmark: throughput, a year of hourly weather, a bare thomas loop and explicit stepping to compare.
// returns rows for run.ts to print; a browser benchmark can sit beside this file and add its own rows.
import { buildMesh, simulate, simulateBatch, type Layer, type Model } from '../../src/lib/thermal/index.ts';
import { outsideBoundary, insideBoundary } from '../../src/lib/thermal/boundary.ts';
import { assembleTheta } from '../../src/lib/thermal/operator.ts';
import { factorise, thetaStep } from '../../src/lib/thermal/stepper.ts';
import { pack, packedStep } from '../../src/lib/thermal/batch.ts';

/** one line of the benchmark table */
export interface BenchRow {
  group: string;
  name: string;
  value: number;
  unit: string;
  /** human-readable target, when there is one */
  target?: string;
  met?: boolean;
}

const now = (): number => performance.now();

// seeded generator (mulberry32): the synthetic weather is the same on every run
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** 8760 hourly outdoor temperatures: seasonal and daily swings plus seeded noise, °C */
export function syntheticYear(seed = 2024): number[] {
  const r = rng(seed);
  const out: number[] = [];
  let drift = 0;
  for (let h = 0; h < 8760; h++) {
    drift = 0.95 * drift + (r() - 0.5) * 1.2;
    out.push(10 - 8 * Math.cos((2 * Math.PI * h) / 8760) - 4 * Math.cos((2 * Math.PI * (h - 15)) / 24) + drift);
  }
  return out;
}

// the heavy re-cladding wall of our fixtures
const heavy: Layer[] = [
  { name: 'Silicate render', thickness: 0.012, conductivity: 0.7, density: 1600, specificHeat: 1000 },
  { name: 'Mineral wool slab', thickness: 0.12, conductivity: 0.035, density: 110, specificHeat: 1030 },
  { name: 'Clay brick', thickness: 0.215, conductivity: 0.77, density: 1700, specificHeat: 800 },
  { name: 'Gypsum plaster', thickness: 0.013, conductivity: 0.4, density: 1000, specificHeat: 1000 },
];

function yearModel(maxCellSize: number, duration = 365 * 86400): Model {
  return {
    layers: heavy,
    outside: { surfaceResistance: 0.04, air: { kind: 'series', step: 3600, values: syntheticYear(), repeat: false } },
    inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
    initial: { kind: 'steady' },
    duration,
    timeStep: 300,
    outputInterval: 3600,
    mesh: { maxCellSize, minCellsPerLayer: 4 },
  };
}

/** best wall time of a few runs, ms */
function best(runs: number, f: () => void): number {
  let t = Infinity;
  for (let i = 0; i < runs; i++) {
    const s = now();
    f();
    t = Math.min(t, now() - s);
  }
  return t;
}

/** least-squares slope of log y against log x */
function logSlope(x: number[], y: number[]): number {
  const lx = x.map(Math.log);
  const ly = y.map(Math.log);
  const mx = lx.reduce((a, b) => a + b, 0) / lx.length;
  const my = ly.reduce((a, b) => a + b, 0) / ly.length;
  let num = 0;
  let den = 0;
  for (let i = 0; i < lx.length; i++) {
    num += (lx[i] - mx) * (ly[i] - my);
    den += (lx[i] - mx) ** 2;
  }
  return num / den;
}

/**
 * a bare, hand-written constant-matrix crank-nicolson loop on the year problem: same matrices, boundary values
 * by index arithmetic, no outputs. returns the final inside surface temperature so the work cannot be skipped.
 */
function bareThomasYear(model: Model): number {
  const mesh = buildMesh(model.layers, model.mesh);
  const out = outsideBoundary(model.outside);
  const ins = insideBoundary(model.inside);
  const dt = model.timeStep;
  const { implicit, explicit } = assembleTheta(mesh, out, ins, dt, 0.5);
  const f = factorise(implicit);
  const n = mesh.cells + 1;
  const lo = f.lower;
  const cp = f.upperPrime;
  const inv = f.inverse;
  const el = explicit.lower;
  const ed = explicit.diag;
  const eu = explicit.upper;
  const air = Float64Array.from((model.outside.air as { values: number[] }).values);
  const T = new Float64Array(n).fill(20);
  const d = new Float64Array(n);
  const ho = out.h;
  const hi = ins.h;
  const tin = 20;
  const steps = Math.round(model.duration / dt);
  let before = air[0];
  for (let s = 1; s <= steps; s++) {
    const u = (s * dt) / 3600;
    const i0 = Math.min(Math.floor(u), air.length - 1);
    const after = i0 >= air.length - 1 ? air[air.length - 1] : air[i0] + (u - i0) * (air[i0 + 1] - air[i0]);
    d[0] = (ed[0] * T[0] + eu[0] * T[1] + 0.5 * ho * (before + after)) * inv[0];
    for (let i = 1; i < n - 1; i++) d[i] = (el[i] * T[i - 1] + ed[i] * T[i] + eu[i] * T[i + 1] - lo[i] * d[i - 1]) * inv[i];
    d[n - 1] = (el[n - 1] * T[n - 2] + ed[n - 1] * T[n - 1] + hi * tin - lo[n - 1] * d[n - 2]) * inv[n - 1];
    T[n - 1] = d[n - 1];
    for (let i = n - 2; i >= 0; i--) T[i] = d[i] - cp[i] * T[i + 1];
    before = after;
  }
  return T[n - 1];
}

/** explicit forward euler on the engine's mesh at its stability limit dt = min Cᵢ/Kᵢᵢ; inside flux every dtOut */
function explicitRun(model: Model, dtOut: number): { flux: Float64Array; dt: number; steps: number } {
  const mesh = buildMesh(model.layers, model.mesh);
  const n = mesh.cells + 1;
  const out = outsideBoundary(model.outside);
  const ins = insideBoundary(model.inside);
  const g = mesh.conductance;
  const c = mesh.capacity;
  let dt = Infinity;
  for (let i = 0; i < n; i++) {
    const kii = (i > 0 ? g[i - 1] : out.h) + (i < n - 1 ? g[i] : ins.h);
    dt = Math.min(dt, c[i] / kii);
  }
  // a whole number of explicit steps per output interval, not above the limit
  const perOut = Math.ceil(dtOut / dt);
  dt = dtOut / perOut;
  const outputs = Math.floor(model.duration / dtOut + 1e-9) + 1;
  const flux = new Float64Array(outputs);
  const T = simulate({ ...model, duration: model.timeStep }, { storeProfiles: true }).profiles[0]; // the engine's initial state
  const x = Float64Array.from(T);
  const y = new Float64Array(n);
  const rate = new Float64Array(n);
  for (let i = 0; i < n; i++) rate[i] = dt / c[i];
  const sine = model.outside.air as { mean: number; amplitude: number; period: number; peakTime: number };
  const w = (2 * Math.PI) / sine.period;
  const tin = (model.inside.air as { value: number }).value;
  flux[0] = ins.h * (x[n - 1] - tin);
  let steps = 0;
  for (let k = 1; k < outputs; k++) {
    for (let s = 0; s < perOut; s++) {
      const t = ((k - 1) * perOut + s) * dt;
      const tout = sine.mean + sine.amplitude * Math.cos(w * (t - sine.peakTime));
      y[0] = x[0] + rate[0] * (out.h * (tout - x[0]) + g[0] * (x[1] - x[0]));
      for (let i = 1; i < n - 1; i++) y[i] = x[i] + rate[i] * (g[i - 1] * (x[i - 1] - x[i]) + g[i] * (x[i + 1] - x[i]));
      y[n - 1] = x[n - 1] + rate[n - 1] * (g[n - 2] * (x[n - 2] - x[n - 1]) + ins.h * (tin - x[n - 1]));
      x.set(y);
    }
    steps += perOut;
    flux[k] = ins.h * (x[n - 1] - tin);
  }
  return { flux, dt, steps };
}

/** runs the engine benchmark and returns its rows */
export function engineBench(): BenchRow[] {
  const rows: BenchRow[] = [];

  // 1. throughput over mesh sizes, a fixed number of steps
  const sizes = [50, 100, 200, 500, 1000, 2000];
  const steps = 20000;
  const times: number[] = [];
  const throughputModel = (cells: number, duration = steps * 300): Model => ({
    layers: [{ name: 'Clay brick', thickness: 0.3, conductivity: 0.77, density: 1700, specificHeat: 800, cells }],
    outside: { surfaceResistance: 0.04, air: { kind: 'sine', mean: 10, amplitude: 8, period: 86400, peakTime: 54000 } },
    inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
    initial: { kind: 'steady' },
    duration,
    timeStep: 300,
    outputInterval: 3600,
  });
  simulate(throughputModel(200), { storeProfiles: false }); // warm the jit
  for (const cells of sizes) {
    const ms = best(3, () => simulate(throughputModel(cells), { storeProfiles: false }));
    times.push(ms);
    rows.push({ group: 'throughput', name: `${cells} cells × ${steps} steps`, value: (cells * steps) / (ms / 1000), unit: 'node-steps/s' });
  }
  const cellSlope = logSlope(sizes.slice(2), times.slice(2));
  rows.push({ group: 'growth', name: 'runtime ∝ cells^p (200…2000 cells)', value: cellSlope, unit: 'p', target: '0.8 ≤ p ≤ 1.2', met: cellSlope >= 0.8 && cellSlope <= 1.2 });
  // steps: a warm-up run of the same model first, then the best of 5 for each count, the repeats taken
  // round-robin over the counts so a burst of load on the machine hits every count alike; the smallest
  // count is large enough (2e4 steps) that the fixed cost of meshing and factorising does not flatten the slope
  const stepCounts = [20000, 40000, 80000, 160000];
  const stepModel = (s: number) => throughputModel(300, s * 300);
  simulate(stepModel(stepCounts[0]), { storeProfiles: false });
  const stepTimes = stepCounts.map(() => Infinity);
  for (let rep = 0; rep < 5; rep++) {
    stepCounts.forEach((s, i) => {
      stepTimes[i] = Math.min(stepTimes[i], best(1, () => simulate(stepModel(s), { storeProfiles: false })));
    });
  }
  const stepSlope = logSlope(stepCounts, stepTimes);
  rows.push({ group: 'growth', name: 'runtime ∝ steps^p (300 cells, 2e4…1.6e5 steps, best of 5)', value: stepSlope, unit: 'p', target: '0.8 ≤ p ≤ 1.2', met: stepSlope >= 0.8 && stepSlope <= 1.2 });

  // 2. a year of hourly weather at 300 s steps, ~300 cells
  const year = yearModel(0.00125);
  const yearMesh = buildMesh(year.layers, year.mesh);
  simulate({ ...year, duration: 30 * 86400 }, { storeProfiles: false });
  let engineMs = Infinity;
  let yearSteps = 0;
  for (let i = 0; i < 3; i++) {
    const r = simulate(year, { storeProfiles: false });
    engineMs = Math.min(engineMs, r.stats.elapsedMs);
    yearSteps = r.stats.steps;
  }
  rows.push({ group: 'year', name: `8760 h weather, ${yearMesh.cells} cells, ${yearSteps} steps`, value: engineMs, unit: 'ms', target: '< 1000 ms', met: engineMs < 1000 });

  // 3. the same problem by a bare hand-written thomas loop
  bareThomasYear({ ...year, duration: 30 * 86400 });
  const bareMs = best(3, () => bareThomasYear(year));
  const ratio = bareMs / engineMs;
  rows.push({ group: 'year', name: 'bare constant-matrix thomas loop, same problem', value: bareMs, unit: 'ms' });
  rows.push({ group: 'year', name: 'engine throughput / bare loop throughput', value: ratio, unit: '×', target: '≥ 0.8', met: ratio >= 0.8 });

  // 4. crank-nicolson at 300 s against explicit euler at its stability limit, 1 mm mesh, to the same accuracy
  const periodic: Model = {
    layers: heavy,
    outside: { surfaceResistance: 0.04, air: { kind: 'sine', mean: 5, amplitude: 10, period: 86400, peakTime: 54000 } },
    inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
    initial: { kind: 'steady' },
    duration: 4 * 86400,
    timeStep: 300,
    outputInterval: 900,
    mesh: { maxCellSize: 0.001, minCellsPerLayer: 4 },
  };
  const reference = simulate({ ...periodic, timeStep: 15 }, { storeProfiles: false }).series.insideFlux;
  const fluxError = (flux: ArrayLike<number>) => {
    let e = 0;
    for (let k = 0; k < reference.length; k++) e = Math.max(e, Math.abs(flux[k] - reference[k]));
    return e / (10 * simulate({ ...periodic, duration: 300 }, { storeProfiles: false }).periodic.periodicTransmittance);
  };
  let cnMs = Infinity;
  let cnFlux: number[] = [];
  for (let i = 0; i < 3; i++) {
    const s = now();
    cnFlux = simulate(periodic, { storeProfiles: false }).series.insideFlux;
    cnMs = Math.min(cnMs, now() - s);
  }
  const s = now();
  const fe = explicitRun(periodic, periodic.outputInterval);
  const feMs = now() - s;
  const cnErr = fluxError(cnFlux);
  const feErr = fluxError(fe.flux);
  const cells = buildMesh(periodic.layers, periodic.mesh).cells;
  rows.push({ group: 'explicit', name: `crank-nicolson, dt 300 s, ${cells} cells (1 mm), 4 days`, value: cnMs, unit: 'ms' });
  rows.push({ group: 'explicit', name: `  its max inside-flux error / flux amplitude`, value: cnErr, unit: '', target: '< 0.01', met: cnErr < 0.01 });
  rows.push({ group: 'explicit', name: `forward euler at its limit, dt ${fe.dt.toFixed(3)} s, ${fe.steps} steps`, value: feMs, unit: 'ms' });
  rows.push({ group: 'explicit', name: `  its max inside-flux error / flux amplitude`, value: feErr, unit: '', target: '< 0.01', met: feErr < 0.01 });
  rows.push({ group: 'explicit', name: 'explicit time / crank-nicolson time', value: feMs / cnMs, unit: '×', target: '≥ 50', met: feMs / cnMs >= 50 });
  rows.push(...batchBench(), ...periodicStartBench());
  return rows;
}

// the heavy demo wall of issue 9: render, 120 mm stone wool, 215 mm brick, 150 mm dense concrete, plaster
// (typical handbook values, ISO 10456 / CIBSE Guide A, from memory); about 590 kJ/m²K
const heavyDemo: Layer[] = [
  { name: 'Cement-sand render', thickness: 0.02, conductivity: 1.0, density: 1800, specificHeat: 1000 },
  { name: 'Stone wool slab', thickness: 0.12, conductivity: 0.036, density: 100, specificHeat: 1030 },
  { name: 'Clay brick', thickness: 0.215, conductivity: 0.77, density: 1700, specificHeat: 800 },
  { name: 'Dense concrete', thickness: 0.15, conductivity: 2.0, density: 2400, specificHeat: 1000 },
  { name: 'Gypsum plaster', thickness: 0.013, conductivity: 0.4, density: 1000, specificHeat: 1000 },
];
const clearDay = Array.from({ length: 144 }, (_, i) => Math.max(0, 600 * Math.sin((Math.PI * (i * 600 - 6 * 3600)) / (12 * 3600))));

/**
 * the batched engine at K = 4 against the single-model engine on the same four models, node-steps per second.
 * the machine is shared by several busy processes, so each figure is the best of many short alternating trials
 * (a trial of a few ms often runs without losing its core, a long one never does): that estimates the engines'
 * own speed, not the neighbours'.
 */
export function batchBench(): BenchRow[] {
  // four variants of the heavy wall as a sensitivity study makes them (layer thicknesses ±10 %), 3-day sine runs
  const variant = (f: number, j: number): Model => ({
    layers: heavyDemo.map((l, i) => (i === j ? { ...l, thickness: l.thickness * f } : l)),
    outside: { surfaceResistance: 0.04, air: { kind: 'sine', mean: 8, amplitude: 7, period: 86400, peakTime: 54000 } },
    inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
    initial: { kind: 'periodic' },
    duration: 3 * 86400,
    timeStep: 300,
    outputInterval: 3600,
  });
  const models = [variant(1.1, 2), variant(0.9, 2), variant(1.1, 3), variant(0.9, 3)];
  const nodes = models.map((m) => buildMesh(m.layers, m.mesh).cells + 1);
  const nodeSteps = nodes.reduce((a, n) => a + n, 0) * (3 * 86400) / 300;
  const options = { storeProfiles: false };
  let single = Infinity;
  let batched = Infinity;
  for (let rep = 0; rep < 150; rep++) {
    single = Math.min(single, best(1, () => models.forEach((m) => simulate(m, options))));
    batched = Math.min(batched, best(1, () => simulateBatch(models, options)));
  }
  // the solver alone: thetaStep on each model's own matrices against the packed 4-lane step
  const steppings = models.map((m) => {
    const mesh = buildMesh(m.layers, m.mesh);
    const { implicit, explicit } = assembleTheta(mesh, outsideBoundary(m.outside), insideBoundary(m.inside), m.timeStep, 0.5);
    return { factor: factorise(implicit), explicit, T: new Float64Array(mesh.cells + 1).fill(15) };
  });
  const rows = Math.max(...nodes) + 1;
  const packed = pack(
    steppings.map((s) => ({ dt: 300, theta: 0.5, factor: s.factor, matrices: { implicit: s.explicit, explicit: s.explicit } })),
    rows,
  );
  const x = new Float64Array(4 * (rows + 1)).fill(15);
  const b0 = new Float64Array(4).fill(100);
  const kernelSteps = 500;
  let kernelSingle = Infinity;
  let kernelPacked = Infinity;
  for (let rep = 0; rep < 150; rep++) {
    kernelSingle = Math.min(
      kernelSingle,
      best(1, () => steppings.forEach((s) => {
        for (let n = 0; n < kernelSteps; n++) thetaStep(s.factor, s.explicit, s.T, 100, 100);
      })),
    );
    kernelPacked = Math.min(
      kernelPacked,
      best(1, () => {
        for (let n = 0; n < kernelSteps; n++) {
          for (let k = 0; k < 4; k++) x[4 * nodes[k] + k] = 100;
          packedStep(packed, x, rows, b0);
        }
      }),
    );
  }
  const kernelNodeSteps = nodes.reduce((a, n) => a + n, 0) * kernelSteps;
  const ratio = single / batched;
  const kernelRatio = kernelSingle / kernelPacked;
  return [
    { group: 'batched engine', name: 'simulate(), 4 heavy-wall variants × 3 days, one by one', value: nodeSteps / (single / 1000), unit: 'node-steps/s' },
    { group: 'batched engine', name: 'simulateBatch(), the same models, K = 4 interleaved', value: nodeSteps / (batched / 1000), unit: 'node-steps/s' },
    { group: 'batched engine', name: 'batched / single throughput, whole runs', value: ratio, unit: '×', target: '≥ 2.5', met: ratio >= 2.5 },
    { group: 'batched engine', name: 'solver alone: thetaStep one model at a time', value: kernelNodeSteps / (kernelSingle / 1000), unit: 'node-steps/s' },
    { group: 'batched engine', name: 'solver alone: packed 4-lane step', value: kernelNodeSteps / (kernelPacked / 1000), unit: 'node-steps/s' },
    { group: 'batched engine', name: 'batched / single throughput, solver alone', value: kernelRatio, unit: '×' },
  ];
}

/** the periodic start of the heavy wall in periods' worth of its own stepping (stats.periodicStart.costPeriods) */
export function periodicStartBench(): BenchRow[] {
  const rows: BenchRow[] = [];
  const cases: Array<[string, Model['outside']]> = [
    ['sine day', { surfaceResistance: 0.04, air: { kind: 'sine', mean: 8, amplitude: 7, period: 86400, peakTime: 54000 } }],
    [
      'sol-air day (600 s sun)',
      {
        surfaceResistance: 0.04,
        air: { kind: 'sine', mean: 8, amplitude: 7, period: 86400, peakTime: 54000 },
        solar: { absorptance: 0.6, irradiance: { kind: 'series', step: 600, values: clearDay, repeat: true } },
      },
    ],
  ];
  for (const [label, outside] of cases) {
    const model: Model = {
      layers: heavyDemo,
      outside,
      inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } },
      initial: { kind: 'periodic' },
      duration: 3 * 86400,
      timeStep: 300,
      outputInterval: 3600,
    };
    let startMs = Infinity;
    let periodMs = Infinity;
    let solves = 0;
    for (let rep = 0; rep < 15; rep++) {
      const p = simulate(model, { storeProfiles: false }).stats.periodicStart!;
      startMs = Math.min(startMs, p.elapsedMs);
      if (p.costPeriods > 0) periodMs = Math.min(periodMs, p.elapsedMs / p.costPeriods);
      solves = p.solves;
    }
    const cost = startMs / periodMs;
    rows.push({ group: 'periodic start', name: `heavy wall, ${label}: complex solves`, value: solves, unit: 'count' });
    rows.push({ group: 'periodic start', name: `heavy wall, ${label}: cost in periods of its own stepping`, value: cost, unit: 'periods', target: '< 3', met: cost < 3 });
  }
  return rows;
}
