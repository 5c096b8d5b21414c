// one clear day of irradiance on a face, set by place, date and face: the sun from suncalc,
// the clear sky by Hottel (1976) with Liu & Jordan (1960) diffuse, onto the face by the chosen
// transposition model. sampled every 600 s of local clock time from midnight: 144 values, a
// day that repeats with exactly 86,400 s.
import { sunPosition } from './sunPosition.ts';
import { hottelClearSky, type HottelClimate } from './clearSky.ts';
import { irradianceOnFace, type Face, type TranspositionModel } from './transposition.ts';

export const CLEAR_DAY_STEP = 600;
export const CLEAR_DAY_SAMPLES = 86400 / CLEAR_DAY_STEP; // 144

export interface PlaceAndDate {
  /** degrees north */
  latitude: number;
  /** degrees east */
  longitude: number;
  /** h: the clock's offset from UTC (+1 for British Summer Time) */
  timeZone: number;
  /** m above sea level */
  elevation: number;
  /** YYYY-MM-DD */
  date: string;
}

export interface ClearDaySpec extends PlaceAndDate {
  face: Face;
  groundReflectance: number;
  climate: HottelClimate;
  transposition: TranspositionModel;
}

/** day of the year, 1–366, of a YYYY-MM-DD date */
export function dayOfYear(date: string): number {
  const [y, m, d] = date.split('-').map(Number);
  return Math.round((Date.UTC(y, m - 1, d) - Date.UTC(y, 0, 1)) / 86400000) + 1;
}

/** the UTC instant of local clock time `seconds` after midnight of the date */
export function instantOf(place: PlaceAndDate, seconds: number): Date {
  const [y, m, d] = place.date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d) + (seconds - place.timeZone * 3600) * 1000);
}

export interface ClearDaySample {
  /** s of local clock time from midnight */
  time: number;
  sunAzimuth: number;
  sunAltitude: number;
  /** W/m² on the face */
  irradiance: number;
}

/** every 600 s of the day: the sun's position and the irradiance on the face (144 samples) */
export function clearDayOnFace(spec: ClearDaySpec): ClearDaySample[] {
  const n = dayOfYear(spec.date);
  const samples: ClearDaySample[] = [];
  for (let i = 0; i < CLEAR_DAY_SAMPLES; i++) {
    const time = i * CLEAR_DAY_STEP;
    const sun = sunPosition(instantOf(spec, time), spec.latitude, spec.longitude);
    const cosZ = Math.sin((sun.altitude * Math.PI) / 180);
    const sky = hottelClearSky(cosZ, n, spec.elevation / 1000, spec.climate);
    const irradiance = irradianceOnFace(spec.transposition, sky, sun.azimuth, sun.altitude, spec.face, spec.groundReflectance);
    samples.push({ time, sunAzimuth: sun.azimuth, sunAltitude: sun.altitude, irradiance });
  }
  return samples;
}

/** the 144 irradiance values, W/m², rounded to 0.01 W/m² */
export function clearDayIrradianceOnFace(spec: ClearDaySpec): number[] {
  return clearDayOnFace(spec).map((s) => Math.round(s.irradiance * 100) / 100);
}
