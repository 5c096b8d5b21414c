// the workbench document: what one revision of an assembly stores (revisions.model).
// the build-up (layers with their material links) and the exposure settings, in the
// units the engine uses (m, W/(m·K), kg/m³, J/(kg·K), s, °C); the UI shows mm and hours.
// toModel() turns a document into the engine's model.
import { z } from 'zod';
import type { ModelInput, SignalData } from './model';
import { HOTTEL_CLIMATE_NAMES, type HottelClimate } from '../solar/clearSky.ts';
import { TRANSPOSITION_MODELS } from '../solar/transposition.ts';
import { CLEAR_DAY_STEP, clearDayIrradianceOnFace } from '../solar/clearDay.ts';
import { skyLongWaveLoss } from '../solar/longWave.ts';

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
  id: z.string().min(1),
  name: z.string().trim().min(1, { error: 'must not be empty' }).max(160, { error: 'must be at most 160 characters' }),
  /** the library material it came from: "builtin:<key>" or "team:<id>"; null once edited away from it */
  materialRef: z.string().nullable().default(null),
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

const amplitudeField = () => num('K').refine((v) => v >= 0 && v <= 30, { error: 'must be between 0 and 30 K' });
const peakHourField = () => num('h').refine((v) => v >= 0 && v <= 24, { error: 'must be between 0 and 24 h' });
const absorptanceField = () => num('').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1' });

/** the face of the assembly: where its outward normal points and how steep it is, degrees */
export const faceSchema = z.object({
  /** outward normal, clockwise from north: 0 N, 90 E, 180 S, 270 W */
  azimuth: num('°').refine((v) => v >= 0 && v < 360, { error: 'must be from 0 up to 360°' }),
  /** from horizontal: 0 a flat roof, 90 a wall */
  tilt: num('°').refine((v) => v >= 0 && v <= 180, { error: 'must be between 0 and 180°' }),
});
export type FaceSpec = z.output<typeof faceSchema>;

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'must be a date written YYYY-MM-DD' })
  .refine((v) => {
    const [y, m, d] = v.split('-').map(Number);
    const t = new Date(Date.UTC(y, m - 1, d));
    return y >= 1900 && y <= 2200 && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
  }, { error: 'must be a real date between 1900 and 2200' });

/** the sun on the face: a hand-typed half sine, or a clear day by place and date */
export const sunSchema = z.discriminatedUnion('source', [
  z.object({
    source: z.literal('custom'),
    /** peak irradiance on the wall's face, W/m² */
    peakIrradiance: num('W/m²').refine((v) => v >= 0 && v <= 1400, { error: 'must be between 0 and 1400 W/m²' }),
    /** hours of sunrise and sunset on the face, 0–24 */
    sunrise: num('h').refine((v) => v >= 0 && v < 24, { error: 'must be between 0 and 24 h' }),
    sunset: num('h').refine((v) => v > 0 && v <= 24, { error: 'must be between 0 and 24 h' }),
  }),
  z.object({
    source: z.literal('place'),
    /** the place's name as shown (a preset's name, or the user's own) */
    placeName: z.string().max(120).default(''),
    /** degrees north (−66 to 66: beyond the polar circles a day need not have a sunrise) */
    latitude: num('°').refine((v) => v >= -66 && v <= 66, { error: 'must be between −66 and 66° (north positive)' }),
    /** degrees east */
    longitude: num('°').refine((v) => v >= -180 && v <= 180, { error: 'must be between −180 and 180° (east positive)' }),
    /** h: the clock's offset from UTC */
    timeZone: num('h').refine((v) => v >= -12 && v <= 14, { error: 'must be between −12 and +14 h' }),
    /** m above sea level (Hottel's model holds below 2500 m) */
    elevation: num('m').refine((v) => v >= 0 && v <= 2500, { error: 'must be between 0 and 2500 m' }).default(0),
    /** the day, YYYY-MM-DD */
    date: isoDate,
    /** reflectance of the ground in front of the face, 0–1 */
    groundReflectance: num('').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1' }).default(0.2),
    /** Hottel's climate correction (Duffie & Beckman table 2.8.1) */
    climate: z.enum(HOTTEL_CLIMATE_NAMES as [HottelClimate, ...HottelClimate[]], { error: 'must be one of the clear-sky climates' }).default('midlatitude-summer'),
    /** the clear-sky model: Hottel (1976) beam, Liu & Jordan (1960) diffuse */
    clearSky: z.literal('hottel-1976', { error: 'must be "hottel-1976"' }).default('hottel-1976'),
    /** the sky model that carries the irradiance onto the face */
    transposition: z.enum(TRANSPOSITION_MODELS, { error: 'must be "isotropic" or "hay-davies"' }).default('isotropic'),
  }),
]);
export type SunSpec = z.output<typeof sunSchema>;

/** the outer surface's long-wave loss to the sky (ISO 13790 §11.4.6); null leaves it out */
export const skyLossSchema = z
  .object({
    /** long-wave emissivity of the outer surface, 0–1 */
    emissivity: num('').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1' }),
  })
  .nullable();

export const outdoorSchema = z.discriminatedUnion('mode', [
  z.object({
    mode: z.literal('sine'),
    /** daily mean, °C */
    mean: num('°C'),
    /** amplitude of the daily sine, K (half the swing maximum − minimum) */
    amplitude: amplitudeField(),
    /** hour of the day of the maximum, 0–24 */
    peakHour: peakHourField(),
  }),
  z.object({
    mode: z.literal('solair'),
    mean: num('°C'),
    amplitude: amplitudeField(),
    peakHour: peakHourField(),
    /** solar absorptance of the outer surface, 0–1 */
    absorptance: absorptanceField(),
    face: faceSchema.default({ azimuth: 270, tilt: 90 }),
    sun: sunSchema,
    skyLoss: skyLossSchema.default(null),
  }),
  z.object({
    mode: z.literal('series'),
    /** the team's upload (uploads.id) */
    uploadId: z.number().int().positive(),
    /** absorptance used with the upload's irradiance column, when it has one */
    absorptance: absorptanceField().default(0.6),
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

/** one calendar month outdoors for the moisture check: mean air temperature °C and relative humidity % */
export const climateMonthSchema = z.object({
  temperature: num('°C').refine((v) => v >= -60 && v <= 60, { error: 'must be between −60 and 60 °C' }),
  relativeHumidity: num('%').refine((v) => v > 0 && v <= 100, { error: 'must be between 0 and 100 %' }),
});

/** the indoor air of the moisture check: a temperature and either a fixed relative humidity (%) or an ISO 13788 humidity class 1–5 */
export const climateIndoorSchema = z
  .object({
    temperature: num('°C').refine((v) => v >= 0 && v <= 40, { error: 'must be between 0 and 40 °C' }),
    relativeHumidity: num('%').refine((v) => v > 0 && v <= 100, { error: 'must be between 0 and 100 %' }).optional(),
    humidityClass: z
      .number({ error: 'must be a whole number from 1 to 5' })
      .refine((v) => Number.isInteger(v) && v >= 1 && v <= 5, { error: 'must be a whole number from 1 to 5' })
      .optional(),
  })
  .superRefine((v, ctx) => {
    const both = v.relativeHumidity !== undefined && v.humidityClass !== undefined;
    const neither = v.relativeHumidity === undefined && v.humidityClass === undefined;
    if (both || neither) ctx.addIssue({ code: 'custom', path: ['relativeHumidity'], message: 'give either relativeHumidity (%) or humidityClass (1–5), not both' });
  })
  .transform((v): { temperature: number; relativeHumidity: number } | { temperature: number; humidityClass: 1 | 2 | 3 | 4 | 5 } =>
    v.humidityClass !== undefined ? { temperature: v.temperature, humidityClass: v.humidityClass as 1 | 2 | 3 | 4 | 5 } : { temperature: v.temperature, relativeHumidity: v.relativeHumidity as number },
  );

/** the monthly climate of the moisture check (ISO 13788): twelve months, January first, and the indoor air */
export const climateSchema = z.object({
  months: z.array(climateMonthSchema, { error: 'must be 12 months' }).length(12, { error: 'must hold 12 months, January first' }),
  indoor: climateIndoorSchema,
});
export type ClimateData = z.output<typeof climateSchema>;

export const exposureSchema = z.object({
  outdoor: outdoorSchema,
  indoor: indoorSchema,
  heatFlowDirection: z.enum(HEAT_FLOW_DIRECTIONS).default('horizontal'),
  /** m²K/W */
  insideSurfaceResistance: num('m²K/W').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1 m²K/W' }),
  outsideSurfaceResistance: num('m²K/W').refine((v) => v >= 0 && v <= 1, { error: 'must be between 0 and 1 m²K/W' }),
  /** days reported (after the warm-up, which only an uploaded series has) */
  days: num('d').refine((v) => Number.isInteger(v) && v >= 1 && v <= 3660, { error: 'must be a whole number of days from 1 to 3660' }),
  /** uploaded series only: days run first and left out of the figures, so the wall forgets its
   *  initial state; a repeating exposure starts in its periodic state and ignores this */
  warmupDays: num('d').refine((v) => Number.isInteger(v) && v >= 0 && v <= 60, { error: 'must be a whole number of days from 0 to 60' }),
  /** s */
  timeStep: num('s').refine((v) => v >= 1 && v <= 3600 && 3600 % v === 0, { error: 'must divide an hour: 60, 120, 300, 600, 900, 1800 or 3600 s…' }),
  /** m */
  maxCellSize: num('m').refine((v) => v >= 0.0005 && v <= 0.1, { error: 'must be between 0.5 and 100 mm' }),
  /** indoor relative humidity for the dew-point check, %; null leaves the check out */
  indoorRelativeHumidity: num('%').refine((v) => v > 0 && v <= 100, { error: 'must be between 0 and 100 %' }).nullable().default(50),
  /** the monthly climate of the moisture check; absent leaves the check out */
  climate: climateSchema.optional(),
});
export type Exposure = z.output<typeof exposureSchema>;

/** the version of the document format written now (see the README, "The workbench document") */
export const DOCUMENT_VERSION = 2;

/** the document as version 2 writes it (no migration) */
export const workbenchDocumentV2Schema = z.object({
  version: z.literal(2, { error: 'must be 2 (or 1, which is read and converted)' }),
  layers: z.array(docLayerSchema).min(1, { error: 'must hold at least one layer' }).max(40, { error: 'must hold at most 40 layers' }),
  exposure: exposureSchema,
});

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Reads an older document as version 2; leaves anything else as it is (the schema then says
 * what is wrong). Version 1 (or no version) kept the outdoor sine's `swing` (maximum − minimum)
 * where version 2 keeps its `amplitude` (half of it), and the sol-air day's hand-typed sun at
 * the top of `outdoor` where version 2 has `sun: { source: 'custom', … }`, a face (a west wall)
 * and no sky loss, so an old revision gives the result it gave before (but for the periodic
 * start, which replaces its warm-up).
 */
export function migrateDocument(input: unknown): unknown {
  if (!isRecord(input) || (input.version !== undefined && input.version !== 1)) return input;
  const doc: Record<string, unknown> = { ...input, version: 2 };
  if (isRecord(input.exposure) && isRecord(input.exposure.outdoor)) {
    const out: Record<string, unknown> = { ...input.exposure.outdoor };
    if ((out.mode === 'sine' || out.mode === 'solair') && 'swing' in out && !('amplitude' in out)) {
      out.amplitude = typeof out.swing === 'number' ? out.swing / 2 : out.swing;
      delete out.swing;
    }
    if (out.mode === 'solair' && !('sun' in out)) {
      out.sun = { source: 'custom', peakIrradiance: out.peakIrradiance, sunrise: out.sunrise, sunset: out.sunset };
      delete out.peakIrradiance;
      delete out.sunrise;
      delete out.sunset;
      out.face ??= { azimuth: 270, tilt: 90 };
      out.skyLoss ??= null;
    }
    doc.exposure = { ...input.exposure, outdoor: out };
  }
  return doc;
}

/** a document of any version, read as the current one (older versions are converted on read) */
export const workbenchDocumentSchema = z.preprocess(migrateDocument, workbenchDocumentV2Schema);
export type WorkbenchDocument = z.output<typeof workbenchDocumentV2Schema>;
export type WorkbenchDocumentInput = z.input<typeof workbenchDocumentV2Schema>;

/** the sun by place of a new sol-air day: the Harrow Lane site on a clear midsummer-month day, a west wall */
export function defaultPlaceSun(): Extract<SunSpec, { source: 'place' }> {
  return {
    source: 'place',
    placeName: 'Harrow Lane Library, Leeds',
    latitude: 53.8,
    longitude: -1.55,
    timeZone: 1,
    elevation: 60,
    date: '2026-07-21',
    groundReflectance: 0.2,
    climate: 'midlatitude-summer',
    clearSky: 'hottel-1976',
    transposition: 'isotropic',
  };
}

/** a temperate summer day on a west-facing wall: the defaults of a new assembly */
export function defaultExposure(): Exposure {
  return {
    outdoor: { mode: 'sine', mean: 22, amplitude: 6, peakHour: 15 },
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

/** true when every signal of the exposure repeats each day: the run starts in its periodic state */
export function isRepeatingExposure(exposure: Exposure): boolean {
  return exposure.outdoor.mode !== 'series';
}

/** the warm-up days the run really has: only an uploaded series warms up */
export function effectiveWarmupDays(exposure: Exposure): number {
  return isRepeatingExposure(exposure) ? 0 : exposure.warmupDays;
}

/**
 * Clear-day irradiance on the face by hand: a half sine between sunrise and sunset with
 * the given peak, zero at night, sampled every `step` seconds over one day: exactly
 * 86,400 / step values, the day repeating after the last (a shape chosen for its
 * simplicity, common practice, no source).
 */
export function clearDayIrradiance(peak: number, sunrise: number, sunset: number, step = 600): number[] {
  const n = Math.round(DAY / step);
  const values: number[] = [];
  for (let i = 0; i < n; i++) {
    const h = (i * step) / HOUR;
    values.push(h > sunrise && h < sunset ? peak * Math.sin((Math.PI * (h - sunrise)) / (sunset - sunrise)) : 0);
  }
  return values;
}

/** the irradiance on the face over one day, every 600 s (144 values), W/m² */
export function sunOnFace(outdoor: Extract<Outdoor, { mode: 'solair' }>): number[] {
  const sun = outdoor.sun;
  if (sun.source === 'custom') return sun.peakIrradiance > 0 && sun.sunset > sun.sunrise ? clearDayIrradiance(sun.peakIrradiance, sun.sunrise, sun.sunset, CLEAR_DAY_STEP) : new Array<number>(DAY / CLEAR_DAY_STEP).fill(0);
  return clearDayIrradianceOnFace({ ...sun, face: outdoor.face });
}

/** W/m², the net long-wave loss of the outer surface to the sky, or null without one */
export function skyLossOf(outdoor: Outdoor): number | null {
  if (outdoor.mode !== 'solair' || !outdoor.skyLoss) return null;
  return skyLongWaveLoss(outdoor.skyLoss.emissivity, outdoor.face.tilt);
}

/**
 * The engine model for a document. A repeating exposure (daily sine, sol-air day, with a
 * constant indoor air or a 24-hour schedule) starts in its periodic state at midnight of the
 * first reported day; an uploaded series starts from the steady state at midnight of the first
 * warm-up day, and the warm-up is part of the run (the caller drops it from the figures).
 * Every repeating series repeats with exactly its period: 24 hourly values, 144 values at
 * 600 s. `upload` is needed when the outdoor mode is `series`.
 */
export function toModel(doc: WorkbenchDocument, upload?: UploadedSeries): ModelInput {
  const { exposure } = doc;
  const repeating = isRepeatingExposure(exposure);
  const totalDays = exposure.days + effectiveWarmupDays(exposure);
  let air: SignalData;
  let solar: { absorptance: number; irradiance: SignalData } | undefined;
  let longWave: { netLoss: SignalData } | undefined;
  const out = exposure.outdoor;
  if (out.mode === 'sine' || out.mode === 'solair') {
    air = { kind: 'sine', mean: out.mean, amplitude: out.amplitude, period: DAY, peakTime: out.peakHour * HOUR };
    if (out.mode === 'solair') {
      const values = sunOnFace(out);
      if (values.some((v) => v > 0)) solar = { absorptance: out.absorptance, irradiance: { kind: 'series', step: CLEAR_DAY_STEP, values, repeat: true } };
      const loss = skyLossOf(out);
      if (loss !== null && loss > 0) longWave = { netLoss: { kind: 'constant', value: Number(loss.toFixed(6)) } };
    }
  } else {
    if (!upload) throw new Error('the uploaded outdoor series is not loaded');
    air = { kind: 'series', step: upload.step, values: upload.air, repeat: true };
    if (upload.irradiance && upload.irradiance.length === upload.air.length) {
      solar = { absorptance: out.absorptance, irradiance: { kind: 'series', step: upload.step, values: upload.irradiance, repeat: true } };
    }
  }
  const ind = exposure.indoor;
  const insideAir: SignalData = ind.mode === 'constant' ? { kind: 'constant', value: ind.value } : { kind: 'series', step: HOUR, values: [...ind.hourly], repeat: true };
  return {
    layers: doc.layers.map((l) => ({
      name: l.name,
      thickness: l.thickness,
      conductivity: l.conductivity,
      density: l.density,
      specificHeat: l.specificHeat,
    })),
    outside: { surfaceResistance: exposure.outsideSurfaceResistance, air, ...(solar ? { solar } : {}), ...(longWave ? { longWave } : {}) },
    inside: { surfaceResistance: exposure.insideSurfaceResistance, air: insideAir },
    initial: repeating ? { kind: 'periodic' } : { kind: 'steady' },
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

const fmtNum = (v: number, digits: number) => String(Number(v.toFixed(digits)));

/** the outdoor air in words, with amplitude and swing both given (for the report and the shared view) */
export function describeOutdoorAir(outdoor: Outdoor): string {
  if (outdoor.mode === 'series') return `uploaded hourly series, absorptance ${outdoor.absorptance}`;
  return `daily sine, mean ${fmtNum(outdoor.mean, 2)} °C, amplitude ${fmtNum(outdoor.amplitude, 2)} K (swing ${fmtNum(2 * outdoor.amplitude, 2)} K, maximum − minimum), peak at ${fmtNum(outdoor.peakHour, 2)} h`;
}

/** the sun and sky of a sol-air day in words; null for other modes */
export function describeSunAndSky(outdoor: Outdoor): string | null {
  if (outdoor.mode !== 'solair') return null;
  const sun = outdoor.sun;
  const face = `face azimuth ${fmtNum(outdoor.face.azimuth, 1)}° from north, tilt ${fmtNum(outdoor.face.tilt, 1)}°`;
  const sunText =
    sun.source === 'custom'
      ? `custom half sine, peak ${sun.peakIrradiance} W/m² from ${sun.sunrise} h to ${sun.sunset} h`
      : `clear day at ${sun.placeName || 'a place'} (${fmtNum(sun.latitude, 3)}° N, ${fmtNum(sun.longitude, 3)}° E, UTC${sun.timeZone >= 0 ? '+' : '−'}${Math.abs(sun.timeZone)} h) on ${sun.date}: Hottel (1976) clear sky with Liu–Jordan diffuse, ${sun.transposition === 'isotropic' ? 'isotropic sky (Liu–Jordan 1963)' : 'Hay–Davies sky'}, ground reflectance ${sun.groundReflectance}`;
  const loss = skyLossOf(outdoor);
  const sky = loss === null ? 'no long-wave loss to the sky' : `long-wave loss to the sky ${fmtNum(loss, 1)} W/m² (ISO 13790 §11.4.6, emissivity ${outdoor.skyLoss!.emissivity})`;
  return `${sunText}; ${face}; absorptance ${outdoor.absorptance}; ${sky}`;
}
