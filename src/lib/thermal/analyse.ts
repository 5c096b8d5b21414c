// everything that needs no time stepping: cheap enough to run on every keystroke
import { layerFigures, lumpedFigures } from './diagnostics.ts';
import { countCells } from './mesh.ts';
import { periodicAnalysis } from './periodic.ts';
import { steadyFigures } from './steady.ts';
import type { Figures, Model } from './types.ts';

/** the default period when the outside air is not a sine, s */
export const DEFAULT_PERIOD = 86400;

/** the periodic analysis period: the outside air sine's period, else one day */
export function analysisPeriod(model: Pick<Model, 'outside'>): number {
  const air = model.outside.air;
  return air.kind === 'sine' ? air.period : DEFAULT_PERIOD;
}

/** steady, per-layer, lumped and periodic figures without time stepping */
export function analyse(model: Pick<Model, 'layers' | 'outside' | 'inside' | 'mesh'>): Figures {
  const rse = model.outside.surfaceResistance;
  const rsi = model.inside.surfaceResistance;
  const period = analysisPeriod(model);
  const steady = steadyFigures(model.layers, rse, rsi);
  return {
    steady,
    layers: layerFigures(model.layers, rse, rsi, period),
    lumped: lumpedFigures(model.layers, rse, rsi),
    periodic: periodicAnalysis(model.layers, rse, rsi, period, steady.uValue),
    cells: countCells(model.layers, model.mesh),
  };
}
