import { describe, expect, it } from 'vitest';
import { saturationPressure, saturationTemperature, vapourPressure } from '../../../src/lib/moisture/index.ts';

describe('saturationPressure (ISO 13788:2012 Annex E formulas)', () => {
  // published saturation pressures (WMO / CRC Handbook tables, from memory): over ice at −10 °C 259.9 Pa,
  // at 0 °C 611.2 Pa, over water at 10 °C 1227.9 Pa and at 20 °C 2338.8 Pa. the standard's formulas
  // (constant 610.5 Pa) agree within about 0.3 %.
  it.each([
    [-10, 259.9],
    [0, 611.2],
    [10, 1227.9],
    [20, 2338.8],
  ])('gives the published value at %d °C within 0.3 %%', (theta, table) => {
    expect(Math.abs(saturationPressure(theta) / table - 1)).toBeLessThan(0.003);
  });

  it('takes the ice branch below 0 °C and the water branch above, meeting at 610.5 Pa', () => {
    // the two formulas of ISO 13788:2012 Annex E (from memory) both give 610.5 Pa at 0 °C
    expect(saturationPressure(0)).toBeCloseTo(610.5, 10);
    expect(saturationPressure(-1e-9)).toBeCloseTo(610.5, 5);
    // over ice the pressure is lower than over water at −10 °C (286.5 Pa over water, WMO table, from memory)
    expect(saturationPressure(-10)).toBeLessThan(270);
  });

  it('is inverted exactly by saturationTemperature on both branches', () => {
    for (const t of [-25, -10, -0.5, 0, 0.5, 7, 15.3, 30]) expect(saturationTemperature(saturationPressure(t))).toBeCloseTo(t, 9);
  });

  it('gives the dew point of air at 20 °C and 50 % as about 9.3 °C (psychrometric tables, from memory)', () => {
    expect(saturationTemperature(vapourPressure(20, 50))).toBeCloseTo(9.3, 1);
  });
});
