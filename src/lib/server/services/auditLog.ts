import { and, count, desc, eq, inArray, like, or } from 'drizzle-orm';
import { db } from '../db';
import { assemblies, auditLog, revisions, shareLinks, users } from '../db/schema';
import type { ListQuery } from '../../schemas/api';
import type { AuditRow } from '../../schemas/rows';
import { likePattern, offsetOf, orderFor, pageOf, type Page } from './list';

const PERSON_ACTIONS = new Set(['role_changed', 'member_removed', 'member_left']);

/** names for the raw targets (user ids, share:<id>, revision:<id>) of one page */
async function describeTargets(rows: Omit<AuditRow, 'targetText'>[]): Promise<AuditRow[]> {
  const userIds = [...new Set(rows.filter((r) => PERSON_ACTIONS.has(r.action)).map((r) => r.target))];
  const shareIds = [...new Set(rows.map((r) => /^share:(\d+)$/.exec(r.target)?.[1]).filter(Boolean).map(Number))];
  const revisionIds = [...new Set(rows.map((r) => /^revision:(\d+)$/.exec(r.target)?.[1]).filter(Boolean).map(Number))];
  const names = new Map<string, string>();
  if (userIds.length) for (const u of await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, userIds))) names.set(u.id, u.name);
  if (shareIds.length) {
    const shares = await db
      .select({ id: shareLinks.id, label: shareLinks.label, number: revisions.number, assembly: assemblies.name })
      .from(shareLinks)
      .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
      .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
      .where(inArray(shareLinks.id, shareIds));
    for (const sh of shares) names.set(`share:${sh.id}`, `${sh.label ? `“${sh.label}”, ` : ''}${sh.assembly} R${sh.number}`);
  }
  if (revisionIds.length) {
    const revs = await db
      .select({ id: revisions.id, number: revisions.number, assembly: assemblies.name })
      .from(revisions)
      .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
      .where(inArray(revisions.id, revisionIds));
    for (const r of revs) names.set(`revision:${r.id}`, `${r.assembly} R${r.number}`);
  }
  return rows.map((r) => ({ ...r, targetText: names.get(r.target) ?? r.target }));
}

/**
 * A team's audit log. Sign-ins are not tied to one team, so a team's log shows the
 * sign-ins and failed sign-ins of its members' addresses as well as its own rows.
 */
export async function listAudit(teamId: number, memberEmails: string[], q: ListQuery): Promise<Page<AuditRow>> {
  const p = likePattern(q.q);
  const signIns = memberEmails.length
    ? and(or(eq(auditLog.action, 'sign_in'), eq(auditLog.action, 'sign_in_failed')), or(...memberEmails.map((e) => eq(auditLog.target, e))))
    : undefined;
  const where = and(
    signIns ? or(eq(auditLog.teamId, teamId), signIns) : eq(auditLog.teamId, teamId),
    q.q ? or(like(auditLog.action, p), like(auditLog.target, p), like(users.name, p), like(auditLog.ip, p)) : undefined,
  );
  const items = await db
    .select({
      id: auditLog.id,
      action: auditLog.action,
      actorName: users.name,
      target: auditLog.target,
      detail: auditLog.detail,
      ip: auditLog.ip,
      success: auditLog.success,
      createdAt: auditLog.createdAt,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(where)
    .orderBy(...orderFor(q.sort, { createdAt: auditLog.createdAt, action: auditLog.action, actorName: users.name, target: auditLog.target }), desc(auditLog.id))
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db.select({ n: count() }).from(auditLog).leftJoin(users, eq(users.id, auditLog.actorId)).where(where);
  return pageOf(await describeTargets(items), q, n);
}
