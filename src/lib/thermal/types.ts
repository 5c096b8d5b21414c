// public types of the thermal engine; SI units throughout (m, s, °C, W/(m·K), kg/m³, J/(kg·K), m²·K/W, W/m², J/m²)

/** constant value, °C or W/m² depending on where it is used */
export interface ConstantSignal {
  kind: 'constant';
  value: number;
}

/** mean + amplitude·cos(2π(t − peakTime)/period); peaks peakTime seconds after t = 0 */
export interface SineSignal {
  kind: 'sine';
  mean: number;
  amplitude: number;
  /** s, > 0 */
  period: number;
  /** s */
  peakTime: number;
}

/**
 * samples values[i] at t = i·step, linear between.
 * past the last sample: with repeat the pattern repeats with period values.length·step
 * (interpolating from the last value back to the first over the final step), else the last value holds.
 */
export interface SeriesSignal {
  kind: 'series';
  /** s, > 0 */
  step: number;
  values: number[];
  repeat?: boolean;
}

/** a boundary signal: temperature in °C or irradiance in W/m² */
export type Signal = ConstantSignal | SineSignal | SeriesSignal;

/** one homogeneous layer; extra fields used by the app (materialId, materialClass, note) are ignored */
export interface Layer {
  name: string;
  /** m, > 0 */
  thickness: number;
  /** W/(m·K), > 0 */
  conductivity: number;
  /** kg/m³, > 0 */
  density: number;
  /** J/(kg·K), > 0 */
  specificHeat: number;
  /** overrides the automatic mesh for this layer */
  cells?: number;
}

/** outside boundary: film, air temperature and optional sun on the surface */
export interface OutsideBoundary {
  /** m²K/W; 0 prescribes the surface temperature (sol-air temperature, which then equals the air) */
  surfaceResistance: number;
  air: Signal;
  /** sol-air temperature = air + absorptance·irradiance·surfaceResistance */
  solar?: { absorptance: number; irradiance: Signal };
  /**
   * net long-wave loss of the outer surface to sky and surroundings, W/m² (positive = loss);
   * subtracts netLoss·surfaceResistance from the sol-air temperature (ignored with surfaceResistance 0, like solar)
   */
  longWave?: { netLoss: Signal };
}

/** inside boundary: film and room air temperature */
export interface InsideBoundary {
  /** m²K/W; 0 prescribes the surface temperature */
  surfaceResistance: number;
  air: Signal;
}

/**
 * uniform temperature; the steady profile for the signals' values at t = 0; or the periodic steady state
 * of signals that all repeat (constant, sine, series with repeat) with a common period
 */
export type InitialState = { kind: 'uniform'; temperature: number } | { kind: 'steady' } | { kind: 'periodic' };

/** mesh rule: per layer max(minCellsPerLayer, ceil(thickness / maxCellSize)) cells unless the layer sets cells */
export interface MeshOptions {
  /** m, default 0.005 */
  maxCellSize?: number;
  /** default 4 */
  minCellsPerLayer?: number;
}

/** θ-method: crank-nicolson (θ = ½) or implicit (backward Euler, θ = 1) */
export type Scheme = 'crank-nicolson' | 'implicit';

/** a layered wall or roof under boundary signals; layers run from the OUTSIDE face (index 0) to the INSIDE face */
export interface Model {
  layers: Layer[];
  outside: OutsideBoundary;
  inside: InsideBoundary;
  initial: InitialState;
  /** s */
  duration: number;
  /** s */
  timeStep: number;
  /** s; output at t = 0, outputInterval, 2·outputInterval, … ≤ duration */
  outputInterval: number;
  mesh?: MeshOptions;
  scheme?: Scheme;
}

/** steady-state figures */
export interface SteadyResult {
  /** R_se + Σ d/λ + R_si, m²K/W */
  totalResistance: number;
  /** W/m²K */
  uValue: number;
}

/** per-layer diagnostics of the contract */
export interface LayerFigures {
  name: string;
  /** d/λ, m²K/W */
  resistance: number;
  /** λ/(ρc), m²/s */
  diffusivity: number;
  /** ρcd, J/m²K */
  arealHeatCapacity: number;
  /** sqrt(diffusivity·period/π), m */
  penetrationDepth: number;
}

/** extra per-layer figures the workbench shows (not part of the contract) */
export interface LayerExtraFigures extends LayerFigures {
  /** a·P/d² for one period P, dimensionless */
  fourier: number;
  /** h̄·(d/2)/λ with h̄ the mean film coefficient of the assembly */
  biot: number;
  /** biot < 0.1 (common practice) */
  lumped: boolean;
}

/** the whole assembly as one lumped body between the two air temperatures */
export interface LumpedFigures {
  /** total thickness / 2, m */
  characteristicLength: number;
  /** h̄·Lc/k_eff; Infinity when a surface is prescribed (printed as null in JSON) */
  biot: number;
  /** biot < 0.1 */
  valid: boolean;
  /** Σρcd / (1/R_se + 1/R_si), s; 0 when a surface is prescribed */
  timeConstant: number;
}

/** analytic periodic steady state (ISO 13786 transfer matrices) */
export interface PeriodicResult {
  /** s */
  period: number;
  /** |Y12|, W/m²K */
  periodicTransmittance: number;
  /** periodicTransmittance / uValue */
  decrementFactor: number;
  /** s in [0, period): from the outside air peak to the inside heat flux peak */
  timeLag: number;
  /** W/m²K */
  admittanceInside: number;
  /** J/m²K, κ1 of ISO 13786 */
  arealHeatCapacityInside: number;
}

/** output series, one entry per output time (plain arrays so the result is JSON) */
export interface SeriesResult {
  time: number[];
  outsideAir: number[];
  outsideSurface: number[];
  insideSurface: number[];
  insideAir: number[];
  /** interfaces[j][k]: interface between layers j and j+1 at time k */
  interfaces: number[][];
  /** W/m² entering the wall at the outside surface (positive towards the inside) */
  outsideFlux: number[];
  /** W/m² leaving the wall into the room (positive towards the inside) */
  insideFlux: number[];
}

/** energy account over the run, J/m² */
export interface EnergyResult {
  storedChange: number;
  inOutside: number;
  outInside: number;
  /** |inOutside − outInside − storedChange| / max(|inOutside|, |outInside|, |storedChange|, 1) */
  balanceError: number;
}

/** how the time steps were taken, so the scheme can be named truthfully */
export interface SchemeAccount {
  /** the model's scheme */
  scheme: 'crank-nicolson' | 'implicit';
  /** whole steps taken with the model's scheme at its full step (the short last step counts here too) */
  fullSteps: number;
  /** restarts after a jump (or a uniform start): each replaces whole steps by the sub-steps below */
  restarts: number;
  /** backward-euler sub-steps of a quarter step taken in restarts */
  backwardEulerSubSteps: number;
  /** crank–nicolson sub-steps of half a step taken in restarts */
  crankNicolsonSubSteps: number;
}

/** what the periodic start did (initial.kind "periodic") */
export interface PeriodicStartStats {
  /** the common period P, s (0 when every signal is constant: the start is then the steady state) */
  period: number;
  /** samples per period N of the frequency-domain solve */
  samples: number;
  /** P/N, s */
  stepSize: number;
  /** complex tridiagonal solves (harmonics with a non-negligible drive) */
  solves: number;
  /** periods stepped for the restart correction (jumps inside the period): 0 or 2 */
  correctionPeriods: number;
  /** wall time of the periodic start, ms */
  elapsedMs: number;
  /** that time in periods' worth of this run's own stepping (wall time of stepping one period) */
  costPeriods: number;
}

/** run statistics */
export interface StatsResult {
  cells: number;
  steps: number;
  /** cells × steps */
  nodeSteps: number;
  elapsedMs: number;
  /** the steps by kind */
  scheme: SchemeAccount;
  /** present for a periodic start */
  periodicStart?: PeriodicStartStats;
}

/** what simulate() returns (the contract's Result) */
export interface Result {
  steady: SteadyResult;
  layers: LayerFigures[];
  lumped: LumpedFigures;
  periodic: PeriodicResult;
  /** node positions from the outside face, m */
  mesh: { x: number[] };
  series: SeriesResult;
  /** profiles[k][i]: temperature at mesh.x[i] at series.time[k]; empty when profiles are not stored */
  profiles: number[][];
  energy: EnergyResult;
  stats: StatsResult;
}

/** what analyse() returns: everything that needs no time stepping */
export interface Figures {
  steady: SteadyResult;
  layers: LayerExtraFigures[];
  lumped: LumpedFigures;
  periodic: PeriodicResult;
  /** cells the mesh rule makes */
  cells: number;
}

/** options for simulate() */
export interface SimulateOptions {
  /** called with the fraction done (0…1) every progressEvery steps */
  onProgress?: (fraction: number) => void;
  /** polled every progressEvery steps; returning true stops the run with a SimulationCancelled error */
  shouldCancel?: () => boolean;
  /** steps between progress/cancel checks, default 4096 */
  progressEvery?: number;
  /** store full profiles (default true); false leaves profiles empty */
  storeProfiles?: boolean;
  /** restart with backward-euler sub-steps after a uniform start and after each jump (default true); false only to show the ringing */
  restart?: boolean;
}
