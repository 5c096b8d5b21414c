// boundary conditions: a surface film is a resistance (robin); a zero resistance prescribes the
// surface temperature (dirichlet); sun on the outside enters through the sol-air temperature
import { compileSignal, signalAt, signalRate, type CompiledSignal } from './signals.ts';
import type { InsideBoundary, OutsideBoundary } from './types.ts';

/** one side of the wall, ready for the time loop */
export interface BoundarySide {
  /** surfaceResistance = 0: the surface node follows the driving temperature */
  prescribed: boolean;
  /** film coefficient 1/R, W/m²K (0 when prescribed; the film is not used then) */
  h: number;
  air: CompiledSignal;
  /** irradiance on the surface, or null without sun */
  irradiance: CompiledSignal | null;
  /** absorptance · R, m²K/W: the sol-air rise per W/m² */
  solarGain: number;
  /** net long-wave loss of the surface (W/m², positive = loss), or null without it */
  netLoss: CompiledSignal | null;
  /** R, m²K/W: the sol-air drop per W/m² of long-wave loss */
  lossGain: number;
}

/**
 * sol-air temperature = air + R_se · (absorptance · irradiance − netLoss) (engine contract, "Sol-air temperature").
 * with R_se = 0 the term vanishes and the sol-air temperature equals the air temperature: a prescribed
 * surface has no film through which absorbed sun could raise it, so sun is then ignored (documented choice).
 */
export function solAirTemperature(
  air: number,
  absorptance: number,
  irradiance: number,
  surfaceResistance: number,
  netLoss = 0,
): number {
  return air + surfaceResistance * (absorptance * irradiance - netLoss);
}

export function outsideBoundary(b: OutsideBoundary): BoundarySide {
  const R = b.surfaceResistance;
  return {
    prescribed: R === 0,
    h: R === 0 ? 0 : 1 / R,
    air: compileSignal(b.air),
    irradiance: b.solar && R > 0 ? compileSignal(b.solar.irradiance) : null,
    solarGain: b.solar && R > 0 ? b.solar.absorptance * R : 0,
    netLoss: b.longWave && R > 0 ? compileSignal(b.longWave.netLoss) : null,
    lossGain: b.longWave && R > 0 ? R : 0,
  };
}

export function insideBoundary(b: InsideBoundary): BoundarySide {
  const R = b.surfaceResistance;
  return {
    prescribed: R === 0,
    h: R === 0 ? 0 : 1 / R,
    air: compileSignal(b.air),
    irradiance: null,
    solarGain: 0,
    netLoss: null,
    lossGain: 0,
  };
}

/** the temperature that drives the surface: sol-air outside, air inside (°C) */
export function drivingTemperature(side: BoundarySide, t: number): number {
  let d = signalAt(side.air, t);
  if (side.irradiance !== null) d += side.solarGain * signalAt(side.irradiance, t);
  if (side.netLoss !== null) d -= side.lossGain * signalAt(side.netLoss, t);
  return d;
}

/** rate of change of the driving temperature (K/s), for the surface flux of a prescribed surface */
export function drivingRate(side: BoundarySide, t: number, h: number): number {
  let r = signalRate(side.air, t, h);
  if (side.irradiance !== null) r += side.solarGain * signalRate(side.irradiance, t, h);
  if (side.netLoss !== null) r -= side.lossGain * signalRate(side.netLoss, t, h);
  return r;
}
