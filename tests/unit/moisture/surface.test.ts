import { describe, expect, it } from 'vitest';
import { saturationPressure, saturationTemperature, surfaceCheck, temperatureFactor, type Climate, type MoistureLayer } from '../../../src/lib/moisture/index.ts';

const concrete: MoistureLayer = { name: 'Dense concrete', thickness: 0.2, conductivity: 1.35, vapourResistanceFactor: 120 };

describe('temperatureFactor (ISO 13788:2012 clause 6, from memory)', () => {
  it('equals 1 − R_si/(R_se + d/λ + R_si) with R_si = 0.25 m²K/W for a single layer (closed form)', () => {
    const rt = 0.04 + 0.2 / 1.35 + 0.25;
    expect(temperatureFactor([concrete])).toBeCloseTo(1 - 0.25 / rt, 12);
    expect(temperatureFactor([concrete])).toBeCloseTo(0.429417, 5);
  });
});

describe('surfaceCheck (ISO 13788:2012 clause 6, from memory)', () => {
  const climate: Climate = {
    months: Array.from({ length: 12 }, (_, i) => ({ temperature: i === 0 ? 0 : 15, relativeHumidity: 80 })),
    indoor: { temperature: 20, relativeHumidity: 60 },
  };
  it('takes f_Rsi,min from the 80 % surface humidity limit in the critical month, and flags the bare concrete wall', () => {
    const s = surfaceCheck([concrete], climate);
    // January: p_i = 0.6 × 2336.95 = 1402.17 Pa; θ_si,min = θ_sat(1402.17/0.8) (about 15.4 °C);
    // f_Rsi,min = (θ_si,min − 0)/(20 − 0)
    const theta = saturationTemperature((0.6 * saturationPressure(20)) / 0.8);
    expect(theta).toBeCloseTo(15.4, 1);
    expect(s.criticalMonth).toBe(1);
    expect(s.fRsiMin).toBeCloseTo(theta / 20, 9);
    expect(s.mouldRisk).toBe(true);
    // the dew point of 20 °C / 60 % is about 12.0 °C (psychrometric tables, from memory): f 0.60 > 0.43
    expect(s.fRsiMinCondensation).toBeCloseTo(12.0 / 20, 2);
    expect(s.condensationRisk).toBe(true);
  });
  it('passes an insulated wall', () => {
    const s = surfaceCheck([concrete, { name: 'Mineral wool', thickness: 0.1, conductivity: 0.035, vapourResistanceFactor: 1 }], climate);
    expect(s.fRsi).toBeGreaterThan(0.9);
    expect(s.mouldRisk).toBe(false);
    expect(s.condensationRisk).toBe(false);
  });
});
