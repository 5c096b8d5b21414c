import { describe, expect, it } from 'vitest';
import { extraterrestrialNormal, hottelClearSky, hottelConstants } from '../../../src/lib/solar/clearSky';
import { cosIncidence, irradianceOnFace } from '../../../src/lib/solar/transposition';
import { skyLongWaveLoss, skyViewFactor } from '../../../src/lib/solar/longWave';
import { clearDayOnFace, dayOfYear } from '../../../src/lib/solar/clearDay';

describe('Hottel clear sky', () => {
  // Duffie & Beckman, Solar Engineering of Thermal Processes, Example 2.8.1 (values from memory): Madison, 270 m,
  // 22 August, 11:30 solar time, cos θz = 0.846, mid-latitude summer (climate factors 0.97, 0.99, 1.02):
  // a0 = 0.1496, a1 = 0.7290, k = 0.3708, τb = 0.62, G_on = 1339 W/m², G_cnb ≈ 830 W/m², G_cb ≈ 702 W/m²
  it('reproduces the worked example of Duffie & Beckman §2.8 (Madison, 22 August)', () => {
    const c = hottelConstants(0.27, 'midlatitude-summer');
    expect(c.a0).toBeCloseTo(0.1496, 3);
    expect(c.a1).toBeCloseTo(0.729, 3);
    expect(c.k).toBeCloseTo(0.3708, 3);
    const n = dayOfYear('2026-08-22');
    expect(n).toBe(234);
    expect(extraterrestrialNormal(n)).toBeCloseTo(1339, -1);
    const sky = hottelClearSky(0.846, n, 0.27, 'midlatitude-summer');
    const tauB = sky.beamNormal / sky.extraterrestrial;
    expect(tauB).toBeCloseTo(0.62, 2);
    expect(sky.beamNormal).toBeGreaterThan(820);
    expect(sky.beamNormal).toBeLessThan(840);
    expect(sky.beamNormal * 0.846).toBeGreaterThan(692);
    expect(sky.beamNormal * 0.846).toBeLessThan(712);
    // Liu & Jordan (1960): τd = 0.271 − 0.294 τb
    expect(sky.diffuseHorizontal / (sky.extraterrestrial * 0.846)).toBeCloseTo(0.271 - 0.294 * tauB, 10);
  });

  it('gives nothing with the sun below the horizon', () => {
    expect(hottelClearSky(-0.1, 172, 0, 'midlatitude-summer')).toMatchObject({ beamNormal: 0, diffuseHorizontal: 0 });
  });
});

describe('transposition onto the face', () => {
  const sky = { beamNormal: 800, diffuseHorizontal: 100, extraterrestrial: 1350 };
  it('gives a horizontal face the global horizontal irradiance, with either sky model (Duffie & Beckman eq. 2.15.1 at β = 0)', () => {
    for (const model of ['isotropic', 'hay-davies'] as const) {
      const g = irradianceOnFace(model, sky, 200, 40, { azimuth: 0, tilt: 0 }, 0.2);
      expect(g).toBeCloseTo(800 * Math.sin((40 * Math.PI) / 180) + 100, 9);
    }
  });

  it('gives a wall facing away from the sun only sky diffuse and ground reflection (isotropic: half of each)', () => {
    const alt = 30;
    const g = irradianceOnFace('isotropic', sky, 180, alt, { azimuth: 0, tilt: 90 }, 0.2);
    const global = 800 * Math.sin((alt * Math.PI) / 180) + 100;
    expect(g).toBeCloseTo(100 / 2 + (global * 0.2) / 2, 9);
  });

  it('finds normal incidence when the face looks straight at the sun', () => {
    expect(cosIncidence(250, 35, { azimuth: 250, tilt: 55 })).toBeCloseTo(1, 12);
  });
});

describe('sky long-wave loss, ISO 13790 §11.4.6', () => {
  it('is F_r · 5ε · 11 K: 49.5 W/m² for a flat roof and 24.75 W/m² for a wall at ε = 0.9', () => {
    expect(skyViewFactor(0)).toBe(1);
    expect(skyViewFactor(90)).toBeCloseTo(0.5, 12);
    expect(skyLongWaveLoss(0.9, 0)).toBeCloseTo(49.5, 10);
    expect(skyLongWaveLoss(0.9, 90)).toBeCloseTo(24.75, 10);
  });
});

describe('a clear day on a face', () => {
  const leeds = { latitude: 53.8, longitude: -1.55, timeZone: 1, elevation: 60, date: '2026-07-21', groundReflectance: 0.2, climate: 'midlatitude-summer' as const, transposition: 'isotropic' as const };
  it('samples 144 values every 600 s from local midnight, sunny on a west wall in the afternoon only', () => {
    const west = clearDayOnFace({ ...leeds, face: { azimuth: 270, tilt: 90 } });
    expect(west).toHaveLength(144);
    expect(west[1].time).toBe(600);
    const at = (h: number) => west[h * 6].irradiance;
    expect(at(0)).toBe(0);
    expect(at(17)).toBeGreaterThan(400);
    // the morning brings only diffuse and ground reflection to a west wall
    expect(at(9)).toBeLessThan(150);
    const peak = west.reduce((a, s) => (s.irradiance > a.irradiance ? s : a));
    expect(peak.time / 3600).toBeGreaterThan(16);
    expect(peak.time / 3600).toBeLessThan(19.5);
  });

  it('peaks on a south wall near solar noon, 13:06 BST at Leeds (the longitude adds 6 min, the equation of time about 6.5 min in late July)', () => {
    const south = clearDayOnFace({ ...leeds, face: { azimuth: 180, tilt: 90 } });
    const peak = south.reduce((a, s) => (s.irradiance > a.irradiance ? s : a));
    expect(Math.abs(peak.time - (13 * 3600 + 12 * 60))).toBeLessThanOrEqual(1200);
  });
});
