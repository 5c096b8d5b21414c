// the rows of a run's figures table: simulated beside analytic, each with its unit and how it
// was computed. the Response pane, the Report and the Shared view all show these rows.
import type { RunDone } from './runDocument.ts';
import type { Exposure } from '../schemas/workbench.ts';
import { dayClock } from './figures.ts';
import { fixed } from './figureDefs.ts';

const H = 3600;

export interface FigureRow {
  key: string;
  label: string;
  unit: string;
  simulated: string;
  analytic: string;
  note?: string;
  how: string;
  warn?: boolean;
  /** the engine's housekeeping (energy balance, mesh) is not shown to a guest */
  client?: boolean;
}

/** the rows a guest sees on the Shared view */
export const clientRows = (rows: FigureRow[]) => rows.filter((r) => r.client !== false);

export function figureRows(run: RunDone, exposure: Exposure): FigureRow[] {
  const f = run.figures;
  const a = run.analytic;
  const lastDay = `the last simulated day (${dayClock(f.lastPeriodFrom - exposure.warmupDays * 86400)} to the end)`;
  const drive = run.series.solAir.some((v, k) => v !== run.series.outsideAir[k]) ? 'sol-air temperature' : 'outdoor air temperature';
  const rows: FigureRow[] = [
    {
      key: 'uValue',
      label: 'U-value',
      unit: 'W/m²K',
      simulated: '',
      analytic: fixed(a.steady.uValue, 3),
      how: 'Steady state: 1 / (R_se + Σ d/λ + R_si), ISO 6946.',
    },
    {
      key: 'decrementFactor',
      label: 'Decrement factor',
      unit: '–',
      simulated: fixed(f.decrementFactor.simulated, 3),
      analytic: fixed(f.decrementFactor.analytic, 3),
      how: `Simulated: amplitude of the first harmonic of the inside heat flux over ${lastDay}, divided by the amplitude of the first harmonic of the ${drive} and by the U-value. Analytic: ISO 13786 transfer matrices, |Y₁₂| / U.`,
    },
    {
      key: 'timeLag',
      label: 'Time lag',
      unit: 'h',
      simulated: fixed(f.timeLag.simulated / H, 2),
      analytic: fixed(f.timeLag.analytic / H, 2),
      how: `Simulated: phase of the first harmonic of the inside heat flux minus that of the ${drive}, over ${lastDay}. Analytic: ISO 13786, the phase of Y₁₂.`,
    },
    {
      key: 'periodicTransmittance',
      label: 'Periodic thermal transmittance',
      unit: 'W/m²K',
      simulated: fixed(f.periodicTransmittance.simulated, 3),
      analytic: fixed(f.periodicTransmittance.analytic, 3),
      how: 'Inside heat flux amplitude per kelvin of outdoor amplitude; simulated from the fitted harmonics, analytic |Y₁₂| of ISO 13786.',
    },
    {
      key: 'peakInsideFlux',
      label: 'Peak inside heat flux',
      unit: 'W/m²',
      simulated: fixed(f.peakInsideFlux.value, 2),
      analytic: '',
      note: dayClock(f.peakInsideFlux.time),
      how: 'Largest inside heat flux (positive into the room) at the output times of the reported days.',
    },
    {
      key: 'heatGained',
      label: 'Heat into the room, last day',
      unit: 'Wh/m²',
      simulated: fixed(f.heatGained, 1),
      analytic: '',
      how: `Time integral of the positive part of the inside heat flux over ${lastDay} (trapezoids split where the flux changes sign).`,
    },
    {
      key: 'heatLost',
      label: 'Heat out of the room, last day',
      unit: 'Wh/m²',
      simulated: fixed(f.heatLost, 1),
      analytic: '',
      how: `Time integral of the negative part of the inside heat flux over ${lastDay}, shown as a positive amount.`,
    },
    {
      key: 'insideSurfaceMin',
      label: 'Inside surface, lowest',
      unit: '°C',
      simulated: fixed(f.insideSurfaceMin.value, 2),
      analytic: '',
      note: dayClock(f.insideSurfaceMin.time),
      how: 'Lowest inside surface temperature at the output times of the reported days.',
    },
    {
      key: 'insideSurfaceMax',
      label: 'Inside surface, highest',
      unit: '°C',
      simulated: fixed(f.insideSurfaceMax.value, 2),
      analytic: '',
      note: dayClock(f.insideSurfaceMax.time),
      how: 'Highest inside surface temperature at the output times of the reported days.',
    },
  ];
  if (f.lowestInterface) {
    rows.push({
      key: 'lowestInterface',
      label: 'Lowest interface temperature',
      unit: '°C',
      simulated: fixed(f.lowestInterface.value, 2),
      analytic: '',
      note: `${f.lowestInterface.name}, ${dayClock(f.lowestInterface.time)}`,
      how: 'Lowest temperature of any interface between two layers at the output times of the reported days.',
      warn: f.belowDewPoint,
    });
  }
  if (f.dewPoint) {
    rows.push({
      key: 'dewPoint',
      label: 'Dew point of the indoor air',
      unit: '°C',
      simulated: fixed(f.dewPoint.value, 2),
      analytic: '',
      note: `at ${fixed(f.dewPoint.airTemperature, 1)} °C and ${fixed(f.dewPoint.relativeHumidity, 0)} % RH`,
      how: 'Magnus formula (Alduchov & Eskridge coefficients, over water) at the mean indoor air temperature of the reported days and the indoor relative humidity.',
      warn: f.belowDewPoint,
    });
  }
  rows.push(
    {
      key: 'energyBalanceError',
      client: false,
      label: 'Energy-balance error',
      unit: '–',
      simulated: Number.isFinite(f.energyBalanceError) ? f.energyBalanceError.toExponential(1) : '–',
      analytic: '',
      how: '|heat in at the outside − heat out at the inside − change of stored heat| over the whole run, relative to the largest of the three.',
      warn: f.energyBalanceError > 1e-6,
    },
    {
      key: 'mesh',
      client: false,
      label: 'Mesh and step',
      unit: '',
      simulated: `${f.cells} cells`,
      analytic: '',
      note: `largest cell ${fixed(f.maxCellSize * 1000, 1)} mm, step ${f.timeStep} s, Crank–Nicolson`,
      how: 'Each layer gets at least 4 cells and no cell thicker than the largest cell; the time step is the run setting.',
    },
  );
  return rows;
}

