// the workbench document: what one revision of an assembly stores (revisions.model).
// the build-up (layers with their material links) and the exposure settings, in the
// units the engine uses (m, W/(m·K), kg/m³, J/(kg·K), s, °C); the UI shows mm and hours.
// toModel() turns a document into the engine's model.
import { z } from 'zod';
import './jitless';
import type { ModelInput, SignalData } from './model';

export const MATERIAL_CLASSES = ['masonry', 'concrete', 'timber', 'insulation', 'board', 'metal', 'membrane', 'air', 'render'] as const;
export type MaterialClass = (typeof MATERIAL_CLASSES)[number];

const num = (unit: string) =>
  z.number({ error: (i) => (i.input === undefined ? 'is required' : `must be a finite number${unit ? ` in ${unit}` : ''}`) }).refine(Number.isFinite, {
    error: `must be a finite number${unit ? ` in ${unit}` : ''}`,
  });
const pos = (unit: string) => num(unit).refine((v) => v > 0, { error: `must be greater than 0 ${unit}`.trim() });

/** one layer card; ordered from the OUTSIDE face (index 0) to the INSIDE face */
export const docLayerSchema = z.object({
  /** stable client id of the card (survives reordering; used by drag and drop) */
  id: z.string().min(1).max(100, { error: 'must be at most 100 characters' }),
  name: z.string().trim().min(1, { error: 'must not be empty' }).max(160, { error: 'must be at most 160 characters' }),
  /** the library material it came from: "builtin:<key>" or "team:<id>"; null once edited away from it */
  materialRef: z.string().max(100, { error: 'must be at most 100 characters' }).nullable().default(null),
  materialClass: z.enum(MATERIAL_CLASSES, { error: 'must be one of the material classes' }),
  /** m (shown in mm) */
  thickness: pos('m'),
  /** W/(m·K) */
  conductivity: pos('W/(m·K)'),
  /** kg/m³ */
  density: pos('kg/m³'),
  /** J/(kg·K) */
  specificHeat: pos('J/(kg·K)'),
  /** water-vapour resistance factor μ (–), optional */
  vapourResistanceFactor: num('').refine((v) => v >= 1, { error: 'must be at least 1' }).nullable().default(null),
  /** where the values come from */
  source: z.string().max(2000).default(''),
  note: z.string().max(2000).default(''),
});
export type DocLayer = z.output<typeof docLayerSchema>;

/** hourly indoor set-points for one day, 24 values, °C; hour h holds from h:00, linear between */
const daySchedule = z.array(num('°C'), { error: 'must be 24 hourly values' }).length(24, { error: 'must hold 24 hourly values' });

export const outdoorSchema = z.discriminatedUnion('mode', [
  z.object({
    mode: z.literal('sine'),
    /** daily mean, °C */
    mean: num('°C'),
    /** daily swing = maximum − minimum, K (amplitude is half of it) */
    swing: num('K').refine((v) => v >= 0, { error: 'must be at least 0 K' }),
    /** hour of the day of the maximum, 0–24 */
    peakHour: num('h').refine((v) => v >= 0 && v <= 24, { error: 'must be between 0 and 24 h' }),
  }),
  z.object({
    mode: z.literal('solair'),
    mean: num('°C'),
    swing: num('K').refine((v) => v >= 0, { error: 'must be at least 0 K' }),
    peakHour: num('h').refine((v) => v >= 0 && v <= 24, { error: 'must be between 0 and 24 h' }),
    /** solar absorptance of the outer surface, 0–1 */
    absorptance: num('').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1' }),
    /** peak irradiance on the wall's face, W/m² */
    peakIrradiance: num('W/m²').refine((v) => v >= 0 && v <= 1400, { error: 'must be between 0 and 1400 W/m²' }),
    /** hours of sunrise and sunset on the face, 0–24 */
    sunrise: num('h').refine((v) => v >= 0 && v < 24, { error: 'must be between 0 and 24 h' }),
    sunset: num('h').refine((v) => v > 0 && v <= 24, { error: 'must be between 0 and 24 h' }),
  }),
  z.object({
    mode: z.literal('series'),
    /** the team's upload (uploads.id) */
    uploadId: z.number().int().positive(),
    /** absorptance used with the upload's irradiance column, when it has one */
    absorptance: num('').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1' }).default(0.6),
  }),
]);
export type Outdoor = z.output<typeof outdoorSchema>;

export const indoorSchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('constant'), value: num('°C') }),
  z.object({ mode: z.literal('schedule'), hourly: daySchedule }),
]);
export type Indoor = z.output<typeof indoorSchema>;

export const HEAT_FLOW_DIRECTIONS = ['horizontal', 'upward', 'downward'] as const;
/** ISO 6946 Table 7 (conventional surface resistances), m²K/W */
export const ISO6946_RSI = { horizontal: 0.13, upward: 0.1, downward: 0.17 } as const;
export const ISO6946_RSE = 0.04;

export const exposureSchema = z.object({
  outdoor: outdoorSchema,
  indoor: indoorSchema,
  heatFlowDirection: z.enum(HEAT_FLOW_DIRECTIONS).default('horizontal'),
  /** m²K/W */
  insideSurfaceResistance: num('m²K/W').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1 m²K/W' }),
  outsideSurfaceResistance: num('m²K/W').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1 m²K/W' }),
  /** days reported (after the warm-up) */
  days: num('d').refine((v) => Number.isInteger(v) && v >= 1 && v <= 3660, { error: 'must be a whole number of days from 1 to 3660' }),
  /** days run first and left out of the figures, so the wall forgets its initial state */
  warmupDays: num('d').refine((v) => Number.isInteger(v) && v >= 0 && v <= 60, { error: 'must be a whole number of days from 0 to 60' }),
  /** s */
  timeStep: num('s').refine((v) => v >= 1 && v <= 3600 && 3600 % v === 0, { error: 'must divide an hour: 60, 120, 300, 600, 900, 1800 or 3600 s…' }),
  /** m */
  maxCellSize: num('m').refine((v) => v >= 0.0005 && v <= 0.1, { error: 'must be between 0.5 and 100 mm' }),
  /** indoor relative humidity for the dew-point check, %; null leaves the check out */
  indoorRelativeHumidity: num('%').refine((v) => v > 0 && v <= 100, { error: 'must be between 0 and 100 %' }).nullable().default(50),
});
export type Exposure = z.output<typeof exposureSchema>;

export const workbenchDocumentSchema = z.object({
  version: z.literal(1).default(1),
  layers: z.array(docLayerSchema).min(1, { error: 'must hold at least one layer' }).max(40, { error: 'must hold at most 40 layers' }),
  exposure: exposureSchema,
});
export type WorkbenchDocument = z.output<typeof workbenchDocumentSchema>;
export type WorkbenchDocumentInput = z.input<typeof workbenchDocumentSchema>;

/** a temperate summer day on a west-facing wall: the defaults of a new assembly */
export function defaultExposure(): Exposure {
  return {
    outdoor: { mode: 'sine', mean: 22, swing: 12, peakHour: 15 },
    indoor: { mode: 'constant', value: 24 },
    heatFlowDirection: 'horizontal',
    insideSurfaceResistance: ISO6946_RSI.horizontal,
    outsideSurfaceResistance: ISO6946_RSE,
    days: 3,
    warmupDays: 4,
    timeStep: 300,
    maxCellSize: 0.005,
    indoorRelativeHumidity: 50,
  };
}

const DAY = 86400;
const HOUR = 3600;

/** an uploaded hourly series, as the uploads table keeps it */
export interface UploadedSeries {
  /** s */
  step: number;
  /** °C */
  air: number[];
  /** W/m² on the face, optional */
  irradiance?: number[];
}

/**
 * Clear-day irradiance on the face: a half sine between sunrise and sunset with
 * the given peak, zero at night, sampled every `step` seconds over one day.
 * A shape chosen for its simplicity (common practice, no source).
 */
export function clearDayIrradiance(peak: number, sunrise: number, sunset: number, step = 600): number[] {
  const n = Math.round(DAY / step);
  const values: number[] = [];
  for (let i = 0; i <= n; i++) {
    const h = (i * step) / HOUR;
    values.push(h > sunrise && h < sunset ? peak * Math.sin((Math.PI * (h - sunrise)) / (sunset - sunrise)) : 0);
  }
  return values;
}

/**
 * The engine model for a document. Time zero is midnight at the start of the
 * first warm-up day; the warm-up is part of the run (the caller drops it from
 * the figures). `upload` is needed when the outdoor mode is `series`.
 */
export function toModel(doc: WorkbenchDocument, upload?: UploadedSeries): ModelInput {
  const { exposure } = doc;
  const totalDays = exposure.days + exposure.warmupDays;
  let air: SignalData;
  let solar: { absorptance: number; irradiance: SignalData } | undefined;
  const out = exposure.outdoor;
  if (out.mode === 'sine' || out.mode === 'solair') {
    air = { kind: 'sine', mean: out.mean, amplitude: out.swing / 2, period: DAY, peakTime: out.peakHour * HOUR };
    if (out.mode === 'solair' && out.peakIrradiance > 0 && out.sunset > out.sunrise) {
      solar = {
        absorptance: out.absorptance,
        irradiance: { kind: 'series', step: 600, values: clearDayIrradiance(out.peakIrradiance, out.sunrise, out.sunset, 600), repeat: true },
      };
    }
  } else {
    if (!upload) throw new Error('the uploaded outdoor series is not loaded');
    air = { kind: 'series', step: upload.step, values: upload.air, repeat: true };
    if (upload.irradiance && upload.irradiance.length === upload.air.length) {
      solar = { absorptance: out.absorptance, irradiance: { kind: 'series', step: upload.step, values: upload.irradiance, repeat: true } };
    }
  }
  const ind = exposure.indoor;
  const insideAir: SignalData =
    ind.mode === 'constant'
      ? { kind: 'constant', value: ind.value }
      : { kind: 'series', step: HOUR, values: [...ind.hourly, ind.hourly[0]], repeat: true };
  return {
    layers: doc.layers.map((l) => ({
      name: l.name,
      thickness: l.thickness,
      conductivity: l.conductivity,
      density: l.density,
      specificHeat: l.specificHeat,
    })),
    outside: { surfaceResistance: exposure.outsideSurfaceResistance, air, ...(solar ? { solar } : {}) },
    inside: { surfaceResistance: exposure.insideSurfaceResistance, air: insideAir },
    initial: { kind: 'steady' },
    duration: totalDays * DAY,
    timeStep: exposure.timeStep,
    // every 15 minutes for short runs, hourly for long ones; always a whole number of steps
    outputInterval: totalDays > 60 ? HOUR : 900 % exposure.timeStep === 0 ? 900 : exposure.timeStep,
    mesh: { maxCellSize: exposure.maxCellSize, minCellsPerLayer: 4 },
    scheme: 'crank-nicolson',
  };
}

/** the dew point of air, °C, by the Magnus formula with Alduchov & Eskridge (1996) coefficients, over water */
export function dewPoint(airTemperature: number, relativeHumidity: number): number {
  const a = 17.625;
  const b = 243.04;
  const gamma = Math.log(relativeHumidity / 100) + (a * airTemperature) / (b + airTemperature);
  return (b * gamma) / (a - gamma);
}
