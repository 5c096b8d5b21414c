// teams, members and roles. the last admin of a team can neither leave nor be demoted.
import { and, count, eq, like, or, sql } from 'drizzle-orm';
import { db } from '../db';
import { memberships, teams, users, type Role } from '../db/schema';
import { audit } from '../audit';
import { teamBody, type ListQuery } from '../../schemas/api';
import type { MemberRow } from '../../schemas/rows';
import { likePattern, offsetOf, orderFor, pageOf, type Page } from './list';

export type Fail = { ok: false; status: number; code: string; message: string };
export const fail = (status: number, code: string, message: string): Fail => ({ ok: false, status, code, message });

export async function createTeam(userId: string, name: string, ip = ''): Promise<{ id: number; name: string }> {
  const [team] = await db.insert(teams).values({ name }).$returningId();
  await db.insert(memberships).values({ teamId: team.id, userId, role: 'admin' });
  await audit({ action: 'team_created', teamId: team.id, actorId: userId, target: name, ip });
  return { id: team.id, name };
}

/**
 * The "start a team" form (field teamName) of the Jobs and Team pages: the new team,
 * or the name as typed with the message for its field.
 */
export async function createTeamFromForm(userId: string, form: FormData, ip = ''): Promise<{ ok: true; teamId: number } | { ok: false; name: string; error: string }> {
  const name = String(form.get('teamName') ?? '');
  const parsed = teamBody.safeParse({ name });
  if (!parsed.success) return { ok: false, name, error: parsed.error.issues[0]?.message ?? 'Team name is not valid' };
  const team = await createTeam(userId, parsed.data.name, ip);
  return { ok: true, teamId: team.id };
}

export async function listMembers(teamId: number, q: ListQuery): Promise<Page<MemberRow>> {
  const where = and(
    eq(memberships.teamId, teamId),
    q.q ? or(like(users.name, likePattern(q.q)), like(users.email, likePattern(q.q)), like(memberships.role, likePattern(q.q))) : undefined,
  );
  const items = await db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(where)
    .orderBy(...orderFor(q.sort, { name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.createdAt }))
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db.select({ n: count() }).from(memberships).innerJoin(users, eq(users.id, memberships.userId)).where(where);
  return pageOf(items, q, n);
}

type Exec = Pick<typeof db, 'select'>;

async function adminCount(ex: Exec, teamId: number): Promise<number> {
  const [{ n }] = await ex
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'admin')));
  return n;
}

async function roleOf(ex: Exec, teamId: number, userId: string): Promise<Role | null> {
  const rows = await ex
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .limit(1);
  return rows[0]?.role ?? null;
}

export async function changeRole(teamId: number, actorId: string, userId: string, role: Role, ip = ''): Promise<{ ok: true; from: Role } | Fail> {
  return db.transaction(async (tx) => {
    // lock the team's admin rows so two demotions at once cannot leave it without one
    await tx.execute(sql`select user_id from memberships where team_id = ${teamId} for update`);
    const from = await roleOf(tx, teamId, userId);
    if (!from) return fail(404, 'not_found', 'That person is not a member of this team.');
    if (from === role) return { ok: true as const, from };
    if (from === 'admin' && (await adminCount(tx, teamId)) <= 1) {
      return fail(409, 'last_admin', 'This is the team’s only admin. Make another member admin first, then change this role.');
    }
    await tx.update(memberships).set({ role }).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await audit({ action: 'role_changed', teamId, actorId, target: userId, detail: { from, to: role }, ip }, tx);
    return { ok: true as const, from };
  });
}

/** remove a member (an admin) or leave (the member themself) */
export async function removeMember(teamId: number, actorId: string, userId: string, ip = ''): Promise<{ ok: true } | Fail> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select user_id from memberships where team_id = ${teamId} for update`);
    const from = await roleOf(tx, teamId, userId);
    if (!from) return fail(404, 'not_found', 'That person is not a member of this team.');
    if (from === 'admin' && (await adminCount(tx, teamId)) <= 1) {
      return fail(
        409,
        'last_admin',
        actorId === userId
          ? 'You are the team’s only admin and cannot leave. Make another member admin first.'
          : 'This is the team’s only admin and cannot be removed. Make another member admin first.',
      );
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await audit({ action: actorId === userId ? 'member_left' : 'member_removed', teamId, actorId, target: userId, detail: { role: from }, ip }, tx);
    return { ok: true as const };
  });
}
