// the monthly climate of the ISO 13788 method: outdoor temperature and humidity per month,
// and the indoor air either at a fixed relative humidity or by an internal humidity class.
import { saturationPressure, vapourPressure } from './saturation.ts';

/** one calendar month outdoors: mean air temperature, °C, and mean relative humidity, % */
export interface MonthClimate {
  temperature: number;
  relativeHumidity: number;
}

/** the indoor air: its temperature, °C, and either a fixed relative humidity (%) or a humidity class 1–5 */
export type IndoorClimate = { temperature: number; relativeHumidity: number } | { temperature: number; humidityClass: HumidityClass };

export type HumidityClass = 1 | 2 | 3 | 4 | 5;

/** twelve months, January first, and the indoor air */
export interface Climate {
  months: MonthClimate[];
  indoor: IndoorClimate;
}

/** days in each calendar month of a common year (the method's monthly time, ISO 13788:2012 7.1) */
export const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;

export const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'] as const;
export const MONTH_SHORT = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

/**
 * internal moisture supply Δp, Pa, of each humidity class at outdoor temperatures of 0 °C and
 * below; it falls linearly to zero at 20 °C (ISO 13788:2012 Annex A, Figure A.2, from memory:
 * 1 unoccupied or storage, 2 offices and dwellings with low occupancy, 3 dwellings of unknown
 * occupancy, 4 sports halls, kitchens and canteens, 5 special buildings such as laundries,
 * breweries and swimming pools)
 */
export const HUMIDITY_CLASS_DELTA_P: Record<HumidityClass, number> = { 1: 270, 2: 540, 3: 810, 4: 1080, 5: 1350 };

export const HUMIDITY_CLASS_LABELS: Record<HumidityClass, string> = {
  1: 'Class 1: unoccupied, storage',
  2: 'Class 2: offices, dwellings with low occupancy',
  3: 'Class 3: dwellings of unknown occupancy',
  4: 'Class 4: sports halls, kitchens, canteens',
  5: 'Class 5: laundries, breweries, swimming pools',
};

/** the safety factor on the internal moisture supply (ISO 13788:2012 Annex A, from memory; the clause number not checked) */
export const MOISTURE_SUPPLY_SAFETY_FACTOR = 1.1;

/** internal moisture supply Δp, Pa, of a humidity class at an outdoor temperature θ_e (before the safety factor) */
export function moistureSupply(humidityClass: HumidityClass, outsideTemperature: number): number {
  const top = HUMIDITY_CLASS_DELTA_P[humidityClass];
  if (outsideTemperature <= 0) return top;
  if (outsideTemperature >= 20) return 0;
  return top * (1 - outsideTemperature / 20);
}

/**
 * the indoor vapour pressure, Pa, in a month: φ_i·p_sat(θ_i) with a fixed humidity, or
 * p_e + 1.10·Δp with a humidity class (ISO 13788:2012 Annex A, from memory),
 * never above saturation at the indoor temperature
 */
export function insideVapourPressure(indoor: IndoorClimate, month: MonthClimate): number {
  const sat = saturationPressure(indoor.temperature);
  if ('humidityClass' in indoor) {
    const pe = vapourPressure(month.temperature, month.relativeHumidity);
    return Math.min(sat, pe + MOISTURE_SUPPLY_SAFETY_FACTOR * moistureSupply(indoor.humidityClass, month.temperature));
  }
  return (indoor.relativeHumidity / 100) * sat;
}
