// the exposure in words: every setting that produced a run's figures and only those that
// apply (no absorptance for an upload without irradiance). the Report, the Shared view and
// the CSV export's header lines all write it from here.
import { describeOutdoorAir, describeSunAndSky, effectiveWarmupDays, type Exposure } from '../schemas/workbench.ts';

/** what is known of an uploaded outdoor series (the Report knows it; a guest's page does not name it) */
export interface UploadFacts {
  name?: string;
  hours?: number;
  hasIrradiance: boolean;
}

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
    lines.push(['Outdoor air', describeOutdoorAir(out)]);
    if (out.mode === 'solair') {
      lines.push(['Sun and sky on the face', `${describeSunAndSky(out) ?? ''}; solar absorptance ${num(out.absorptance, 2)}`]);
    }
  }
  const ind = e.indoor;
  lines.push([
    'Indoor air',
    ind.mode === 'constant' ? `constant ${num(ind.value, 1)} °C` : `24-hour schedule from ${num(Math.min(...ind.hourly), 1)} to ${num(Math.max(...ind.hourly), 1)} °C`,
  ]);
  lines.push(['Surface resistances', `R_si ${num(e.insideSurfaceResistance, 2)} m²K/W (${e.heatFlowDirection} heat flow); R_se ${num(e.outsideSurfaceResistance, 2)} m²K/W`]);
  const c = e.climate;
  lines.push([
    'Monthly climate (moisture check)',
    c
      ? `12 months outdoors from ${num(Math.min(...c.months.map((m) => m.temperature)), 1)} to ${num(Math.max(...c.months.map((m) => m.temperature)), 1)} °C; indoors ${num(c.indoor.temperature, 1)} °C at ${'humidityClass' in c.indoor ? `ISO 13788 humidity class ${c.indoor.humidityClass}` : `${num(c.indoor.relativeHumidity, 0)} % relative humidity`}`
      : 'none: no moisture check',
  ]);
  return lines;
}

/** how the engine ran it */
export function runLines(e: Exposure): [string, string][] {
  return [
    [
      'Run length',
      e.outdoor.mode === 'series'
        ? `${e.days} ${e.days === 1 ? 'day' : 'days'} reported after ${effectiveWarmupDays(e)} warm-up ${effectiveWarmupDays(e) === 1 ? 'day' : 'days'}`
        : `${e.days} ${e.days === 1 ? 'day' : 'days'} reported, starting in the periodic state of the repeating day`,
    ],
    ['Engine', `Crank–Nicolson; time step ${e.timeStep} s; largest cell ${num(e.maxCellSize * 1000, 1)} mm; at least 4 cells per layer; backward-Euler start-up sub-steps after a jump of the driving temperature`],
  ];
}
