import { and, eq } from 'drizzle-orm';
import { db } from './db';
import { memberships, teams, jobs, assemblies, revisions, type Role } from './db/schema';
import { apiError } from './http';

export interface Member {
  userId: string;
  teamId: number;
  teamName: string;
  role: Role;
}

/** what each role may do (design.md, Who uses it) */
export const can = {
  /** build, edit, save and run assemblies; manage the team's own materials */
  edit: (role: Role) => role === 'admin' || role === 'engineer',
  /** comment, mark checked or send back */
  check: (role: Role) => role === 'checker' || role === 'admin',
  /** invite, remove, change roles */
  administer: (role: Role) => role === 'admin',
  /** read everything in the team */
  read: (_role: Role) => true,
};

export async function membership(userId: string, teamId: number): Promise<Member | null> {
  const rows = await db
    .select({ userId: memberships.userId, teamId: memberships.teamId, role: memberships.role, teamName: teams.name })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, userId), eq(memberships.teamId, teamId)))
    .limit(1);
  return rows[0] ?? null;
}

/** the teams a person belongs to, oldest first */
export async function teamsOf(userId: string): Promise<Member[]> {
  return db
    .select({ userId: memberships.userId, teamId: memberships.teamId, role: memberships.role, teamName: teams.name })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(memberships.createdAt);
}

export async function teamOfJob(jobId: number): Promise<number | null> {
  const rows = await db.select({ teamId: jobs.teamId }).from(jobs).where(eq(jobs.id, jobId)).limit(1);
  return rows[0]?.teamId ?? null;
}

export async function teamOfAssembly(assemblyId: number): Promise<number | null> {
  const rows = await db
    .select({ teamId: jobs.teamId })
    .from(assemblies)
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(eq(assemblies.id, assemblyId))
    .limit(1);
  return rows[0]?.teamId ?? null;
}

export async function teamOfRevision(revisionId: number): Promise<number | null> {
  const rows = await db
    .select({ teamId: jobs.teamId })
    .from(revisions)
    .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(eq(revisions.id, revisionId))
    .limit(1);
  return rows[0]?.teamId ?? null;
}

/**
 * The member's standing in the team that owns a thing, or an error response:
 * 401 signed out, 404 when the thing is missing or belongs to another team
 * (another team's ids are not confirmed to exist), 403 when the role may not.
 */
export async function authorize(
  locals: App.Locals,
  teamId: number | null,
  allowed: (role: Role) => boolean = can.read,
): Promise<{ member: Member } | { response: Response }> {
  if (!locals.user) return { response: apiError(401, 'unauthenticated', 'Sign in first.') };
  if (teamId === null) return { response: apiError(404, 'not_found', 'Not found.') };
  const member = await membership(locals.user.id, teamId);
  if (!member) return { response: apiError(404, 'not_found', 'Not found.') };
  if (!allowed(member.role)) return { response: apiError(403, 'forbidden', `Your role (${member.role}) may not do this.`) };
  return { member };
}
