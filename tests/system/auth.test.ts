// accounts and invitations end to end over HTTP, reading the mail from the fake SMTP store
import { describe, it, expect, afterAll } from 'vitest';
import { and, desc, eq } from 'drizzle-orm';
import { closeTestDb, lastMailTo, testDb } from '../support/db';
import { auditLog, emailTokens, invitations, memberships, users } from '../../src/lib/server/db/schema';
import { hashToken } from '../../src/lib/server/tokens';
import { DEMO, PASSWORD, call, demoTeamId, makeTeam, makeUser, uid } from './teamFixtures';

afterAll(closeTestDb);

const linkToken = (text: string, path: string) => {
  const m = text.match(new RegExp(`${path}/([A-Za-z0-9_-]{40,})`));
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[1];
};
const cookieOf = (res: Response) => (res.headers.get('set-cookie') ?? '').split(';')[0];

describe('sign up', () => {
  it('names each invalid field: name, e-mail, and a password under 10 characters', async () => {
    const res = await call('POST', '/api/auth/signup', { body: { name: ' ', email: 'not-an-address', password: 'short' } });
    expect(res.status).toBe(422);
    const { error } = await res.json();
    expect(error.code).toBe('invalid');
    expect(error.fields.name).toMatch(/Name/);
    expect(error.fields.email).toMatch(/E-mail/);
    expect(error.fields.password).toMatch(/at least 10 characters/);
  });

  it('mails a single-use verification link, stored only as its sha256, that confirms the address and signs in', async () => {
    const email = `new-${uid()}@example.test`;
    const res = await call('POST', '/api/auth/signup', { body: { name: 'Maren Holt', email, password: 'a long enough password' } });
    expect(res.status).toBe(202);
    // not signed in until the link proves the mailbox
    expect(res.headers.get('set-cookie')).toBeNull();
    // the worker sends the queued message within a few seconds
    const mail = await lastMailTo(email);
    const token = linkToken(mail.textBody, '/verify');
    expect(token.length).toBeGreaterThanOrEqual(43); // 32 random bytes in base64url: 256 bits

    const [user] = await testDb().select().from(users).where(eq(users.email, email));
    const rows = await testDb().select().from(emailTokens).where(eq(emailTokens.userId, user.id));
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(hashToken(token));
    expect(rows[0].tokenHash).not.toContain(token);
    // 48 hours, give or take the test's own time
    expect(rows[0].expiresAt.getTime() - rows[0].createdAt.getTime()).toBeCloseTo(48 * 3600_000, -4);

    expect(user.emailVerifiedAt).toBeNull();
    const verified = await call('POST', '/api/auth/verify', { body: { token } });
    expect(verified.status).toBe(200);
    expect(verified.headers.get('set-cookie')).toMatch(/HttpOnly/i);
    expect(verified.headers.get('set-cookie')).toMatch(/SameSite=Lax/i);
    const after = await (await call('GET', '/api/auth/me', { cookie: cookieOf(verified) })).json();
    expect(after.user.emailVerified).toBe(true);
    const again = await call('POST', '/api/auth/verify', { body: { token } });
    expect(again.status).toBe(410);
  });

  it('refuses an expired verification link', async () => {
    const email = `late-${uid()}@example.test`;
    await call('POST', '/api/auth/signup', { body: { name: 'Late Reader', email, password: 'a long enough password' } });
    const token = linkToken((await lastMailTo(email)).textBody, '/verify');
    await testDb().update(emailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(emailTokens.tokenHash, hashToken(token)));
    const res = await call('POST', '/api/auth/verify', { body: { token } });
    expect(res.status).toBe(410);
    expect((await res.json()).error.message).toMatch(/expired/);
  });

  it('answers an address that has an account exactly as a new one, and mails its owner instead', async () => {
    const owner = await makeUser();
    const fresh = `fresh-${uid()}@example.test`;
    const known = await call('POST', '/api/auth/signup', { body: { name: 'Copy', email: owner.email.toUpperCase(), password: 'a long enough password' } });
    const unknown = await call('POST', '/api/auth/signup', { body: { name: 'Copy', email: fresh, password: 'a long enough password' } });
    expect(known.status).toBe(unknown.status);
    const [a, b] = [await known.json(), await unknown.json()];
    expect(a.message.replace(owner.email, 'ADDRESS')).toBe(b.message.replace(fresh, 'ADDRESS'));
    expect(known.headers.get('set-cookie')).toBeNull();
    const mail = await lastMailTo(owner.email);
    expect(mail.subject).toMatch(/tried to create a Wallpulse account/);
    expect(mail.textBody).toMatch(/\/signin/);
    const rows = await testDb().select().from(users).where(eq(users.email, owner.email));
    expect(rows).toHaveLength(1);
  });
});

describe('sign in', () => {
  it('signs in with the right password and writes sign_in and sign_in_failed rows to the audit log', async () => {
    const { email } = await makeUser();
    const wrong = await call('POST', '/api/auth/signin', { body: { email, password: 'not the password' } });
    expect(wrong.status).toBe(401);
    const right = await call('POST', '/api/auth/signin', { body: { email, password: PASSWORD } });
    expect(right.status).toBe(200);
    expect(right.headers.get('set-cookie')).toMatch(/wallpulse_session=\w+.*HttpOnly/i);
    const rows = await testDb().select().from(auditLog).where(eq(auditLog.target, email)).orderBy(auditLog.id);
    expect(rows.map((r) => [r.action, r.success])).toEqual([
      ['sign_in_failed', false],
      ['sign_in', true],
    ]);
  });

  it('locks an address out from one place after five failed tries, even with the right password then', async () => {
    const { email } = await makeUser();
    for (let i = 0; i < 5; i++) expect((await call('POST', '/api/auth/signin', { body: { email, password: 'guess number ' + i } })).status).toBe(401);
    const locked = await call('POST', '/api/auth/signin', { body: { email, password: PASSWORD } });
    expect(locked.status).toBe(429);
    expect((await locked.json()).error.message).toMatch(/Too many failed sign-ins/);
  });

  it('ends the session on sign out', async () => {
    const { email } = await makeUser();
    const cookie = cookieOf(await call('POST', '/api/auth/signin', { body: { email, password: PASSWORD } }));
    expect((await call('GET', '/api/auth/me', { cookie })).status).toBe(200);
    expect((await call('POST', '/api/auth/signout', { cookie })).status).toBe(204);
    expect((await call('GET', '/api/auth/me', { cookie })).status).toBe(401);
  });
});

describe('password reset', () => {
  it('mails a one-hour link that sets a new password once and ends the old sessions', async () => {
    const { email } = await makeUser();
    const oldCookie = cookieOf(await call('POST', '/api/auth/signin', { body: { email, password: PASSWORD } }));
    expect((await call('POST', '/api/auth/reset-request', { body: { email } })).status).toBe(202);
    const token = linkToken((await lastMailTo(email)).textBody, '/reset');
    const [row] = await testDb().select().from(emailTokens).where(eq(emailTokens.tokenHash, hashToken(token)));
    expect(row.purpose).toBe('reset');
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeCloseTo(3600_000, -4);

    expect((await call('POST', '/api/auth/reset', { body: { token, password: 'short' } })).status).toBe(422);
    expect((await call('POST', '/api/auth/reset', { body: { token, password: 'a brand new passphrase' } })).status).toBe(200);
    expect((await call('POST', '/api/auth/reset', { body: { token, password: 'another new passphrase' } })).status).toBe(410);
    expect((await call('GET', '/api/auth/me', { cookie: oldCookie })).status).toBe(401);
    expect((await call('POST', '/api/auth/signin', { body: { email, password: PASSWORD } })).status).toBe(401);
    expect((await call('POST', '/api/auth/signin', { body: { email, password: 'a brand new passphrase' } })).status).toBe(200);
  });

  it('answers the same for an address with no account, and sends nothing', async () => {
    const email = `nobody-${uid()}@example.test`;
    const res = await call('POST', '/api/auth/reset-request', { body: { email } });
    expect(res.status).toBe(202);
    await expect(lastMailTo(email, 1500)).rejects.toThrow(/no mail/);
  });

  it('refuses a reset link past its hour', async () => {
    const { email } = await makeUser();
    await call('POST', '/api/auth/reset-request', { body: { email } });
    const token = linkToken((await lastMailTo(email)).textBody, '/reset');
    await testDb().update(emailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(emailTokens.tokenHash, hashToken(token)));
    expect((await call('POST', '/api/auth/reset', { body: { token, password: 'a brand new passphrase' } })).status).toBe(410);
  });
});

describe('invitations', () => {
  it('mails a 7-day link that a new person accepts with a new account, joining with the invited role', async () => {
    const teamId = await demoTeamId();
    const email = `invitee-${uid()}@example.test`;
    const sent = await call('POST', `/api/teams/${teamId}/invitations`, { userId: DEMO.admin, body: { email, role: 'checker' } });
    expect(sent.status).toBe(201);
    const mail = await lastMailTo(email);
    expect(mail.subject).toMatch(/Calder Row Envelope Studio/);
    const token = linkToken(mail.textBody, '/invite');
    const [inv] = await testDb().select().from(invitations).where(eq(invitations.email, email));
    expect(inv.tokenHash).toBe(hashToken(token));
    expect(inv.expiresAt.getTime() - inv.createdAt.getTime()).toBeCloseTo(7 * 86400_000, -4);

    const missing = await call('POST', '/api/invitations/accept', { body: { token } });
    expect(missing.status).toBe(422);
    expect(Object.keys((await missing.json()).error.fields).sort()).toEqual(['name', 'password']);
    const accepted = await call('POST', '/api/invitations/accept', { body: { token, name: 'Ada Brennan', password: 'a long enough password' } });
    expect(accepted.status).toBe(200);
    const cookie = cookieOf(accepted);
    const me = await (await call('GET', '/api/auth/me', { cookie })).json();
    expect(me.user.emailVerified).toBe(true);
    expect(me.teams).toEqual([{ id: teamId, name: 'Calder Row Envelope Studio', role: 'checker' }]);
    expect((await call('POST', '/api/invitations/accept', { body: { token } })).status).toBe(410);
    const audit = await testDb().select().from(auditLog).where(and(eq(auditLog.action, 'invitation_sent'), eq(auditLog.target, email)));
    expect(audit).toHaveLength(1);
  });

  it('lets an existing person accept only when signed in with the invited address', async () => {
    const teamId = await makeTeam();
    const admin = await makeUser({ teamId, role: 'admin' });
    const invited = await makeUser();
    const other = await makeUser();
    await call('POST', `/api/teams/${teamId}/invitations`, { userId: admin.id, body: { email: invited.email, role: 'engineer' } });
    const token = linkToken((await lastMailTo(invited.email)).textBody, '/invite');
    const signedOut = await call('POST', '/api/invitations/accept', { body: { token } });
    expect(signedOut.status).toBe(401);
    const wrong = await call('POST', '/api/invitations/accept', { userId: other.id, body: { token } });
    expect(wrong.status).toBe(403);
    expect((await wrong.json()).error.message).toMatch(/This invitation is for/);
    expect((await call('POST', '/api/invitations/accept', { userId: invited.id, body: { token } })).status).toBe(200);
    const rows = await testDb().select().from(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, invited.id)));
    expect(rows[0].role).toBe('engineer');
  });

  it('refuses an expired invitation with a message that says so', async () => {
    const teamId = await makeTeam();
    const admin = await makeUser({ teamId, role: 'admin' });
    const email = `slow-${uid()}@example.test`;
    await call('POST', `/api/teams/${teamId}/invitations`, { userId: admin.id, body: { email, role: 'engineer' } });
    const token = linkToken((await lastMailTo(email)).textBody, '/invite');
    await testDb().update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.tokenHash, hashToken(token)));
    const res = await call('POST', '/api/invitations/accept', { body: { token, name: 'Slow Reader', password: 'a long enough password' } });
    expect(res.status).toBe(410);
    expect((await res.json()).error.message).toMatch(/expired/);
  });
});

describe('roles', () => {
  it('keeps the last admin: they can neither be demoted nor leave, with a clear message', async () => {
    const teamId = await makeTeam();
    const admin = await makeUser({ teamId, role: 'admin' });
    const demote = await call('PATCH', `/api/teams/${teamId}/members/${admin.id}`, { userId: admin.id, body: { role: 'engineer' } });
    expect(demote.status).toBe(409);
    expect((await demote.json()).error.message).toMatch(/only admin/);
    const leave = await call('DELETE', `/api/teams/${teamId}/members/${admin.id}`, { userId: admin.id });
    expect(leave.status).toBe(409);
    expect((await leave.json()).error.message).toMatch(/only admin and cannot leave/);
  });

  it('changes a role and removes a member, each with an audit row; a member may leave', async () => {
    const teamId = await makeTeam();
    const admin = await makeUser({ teamId, role: 'admin' });
    const a = await makeUser({ teamId, role: 'engineer' });
    const b = await makeUser({ teamId, role: 'checker' });
    expect((await call('PATCH', `/api/teams/${teamId}/members/${a.id}`, { userId: admin.id, body: { role: 'admin' } })).status).toBe(200);
    // with two admins, the first may now step down
    expect((await call('PATCH', `/api/teams/${teamId}/members/${admin.id}`, { userId: a.id, body: { role: 'engineer' } })).status).toBe(200);
    expect((await call('DELETE', `/api/teams/${teamId}/members/${admin.id}`, { userId: a.id })).status).toBe(204);
    expect((await call('DELETE', `/api/teams/${teamId}/members/${b.id}`, { userId: b.id })).status).toBe(204);
    const rows = await testDb().select().from(auditLog).where(eq(auditLog.teamId, teamId)).orderBy(desc(auditLog.id));
    expect(rows.map((r) => r.action).slice(0, 4)).toEqual(['member_left', 'member_removed', 'role_changed', 'role_changed']);
    expect(rows[3].detail).toEqual({ from: 'engineer', to: 'admin' });
    const audit = await (await call('GET', `/api/audit?teamId=${teamId}&sort=-createdAt&pageSize=50`, { userId: a.id })).json();
    expect(audit.items.map((r: { action: string }) => r.action)).toContain('role_changed');
  });

  it('lets a new person with no team start one and become its admin', async () => {
    const { id } = await makeUser();
    const res = await call('POST', '/api/teams', { userId: id, body: { name: `Studio ${uid()}` } });
    expect(res.status).toBe(201);
    const { team } = await res.json();
    const rows = await testDb().select().from(memberships).where(eq(memberships.teamId, team.id));
    expect(rows.map((r) => [r.userId, r.role])).toEqual([[id, 'admin']]);
    const bad = await call('POST', '/api/teams', { userId: id, body: { name: '' } });
    expect((await bad.json()).error.fields.name).toMatch(/Team name/);
  });
});
