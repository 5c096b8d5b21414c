// a job as one backup file (src/lib/schemas/backup.ts) and back: export reads the job, its
// assemblies, revisions with their check trail, comments, runs and the uploads its documents
// use; import checks the whole file first and then writes it as a new job of a team in one
// transaction, so a file that fails anywhere changes nothing.
import { and, asc, eq, getTableColumns, inArray, sql } from 'drizzle-orm';
import { db } from '../db';
import { assemblies, comments, jobs, memberships, revisionEvents, revisions, runs, teams, uploads, users } from '../db/schema';
import {
  BACKUP_FORMAT,
  BACKUP_VERSION,
  MAX_BACKUP_BYTES,
  MAX_BACKUP_MB,
  describeBackupPath,
  jobBackupSchema,
  type BackupRun,
  type JobBackup,
  type RestoreResult,
} from '../../schemas/backup';
import { MAX_JSON_DEPTH, fieldErrors, jsonDepth } from '../http';
import { audit } from '../audit';
import { checkPacked } from './runs';

/** a failure answered as the one JSON error shape */
export interface BackupProblem {
  ok: false;
  status: number;
  code: string;
  message: string;
  fields?: Record<string, string>;
}
const problem = (status: number, code: string, message: string, fields?: Record<string, string>): BackupProblem => ({ ok: false, status, code, message, ...(fields ? { fields } : {}) });
const NOTHING = 'nothing was restored';

// --- references to uploads inside documents and run rows ---

/**
 * A copy of a value with every uploaded-series reference ({ mode: "series", uploadId })
 * passed through `map`; the key order is kept, so an unchanged value serialises the same.
 */
function mapUploadRefs(value: unknown, map: (uploadId: number, path: string) => number, path = ''): unknown {
  if (Array.isArray(value)) return value.map((v, i) => mapUploadRefs(v, map, `${path}[${i}]`));
  if (!value || typeof value !== 'object') return value;
  const obj = value as Record<string, unknown>;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(obj)) out[k] = mapUploadRefs(v, map, path ? `${path}.${k}` : k);
  if (obj.mode === 'series' && typeof obj.uploadId === 'number') out.uploadId = map(obj.uploadId, path ? `${path}.uploadId` : 'uploadId');
  return out;
}

/** the same for a JSON text column (a run's exposure): rewritten only when it holds a reference */
function mapUploadRefsInText(text: string, map: (uploadId: number, path: string) => number): string {
  if (!text.includes('"uploadId"')) return text;
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    return text;
  }
  let changed = false;
  const mapped = mapUploadRefs(parsed, (id, path) => {
    changed = true;
    return map(id, path);
  });
  return changed ? JSON.stringify(mapped) : text;
}

// --- run rows as stored ---

/** the runs table's columns by SQL name, without the ids the import gives anew */
function runColumns() {
  const all = Object.values(getTableColumns(runs));
  return new Map(all.filter((c) => !['id', 'revision_id', 'created_by'].includes(c.name)).map((c) => [c.name, c]));
}
const isDateColumn = (sqlType: string) => /^(datetime|timestamp|date)/i.test(sqlType);

/** a stored value as the file keeps it: dates as ISO text, binary as base64 */
function toFileValue(v: unknown): string | number | boolean | null | { $base64: string } {
  if (v === null || v === undefined) return null;
  if (v instanceof Date) return v.toISOString();
  if (Buffer.isBuffer(v) || v instanceof Uint8Array) return { $base64: Buffer.from(v).toString('base64') };
  if (typeof v === 'bigint') return v.toString();
  if (typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean') return v;
  return JSON.stringify(v);
}

// --- export ---

/** the job as a backup file, or null when there is no such job */
export async function exportJob(jobId: number): Promise<JobBackup | null> {
  const job = (await db.select().from(jobs).where(eq(jobs.id, jobId)).limit(1))[0];
  if (!job) return null;
  const team = (await db.select({ name: teams.name }).from(teams).where(eq(teams.id, job.teamId)).limit(1))[0];

  // people and uploads get keys in the order the file first names them
  const personKeys = new Map<string, string>();
  const person = (userId: string | null): string | null => {
    if (!userId) return null;
    let key = personKeys.get(userId);
    if (!key) personKeys.set(userId, (key = `p${personKeys.size + 1}`));
    return key;
  };
  const uploadKeys = new Map<number, number>();
  const uploadKey = (id: number) => {
    let key = uploadKeys.get(id);
    if (key === undefined) uploadKeys.set(id, (key = uploadKeys.size + 1));
    return key;
  };

  const jobCreatedBy = person(job.createdBy);
  const assemblyRows = await db.select().from(assemblies).where(eq(assemblies.jobId, jobId)).orderBy(asc(assemblies.id));
  const out: JobBackup['assemblies'] = [];
  for (const a of assemblyRows) {
    const createdBy = person(a.createdBy);
    const revs = await db.select().from(revisions).where(eq(revisions.assemblyId, a.id)).orderBy(asc(revisions.number));
    const ids = revs.map((r) => r.id);
    const numberOf = new Map(revs.map((r) => [r.id, r.number]));
    const events = ids.length ? await db.select().from(revisionEvents).where(inArray(revisionEvents.revisionId, ids)).orderBy(asc(revisionEvents.id)) : [];
    const notes = ids.length ? await db.select().from(comments).where(inArray(comments.revisionId, ids)).orderBy(asc(comments.id)) : [];
    // runs read as stored (no column mapping), so the file carries exactly what the table keeps
    const [runRows] = ids.length
      ? ((await db.execute(sql`select * from ${runs} where ${inArray(runs.revisionId, ids)} order by ${runs.id}`)) as unknown as [Record<string, unknown>[]])
      : [[]];
    const columns = runColumns();
    out.push({
      name: a.name,
      element: a.element,
      description: a.description,
      createdBy,
      createdAt: a.createdAt.toISOString(),
      updatedAt: a.updatedAt.toISOString(),
      revisions: revs.map((r) => ({
        number: r.number,
        parentNumber: r.parentId === null ? null : (numberOf.get(r.parentId) ?? null),
        model: mapUploadRefs(r.model, uploadKey),
        note: r.note,
        state: r.state,
        author: person(r.authorId),
        createdAt: r.createdAt.toISOString(),
        events: events
          .filter((e) => e.revisionId === r.id)
          .map((e) => ({ fromState: e.fromState, toState: e.toState, actor: person(e.actorId), note: e.note, createdAt: e.createdAt.toISOString() })),
        comments: notes.filter((c) => c.revisionId === r.id).map((c) => ({ author: person(c.authorId), body: c.body, createdAt: c.createdAt.toISOString() })),
        runs: runRows
          .filter((row) => row.revision_id === r.id)
          .map((row) => {
            const stored: BackupRun['columns'] = {};
            for (const name of columns.keys()) {
              if (!(name in row)) continue;
              const v = toFileValue(row[name]);
              stored[name] = typeof v === 'string' ? mapUploadRefsInText(v, uploadKey) : v;
            }
            return { createdBy: person((row.created_by as string | null) ?? null), columns: stored };
          }),
      })),
    });
  }

  const uploadRows = uploadKeys.size ? await db.select().from(uploads).where(and(inArray(uploads.id, [...uploadKeys.keys()]), eq(uploads.teamId, job.teamId))) : [];
  const fileUploads: JobBackup['uploads'] = uploadRows
    .map((u) => ({
      key: uploadKeys.get(u.id)!,
      name: u.name,
      fileName: u.fileName,
      mapping: u.mapping as JobBackup['uploads'][number]['mapping'],
      series: u.series as JobBackup['uploads'][number]['series'],
      createdBy: person(u.createdBy),
      createdAt: u.createdAt.toISOString(),
    }))
    .sort((x, y) => x.key - y.key);

  const people = personKeys.size ? await db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(inArray(users.id, [...personKeys.keys()])) : [];
  return {
    format: BACKUP_FORMAT,
    version: BACKUP_VERSION,
    exportedAt: new Date().toISOString(),
    source: { team: team?.name ?? '', jobId },
    job: {
      name: job.name,
      reference: job.reference,
      client: job.client,
      location: job.location,
      notes: job.notes,
      createdBy: jobCreatedBy,
      createdAt: job.createdAt.toISOString(),
      updatedAt: job.updatedAt.toISOString(),
    },
    people: people.map((p) => ({ key: personKeys.get(p.id)!, name: p.name, email: p.email })).sort((a, b) => Number(a.key.slice(1)) - Number(b.key.slice(1))),
    uploads: fileUploads,
    assemblies: out,
  };
}

/** a file name for the download: the job's name in plain letters and the day */
export function backupFileName(jobName: string, day = new Date()): string {
  const slug = jobName
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/\s+/g, '-')
    .toLowerCase()
    .slice(0, 60);
  return `wallpulse-job-${slug || 'backup'}-${day.toISOString().slice(0, 10)}.json`;
}

// --- reading a file ---

/** the request body as text, counting bytes as they arrive; never more than the limit is held */
export async function readBackupBody(request: Request): Promise<{ ok: true; text: string } | BackupProblem> {
  const tooLarge = problem(413, 'too_large', `The backup file is larger than ${MAX_BACKUP_MB} MB, the most a restore reads; ${NOTHING}.`);
  const declared = Number(request.headers.get('content-length') ?? 0);
  if (declared > MAX_BACKUP_BYTES) return tooLarge;
  if (!request.body) return problem(400, 'empty', `The request carries no backup file; ${NOTHING}.`);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > MAX_BACKUP_BYTES) {
      await reader.cancel().catch(() => undefined);
      return tooLarge;
    }
    chunks.push(value);
  }
  if (size === 0) return problem(400, 'empty', `The backup file is empty; ${NOTHING}.`);
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(Buffer.concat(chunks)) };
  } catch {
    return problem(400, 'bad_encoding', `The file is not UTF-8 text, so it is not a Wallpulse job backup; ${NOTHING}.`);
  }
}

/** the first problem by its path, for the one-line message */
function firstProblem(fields: Record<string, string>): string {
  const [path, message] = Object.entries(fields)[0] ?? ['(file)', 'is not valid'];
  const more = Object.keys(fields).length - 1;
  return `${describeBackupPath(path)} ${message}${more > 0 ? ` (and ${more} more problem${more > 1 ? 's' : ''})` : ''}`;
}

/** parse and check a whole backup file; nothing is written here */
export function parseBackup(text: string): { ok: true; backup: JobBackup } | BackupProblem {
  if (jsonDepth(text, MAX_JSON_DEPTH) > MAX_JSON_DEPTH) {
    return problem(422, 'too_deep', `The file nests lists and objects deeper than ${MAX_JSON_DEPTH} levels; a Wallpulse job backup needs about 12; ${NOTHING}.`);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (err) {
    return problem(400, 'bad_json', `The file is not valid JSON (${(err as Error).message}); ${NOTHING}.`);
  }
  if (!raw || typeof raw !== 'object' || Array.isArray(raw) || (raw as { format?: unknown }).format !== BACKUP_FORMAT) {
    return problem(422, 'not_a_backup', `The file is not a Wallpulse job backup: it has no "format": "${BACKUP_FORMAT}"; ${NOTHING}.`, { format: `must be "${BACKUP_FORMAT}"` });
  }
  const version = (raw as { version?: unknown }).version;
  if (version !== BACKUP_VERSION) {
    return problem(
      422,
      'unsupported_version',
      `The backup is format version ${JSON.stringify(version ?? null)}; this Wallpulse restores version ${BACKUP_VERSION}; ${NOTHING}.`,
      { version: `must be ${BACKUP_VERSION}` },
    );
  }
  const parsed = jobBackupSchema.safeParse(raw);
  if (!parsed.success) {
    const fields = fieldErrors(parsed.error);
    return problem(422, 'invalid', `The backup does not fit format version ${BACKUP_VERSION}: ${firstProblem(fields)}; ${NOTHING}.`, fields);
  }
  const backup = parsed.data;
  const fields = crossCheck(backup);
  if (Object.keys(fields).length) return problem(422, 'invalid', `The backup does not hold together: ${firstProblem(fields)}; ${NOTHING}.`, fields);
  return { ok: true, backup };
}

/** what the schema alone cannot see: keys that name nothing, revision numbers, run columns */
function crossCheck(b: JobBackup): Record<string, string> {
  const fields: Record<string, string> = {};
  const add = (path: string, message: string) => {
    if (!(path in fields)) fields[path] = message;
  };
  const people = new Set<string>();
  b.people.forEach((p, i) => (people.has(p.key) ? add(`people[${i}].key`, `repeats the key ${p.key}`) : people.add(p.key)));
  const uploadKeys = new Set<number>();
  b.uploads.forEach((u, i) => (uploadKeys.has(u.key) ? add(`uploads[${i}].key`, `repeats the key ${u.key}`) : uploadKeys.add(u.key)));
  const who = (path: string, key: string | null) => {
    if (key !== null && !people.has(key)) add(path, `names the person ${key}, who is not in the file's people`);
  };
  const uploadRef = (base: string) => (id: number, path: string) => {
    if (!uploadKeys.has(id)) add(`${base}.${path}`, `names the upload ${id}, which is not in the file's uploads`);
    return id;
  };
  who('job.createdBy', b.job.createdBy);
  b.uploads.forEach((u, i) => who(`uploads[${i}].createdBy`, u.createdBy));
  const columns = runColumns();
  b.assemblies.forEach((a, ai) => {
    const at = `assemblies[${ai}]`;
    who(`${at}.createdBy`, a.createdBy);
    const numbers = new Set<number>();
    a.revisions.forEach((r, ri) => {
      const rt = `${at}.revisions[${ri}]`;
      if (numbers.has(r.number)) add(`${rt}.number`, `repeats revision number ${r.number}`);
      if (r.parentNumber !== null && !numbers.has(r.parentNumber)) add(`${rt}.parentNumber`, `must name an earlier revision of the assembly (${r.parentNumber} is not one)`);
      numbers.add(r.number);
      who(`${rt}.author`, r.author);
      mapUploadRefs(r.model, uploadRef(`${rt}.model`));
      r.events.forEach((e, i) => who(`${rt}.events[${i}].actor`, e.actor));
      r.comments.forEach((c, i) => who(`${rt}.comments[${i}].author`, c.author));
      r.runs.forEach((run, i) => {
        const path = `${rt}.runs[${i}]`;
        who(`${path}.createdBy`, run.createdBy);
        for (const [name, value] of Object.entries(run.columns)) {
          const column = columns.get(name);
          if (!column) {
            add(`${path}.columns.${name}`, 'is not a column of a run in this version of Wallpulse');
            continue;
          }
          const type = column.getSQLType();
          if (value === null && column.notNull) add(`${path}.columns.${name}`, 'must not be empty');
          else if (value !== null && isDateColumn(type) && (typeof value !== 'string' || Number.isNaN(Date.parse(value)))) add(`${path}.columns.${name}`, 'must be a date and time (ISO 8601)');
          else if (value !== null && /int|double|float|decimal/i.test(type) && typeof value !== 'number') add(`${path}.columns.${name}`, 'must be a number');
          else if (typeof value === 'string') mapUploadRefsInText(value, uploadRef(`${path}.columns.${name}`));
          // a kept run's packed series is read back by the Report and the Shared view: it must be one
          if (name === 'packed' && value !== null && typeof value === 'object') {
            const unreadable = checkPacked(Buffer.from(value.$base64, 'base64'));
            if (unreadable) add(`${path}.columns.${name}`, unreadable.replace(/^The packed run/, 'holds a packed run that').replace(/ Keep it without its series\.$/, ''));
          }
        }
        for (const [name, column] of columns) {
          if (!(name in run.columns) && column.notNull && !column.hasDefault) add(`${path}.columns.${name}`, 'is required');
        }
      });
    });
  });
  return fields;
}

// --- import ---

/** the message of a database error without the query and its parameters */
function databaseMessage(err: unknown): string {
  const cause = (err as { cause?: unknown }).cause;
  const message = cause instanceof Error ? cause.message : err instanceof Error && !err.message.startsWith('Failed query') ? err.message : 'the database refused a row';
  return message.slice(0, 200);
}

/**
 * Write a checked backup as a new job of the team. Each person of the file who is a member
 * of the team (same e-mail) stays the author; the others become the importing person, and
 * their names are kept in a note added to the job's notes. One transaction: all or nothing.
 */
export async function restoreJob(teamId: number, importer: { id: string; name: string }, b: JobBackup, ip = ''): Promise<{ ok: true; result: RestoreResult } | BackupProblem> {
  const emails = [...new Set(b.people.map((p) => p.email.toLowerCase()))];
  const members = emails.length
    ? await db
        .select({ id: users.id, email: users.email })
        .from(users)
        .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId)))
        .where(inArray(users.email, emails))
    : [];
  const byEmail = new Map(members.map((m) => [m.email.toLowerCase(), m.id]));
  const userOf = new Map<string, string>();
  const reassigned: string[] = [];
  for (const p of b.people) {
    const id = byEmail.get(p.email.toLowerCase());
    if (id) userOf.set(p.key, id);
    else {
      userOf.set(p.key, importer.id);
      reassigned.push(p.name || p.email);
    }
  }
  const who = (key: string | null) => (key === null ? null : userOf.get(key)!);
  const notes = reassigned.length
    ? `${b.job.notes}${b.job.notes ? '\n\n' : ''}Restored from a backup file of ${b.exportedAt.slice(0, 10)}: the work of ${reassigned.join(', ')} (not members of this team) is recorded under ${importer.name}.`
    : b.job.notes;
  const columns = runColumns();
  const counts = { assemblies: 0, revisions: 0, runs: 0, comments: 0, uploads: 0 };

  let jobId: number;
  try {
    jobId = await db.transaction(async (tx) => {
      const now = new Date();
      const [job] = await tx
        .insert(jobs)
        .values({ teamId, name: b.job.name, reference: b.job.reference, client: b.job.client, location: b.job.location, notes, createdBy: who(b.job.createdBy), createdAt: now, updatedAt: now })
        .$returningId();
      const uploadIds = new Map<number, number>();
      for (const u of b.uploads) {
        const [row] = await tx
          .insert(uploads)
          .values({ teamId, name: u.name, fileName: u.fileName, mapping: u.mapping, series: u.series, rowCount: u.series.air.length, createdBy: who(u.createdBy), createdAt: new Date(u.createdAt) })
          .$returningId();
        uploadIds.set(u.key, row.id);
        counts.uploads++;
      }
      const uploadId = (key: number) => uploadIds.get(key)!;
      for (const a of b.assemblies) {
        const [assembly] = await tx
          .insert(assemblies)
          .values({ jobId: job.id, name: a.name, element: a.element, description: a.description, createdBy: who(a.createdBy), createdAt: new Date(a.createdAt), updatedAt: new Date(a.updatedAt) })
          .$returningId();
        counts.assemblies++;
        const revisionIds = new Map<number, number>();
        for (const r of [...a.revisions].sort((x, y) => x.number - y.number)) {
          const [rev] = await tx
            .insert(revisions)
            .values({
              assemblyId: assembly.id,
              number: r.number,
              parentId: r.parentNumber === null ? null : revisionIds.get(r.parentNumber)!,
              model: mapUploadRefs(r.model, uploadId),
              note: r.note,
              state: r.state,
              authorId: who(r.author),
              createdAt: new Date(r.createdAt),
            })
            .$returningId();
          revisionIds.set(r.number, rev.id);
          counts.revisions++;
          for (const e of r.events) {
            await tx.insert(revisionEvents).values({ revisionId: rev.id, fromState: e.fromState, toState: e.toState, actorId: who(e.actor), note: e.note, createdAt: new Date(e.createdAt) });
          }
          for (const c of r.comments) {
            await tx.insert(comments).values({ revisionId: rev.id, authorId: who(c.author), body: c.body, createdAt: new Date(c.createdAt) });
            counts.comments++;
          }
          for (const run of r.runs) {
            // written as stored: the column names of the file, values decoded only from the file's own encodings
            const names = ['revision_id', 'created_by'];
            const values: unknown[] = [rev.id, who(run.createdBy)];
            for (const [name, value] of Object.entries(run.columns)) {
              const type = columns.get(name)!.getSQLType();
              names.push(name);
              if (value !== null && typeof value === 'object') values.push(Buffer.from(value.$base64, 'base64'));
              else if (typeof value === 'string' && isDateColumn(type)) values.push(new Date(value));
              else if (typeof value === 'string') values.push(mapUploadRefsInText(value, uploadId));
              else values.push(value);
            }
            for (const [name, column] of columns) {
              if (!names.includes(name) && column.defaultFn) {
                names.push(name);
                values.push(column.defaultFn());
              }
            }
            await tx.execute(
              sql`insert into ${runs} (${sql.join(
                names.map((n) => sql.identifier(n)),
                sql`, `,
              )}) values (${sql.join(
                values.map((v) => sql`${v}`),
                sql`, `,
              )})`,
            );
            counts.runs++;
          }
        }
      }
      return job.id;
    });
  } catch (err) {
    return problem(422, 'not_restored', `The backup could not be written (${databaseMessage(err)}); ${NOTHING}.`);
  }

  // after the transaction: the audit row never holds a second connection while one is open
  await audit({ action: 'job_restored', teamId, actorId: importer.id, target: `job:${jobId}`, detail: { from: b.source, exportedAt: b.exportedAt, counts, reassigned }, ip });
  return { ok: true, result: { job: { id: jobId, name: b.job.name, teamId }, counts, reassigned } };
}

/** record who downloaded a job's backup */
export async function auditExport(teamId: number, actorId: string, jobId: number, ip = ''): Promise<void> {
  await audit({ action: 'job_exported', teamId, actorId, target: `job:${jobId}`, ip });
}
