// the one zod schema of a wall model, shared by the browser, the api and the command line.
// messages read `path: message` through formatIssues(), e.g. `layers[1].thickness: must be greater than 0 m`.
import { z } from 'zod';
import { countCells } from '../thermal/mesh.ts';
import { commonPeriod } from '../thermal/signals.ts';
import type { Model as EngineModel } from '../thermal/types.ts';

/** ten years of 365.25 days, s */
export const MAX_DURATION = 10 * 365.25 * 86400; // 315,576,000 s
/** the largest mesh the engine accepts */
export const MAX_CELLS = 20_000;
/** bounds on the work of one run, so a valid model never exhausts the machine */
export const MAX_STEPS = 100_000_000;
export const MAX_OUTPUTS = 1_000_000;
export const MAX_PROFILE_VALUES = 20_000_000;

export const DEFAULT_MESH = { maxCellSize: 0.005, minCellsPerLayer: 4 } as const;
export const DEFAULT_SCHEME = 'crank-nicolson' as const;

const typeName = (input: unknown): string =>
  input === null ? 'null' : Array.isArray(input) ? 'array' : typeof input === 'number' && Number.isNaN(input) ? 'NaN' : typeof input;

/** a finite number; NaN and ±Infinity are rejected with a message that names them */
function finite(unit: string) {
  return z.number({
    error: (issue) =>
      issue.input === undefined
        ? 'is required'
        : typeof issue.input === 'number'
          ? `must be a finite number${unit ? ` in ${unit}` : ''} (got ${String(issue.input)})`
          : `must be a number${unit ? ` in ${unit}` : ''} (got ${typeName(issue.input)})`,
  });
}

const unitSuffix = (unit: string): string => (unit ? ` ${unit}` : '');
const positive = (unit: string) => finite(unit).gt(0, { error: `must be greater than 0${unitSuffix(unit)}` });
const nonNegative = (unit: string) => finite(unit).gte(0, { error: `must be at least 0${unitSuffix(unit)}` });

const text = z.string({ error: (i) => (i.input === undefined ? 'is required' : 'must be a string') });

const required = (what: string) => ({
  error: (i: { input: unknown }) => (i.input === undefined ? 'is required' : `must be ${what}`),
});

const constantSignal = z.object(
  { kind: z.literal('constant'), value: finite('') },
  required('a signal object'),
);
const sineSignal = z.object(
  {
    kind: z.literal('sine'),
    mean: finite(''),
    amplitude: finite(''),
    period: positive('s'),
    peakTime: finite('s'),
  },
  required('a signal object'),
);
const seriesSignal = z.object(
  {
    kind: z.literal('series'),
    step: positive('s'),
    values: z.array(finite(''), required('an array of numbers')).min(1, { error: 'must hold at least one value' }),
    repeat: z.boolean(required('true or false')).optional(),
  },
  required('a signal object'),
);

/** constant, sine or series (see the engine's Signal type) */
export const signalSchema = z.discriminatedUnion('kind', [constantSignal, sineSignal, seriesSignal], {
  error: (issue) => {
    const input = issue.input as unknown;
    if (input === undefined) return 'is required';
    if (typeof input !== 'object' || input === null || Array.isArray(input)) return 'must be a signal object';
    return `must be one of "constant", "sine" or "series" (got ${JSON.stringify((input as { kind?: unknown }).kind) ?? 'nothing'})`;
  },
});

/** one homogeneous layer; app fields (materialId, materialClass, note) are allowed and ignored by the engine */
export const layerSchema = z.object(
  {
    name: text,
    thickness: positive('m'),
    conductivity: positive('W/(m·K)'),
    density: positive('kg/m³'),
    specificHeat: positive('J/(kg·K)'),
    cells: z
      .number(required('a whole number'))
      .int({ error: 'must be a whole number of cells' })
      .gte(1, { error: 'must be at least 1 cell' })
      .lte(MAX_CELLS, { error: `must be at most ${MAX_CELLS} cells` })
      .optional(),
    materialId: z.union([z.string(), z.number()]).optional(),
    materialClass: z.string().optional(),
    note: z.string().optional(),
  },
  required('a layer object'),
);

export const outsideSchema = z.object(
  {
    surfaceResistance: nonNegative('m²K/W'),
    air: signalSchema,
    solar: z
      .object(
        {
          absorptance: finite('')
            .gte(0, { error: 'must be between 0 and 1' })
            .lte(1, { error: 'must be between 0 and 1' }),
          irradiance: signalSchema,
        },
        required('an object'),
      )
      .optional(),
    // W/m², positive = loss to sky and surroundings; subtracted as netLoss·surfaceResistance from the sol-air temperature
    longWave: z.object({ netLoss: signalSchema }, required('an object')).optional(),
  },
  required('an object'),
);

export const insideSchema = z.object(
  { surfaceResistance: nonNegative('m²K/W'), air: signalSchema },
  required('an object'),
);

export const initialSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('uniform'), temperature: finite('°C') }),
    z.object({ kind: z.literal('steady') }),
    z.object({ kind: z.literal('periodic') }),
  ],
  {
    error: (issue) => {
      const input = issue.input as unknown;
      if (input === undefined) return 'is required';
      if (typeof input !== 'object' || input === null || Array.isArray(input)) return 'must be an object';
      return `must be "uniform", "steady" or "periodic" (got ${JSON.stringify((input as { kind?: unknown }).kind) ?? 'nothing'})`;
    },
  },
);

export const meshSchema = z.object(
  {
    maxCellSize: positive('m').default(DEFAULT_MESH.maxCellSize),
    minCellsPerLayer: z
      .number(required('a whole number'))
      .int({ error: 'must be a whole number of cells' })
      .gte(1, { error: 'must be at least 1 cell' })
      .lte(MAX_CELLS, { error: `must be at most ${MAX_CELLS} cells` })
      .default(DEFAULT_MESH.minCellsPerLayer),
  },
  required('an object'),
);

const schemeSchema = z.enum(['crank-nicolson', 'implicit'], {
  error: (i) => `must be "crank-nicolson" or "implicit" (got ${JSON.stringify(i.input)})`,
});

/** the model: layers from the OUTSIDE face (index 0) to the INSIDE face, boundaries, timing, mesh, scheme */
export const modelSchema = z
  .object(
    {
      layers: z.array(layerSchema, required('an array of layers')).min(1, { error: 'must hold at least one layer' }),
      outside: outsideSchema,
      inside: insideSchema,
      initial: initialSchema,
      duration: finite('s')
        .gt(0, { error: 'must be greater than 0 s' })
        .lte(MAX_DURATION, { error: `must be at most ten years (${MAX_DURATION} s, years of 365.25 days)` }),
      timeStep: positive('s'),
      outputInterval: positive('s'),
      mesh: meshSchema.default({ ...DEFAULT_MESH }),
      scheme: schemeSchema.default(DEFAULT_SCHEME),
    },
    required('a model object'),
  )
  .superRefine((m, ctx) => {
    if (m.initial.kind === 'periodic') {
      const p = commonPeriod(m);
      if (!p.ok) ctx.addIssue({ code: 'custom', path: ['initial', 'kind'], message: p.message });
    }
    const cells = countCells(m.layers, m.mesh);
    if (cells > MAX_CELLS) {
      ctx.addIssue({
        code: 'custom',
        path: ['mesh'],
        message: `the mesh would have ${cells} cells; at most ${MAX_CELLS} are allowed (raise maxCellSize or lower layer cells)`,
      });
    }
    const steps = Math.ceil(m.duration / m.timeStep - 1e-9);
    if (steps > MAX_STEPS) {
      ctx.addIssue({
        code: 'custom',
        path: ['timeStep'],
        message: `makes ${steps} steps over the duration; at most ${MAX_STEPS} are allowed (raise it above ${m.duration / MAX_STEPS} s)`,
      });
    }
    const outputs = Math.floor(m.duration / m.outputInterval + 1e-9) + 1;
    if (outputs > MAX_OUTPUTS) {
      ctx.addIssue({
        code: 'custom',
        path: ['outputInterval'],
        message: `makes ${outputs} output times; at most ${MAX_OUTPUTS} are allowed`,
      });
    } else if (cells <= MAX_CELLS && outputs * (cells + 1) > MAX_PROFILE_VALUES) {
      ctx.addIssue({
        code: 'custom',
        path: ['outputInterval'],
        message: `makes ${outputs} profiles of ${cells + 1} nodes; at most ${MAX_PROFILE_VALUES} values are allowed (raise it)`,
      });
    }
  });

/** a model as written (optional fields may be missing) */
export type ModelInput = z.input<typeof modelSchema>;
/** a validated model with defaults filled in; assignable to the engine's Model */
export type ModelData = z.output<typeof modelSchema>;
export type SignalData = z.output<typeof signalSchema>;
export type LayerData = z.output<typeof layerSchema>;

/** `layers[1].thickness` from ['layers', 1, 'thickness']; the whole model is `model` */
export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out === '' ? 'model' : out;
}

/** one `path: message` line per problem */
export function formatIssues(error: z.ZodError): string[] {
  return error.issues.map((issue) => `${formatPath(issue.path)}: ${issue.message}`);
}

/** validates unknown input: the model with defaults, or the `path: message` lines */
export function parseModel(input: unknown): { ok: true; model: ModelData } | { ok: false; issues: string[] } {
  const r = modelSchema.safeParse(input);
  return r.success ? { ok: true, model: r.data } : { ok: false, issues: formatIssues(r.error) };
}

// compile-time proof that a validated model is what the engine takes
export const toEngineModel = (model: ModelData): EngineModel => model;
