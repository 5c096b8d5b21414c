// net long-wave loss of an outer surface to the sky, by the simplified method of
// ISO 13790:2008 §11.4.6 (kept in ISO 52016-1:2017 §6.5.13): the extra loss to the sky is
// q = F_r · h_r · Δθ_er with h_r = 5·ε W/m²K (the standard's first approximation),
// Δθ_er = 11 K (its average difference between the outdoor air and the apparent sky in
// intermediate zones) and the form factor to the sky F_r = (1 + cos β)/2 for an unshaded face
// of tilt β (1 for a flat roof, 0.5 for a wall).

/** K, ISO 13790 §11.4.6 */
export const SKY_TEMPERATURE_DEPRESSION = 11;
/** W/(m²K) per unit emissivity, ISO 13790 §11.4.6 (h_r = 5 ε) */
export const RADIATIVE_COEFFICIENT_PER_EMISSIVITY = 5;

/** the form factor between a face of tilt β (degrees) and the sky */
export function skyViewFactor(tilt: number): number {
  return (1 + Math.cos((tilt * Math.PI) / 180)) / 2;
}

/** W/m², positive = loss: the net long-wave loss of the face to the sky */
export function skyLongWaveLoss(emissivity: number, tilt: number): number {
  return skyViewFactor(tilt) * RADIATIVE_COEFFICIENT_PER_EMISSIVITY * emissivity * SKY_TEMPERATURE_DEPRESSION;
}
