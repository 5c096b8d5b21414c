// the exposure in words: every setting that produced a run's figures and only those that
// apply (no absorptance for an upload without irradiance). the Report, the Shared view and
// the CSV export's header lines all write it from here.
import type { Exposure } from '../schemas/workbench.ts';

/** what is known of an uploaded outdoor series (the Report knows it; a guest's page does not name it) */
export interface UploadFacts {
  name?: string;
  hours?: number;
  hasIrradiance: boolean;
}

const clock = (h: number) => `${String(Math.floor(h)).padStart(2, '0')}:${String(Math.round((h % 1) * 60)).padStart(2, '0')}`;
const num = (v: number, digits: number) => v.toFixed(digits).replace(/^-/, '\u2212');

/** the outdoor, indoor and surface settings, as label and text */
export function exposureLines(e: Exposure, upload: UploadFacts | null = null): [string, string][] {
  const out = e.outdoor;
  const lines: [string, string][] = [];
  if (out.mode === 'series') {
    const named = upload?.name ? ` "${upload.name}"` : '';
    const hours = upload?.hours ? ` (${upload.hours.toLocaleString('en-GB')} h)` : '';
    lines.push(['Outdoor air', `uploaded hourly series${named}${hours}, repeated when the run is longer`]);
    if (upload?.hasIrradiance) lines.push(['Sun on the face', `the upload's irradiance column; solar absorptance ${num(out.absorptance, 2)}`]);
    else lines.push(['Sun on the face', 'none: the upload has no irradiance column']);
  } else {
    lines.push(['Outdoor air', `daily sine: mean ${num(out.mean, 1)} °C; swing ${num(out.swing, 1)} K; peak at ${clock(out.peakHour)}`]);
    if (out.mode === 'solair') {
      lines.push(['Sun on the face', `clear-day half sine: peak ${num(out.peakIrradiance, 0)} W/m² from ${clock(out.sunrise)} to ${clock(out.sunset)}; solar absorptance ${num(out.absorptance, 2)}`]);
    }
  }
  const ind = e.indoor;
  lines.push([
    'Indoor air',
    ind.mode === 'constant' ? `constant ${num(ind.value, 1)} °C` : `24-hour schedule from ${num(Math.min(...ind.hourly), 1)} to ${num(Math.max(...ind.hourly), 1)} °C`,
  ]);
  lines.push(['Surface resistances', `R_si ${num(e.insideSurfaceResistance, 2)} m²K/W (${e.heatFlowDirection} heat flow); R_se ${num(e.outsideSurfaceResistance, 2)} m²K/W`]);
  lines.push(['Indoor relative humidity', e.indoorRelativeHumidity === null ? 'not given: no dew-point check' : `${num(e.indoorRelativeHumidity, 0)} % (for the dew-point check)`]);
  return lines;
}

/** how the engine ran it */
export function runLines(e: Exposure): [string, string][] {
  return [
    ['Run length', `${e.days} ${e.days === 1 ? 'day' : 'days'} reported after ${e.warmupDays} warm-up ${e.warmupDays === 1 ? 'day' : 'days'}`],
    ['Engine', `Crank–Nicolson; time step ${e.timeStep} s; largest cell ${num(e.maxCellSize * 1000, 1)} mm; at least 4 cells per layer`],
  ];
}
