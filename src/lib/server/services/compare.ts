// what the compare page picks from: a job's assemblies, each with its revisions and their documents
import { asc, desc, eq, inArray } from 'drizzle-orm';
import { db } from '../db';
import { assemblies, revisions, type RevisionState } from '../db/schema';

export interface CompareRevision {
  id: number;
  number: number;
  state: RevisionState;
  note: string;
  createdAt: Date;
  /** the workbench document the revision keeps */
  model: unknown;
}

export interface CompareAssembly {
  id: number;
  name: string;
  element: 'wall' | 'roof' | 'floor';
  /** newest first */
  revisions: CompareRevision[];
}

/** every assembly of a job (by name) with its revisions (newest first) */
export async function compareSources(jobId: number): Promise<CompareAssembly[]> {
  const list = await db
    .select({ id: assemblies.id, name: assemblies.name, element: assemblies.element })
    .from(assemblies)
    .where(eq(assemblies.jobId, jobId))
    .orderBy(asc(assemblies.name));
  if (list.length === 0) return [];
  const revs = await db
    .select({ id: revisions.id, assemblyId: revisions.assemblyId, number: revisions.number, state: revisions.state, note: revisions.note, createdAt: revisions.createdAt, model: revisions.model })
    .from(revisions)
    .where(inArray(revisions.assemblyId, list.map((a) => a.id)))
    .orderBy(desc(revisions.number));
  return list.map((a) => ({
    ...a,
    revisions: revs.filter((r) => r.assemblyId === a.id).map(({ assemblyId: _a, ...r }) => r),
  }));
}
