// invitations by e-mail: a link with a 7-day token (only its hash kept) that a new or
// existing person accepts; accepting with a new account proves the address.
import { and, count, desc, eq, gt, isNull, like, ne } from 'drizzle-orm';
import { PUBLIC_BASE_URL } from 'astro:env/server';
import { db } from '../db';
import { invitations, memberships, teams, users, type Role } from '../db/schema';
import { audit } from '../audit';
import { deliverNow, queueMail } from '../mail';
import { hashToken, tokenPair, DAY_MS } from '../tokens';
import type { ListQuery } from '../../schemas/api';
import type { InvitationRow, InvitationStatus } from '../../schemas/rows';
import { likePattern, offsetOf, orderFor, pageOf, type Page } from './list';
import { fail, type Fail } from './teams';

export const INVITATION_LIFETIME_MS = 7 * DAY_MS;

export async function invite(teamId: number, actor: { id: string; name: string }, email: string, role: Role, ip = ''): Promise<{ ok: true; id: number } | Fail> {
  const already = await db
    .select({ userId: users.id })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId)))
    .where(eq(users.email, email))
    .limit(1);
  if (already[0]) return fail(409, 'already_member', `${email} is already a member of this team.`);
  const team = (await db.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId)).limit(1))[0];
  const { token, hash } = tokenPair();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
  const [row] = await db.insert(invitations).values({ teamId, email, role, tokenHash: hash, invitedBy: actor.id, expiresAt }).$returningId();
  const url = `${PUBLIC_BASE_URL}/invite/${token}`;
  // queued, then sent at once: the admin learns now whether it went out
  const mailId = await queueMail(
    {
      to: email,
      subject: `${actor.name} invited you to ${team?.name ?? 'a team'} on Wallpulse`,
      purpose: 'invite',
      text: `Hello,\n\n${actor.name} invited you to join ${team?.name ?? 'their team'} on Wallpulse as ${role === 'admin' ? 'an admin' : `a ${role}`}.\n\nOpen the link below to accept. It expires in 7 days.\n\n${url}\n\nIf you did not expect this, ignore this message.\n`,
    },
    { forDeliverNow: true },
  );
  if (!(await deliverNow(mailId))) {
    // an invitation nobody received must not stay open
    await db.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, row.id));
    return fail(503, 'mail_failed', `The invitation to ${email} could not be sent: the mail server did not answer. Try again in a minute.`);
  }
  // a new invitation replaces any open one to the same address, once it has gone out: when the
  // mail fails, an earlier invitation the person did receive stays usable
  await db
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(
      and(eq(invitations.teamId, teamId), eq(invitations.email, email), ne(invitations.id, row.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)),
    );
  await audit({ action: 'invitation_sent', teamId, actorId: actor.id, target: email, detail: { role, invitationId: row.id }, ip });
  return { ok: true, id: row.id };
}

function statusOf(r: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }): InvitationStatus {
  if (r.acceptedAt) return 'accepted';
  if (r.revokedAt) return 'revoked';
  if (r.expiresAt.getTime() <= Date.now()) return 'expired';
  return 'open';
}

export async function listInvitations(teamId: number, q: ListQuery): Promise<Page<InvitationRow>> {
  const where = and(eq(invitations.teamId, teamId), q.q ? like(invitations.email, likePattern(q.q)) : undefined);
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedByName: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(where)
    .orderBy(...orderFor(q.sort, { createdAt: invitations.createdAt, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt }), desc(invitations.id))
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db.select({ n: count() }).from(invitations).where(where);
  return pageOf(rows.map((r) => ({ ...r, status: statusOf(r) })), q, n);
}

export async function revokeInvitation(invitationId: number, actorId: string, ip = ''): Promise<{ ok: true } | Fail> {
  const row = (await db.select().from(invitations).where(eq(invitations.id, invitationId)).limit(1))[0];
  if (!row) return fail(404, 'not_found', 'Not found.');
  if (statusOf(row) !== 'open') return fail(409, 'not_open', `This invitation is ${statusOf(row)} and cannot be revoked.`);
  await db.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, invitationId));
  await audit({ action: 'invitation_revoked', teamId: row.teamId, actorId, target: row.email, detail: { invitationId }, ip });
  return { ok: true };
}

export async function teamOfInvitation(invitationId: number): Promise<number | null> {
  const rows = await db.select({ teamId: invitations.teamId }).from(invitations).where(eq(invitations.id, invitationId)).limit(1);
  return rows[0]?.teamId ?? null;
}

export interface OpenInvitation {
  id: number;
  teamId: number;
  teamName: string;
  email: string;
  role: Role;
  invitedByName: string | null;
  expiresAt: Date;
  /** an account already exists for the address */
  hasAccount: boolean;
}

/** the open invitation a token names, or why it cannot be used */
export async function invitationByToken(token: string): Promise<{ ok: true; invitation: OpenInvitation } | Fail> {
  const rows = await db
    .select({
      id: invitations.id,
      teamId: invitations.teamId,
      teamName: teams.name,
      email: invitations.email,
      role: invitations.role,
      invitedByName: users.name,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
    })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, hashToken(token)))
    .limit(1);
  const row = rows[0];
  if (!row) return fail(404, 'invitation_invalid', 'This invitation link is not valid. Check that the whole link was copied, or ask for a new invitation.');
  const status = statusOf(row);
  if (status === 'accepted') return fail(410, 'invitation_used', 'This invitation was accepted already. Sign in to reach the team.');
  if (status === 'revoked') return fail(410, 'invitation_revoked', 'This invitation was withdrawn by the team. Ask its admin for a new one.');
  if (status === 'expired') return fail(410, 'invitation_expired', 'This invitation has expired (invitations last 7 days). Ask the team’s admin for a new one.');
  const account = await db.select({ id: users.id }).from(users).where(eq(users.email, row.email)).limit(1);
  const { acceptedAt: _a, revokedAt: _r, ...invitation } = row;
  return { ok: true, invitation: { ...invitation, hasAccount: Boolean(account[0]) } };
}

/** join the team as the invited role; the signed-in person's address must be the invited one */
export async function acceptInvitation(token: string, user: { id: string; email: string }, ip = ''): Promise<{ ok: true; teamId: number } | Fail> {
  const found = await invitationByToken(token);
  if (!found.ok) return found;
  const inv = found.invitation;
  if (inv.email.toLowerCase() !== user.email.toLowerCase()) {
    return fail(403, 'wrong_account', `This invitation is for ${inv.email}, but you are signed in as ${user.email}. Sign out and sign in with the invited address.`);
  }
  const [res] = await db
    .update(invitations)
    .set({ acceptedAt: new Date() })
    .where(and(eq(invitations.id, inv.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())));
  if ((res as { affectedRows?: number }).affectedRows !== 1) return fail(410, 'invitation_used', 'This invitation was accepted already.');
  const member = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, inv.teamId), eq(memberships.userId, user.id)))
    .limit(1);
  if (!member[0]) await db.insert(memberships).values({ teamId: inv.teamId, userId: user.id, role: inv.role });
  // the link proved the mailbox
  await db.update(users).set({ emailVerifiedAt: new Date() }).where(and(eq(users.id, user.id), isNull(users.emailVerifiedAt)));
  await audit({ action: 'invitation_accepted', teamId: inv.teamId, actorId: user.id, target: inv.email, detail: { role: inv.role, invitationId: inv.id }, ip });
  return { ok: true, teamId: inv.teamId };
}
