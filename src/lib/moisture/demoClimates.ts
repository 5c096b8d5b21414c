// demo climates of Wallpulse's own scenario (the fictional Harrow Lane Library and its
// neighbours): monthly means written for the demo, not measured data of any real place.
import type { Climate, MonthClimate } from './climate.ts';

export interface DemoClimate {
  key: string;
  name: string;
  description: string;
  climate: Climate;
}

const months = (t: number[], rh: number[]): MonthClimate[] => t.map((temperature, i) => ({ temperature, relativeHumidity: rh[i] }));

export const DEMO_CLIMATES: readonly DemoClimate[] = [
  {
    key: 'harrow-lane',
    name: 'Harrow Lane, town site (demo)',
    description: 'The library’s own site: monthly means in the range of a northern inland town, written for the demo. Reading room at 20 °C, humidity class 3 (occupancy not known in detail).',
    climate: {
      months: months([4.0, 4.3, 6.2, 8.4, 11.5, 14.3, 16.4, 16.1, 13.7, 10.3, 6.8, 4.4], [88, 85, 80, 74, 72, 72, 71, 74, 79, 84, 88, 89]),
      indoor: { temperature: 20, humidityClass: 3 },
    },
  },
  {
    key: 'calder-moor',
    name: 'Calder moor edge, upland (demo)',
    description: 'A colder, wetter upland site above the town, with frosty winters, for testing a build-up under harder conditions. Indoor 20 °C at 50 % relative humidity.',
    climate: {
      months: months([-4.5, -3.6, -0.4, 4.0, 9.0, 12.6, 14.8, 14.4, 10.8, 6.0, 1.0, -2.8], [92, 90, 86, 80, 77, 78, 79, 81, 85, 89, 92, 93]),
      indoor: { temperature: 20, relativeHumidity: 50 },
    },
  },
  {
    key: 'harbour-front',
    name: 'Harbour front, mild coast (demo)',
    description: 'A mild, damp coastal site with few frosts. Indoor 20 °C, humidity class 2 (offices, low occupancy).',
    climate: {
      months: months([5.6, 5.7, 7.2, 9.0, 12.0, 14.6, 16.6, 16.8, 15.0, 12.2, 8.8, 6.6], [86, 84, 82, 79, 78, 79, 79, 80, 81, 84, 86, 87]),
      indoor: { temperature: 20, humidityClass: 2 },
    },
  },
];

/** a copy of a demo climate by key (the first when the key is unknown) */
export function demoClimate(key = 'harrow-lane'): Climate {
  const d = DEMO_CLIMATES.find((c) => c.key === key) ?? DEMO_CLIMATES[0];
  return { months: d.climate.months.map((m) => ({ ...m })), indoor: { ...d.climate.indoor } };
}
