// clear-sky irradiance: Hottel's (1976) beam transmittance of a clear atmosphere with 23 km
// visibility, and Liu & Jordan's (1960) diffuse fraction of a clear sky, in the form given by
// Duffie & Beckman, Solar Engineering of Thermal Processes, §2.8 (eqs. 2.8.1, 2.8.2, 2.8.5,
// table 2.8.1) and the extraterrestrial normal irradiance of their eq. 1.4.1a.

/** W/m², the solar constant used by Duffie & Beckman */
export const SOLAR_CONSTANT = 1367;

/** the climate corrections of Hottel's model (Duffie & Beckman table 2.8.1) */
export const HOTTEL_CLIMATES = {
  tropical: { r0: 0.95, r1: 0.98, rk: 1.02 },
  'midlatitude-summer': { r0: 0.97, r1: 0.99, rk: 1.02 },
  'subarctic-summer': { r0: 0.99, r1: 0.99, rk: 1.01 },
  'midlatitude-winter': { r0: 1.03, r1: 1.01, rk: 1.0 },
} as const;
export type HottelClimate = keyof typeof HOTTEL_CLIMATES;
export const HOTTEL_CLIMATE_NAMES = Object.keys(HOTTEL_CLIMATES) as HottelClimate[];

/** W/m² normal to the sun's rays outside the atmosphere on day n of the year (1–365) */
export function extraterrestrialNormal(dayOfYear: number): number {
  return SOLAR_CONSTANT * (1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365));
}

/** Hottel's constants for a site altitude (km, below 2.5 km) and climate */
export function hottelConstants(altitudeKm: number, climate: HottelClimate): { a0: number; a1: number; k: number } {
  const A = Math.min(Math.max(altitudeKm, 0), 2.5);
  const c = HOTTEL_CLIMATES[climate];
  return {
    a0: c.r0 * (0.4237 - 0.00821 * (6 - A) ** 2),
    a1: c.r1 * (0.5055 + 0.00595 * (6.5 - A) ** 2),
    k: c.rk * (0.2711 + 0.01858 * (2.5 - A) ** 2),
  };
}

/** clear-sky irradiance for a sun at zenith angle θz: beam normal to the rays and diffuse on the horizontal, W/m² */
export interface ClearSky {
  /** beam irradiance normal to the sun's rays, W/m² */
  beamNormal: number;
  /** diffuse irradiance on a horizontal surface, W/m² */
  diffuseHorizontal: number;
  /** extraterrestrial normal irradiance, W/m² (for the anisotropy index of Hay–Davies) */
  extraterrestrial: number;
}

/**
 * Hottel (1976) beam and Liu & Jordan (1960) diffuse for a clear sky. `cosZenith` is the
 * cosine of the sun's zenith angle; at or below the horizon everything is zero.
 */
export function hottelClearSky(cosZenith: number, dayOfYear: number, altitudeKm: number, climate: HottelClimate): ClearSky {
  const extraterrestrial = extraterrestrialNormal(dayOfYear);
  if (!(cosZenith > 0)) return { beamNormal: 0, diffuseHorizontal: 0, extraterrestrial };
  const { a0, a1, k } = hottelConstants(altitudeKm, climate);
  const tauBeam = a0 + a1 * Math.exp(-k / cosZenith);
  // Liu & Jordan: τ_d = 0.271 − 0.294 τ_b, for the horizontal diffuse against G_on·cos θz
  const tauDiffuse = Math.max(0, 0.271 - 0.294 * tauBeam);
  return {
    beamNormal: extraterrestrial * Math.max(0, tauBeam),
    diffuseHorizontal: extraterrestrial * cosZenith * tauDiffuse,
    extraterrestrial,
  };
}
