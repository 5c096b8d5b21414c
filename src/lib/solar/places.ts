// named places for the sol-air day: the towns of our own scenario. real towns, so real
// coordinates (rounded to 0.01°); the clock is British Summer Time (UTC+1) for the default
// summer date. elevation above sea level, rounded, for Hottel's clear sky.
import type { HottelClimate } from './clearSky.ts';

export interface PlacePreset {
  key: string;
  /** shown to people */
  name: string;
  latitude: number;
  longitude: number;
  timeZone: number;
  elevation: number;
  climate: HottelClimate;
}

export const PLACE_PRESETS: readonly PlacePreset[] = [
  { key: 'harrow-lane', name: 'Harrow Lane Library, Leeds', latitude: 53.8, longitude: -1.55, timeZone: 1, elevation: 60, climate: 'midlatitude-summer' },
  { key: 'calder-row', name: 'Calder Row studio, Hebden Bridge', latitude: 53.74, longitude: -2.01, timeZone: 1, elevation: 120, climate: 'midlatitude-summer' },
  { key: 'plymouth', name: 'Plymouth site office', latitude: 50.37, longitude: -4.14, timeZone: 1, elevation: 30, climate: 'midlatitude-summer' },
];
