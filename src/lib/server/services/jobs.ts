// jobs and their assemblies. a new assembly starts with revision 1 holding a default document.
import { and, count, eq, like, or, sql } from 'drizzle-orm';
import { db } from '../db';
import { assemblies, jobs, revisions, revisionEvents, users } from '../db/schema';
import type { ListQuery } from '../../schemas/api';
import type { AssemblyRow, JobRow } from '../../schemas/rows';
import { likePattern, offsetOf, orderFor, pageOf, type Page } from './list';
import { defaultDocument, type Element } from './defaultDocument';

const assemblyCount = sql<number>`(select count(*) from ${assemblies} where ${assemblies.jobId} = ${jobs.id})`.mapWith(Number);

export async function listJobs(teamId: number, q: ListQuery): Promise<Page<JobRow>> {
  const p = likePattern(q.q);
  const where = and(
    eq(jobs.teamId, teamId),
    q.q ? or(like(jobs.name, p), like(jobs.reference, p), like(jobs.client, p), like(jobs.location, p)) : undefined,
  );
  const items = await db
    .select({
      id: jobs.id,
      name: jobs.name,
      reference: jobs.reference,
      client: jobs.client,
      location: jobs.location,
      assemblyCount,
      createdByName: users.name,
      createdAt: jobs.createdAt,
      updatedAt: jobs.updatedAt,
    })
    .from(jobs)
    .leftJoin(users, eq(users.id, jobs.createdBy))
    .where(where)
    .orderBy(
      ...orderFor(q.sort, {
        updatedAt: jobs.updatedAt,
        name: jobs.name,
        reference: jobs.reference,
        client: jobs.client,
        location: jobs.location,
        createdAt: jobs.createdAt,
        assemblyCount,
      }),
    )
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db.select({ n: count() }).from(jobs).where(where);
  return pageOf(items, q, n);
}

export async function getJob(jobId: number) {
  const rows = await db.select().from(jobs).where(eq(jobs.id, jobId)).limit(1);
  return rows[0] ?? null;
}

export async function createJob(
  teamId: number,
  userId: string,
  input: { name: string; reference: string; client: string; location: string; notes: string },
): Promise<{ id: number }> {
  const [row] = await db.insert(jobs).values({ teamId, createdBy: userId, ...input }).$returningId();
  return { id: row.id };
}

export async function updateJob(jobId: number, input: Partial<{ name: string; reference: string; client: string; location: string; notes: string }>) {
  await db.update(jobs).set({ ...input, updatedAt: new Date() }).where(eq(jobs.id, jobId));
}

// the outer row named in full: in a select without joins drizzle writes ${assemblies.id} as a bare `id`, which the
// subquery would read as r.id
const headNumber = sql<number | null>`(select max(r.number) from ${revisions} r where r.assembly_id = assemblies.id)`;
const headState = sql<string | null>`(select r.state from ${revisions} r where r.assembly_id = assemblies.id order by r.number desc limit 1)`;

export async function listAssemblies(jobId: number, q: ListQuery): Promise<Page<AssemblyRow>> {
  const p = likePattern(q.q);
  const where = and(eq(assemblies.jobId, jobId), q.q ? or(like(assemblies.name, p), like(assemblies.description, p), like(assemblies.element, p)) : undefined);
  const items = await db
    .select({
      id: assemblies.id,
      name: assemblies.name,
      element: assemblies.element,
      description: assemblies.description,
      headNumber,
      headState,
      updatedAt: assemblies.updatedAt,
    })
    .from(assemblies)
    .where(where)
    .orderBy(...orderFor(q.sort, { name: assemblies.name, element: assemblies.element, updatedAt: assemblies.updatedAt, headNumber, headState }))
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db.select({ n: count() }).from(assemblies).where(where);
  return pageOf(items.map((r) => ({ ...r, headNumber: r.headNumber === null ? null : Number(r.headNumber) })), q, n);
}

/** a new assembly with revision 1 (the default build-up for its element) */
export async function createAssembly(jobId: number, userId: string, input: { name: string; element: Element; description: string }): Promise<{ id: number; revisionId: number }> {
  return db.transaction(async (tx) => {
    const [a] = await tx.insert(assemblies).values({ jobId, createdBy: userId, ...input }).$returningId();
    const [r] = await tx
      .insert(revisions)
      .values({ assemblyId: a.id, number: 1, parentId: null, model: defaultDocument(input.element), note: 'Default build-up', authorId: userId })
      .$returningId();
    await tx.insert(revisionEvents).values({ revisionId: r.id, fromState: null, toState: 'draft', actorId: userId, note: 'Created' });
    await tx.update(jobs).set({ updatedAt: new Date() }).where(eq(jobs.id, jobId));
    return { id: a.id, revisionId: r.id };
  });
}

export async function updateAssembly(assemblyId: number, input: Partial<{ name: string; description: string }>) {
  await db.update(assemblies).set({ ...input, updatedAt: new Date() }).where(eq(assemblies.id, assemblyId));
}

/** the assembly with its job's name and team */
export async function getAssembly(assemblyId: number) {
  const rows = await db
    .select({
      id: assemblies.id,
      name: assemblies.name,
      element: assemblies.element,
      description: assemblies.description,
      jobId: assemblies.jobId,
      jobName: jobs.name,
      teamId: jobs.teamId,
    })
    .from(assemblies)
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(eq(assemblies.id, assemblyId))
    .limit(1);
  return rows[0] ?? null;
}
