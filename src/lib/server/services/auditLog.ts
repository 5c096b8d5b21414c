import { and, count, desc, eq, like, or } from 'drizzle-orm';
import { db } from '../db';
import { auditLog, users } from '../db/schema';
import type { ListQuery } from '../../schemas/api';
import { likePattern, offsetOf, orderFor, type Page } from './list';

export interface AuditRow {
  id: number;
  action: string;
  actorName: string | null;
  target: string;
  detail: Record<string, unknown> | null;
  ip: string;
  success: boolean;
  createdAt: Date;
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
  return { items, page: q.page, pageSize: q.pageSize, total: n };
}
