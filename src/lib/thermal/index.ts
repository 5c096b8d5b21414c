// the thermal engine's public surface: pure typescript, imports nothing outside this folder
export type * from './types.ts';
export { analyse, analysisPeriod, DEFAULT_PERIOD } from './analyse.ts';
export { simulate, SimulationCancelled } from './simulate.ts';
export { buildMesh, cellsForLayer, countCells, DEFAULT_MAX_CELL_SIZE, DEFAULT_MIN_CELLS_PER_LAYER, type Mesh } from './mesh.ts';
export { compileSignal, signalAt, jumpTimes, type CompiledSignal } from './signals.ts';
export { solAirTemperature } from './boundary.ts';
export { steadyFigures } from './steady.ts';
export { layerFigures, lumpedFigures, LUMPED_BIOT_LIMIT } from './diagnostics.ts';
export { periodicAnalysis, wallMatrix, layerMatrix, resistanceMatrix, transmittance } from './periodic.ts';
export { factorise, solve, thetaStep, tridiagonal, type Tridiagonal, type ThomasFactor } from './stepper.ts';
