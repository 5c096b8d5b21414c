// the sun's position in the sky, from the suncalc package (Agafonkin; the low-precision
// formulas of the Astronomy Answers articles on the sun's position). checked in the tests
// against astronomia (Meeus, Astronomical Algorithms, chapters 13 and 25).
import { getPosition } from 'suncalc';

/** where the sun stands: degrees; azimuth clockwise from north (0 N, 90 E, 180 S, 270 W) */
export interface SunPosition {
  azimuth: number;
  /** apparent altitude above the horizon (refraction included), degrees */
  altitude: number;
}

/** the sun's position at a UTC instant seen from a place (latitude north +, longitude east +, degrees) */
export function sunPosition(when: Date, latitude: number, longitude: number): SunPosition {
  const p = getPosition(when, latitude, longitude);
  return { azimuth: ((p.azimuth % 360) + 360) % 360, altitude: p.altitude };
}
