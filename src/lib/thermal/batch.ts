// simulateBatch(): many independent models through one call, results in input order, each identical to simulate()
import { simulate } from './simulate.ts';
import type { Model, Result, SimulateOptions } from './types.ts';

/** runs every model and returns their results in input order */
export function simulateBatch(models: readonly Model[], options: SimulateOptions = {}): Result[] {
  return models.map((m) => simulate(m, options));
}
