// the surface check of ISO 13788:2012 clause 6: the temperature factor of the inside surface
// against the lowest one that keeps the surface below 80 % relative humidity (mould) and
// below saturation (surface condensation), month by month.
import { insideVapourPressure, type Climate } from './climate.ts';
import { saturationTemperature } from './saturation.ts';
import type { MoistureLayer } from './glaser.ts';

/** inside surface resistance of the surface check on opaque elements, m²K/W (ISO 13788:2012 4.3, from memory) */
export const SURFACE_CHECK_RSI = 0.25;
/** outside surface resistance, m²K/W (ISO 6946, as ISO 13788:2012 4.3 refers to it, from memory) */
export const SURFACE_CHECK_RSE = 0.04;
/** the surface relative humidity above which mould is taken to grow (ISO 13788:2012 6.2, from memory) */
export const MOULD_SURFACE_HUMIDITY = 0.8;

export interface SurfaceMonth {
  /** 1…12 */
  month: number;
  /** Pa */
  insideVapourPressure: number;
  /** °C: lowest inside surface temperature for at most 80 % surface humidity */
  minimumSurfaceTemperatureMould: number;
  /** °C: the dew point of the indoor air */
  minimumSurfaceTemperatureCondensation: number;
  /** f_Rsi,min for mould; null when the month has no heat loss (θ_i ≤ θ_e) */
  fRsiMinMould: number | null;
  /** f_Rsi,min for surface condensation; null when the month has no heat loss */
  fRsiMinCondensation: number | null;
  /** °C: the inside surface temperature of the build-up in the month (with R_si = 0.25 m²K/W) */
  surfaceTemperature: number;
  mouldRisk: boolean;
  condensationRisk: boolean;
}

export interface SurfaceCheck {
  /** the build-up's temperature factor f_Rsi = (θ_si − θ_e)/(θ_i − θ_e) = 1 − R_si/R_T */
  fRsi: number;
  /** the largest f_Rsi,min for mould over the months, and its month (1…12); null when no month loses heat */
  fRsiMin: number | null;
  criticalMonth: number | null;
  /** the largest f_Rsi,min for surface condensation */
  fRsiMinCondensation: number | null;
  mouldRisk: boolean;
  condensationRisk: boolean;
  months: SurfaceMonth[];
}

/** f_Rsi = (R_T − R_si)/R_T with R_T = R_se + Σ d/λ + R_si (ISO 13788:2012 3.1 and 6.2, from memory) */
export function temperatureFactor(layers: MoistureLayer[], rsi = SURFACE_CHECK_RSI, rse = SURFACE_CHECK_RSE): number {
  const rt = rse + layers.reduce((a, l) => a + l.thickness / l.conductivity, 0) + rsi;
  return (rt - rsi) / rt;
}

/** the surface check over twelve months (ISO 13788:2012 clause 6, from memory) */
export function surfaceCheck(layers: MoistureLayer[], climate: Climate): SurfaceCheck {
  const fRsi = temperatureFactor(layers);
  const ti = climate.indoor.temperature;
  let fRsiMin: number | null = null;
  let criticalMonth: number | null = null;
  let fRsiMinCondensation: number | null = null;
  const months = climate.months.map((m, i): SurfaceMonth => {
    const pi = insideVapourPressure(climate.indoor, m);
    const mould = saturationTemperature(pi / MOULD_SURFACE_HUMIDITY);
    const dew = saturationTemperature(pi);
    const loses = ti > m.temperature;
    const fm = loses ? (mould - m.temperature) / (ti - m.temperature) : null;
    const fc = loses ? (dew - m.temperature) / (ti - m.temperature) : null;
    if (fm !== null && (fRsiMin === null || fm > fRsiMin)) {
      fRsiMin = fm;
      criticalMonth = i + 1;
    }
    if (fc !== null && (fRsiMinCondensation === null || fc > fRsiMinCondensation)) fRsiMinCondensation = fc;
    const surfaceTemperature = m.temperature + fRsi * (ti - m.temperature);
    return {
      month: i + 1,
      insideVapourPressure: pi,
      minimumSurfaceTemperatureMould: mould,
      minimumSurfaceTemperatureCondensation: dew,
      fRsiMinMould: fm,
      fRsiMinCondensation: fc,
      surfaceTemperature,
      mouldRisk: fm !== null ? fRsi < fm : surfaceTemperature < mould,
      condensationRisk: fc !== null ? fRsi < fc : surfaceTemperature < dew,
    };
  });
  return {
    fRsi,
    fRsiMin,
    criticalMonth,
    fRsiMinCondensation,
    mouldRisk: fRsiMin !== null && fRsi < fRsiMin,
    condensationRisk: fRsiMinCondensation !== null && fRsi < fRsiMinCondensation,
    months,
  };
}
