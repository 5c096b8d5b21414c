import { describe, expect, it } from 'vitest';
import { julian, solar, sidereal, coord, globe, refraction, deltat } from 'astronomia';
import { sunPosition } from '../../../src/lib/solar/sunPosition';

const R2D = 180 / Math.PI;
const D2R = Math.PI / 180;

/** the sun by Meeus's algorithms (astronomia): apparent equatorial (ch. 25) to horizontal (ch. 13), Sæmundsson refraction (ch. 16) */
function meeus(when: Date, latitude: number, longitude: number): { azimuth: number; altitude: number } {
  const jd = julian.DateToJD(when);
  const year = when.getUTCFullYear() + when.getUTCMonth() / 12;
  const jde = jd + deltat.deltaT(year) / 86400;
  const eq = solar.apparentEquatorial(jde);
  // astronomia takes longitude positive westward and gives azimuth from the south, westward
  const hz = new coord.Equatorial(eq.ra, eq.dec).toHorizontal(new globe.Coord(latitude * D2R, -longitude * D2R), sidereal.apparent(jd));
  const altitude = hz.alt + refraction.saemundsson(hz.alt);
  return { azimuth: (((hz.az * R2D + 180) % 360) + 360) % 360, altitude: altitude * R2D };
}

const angleDiff = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);

describe('sunPosition (suncalc) against astronomia (Meeus)', () => {
  const places = [
    ['Leeds', 53.8, -1.55],
    ['Plymouth', 50.37, -4.14],
    ['Singapore', 1.35, 103.82],
    ['Cape Town', -33.92, 18.42],
    ['Denver', 39.74, -104.99],
  ] as const;
  const dates = ['2026-03-20', '2026-06-21', '2026-09-23', '2026-12-21', '2030-02-11'];

  it('agrees within 0.1° in altitude and 0.2° in azimuth whenever the sun is 5° or more above the horizon', () => {
    let worstAlt = 0;
    let worstAz = 0;
    let checked = 0;
    for (const [, lat, lon] of places) {
      for (const date of dates) {
        for (let minutes = 0; minutes < 1440; minutes += 20) {
          const when = new Date(Date.parse(`${date}T00:00:00Z`) + minutes * 60000);
          const a = sunPosition(when, lat, lon);
          const b = meeus(when, lat, lon);
          if (b.altitude < 5) continue;
          checked++;
          worstAlt = Math.max(worstAlt, Math.abs(a.altitude - b.altitude));
          // azimuth is ill-defined near the zenith; weigh it by the cosine of the altitude
          worstAz = Math.max(worstAz, angleDiff(a.azimuth, b.azimuth) * Math.cos(b.altitude * D2R));
        }
      }
    }
    expect(checked).toBeGreaterThan(500);
    expect(worstAlt).toBeLessThan(0.1);
    expect(worstAz).toBeLessThan(0.2);
  });

  it('puts the sun due south at its highest over Greenwich near 12:00 UTC at the March equinox, at 90° − latitude (NOAA: equation of time about −7.5 min)', () => {
    // NOAA solar calculator, 20 March 2026 at Greenwich (51.48° N, 0°): solar noon about 12:07:30 UTC, elevation about 38.5° (from memory)
    const noon = new Date(Date.UTC(2026, 2, 20, 12, 7, 30));
    const p = sunPosition(noon, 51.48, 0);
    expect(angleDiff(p.azimuth, 180)).toBeLessThan(0.5);
    expect(Math.abs(p.altitude - 38.5)).toBeLessThan(0.3);
  });
});
