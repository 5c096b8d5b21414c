// runs kept with a revision: what ran (the exposure), what it found (the summary, keyed by the
// figure definitions of src/lib/workbench/figureDefs.ts), who ran it when, and the run itself
// packed (src/lib/workbench/keptRun.ts) so a checker, the Report and the Shared view read the
// very run the engineer saw.
import { and, desc, eq, isNotNull, sql } from 'drizzle-orm';
import { db } from '../db';
import { runs, users } from '../db/schema';
import { MAX_PACKED_BYTES, readPackedHeader, unpackRun } from '../../workbench/keptRun';
import type { RunDone } from '../../workbench/runDocument';

export type RunSummary = Record<string, number | string | null>;

/** checks packed bytes before they are kept: the header must read and the size stay in the limit */
export function checkPacked(bytes: Uint8Array): string | null {
  if (bytes.length > MAX_PACKED_BYTES) return `The packed run is ${(bytes.length / 1048576).toFixed(1)} MB; at most ${MAX_PACKED_BYTES / 1048576} MB is kept. Keep it without its series.`;
  try {
    readPackedHeader(bytes);
    return null;
  } catch (e) {
    return `The packed run cannot be read: ${e instanceof Error ? e.message : String(e)}.`;
  }
}

export async function addRun(revisionId: number, userId: string, input: { exposure: unknown; summary: RunSummary; packed?: Uint8Array | null }) {
  const createdAt = new Date();
  const [row] = await db
    .insert(runs)
    .values({ revisionId, createdBy: userId, exposure: input.exposure, summary: input.summary, packed: input.packed ? Buffer.from(input.packed) : null, createdAt })
    .$returningId();
  return { id: row.id, createdAt };
}

/** what a run answers with besides its ids: what it ran, what it found, and who ran it when */
const runFields = {
  exposure: runs.exposure,
  summary: runs.summary,
  createdByName: users.name,
  createdAt: runs.createdAt,
  packedBytes: sql<number | null>`length(${runs.packed})`.mapWith((v) => (v === null ? null : Number(v))),
};

export interface KeptRunRow {
  id: number;
  exposure: unknown;
  summary: RunSummary;
  createdByName: string | null;
  createdAt: Date;
  /** the run's series is kept with it */
  hasSeries: boolean;
  packedBytes: number | null;
}

const rowOf = (r: { id: number; exposure: unknown; summary: unknown; createdByName: string | null; createdAt: Date; packedBytes: number | null }): KeptRunRow => ({
  ...r,
  summary: (r.summary ?? {}) as RunSummary,
  hasSeries: r.packedBytes !== null,
});

/** the runs of a revision, newest first (without their packed bytes) */
export async function runsOf(revisionId: number, limit = 100): Promise<KeptRunRow[]> {
  const rows = await db
    .select({ id: runs.id, ...runFields })
    .from(runs)
    .leftJoin(users, eq(users.id, runs.createdBy))
    .where(eq(runs.revisionId, revisionId))
    .orderBy(desc(runs.createdAt), desc(runs.id))
    .limit(limit);
  return rows.map(rowOf);
}

export async function getRun(runId: number): Promise<(KeptRunRow & { revisionId: number }) | null> {
  const rows = await db
    .select({ id: runs.id, revisionId: runs.revisionId, ...runFields })
    .from(runs)
    .leftJoin(users, eq(users.id, runs.createdBy))
    .where(eq(runs.id, runId))
    .limit(1);
  return rows[0] ? { ...rowOf(rows[0]), revisionId: rows[0].revisionId } : null;
}

/** the packed bytes of a run, or null when it was kept without its series */
export async function packedOf(runId: number): Promise<Buffer | null> {
  const rows = await db.select({ packed: runs.packed }).from(runs).where(eq(runs.id, runId)).limit(1);
  return rows[0]?.packed ?? null;
}

export async function revisionOfRun(runId: number): Promise<number | null> {
  const rows = await db.select({ revisionId: runs.revisionId }).from(runs).where(eq(runs.id, runId)).limit(1);
  return rows[0]?.revisionId ?? null;
}

/** the newest run of a revision kept with its series, unpacked; null when there is none (or it does not unpack) */
export async function latestKeptRun(revisionId: number): Promise<{ row: KeptRunRow; run: RunDone } | null> {
  const rows = await db
    .select({ id: runs.id, ...runFields, packed: runs.packed })
    .from(runs)
    .leftJoin(users, eq(users.id, runs.createdBy))
    .where(and(eq(runs.revisionId, revisionId), isNotNull(runs.packed)))
    .orderBy(desc(runs.createdAt), desc(runs.id))
    .limit(1);
  const r = rows[0];
  if (!r || !r.packed) return null;
  const { packed, ...rest } = r;
  try {
    return { row: rowOf(rest), run: unpackRun(new Uint8Array(packed.buffer, packed.byteOffset, packed.byteLength)) };
  } catch {
    return null;
  }
}
