// the thermal engine's public surface: pure typescript, imports nothing outside this folder
export type * from './types.ts';
export { analyse, analysisPeriod, DEFAULT_PERIOD } from './analyse.ts';
export { simulate, SimulationCancelled } from './simulate.ts';
export { simulateBatch } from './batch.ts';
export { periodicState, periodSampling, type PeriodicStartInfo } from './periodicStart.ts';
export { jumpSteps, sideJumps, JUMP_MIN_CHANGE, JUMP_CONCENTRATION } from './jumps.ts';
export { buildMesh, cellsForLayer, countCells, DEFAULT_MAX_CELL_SIZE, DEFAULT_MIN_CELLS_PER_LAYER, type Mesh } from './mesh.ts';
export { compileSignal, signalAt, signalPeriod, commonPeriod, modelSignals, type CompiledSignal } from './signals.ts';
export { solAirTemperature } from './boundary.ts';
export { steadyFigures } from './steady.ts';
export { layerFigures, lumpedFigures, LUMPED_BIOT_LIMIT } from './diagnostics.ts';
export { periodicAnalysis, wallMatrix, layerMatrix, resistanceMatrix, transmittance } from './periodic.ts';
export { factorise, solve, thetaStep, tridiagonal, type Tridiagonal, type ThomasFactor } from './stepper.ts';
