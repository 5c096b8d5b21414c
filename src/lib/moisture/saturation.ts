// water-vapour saturation pressure and its inverse, by the formulas of ISO 13788:2012 Annex E
// (eq. E.7 and E.8, from memory): over water at 0 °C and above, over ice below.

/** Pa at 0 °C: the constant of both branches (ISO 13788:2012 Annex E, from memory) */
export const P_SAT_0 = 610.5;

/** saturation water-vapour pressure, Pa, at temperature θ in °C (ISO 13788:2012 E.7 / E.8, from memory) */
export function saturationPressure(theta: number): number {
  if (theta >= 0) return P_SAT_0 * Math.exp((17.269 * theta) / (237.3 + theta));
  return P_SAT_0 * Math.exp((21.875 * theta) / (265.5 + theta));
}

/**
 * the temperature, °C, at which the saturation pressure equals p (Pa): the dew point of air
 * holding vapour at partial pressure p. the exact inverse of saturationPressure (ISO 13788:2012
 * Annex E, eq. E.9 / E.10, from memory).
 */
export function saturationTemperature(p: number): number {
  if (!(p > 0)) return -Infinity;
  const x = Math.log(p / P_SAT_0);
  if (p >= P_SAT_0) return (237.3 * x) / (17.269 - x);
  return (265.5 * x) / (21.875 - x);
}

/** vapour pressure, Pa, of air at θ °C and relative humidity φ in % */
export function vapourPressure(theta: number, relativeHumidity: number): number {
  return (relativeHumidity / 100) * saturationPressure(theta);
}
