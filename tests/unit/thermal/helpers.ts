// shared builders for the engine tests (not a test file itself)
import type { Layer, Model, Signal } from '../../../src/lib/thermal/index.ts';

export const constant = (value: number): Signal => ({ kind: 'constant', value });

/** a homogeneous layer */
export function layer(name: string, thickness: number, conductivity: number, density: number, specificHeat: number, cells?: number): Layer {
  return cells === undefined
    ? { name, thickness, conductivity, density, specificHeat }
    : { name, thickness, conductivity, density, specificHeat, cells };
}

/** a model with the given layers and sensible defaults, overridable */
export function model(layers: Layer[], over: Partial<Model> = {}): Model {
  return {
    layers,
    outside: { surfaceResistance: 0.04, air: constant(0) },
    inside: { surfaceResistance: 0.13, air: constant(20) },
    initial: { kind: 'uniform', temperature: 20 },
    duration: 86400,
    timeStep: 300,
    outputInterval: 3600,
    ...over,
  };
}

/** a heavy multi-layer wall of our own scenario (render, mineral wool, brick, plaster) */
export const heavyWall: Layer[] = [
  layer('Silicate render', 0.012, 0.7, 1600, 1000),
  layer('Mineral wool slab', 0.12, 0.035, 110, 1030),
  layer('Clay brick', 0.215, 0.77, 1700, 800),
  layer('Gypsum plaster', 0.013, 0.4, 1000, 1000),
];

/**
 * complex amplitude of the fundamental of samples over exactly one period: q(t) = A cos(ωt − φ) gives A e^{−iφ}
 */
export function fundamental(time: number[], values: number[], period: number): { amplitude: number; peakTime: number } {
  const w = (2 * Math.PI) / period;
  let re = 0;
  let im = 0;
  for (let k = 0; k < time.length; k++) {
    re += values[k] * Math.cos(w * time[k]);
    im -= values[k] * Math.sin(w * time[k]);
  }
  re *= 2 / time.length;
  im *= 2 / time.length;
  const phase = -Math.atan2(im, re); // φ
  const peakTime = (((phase / w) % period) + period) % period;
  return { amplitude: Math.hypot(re, im), peakTime };
}

/** the last full period of a series sampled every dtOut (drops the duplicate end point) */
export function lastPeriod(time: number[], values: number[], period: number): { time: number[]; values: number[] } {
  const end = time[time.length - 1];
  const idx: number[] = [];
  for (let k = 0; k < time.length; k++) if (time[k] > end - period + 1e-6) idx.push(k);
  return { time: idx.map((k) => time[k]), values: idx.map((k) => values[k]) };
}
