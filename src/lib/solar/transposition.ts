// irradiance on a tilted face from beam-normal and horizontal-diffuse irradiance
// (Duffie & Beckman §1.6 for the angle of incidence, §2.15–2.16 for the sky models):
// isotropic sky of Liu & Jordan (1963), or the Hay & Davies (1980) sky with circumsolar diffuse.

export const TRANSPOSITION_MODELS = ['isotropic', 'hay-davies'] as const;
export type TranspositionModel = (typeof TRANSPOSITION_MODELS)[number];

const rad = Math.PI / 180;

/** the face: outward normal's azimuth clockwise from north, and tilt from horizontal (90 = wall), degrees */
export interface Face {
  azimuth: number;
  tilt: number;
}

/** cosine of the angle of incidence of the beam on the face (Duffie & Beckman eq. 1.6.3 in horizontal coordinates) */
export function cosIncidence(sunAzimuth: number, sunAltitude: number, face: Face): number {
  const zenith = (90 - sunAltitude) * rad;
  const beta = face.tilt * rad;
  return Math.cos(zenith) * Math.cos(beta) + Math.sin(zenith) * Math.sin(beta) * Math.cos((sunAzimuth - face.azimuth) * rad);
}

/**
 * W/m² on the face. beam normal `Gbn`, horizontal diffuse `Gd`, extraterrestrial normal `Gon`,
 * the sun's azimuth and altitude (degrees), the ground's reflectance ρg (0–1).
 * Isotropic (Liu & Jordan 1963): G_T = G_bn·cos θ + G_d·(1 + cos β)/2 + G·ρg·(1 − cos β)/2.
 * Hay–Davies: the diffuse splits into a circumsolar part A_i = G_bn/G_on that comes with the beam
 * (× cos θ / cos θz) and an isotropic remainder (1 − A_i).
 */
export function irradianceOnFace(
  model: TranspositionModel,
  sky: { beamNormal: number; diffuseHorizontal: number; extraterrestrial: number },
  sunAzimuth: number,
  sunAltitude: number,
  face: Face,
  groundReflectance: number,
): number {
  if (sunAltitude <= 0) return 0;
  const cosZ = Math.sin(sunAltitude * rad);
  const cosTheta = Math.max(0, cosIncidence(sunAzimuth, sunAltitude, face));
  const cosBeta = Math.cos(face.tilt * rad);
  const global = sky.beamNormal * cosZ + sky.diffuseHorizontal;
  const beam = sky.beamNormal * cosTheta;
  const ground = global * groundReflectance * ((1 - cosBeta) / 2);
  if (model === 'isotropic') return beam + sky.diffuseHorizontal * ((1 + cosBeta) / 2) + ground;
  const ai = sky.extraterrestrial > 0 ? Math.min(1, sky.beamNormal / sky.extraterrestrial) : 0;
  // circumsolar diffuse follows the beam's geometry; keep cos θz away from zero at the horizon (Duffie & Beckman's own caution)
  const rb = cosTheta / Math.max(cosZ, Math.sin(5 * rad));
  return beam + sky.diffuseHorizontal * (ai * rb + (1 - ai) * ((1 + cosBeta) / 2)) + ground;
}
