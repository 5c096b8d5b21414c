// the job backup file: one job with its assemblies, revisions (and their check trail),
// runs, comments and the uploaded series its documents use, as one versioned JSON file.
//
// ids of the database never appear in the file: people are "p1", "p2"… (names and e-mail
// addresses kept so an import can find them again), uploads are numbered 1, 2… and a
// document's exposure.outdoor.uploadId names that number. Runs are kept as their rows are
// stored (column name → stored value; text as text, binary as { "$base64": "…" }), so the
// file carries whatever the runs table keeps in this version of Wallpulse.
import { z } from 'zod';
import { workbenchDocumentSchema } from './workbench';
import { uploadMappingSchema, uploadSeriesSchema } from './upload';

export const BACKUP_FORMAT = 'wallpulse-job-backup';
export const BACKUP_VERSION = 1;
/** the largest backup file an import reads, bytes (the database takes rows of at most 16 MB too) */
export const MAX_BACKUP_BYTES = 16 * 1024 * 1024;
export const MAX_BACKUP_MB = MAX_BACKUP_BYTES / 1024 / 1024;

const REVISION_STATES = ['draft', 'in_check', 'checked', 'sent_back', 'issued'] as const;

const missingOr = (message: string) => (issue: { input?: unknown }) => (issue.input === undefined ? 'is required' : message);
const when = z.iso.datetime({ offset: true, error: missingOr('must be a date and time (ISO 8601)') });
const text = (max: number) => z.string({ error: missingOr('must be text') }).max(max, { error: `must be at most ${max} characters` });
const name = (max: number) => text(max).trim().min(1, { error: 'must not be empty' });
/** a person of the file's "people" list, or null where the original author's account is gone */
const personRef = z.string({ error: 'must be a person key such as "p1", or null' }).regex(/^p\d{1,6}$/, { error: 'must be a person key such as "p1"' }).nullable();
const state = z.enum(REVISION_STATES, { error: `must be one of ${REVISION_STATES.join(', ')}` });

export const backupPersonSchema = z.object({
  key: z.string().regex(/^p\d{1,6}$/, { error: 'must be a person key such as "p1"' }),
  name: text(120),
  email: text(255),
});

export const backupUploadSchema = z.object({
  key: z.number({ error: 'must be a whole number' }).int({ error: 'must be a whole number' }).positive({ error: 'must be at least 1' }),
  name: name(160),
  fileName: name(255),
  mapping: uploadMappingSchema,
  series: uploadSeriesSchema,
  createdBy: personRef,
  createdAt: when,
});

/** a stored value of a run's column: text, number, null, or binary as base64 */
const storedValue = z.union([z.string(), z.number(), z.boolean(), z.null(), z.object({ $base64: z.string().regex(/^[A-Za-z0-9+/]*={0,2}$/, { error: 'must be base64' }) })], {
  error: 'must be text, a number, null or { "$base64": "…" }',
});

export const backupRunSchema = z.object({
  createdBy: personRef,
  /** the stored row without its ids: column name → value */
  columns: z.record(z.string().regex(/^[a-z][a-z0-9_]{0,63}$/, { error: 'must be a column name' }), storedValue),
});

export const backupEventSchema = z.object({
  fromState: state.nullable(),
  toState: state,
  actor: personRef,
  note: text(5000),
  createdAt: when,
});

export const backupCommentSchema = z.object({
  author: personRef,
  body: name(10000),
  createdAt: when,
});

/** the workbench document of a revision, checked against the schema of this version */
const documentValue = z.unknown().superRefine((value, ctx) => {
  const parsed = workbenchDocumentSchema.safeParse(value);
  if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
});

export const backupRevisionSchema = z.object({
  number: z.number({ error: 'must be a whole number' }).int({ error: 'must be a whole number' }).positive({ error: 'must be at least 1' }),
  /** the number of the revision it was saved on top of, in the same assembly */
  parentNumber: z.number().int().positive().nullable(),
  model: documentValue,
  note: text(5000),
  state,
  author: personRef,
  createdAt: when,
  events: z.array(backupEventSchema).max(10_000),
  comments: z.array(backupCommentSchema).max(10_000),
  runs: z.array(backupRunSchema).max(10_000),
});

export const backupAssemblySchema = z.object({
  name: name(160),
  element: z.enum(['wall', 'roof', 'floor'], { error: 'must be wall, roof or floor' }),
  description: text(5000),
  createdBy: personRef,
  createdAt: when,
  updatedAt: when,
  revisions: z.array(backupRevisionSchema).min(1, { error: 'must hold at least one revision' }).max(10_000),
});

export const backupJobSchema = z.object({
  name: name(160),
  reference: text(60),
  client: text(160),
  location: text(160),
  notes: text(20_000),
  createdBy: personRef,
  createdAt: when,
  updatedAt: when,
});

export const jobBackupSchema = z.object({
  format: z.literal(BACKUP_FORMAT),
  version: z.literal(BACKUP_VERSION),
  exportedAt: when,
  /** where it came from, for the reader: not used by an import */
  source: z.object({ team: text(120), jobId: z.number().int() }),
  job: backupJobSchema,
  people: z.array(backupPersonSchema).max(10_000),
  uploads: z.array(backupUploadSchema).max(1000),
  assemblies: z.array(backupAssemblySchema).max(1000),
});
export type JobBackup = z.output<typeof jobBackupSchema>;
export type BackupRevision = JobBackup['assemblies'][number]['revisions'][number];
export type BackupRun = BackupRevision['runs'][number];

/** what a successful import answers */
export interface RestoreResult {
  job: { id: number; name: string; teamId: number };
  counts: { assemblies: number; revisions: number; runs: number; comments: number; uploads: number };
  /** original authors who are not members of the importing team, now recorded under the importing person */
  reassigned: string[];
}

const LIST_ITEM: Record<string, string> = {
  assemblies: 'assembly',
  revisions: 'revision',
  layers: 'layer',
  events: 'check step',
  comments: 'comment',
  runs: 'run',
  uploads: 'uploaded series',
  people: 'person',
  hourly: 'hour value',
  air: 'air value',
  irradiance: 'irradiance value',
};

/** a camelCase or snake_case key in plain words */
const words = (key: string) => key.replace(/_/g, ' ').replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();

/**
 * A field path of a backup file ("assemblies[0].revisions[1].model.layers[0].thickness") in words
 * for a person ("assembly 1, revision 2, layer 1: thickness"); counts start at 1.
 */
export function describeBackupPath(path: string): string {
  if (path === '(body)' || path === '') return 'the file';
  const parts: string[] = [];
  const re = /([A-Za-z_$][\w$]*)|\[(\d+)\]/g;
  let pending: string | null = null;
  for (let m = re.exec(path); m; m = re.exec(path)) {
    if (m[1] !== undefined) {
      if (pending !== null) parts.push(words(pending));
      pending = m[1];
    } else {
      const n = Number(m[2]) + 1;
      parts.push(pending !== null && LIST_ITEM[pending] ? `${LIST_ITEM[pending]} ${n}` : `${pending !== null ? `${words(pending)} ` : ''}item ${n}`);
      pending = null;
    }
  }
  const shown = parts.filter((p) => p !== 'model' && p !== 'columns');
  const field = pending !== null ? words(pending) : null;
  if (!shown.length) return field ?? 'the file';
  return field ? `${shown.join(', ')}: ${field}` : shown.join(', ');
}
