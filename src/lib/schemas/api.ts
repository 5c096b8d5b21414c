// request bodies and queries of the accounts, teams and saved-work endpoints.
// messages name the field and read as a sentence after it ("Name must not be empty").
import { z } from 'zod';
import { workbenchDocumentSchema } from './workbench';

const trimmed = (label: string, max: number) =>
  z
    .string({ error: `${label} is required` })
    .trim()
    .max(max, { error: `${label} must be at most ${max} characters` });
const required = (label: string, max: number) => trimmed(label, max).min(1, { error: `${label} must not be empty` });

export const emailSchema = z
  .string({ error: 'E-mail is required' })
  .trim()
  .toLowerCase()
  .max(255, { error: 'E-mail must be at most 255 characters' })
  .pipe(z.email({ error: 'E-mail must be an address like name@example.com' }));

export const PASSWORD_MIN = 10;
export const passwordSchema = z
  .string({ error: 'Password is required' })
  .min(PASSWORD_MIN, { error: `Password must be at least ${PASSWORD_MIN} characters` })
  .max(200, { error: 'Password must be at most 200 characters' });

export const roleSchema = z.enum(['admin', 'engineer', 'checker'], { error: 'Role must be admin, engineer or checker' });

// --- accounts ---

export const signUpBody = z.object({
  name: required('Name', 120),
  email: emailSchema,
  password: passwordSchema,
});
export const signInBody = z.object({
  email: emailSchema,
  password: z.string({ error: 'Password is required' }).min(1, { error: 'Password is required' }).max(200),
});
export const tokenBody = z.object({ token: z.string({ error: 'Token is required' }).min(20, { error: 'Token is not valid' }).max(200) });
export const resetRequestBody = z.object({ email: emailSchema });
export const resetBody = z.object({
  token: z.string({ error: 'Token is required' }).min(20, { error: 'Token is not valid' }).max(200),
  password: passwordSchema,
});

// --- teams ---

export const teamBody = z.object({ name: required('Team name', 120) });
export const roleBody = z.object({ role: roleSchema });
export const invitationBody = z.object({ email: emailSchema, role: roleSchema });
export const acceptInvitationBody = z.object({
  token: z.string({ error: 'Token is required' }).min(20, { error: 'Token is not valid' }).max(200),
  /** only for a new account made while accepting */
  name: required('Name', 120).optional(),
  password: passwordSchema.optional(),
});

// --- lists ---

/** ?page=&pageSize=&sort=&q= on every list; sort is a column key, "-key" for descending */
export function listQuery<const K extends readonly [string, ...string[]]>(sortKeys: K, defaultSort: string) {
  const allowed = new Set<string>(sortKeys);
  return z.object({
    page: z.coerce.number({ error: 'page must be a whole number' }).int({ error: 'page must be a whole number' }).min(1, { error: 'page must be at least 1' }).default(1),
    pageSize: z.coerce
      .number({ error: 'pageSize must be a whole number' })
      .int({ error: 'pageSize must be a whole number' })
      .min(1, { error: 'pageSize must be at least 1' })
      .max(100, { error: 'pageSize must be at most 100' })
      .default(20),
    sort: z
      .string()
      .default(defaultSort)
      .refine((s) => allowed.has(s.replace(/^-/, '')), { error: `sort must be one of ${sortKeys.join(', ')} (prefix - for descending)` }),
    q: z.string().trim().max(200, { error: 'q must be at most 200 characters' }).default(''),
  });
}
export type ListQuery = { page: number; pageSize: number; sort: string; q: string };

export const teamIdQuery = z.object({
  teamId: z.coerce.number({ error: 'teamId must be a team id' }).int().positive({ error: 'teamId must be a team id' }),
});

// --- saved work ---

export const jobBody = z.object({
  teamId: z.number({ error: 'teamId must be a team id' }).int().positive({ error: 'teamId must be a team id' }),
  name: required('Job name', 160),
  reference: trimmed('Reference', 60).default(''),
  client: trimmed('Client', 160).default(''),
  location: trimmed('Location', 160).default(''),
  notes: trimmed('Notes', 5000).default(''),
});
export const jobPatchBody = jobBody.omit({ teamId: true }).partial();

export const ELEMENTS = ['wall', 'roof', 'floor'] as const;
export const assemblyBody = z.object({
  name: required('Assembly name', 160),
  element: z.enum(ELEMENTS, { error: 'Element must be wall, roof or floor' }).default('wall'),
  description: trimmed('Description', 5000).default(''),
});
export const assemblyPatchBody = assemblyBody.omit({ element: true }).partial();

export const revisionBody = z.object({
  baseRevisionId: z.number({ error: 'baseRevisionId must be a revision id or null' }).int().positive().nullable(),
  model: workbenchDocumentSchema,
  note: trimmed('Note', 2000).default(''),
});

export const TRANSITION_TARGETS = ['in_check', 'checked', 'sent_back', 'issued', 'draft'] as const;
export const transitionBody = z.object({
  to: z.enum(TRANSITION_TARGETS, { error: 'to must be in_check, checked, sent_back, issued or draft' }),
  note: trimmed('Note', 2000).default(''),
});

export const commentBody = z.object({ body: required('Comment', 5000) });

const figure = z.union([z.number().refine(Number.isFinite, { error: 'must be a finite number' }), z.string().max(200), z.null()]);
export const runBody = z.object({
  exposure: z.unknown().refine((v) => v !== undefined, { error: 'exposure is required' }),
  summary: z.record(z.string().max(80), figure, { error: 'summary must be an object of figures' }).refine((s) => Object.keys(s).length <= 200, {
    error: 'summary must hold at most 200 figures',
  }),
  /** the run packed by src/lib/workbench/keptRun.ts, base64; left out to keep the figures only */
  packed: z
    .string()
    .max(7_200_000, { error: 'packed must be at most 5 MB (base64)' })
    .regex(/^[A-Za-z0-9+/]*={0,2}$/, { error: 'packed must be base64' })
    .optional(),
});

export const shareBody = z.object({
  label: trimmed('Label', 160).default(''),
  expiresInDays: z
    .number({ error: 'Expires in must be a number of days' })
    .int({ error: 'Expires in must be a whole number of days' })
    .min(1, { error: 'Expires in must be at least 1 day' })
    .max(365, { error: 'Expires in must be at most 365 days' })
    .nullable()
    .optional(),
});

export const idParam = z.coerce.number().int().positive();
