import { describe, expect, it } from 'vitest';
import { analyse, simulate, SimulationCancelled, type Model } from '../../../src/lib/thermal/index.ts';
import { constant, fundamental, heavyWall, lastPeriod, layer, model } from './helpers.ts';

/** erfc by Abramowitz & Stegun, Handbook of Mathematical Functions, 7.1.26 (|error| ≤ 1.5e-7) */
function erfc(x: number): number {
  const t = 1 / (1 + 0.3275911 * x);
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  return poly * Math.exp(-x * x);
}

/** the positive roots of ζ tan ζ = Bi, one in each interval ((n−1)π, (n−½)π), by bisection then newton */
function eigenvalues(bi: number, count: number): number[] {
  const roots: number[] = [];
  for (let n = 0; n < count; n++) {
    let lo = n * Math.PI + 1e-12;
    let hi = n * Math.PI + Math.PI / 2 - 1e-12;
    const f = (z: number) => z * Math.tan(z) - bi;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (f(mid) > 0) hi = mid;
      else lo = mid;
    }
    let z = 0.5 * (lo + hi);
    for (let i = 0; i < 3; i++) z -= f(z) / (Math.tan(z) + z / Math.cos(z) ** 2);
    roots.push(z);
  }
  return roots;
}

describe('simulate: lumped capacitance', () => {
  it('cools 1 mm of steel exponentially, T∞ + (T0 − T∞)·exp(−t/τ)', () => {
    // lumped capacitance solution (Incropera, Fundamentals of Heat and Mass Transfer, eq. 5.6; from memory)
    const m = model([layer('steel sheet', 0.001, 50, 7850, 460)], {
      outside: { surfaceResistance: 0.1, air: constant(20) },
      inside: { surfaceResistance: 0.1, air: constant(20) },
      initial: { kind: 'uniform', temperature: 100 },
      duration: 900,
      timeStep: 2,
      outputInterval: 30,
    });
    const r = simulate(m);
    const tau = r.lumped.timeConstant;
    expect(tau).toBeCloseTo((7850 * 460 * 0.001) / 20, 9);
    for (let k = 1; k < r.series.time.length; k++) {
      const exact = 20 + 80 * Math.exp(-r.series.time[k] / tau);
      expect(Math.abs(r.series.insideSurface[k] - exact)).toBeLessThan(0.08); // 0.1 % of the 80 K drop
    }
  });
});

describe('simulate: plane wall with convection on both faces', () => {
  it('finds the first eigenvalue and coefficient of the one-term table for Bi = 1', () => {
    // one-term coefficients for a plane wall, Bi = 1.0: ζ1 = 0.8603, C1 = 1.1191 (Incropera table 5.1; from memory)
    const [z1] = eigenvalues(1, 1);
    expect(z1).toBeCloseTo(0.8603, 4);
    expect((4 * Math.sin(z1)) / (2 * z1 + Math.sin(2 * z1))).toBeCloseTo(1.1191, 4);
  });

  it('matches the exact eigen-series at the centre and the surface', () => {
    // exact series θ/θ0 = Σ Cn exp(−ζn² Fo) cos(ζn x/L), Cn = 4 sin ζn / (2ζn + sin 2ζn) (Incropera eq. 5.39a; from memory)
    const L = 0.05;
    const k = 0.5;
    const rc = 1e6;
    const h = 10; // Bi = hL/k = 1
    const a = k / rc;
    const roots = eigenvalues(1, 60);
    const exact = (xOverL: number, fo: number) =>
      roots.reduce((s, z) => s + ((4 * Math.sin(z)) / (2 * z + Math.sin(2 * z))) * Math.exp(-z * z * fo) * Math.cos(z * xOverL), 0);
    const m = model([layer('slab', 2 * L, k, 1000, 1000)], {
      outside: { surfaceResistance: 1 / h, air: constant(0) },
      inside: { surfaceResistance: 1 / h, air: constant(0) },
      initial: { kind: 'uniform', temperature: 1 },
      duration: 10000,
      timeStep: 60,
      outputInterval: 500,
    });
    const r = simulate(m);
    const centre = r.mesh.x.length >> 1;
    expect(r.mesh.x[centre]).toBeCloseTo(L, 12);
    for (const fo of [0.2, 0.5, 1, 2]) {
      const kIndex = r.series.time.indexOf(Math.round((fo * L * L) / a));
      expect(kIndex).toBeGreaterThan(0);
      expect(Math.abs(r.profiles[kIndex][centre] - exact(0, fo))).toBeLessThan(1e-3);
      expect(Math.abs(r.series.insideSurface[kIndex] - exact(1, fo))).toBeLessThan(1e-3);
    }
  });
});

describe('simulate: semi-infinite solid', () => {
  const k = 1.4;
  const rc = 2000 * 900;
  const a = k / rc;
  const stepModel = (timeStep: number, restart?: boolean): [Model, object] => [
    model([layer('deep concrete', 1.0, k, 2000, 900)], {
      outside: { surfaceResistance: 0, air: constant(1) },
      inside: { surfaceResistance: 0.13, air: constant(0) },
      initial: { kind: 'uniform', temperature: 0 },
      duration: 43200,
      timeStep,
      outputInterval: timeStep,
    }),
    restart === undefined ? {} : { restart },
  ];

  it('matches the erfc solution for a step at the surface', () => {
    // T = Ts·erfc(x / (2√(at))) for a surface step (Carslaw & Jaeger §2.4; Incropera eq. 5.57), erfc by A&S 7.1.26
    const r = simulate(...stepModel(300));
    for (const t of [10800, 21600, 43200]) {
      const kIndex = r.series.time.indexOf(t);
      for (let i = 1; i < 60; i++) {
        const x = r.mesh.x[i];
        expect(Math.abs(r.profiles[kIndex][i] - erfc(x / (2 * Math.sqrt(a * t))))).toBeLessThan(2e-3);
      }
      // surface flux k·ΔT/√(πat) (same sources)
      const q = k / Math.sqrt(Math.PI * a * t);
      expect(Math.abs(r.series.outsideFlux[kIndex] / q - 1)).toBeLessThan(0.02);
    }
  });

  it('damps crank-nicolson ringing after the step with rannacher half-steps', () => {
    // rannacher, "finite element solution of diffusion problems with irregular data", numer. math. 43 (1984):
    // a few implicit half-steps after the jump restore smoothness; without them high modes flip sign every step.
    // a·dt/dx² = 139 here, far beyond what crank-nicolson damps by itself.
    const bounded = (r: ReturnType<typeof simulate>) => {
      let worst = 0;
      for (let k = 1; k < r.profiles.length; k++) {
        const p = r.profiles[k];
        for (let i = 1; i < 20; i++) {
          worst = Math.max(worst, p[i] - 1, -p[i]); // maximum principle: 0 ≤ T ≤ 1
          if (k > 1) worst = Math.max(worst, r.profiles[k - 1][i] - p[i]); // heating from a step never cools a point
          worst = Math.max(worst, p[i + 1] - p[i]); // and T falls monotonically away from the heated face
        }
      }
      return worst;
    };
    const damped = simulate(...stepModel(3600));
    const ringing = simulate(...stepModel(3600, false));
    expect(bounded(ringing)).toBeGreaterThan(0.02); // the undamped scheme does ring: the check can fail
    expect(bounded(damped)).toBeLessThan(1e-4);
  });
  it('restarts with half-steps after a jump of a series signal later in the run', () => {
    // same remedy (rannacher 1984) applied at every jump: a 5 K change within one minute, mid-step, at 4 h 10 min
    const values = Array.from({ length: 4 * 60 + 12 }, (_, i) => (i <= 4 * 60 + 10 ? 0 : 5));
    const jumpModel: Model = {
      ...stepModel(3600)[0],
      outside: { surfaceResistance: 0, air: { kind: 'series', step: 60, values } },
      initial: { kind: 'steady' },
    };
    const rising = (r: ReturnType<typeof simulate>) => {
      let worst = 0;
      for (let k = 5; k < r.profiles.length; k++) for (let i = 1; i < 20; i++) worst = Math.max(worst, r.profiles[k - 1][i] - r.profiles[k][i]);
      return worst;
    };
    expect(rising(simulate(jumpModel, { restart: false }))).toBeGreaterThan(0.1);
    expect(rising(simulate(jumpModel))).toBeLessThan(5e-6);
  });
});

describe('simulate: periodic steady state', () => {
  it('reproduces the transfer-matrix decrement within 1 % and time lag within 5 minutes', () => {
    // analytic periodic solution: ISO 13786 transfer matrices (periodic.ts), checked above against Carslaw & Jaeger
    const m = model(heavyWall, {
      outside: { surfaceResistance: 0.04, air: { kind: 'sine', mean: 5, amplitude: 10, period: 86400, peakTime: 54000 } },
      inside: { surfaceResistance: 0.13, air: constant(20) },
      initial: { kind: 'steady' },
      duration: 10 * 86400,
      timeStep: 300,
      outputInterval: 300,
    });
    const r = simulate(m, { storeProfiles: false });
    const last = lastPeriod(r.series.time, r.series.insideFlux, 86400);
    const f = fundamental(last.time, last.values, 86400);
    const decrement = f.amplitude / 10 / r.steady.uValue;
    expect(Math.abs(decrement / r.periodic.decrementFactor - 1)).toBeLessThan(0.01);
    let lag = f.peakTime - 54000;
    lag = ((lag % 86400) + 86400) % 86400;
    const diff = Math.abs(lag - r.periodic.timeLag);
    expect(Math.min(diff, 86400 - diff)).toBeLessThan(300);
  });

  it('reproduces the inside admittance with the outside held', () => {
    // ISO 13786 Y11: inside flux amplitude per kelvin of inside air amplitude
    const m = model(heavyWall, {
      outside: { surfaceResistance: 0.04, air: constant(5) },
      inside: { surfaceResistance: 0.13, air: { kind: 'sine', mean: 20, amplitude: 2, period: 86400, peakTime: 0 } },
      initial: { kind: 'steady' },
      duration: 8 * 86400,
      outputInterval: 600,
    });
    const r = simulate(m, { storeProfiles: false });
    const last = lastPeriod(r.series.time, r.series.insideFlux, 86400);
    const f = fundamental(last.time, last.values, 86400);
    expect(Math.abs(f.amplitude / 2 / r.periodic.admittanceInside - 1)).toBeLessThan(0.01);
  });
});

describe('simulate: steady boundaries', () => {
  it('settles to an inside flux within 0.1 % of U·ΔT on a long run', () => {
    // steady series resistances (ISO 6946)
    const m = model(heavyWall, {
      outside: { surfaceResistance: 0.04, air: constant(-5) },
      inside: { surfaceResistance: 0.13, air: constant(20) },
      initial: { kind: 'uniform', temperature: 20 },
      duration: 60 * 86400,
      outputInterval: 86400,
    });
    const r = simulate(m, { storeProfiles: false });
    const q = -r.steady.uValue * 25; // heat leaves the room: negative towards the inside
    const qi = r.series.insideFlux[r.series.insideFlux.length - 1];
    expect(Math.abs(qi / q - 1)).toBeLessThan(1e-3);
    expect(Math.abs(r.series.outsideFlux[r.series.outsideFlux.length - 1] / q - 1)).toBeLessThan(1e-3);
  });

  it('starts in the exact steady state when asked to', () => {
    const m = model(heavyWall, { initial: { kind: 'steady' }, duration: 3600 });
    const r = simulate(m);
    expect(Math.abs(r.series.insideFlux[0] / (r.steady.uValue * -20) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.series.insideFlux[1] / (r.steady.uValue * -20) - 1)).toBeLessThan(1e-9);
  });
});

describe('simulate: energy account', () => {
  const sunny = (over: Partial<Model>): Model =>
    model(heavyWall, {
      outside: {
        surfaceResistance: 0.04,
        air: { kind: 'sine', mean: 5, amplitude: 10, period: 86400, peakTime: 54000 },
        solar: { absorptance: 0.6, irradiance: { kind: 'series', step: 3600, values: [0, 0, 0, 0, 0, 0, 100, 300, 500, 600, 500, 300, 100], repeat: true } },
      },
      inside: { surfaceResistance: 0.13, air: { kind: 'series', step: 300, values: [18, 18, 24, 24, 18], repeat: true } },
      duration: 3 * 86400 + 1000, // a shorter last step, too
      outputInterval: 1800,
      ...over,
    });

  for (const [label, m] of [
    ['crank-nicolson with films', sunny({})],
    ['backward euler with films', sunny({ scheme: 'implicit' })],
    ['prescribed surfaces on both sides', sunny({ outside: { surfaceResistance: 0, air: constant(-10) }, inside: { surfaceResistance: 0, air: constant(20) } })],
  ] as const) {
    it(`closes to round-off: ${label}`, () => {
      // conservation of energy of the discrete system: Σ C ΔT = ∫ (q_out − q_in) dt, θ-weighted like the scheme
      const r = simulate(m, { storeProfiles: false });
      expect(r.energy.balanceError).toBeLessThan(1e-10);
      expect(Math.abs(r.energy.inOutside - r.energy.outInside - r.energy.storedChange)).toBeLessThan(1e-6 * Math.abs(r.energy.storedChange) + 1e-3);
    });
  }

  it('computes the flux of a prescribed surface from the node’s energy equation', () => {
    const m = model(heavyWall, {
      outside: { surfaceResistance: 0, air: constant(-5) },
      inside: { surfaceResistance: 0, air: constant(20) },
      initial: { kind: 'steady' },
      duration: 7200,
    });
    const r = simulate(m);
    const q = 25 / (r.steady.totalResistance); // steady conduction through the layers alone
    expect(Math.abs(r.series.insideFlux[2] / -q - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.series.outsideFlux[2] / -q - 1)).toBeLessThan(1e-9);
  });
});

describe('simulate: order of accuracy', () => {
  const concrete = [layer('concrete', 0.2, 1.8, 2300, 1000)];
  const periodic = (over: Partial<Model>): Model =>
    model(concrete, {
      outside: { surfaceResistance: 0.04, air: { kind: 'sine', mean: 10, amplitude: 10, period: 86400, peakTime: 21600 } },
      inside: { surfaceResistance: 0.13, air: constant(20) },
      initial: { kind: 'steady' },
      duration: 2 * 86400,
      outputInterval: 86400,
      ...over,
    });
  const maxDiff = (a: number[], b: number[]) => a.reduce((m, v, i) => Math.max(m, Math.abs(v - b[i])), 0);
  const final = (r: ReturnType<typeof simulate>) => r.profiles[r.profiles.length - 1];

  it('is second order in time for crank-nicolson and first order for backward euler', () => {
    // observed order p = log2(e(Δt)/e(Δt/2)) against a fine-step reference on the same mesh (richardson)
    for (const [scheme, order] of [['crank-nicolson', 2], ['implicit', 1]] as const) {
      const ref = final(simulate(periodic({ scheme, timeStep: 3600 / 256 })));
      const e = [3600, 1800, 900].map((dt) => maxDiff(final(simulate(periodic({ scheme, timeStep: dt }))), ref));
      const p1 = Math.log2(e[0] / e[1]);
      const p2 = Math.log2(e[1] / e[2]);
      expect(Math.abs(p1 - order)).toBeLessThan(0.25);
      expect(Math.abs(p2 - order)).toBeLessThan(0.25);
    }
  });

  it('is second order in space against the analytic periodic solution', () => {
    // error of the complex inside-flux amplitude against ISO 13786 transfer matrices, halving Δx
    const errors = [0.02, 0.01, 0.005].map((dx) => {
      const m = periodic({ mesh: { maxCellSize: dx, minCellsPerLayer: 1 }, timeStep: 60, duration: 20 * 86400, outputInterval: 600 });
      const r = simulate(m, { storeProfiles: false });
      const last = lastPeriod(r.series.time, r.series.insideFlux, 86400);
      const f = fundamental(last.time, last.values, 86400);
      const y = r.periodic.periodicTransmittance * 10;
      const w = (2 * Math.PI) / 86400;
      const phaseNum = w * (f.peakTime - 21600);
      const phaseExact = w * r.periodic.timeLag;
      return Math.hypot(f.amplitude * Math.cos(phaseNum) - y * Math.cos(phaseExact), f.amplitude * Math.sin(phaseNum) - y * Math.sin(phaseExact)) / y;
    });
    expect(Math.abs(Math.log2(errors[0] / errors[1]) - 2)).toBeLessThan(0.3);
    expect(Math.abs(Math.log2(errors[1] / errors[2]) - 2)).toBeLessThan(0.3);
  });
});

describe('simulate: output', () => {
  it('samples series at every outputInterval, interpolating inside a step when needed', () => {
    const m = model(heavyWall, { duration: 7200, timeStep: 900, outputInterval: 600 });
    const r = simulate(m);
    expect(r.series.time).toEqual([0, 600, 1200, 1800, 2400, 3000, 3600, 4200, 4800, 5400, 6000, 6600, 7200]);
    expect(r.profiles).toHaveLength(13);
    expect(r.profiles[0]).toHaveLength(r.mesh.x.length);
    expect(r.series.interfaces).toHaveLength(3);
    expect(r.series.interfaces[0][0]).toBe(20);
    expect(r.stats.steps).toBe(8);
    expect(r.stats.nodeSteps).toBe(r.stats.cells * 8);
  });

  it('keeps the contract’s figures identical to analyse()', () => {
    const m = model(heavyWall);
    const r = simulate(m, { storeProfiles: false });
    const f = analyse(m);
    expect(r.steady).toEqual(f.steady);
    expect(r.periodic).toEqual(f.periodic);
    expect(Object.keys(r.layers[0]).sort()).toEqual(['arealHeatCapacity', 'diffusivity', 'name', 'penetrationDepth', 'resistance']);
    expect(r.profiles).toEqual([]);
  });

  it('reports progress and stops when cancelled', () => {
    const seen: number[] = [];
    simulate(model(heavyWall, { duration: 86400 * 5 }), { onProgress: (f) => seen.push(f), progressEvery: 100 });
    expect(seen.length).toBeGreaterThan(5);
    expect(seen[seen.length - 1]).toBe(1);
    expect(() => simulate(model(heavyWall, { duration: 86400 * 5 }), { shouldCancel: () => true, progressEvery: 10 })).toThrow(SimulationCancelled);
  });
});
