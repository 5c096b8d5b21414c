import { describe, expect, it } from 'vitest';
import { drivingTemperature, insideBoundary, outsideBoundary, solAirTemperature } from '../../../src/lib/thermal/boundary.ts';

describe('solAirTemperature', () => {
  it('adds absorptance · irradiance · R_se to the air temperature', () => {
    // sol-air definition (CIBSE Guide A / ASHRAE Fundamentals, long-wave term omitted; from memory)
    expect(solAirTemperature(10, 0.6, 500, 0.04)).toBeCloseTo(22, 12);
  });

  it('equals the air temperature when R_se is zero', () => {
    expect(solAirTemperature(10, 0.6, 500, 0)).toBe(10);
  });
});

describe('outsideBoundary', () => {
  it('turns a film resistance into a film coefficient', () => {
    const b = outsideBoundary({ surfaceResistance: 0.04, air: { kind: 'constant', value: 5 } });
    expect(b.prescribed).toBe(false);
    expect(b.h).toBeCloseTo(25, 12);
  });

  it('prescribes the surface when the resistance is zero and then ignores the sun', () => {
    const b = outsideBoundary({
      surfaceResistance: 0,
      air: { kind: 'constant', value: 5 },
      solar: { absorptance: 0.9, irradiance: { kind: 'constant', value: 800 } },
    });
    expect(b.prescribed).toBe(true);
    expect(drivingTemperature(b, 0)).toBe(5);
  });

  it('drives the outside surface with the sol-air temperature', () => {
    const b = outsideBoundary({
      surfaceResistance: 0.05,
      air: { kind: 'constant', value: 5 },
      solar: { absorptance: 0.5, irradiance: { kind: 'series', step: 100, values: [0, 400] } },
    });
    expect(drivingTemperature(b, 50)).toBeCloseTo(5 + 0.5 * 200 * 0.05, 12);
  });
});

describe('insideBoundary', () => {
  it('drives the inside surface with the room air', () => {
    const b = insideBoundary({ surfaceResistance: 0.13, air: { kind: 'constant', value: 21 } });
    expect(drivingTemperature(b, 1e6)).toBe(21);
    expect(b.h).toBeCloseTo(1 / 0.13, 12);
  });
});
