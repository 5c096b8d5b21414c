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
}

/**
 * sol-air temperature = air + absorptance · irradiance · R_se.
 * with R_se = 0 the term vanishes and the sol-air temperature equals the air temperature: a prescribed
 * surface has no film through which absorbed sun could raise it, so sun is then ignored (documented choice).
 */
export function solAirTemperature(air: number, absorptance: number, irradiance: number, surfaceResistance: number): number {
  return air + absorptance * irradiance * surfaceResistance;
}

export function outsideBoundary(b: OutsideBoundary): BoundarySide {
  const R = b.surfaceResistance;
  return {
    prescribed: R === 0,
    h: R === 0 ? 0 : 1 / R,
    air: compileSignal(b.air),
    irradiance: b.solar ? compileSignal(b.solar.irradiance) : null,
    solarGain: b.solar ? b.solar.absorptance * R : 0,
  };
}

export function insideBoundary(b: InsideBoundary): BoundarySide {
  const R = b.surfaceResistance;
  return { prescribed: R === 0, h: R === 0 ? 0 : 1 / R, air: compileSignal(b.air), irradiance: null, solarGain: 0 };
}

/** the temperature that drives the surface: sol-air outside, air inside (°C) */
export function drivingTemperature(side: BoundarySide, t: number): number {
  const air = signalAt(side.air, t);
  return side.irradiance === null ? air : air + side.solarGain * signalAt(side.irradiance, t);
}

/** rate of change of the driving temperature (K/s), for the surface flux of a prescribed surface */
export function drivingRate(side: BoundarySide, t: number, h: number): number {
  const air = signalRate(side.air, t, h);
  return side.irradiance === null ? air : air + side.solarGain * signalRate(side.irradiance, t, h);
}
