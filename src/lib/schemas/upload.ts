// an uploaded hourly outdoor series (uploads table), as the API accepts it
import { z } from 'zod';
import { AIR_RANGE, IRRADIANCE_RANGE, MAX_UPLOAD_HOURS, MIN_UPLOAD_HOURS } from '../workbench/csv.ts';

const finite = (unit: string) =>
  z.number({ error: (i) => (i.input === undefined ? 'is required' : `must be a finite number in ${unit}`) }).refine(Number.isFinite, { error: `must be a finite number in ${unit}` });

export const uploadMappingSchema = z.object({
  timeColumn: z.number().int().min(0).nullable(),
  temperatureColumn: z.number().int().min(0),
  irradianceColumn: z.number().int().min(0).nullable(),
  temperatureUnit: z.enum(['C', 'F'], { error: 'must be "C" or "F"' }),
  /** the column titles, kept for the record */
  columns: z.array(z.string().max(200)).max(200).optional(),
});

export const uploadSeriesSchema = z
  .object({
    step: z.literal(3600, { error: 'must be 3600 s (hourly)' }),
    air: z
      .array(finite('°C').refine((v) => v >= AIR_RANGE.min && v <= AIR_RANGE.max, { error: `must be between ${AIR_RANGE.min} and ${AIR_RANGE.max} °C` }), { error: 'must be an array of temperatures in °C' })
      .min(MIN_UPLOAD_HOURS, { error: `must hold at least ${MIN_UPLOAD_HOURS} hourly values` })
      .max(MAX_UPLOAD_HOURS, { error: `must hold at most ${MAX_UPLOAD_HOURS} hourly values (ten years)` }),
    irradiance: z
      .array(finite('W/m²').refine((v) => v >= IRRADIANCE_RANGE.min && v <= IRRADIANCE_RANGE.max, { error: `must be between ${IRRADIANCE_RANGE.min} and ${IRRADIANCE_RANGE.max} W/m²` }))
      .optional(),
  })
  .refine((s) => !s.irradiance || s.irradiance.length === s.air.length, { path: ['irradiance'], error: 'must hold as many values as air' });

export const uploadCreateSchema = z.object({
  /** the team that keeps it; the member's first team when left out */
  teamId: z.number().int().positive().optional(),
  name: z.string().trim().min(1, { error: 'must not be empty' }).max(160, { error: 'must be at most 160 characters' }),
  fileName: z.string().trim().min(1, { error: 'must not be empty' }).max(255, { error: 'must be at most 255 characters' }),
  mapping: uploadMappingSchema,
  series: uploadSeriesSchema,
});
export type UploadCreate = z.output<typeof uploadCreateSchema>;

/** what the list endpoint returns per upload (without the series) */
export interface UploadSummary {
  id: number;
  teamId: number;
  name: string;
  fileName: string;
  rowCount: number;
  hasIrradiance: boolean;
  createdAt: string;
}
