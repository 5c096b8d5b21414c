// what the app says and keeps when the mail server does not answer: a second instance of the
// built app on the same test database, pointed at an SMTP port nobody listens on
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { and, desc, eq, like } from 'drizzle-orm';
import { closeTestDb, sessionFor, testDb, SESSION_COOKIE } from '../support/db';
import { invitations, outboundMail, smtpInbox, users } from '../../src/lib/server/db/schema';
import { startApp, type AppProcess } from '../../src/stack/app';
import { freePort } from '../../src/stack/util';
import { DEMO, call, demoTeamId, makeUser, uid } from './teamFixtures';

let app: AppProcess;

beforeAll(async () => {
  if (!process.env.WALLPULSE_OUT_DIR) throw new Error('WALLPULSE_OUT_DIR is not set: run the tests with `npm test`, which builds the app there');
  const port = await freePort();
  // a port the kernel just called free; nothing is started on it, so every connection is refused
  const deadSmtp = await freePort();
  app = await startApp(
    process.cwd(),
    { SMTP_URL: `smtp://127.0.0.1:${deadSmtp}`, PUBLIC_BASE_URL: `http://127.0.0.1:${port}` },
    '127.0.0.1',
    port,
  );
});

afterAll(async () => {
  await app?.stop();
  await closeTestDb();
});

/** an HTTP call to the instance without mail, as a user (a fresh session) or with a cookie */
async function callDown(method: string, path: string, opts: { userId?: string; cookie?: string; body?: unknown } = {}): Promise<Response> {
  const headers: Record<string, string> = { origin: app.url };
  if (opts.userId) headers.cookie = `${SESSION_COOKIE}=${await sessionFor(opts.userId)}`;
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.body !== undefined) headers['content-type'] = 'application/json';
  return fetch(app.url + path, { method, headers, body: opts.body === undefined ? undefined : JSON.stringify(opts.body), redirect: 'manual' });
}

const outboundTo = (email: string) => testDb().select().from(outboundMail).where(eq(outboundMail.toAddress, email)).orderBy(desc(outboundMail.id));
const inboxFor = (email: string) => testDb().select().from(smtpInbox).where(like(smtpInbox.envelopeTo, `%${email}%`));

/** the one error shape and nothing else: { error: { code, message } } */
async function expectMailFailed(res: Response, status = 503) {
  expect(res.status).toBe(status);
  const body = await res.json();
  expect(Object.keys(body)).toEqual(['error']);
  expect(Object.keys(body.error).sort()).toEqual(['code', 'message']);
  expect(body.error.code).toBe('mail_failed');
  return body.error.message as string;
}

describe('inviting while the mail server does not answer', () => {
  it('answers 503 saying the invitation could not be sent, withdraws it, and logs the failed message', async () => {
    const teamId = await demoTeamId();
    const email = `down-invite-${uid()}@example.test`;
    const res = await callDown('POST', `/api/teams/${teamId}/invitations`, { userId: DEMO.admin, body: { email, role: 'checker' } });
    const message = await expectMailFailed(res);
    expect(message).toBe(`The invitation to ${email} could not be sent: the mail server did not answer. Try again in a minute.`);

    // the row was written before the send and revoked when it failed: present, revoked, never accepted
    const rows = await testDb().select().from(invitations).where(and(eq(invitations.teamId, teamId), eq(invitations.email, email)));
    expect(rows).toHaveLength(1);
    expect(rows[0].revokedAt).toBeInstanceOf(Date);
    expect(rows[0].acceptedAt).toBeNull();

    const mail = await outboundTo(email);
    expect(mail).toHaveLength(1);
    expect(mail[0]).toMatchObject({ purpose: 'invite', status: 'failed', messageId: null });
    expect(mail[0].error).toMatch(/ECONNREFUSED|connect/i);
    expect(await inboxFor(email)).toEqual([]);
  });

  it('shows the withdrawn invitation as revoked in the team’s list, not as open', async () => {
    const teamId = await demoTeamId();
    const email = `down-list-${uid()}@example.test`;
    await expectMailFailed(await callDown('POST', `/api/teams/${teamId}/invitations`, { userId: DEMO.admin, body: { email, role: 'engineer' } }));
    const res = await callDown('GET', `/api/teams/${teamId}/invitations?q=${encodeURIComponent(email)}`, { userId: DEMO.admin });
    expect(res.status).toBe(200);
    const page = await res.json();
    expect(page.items.map((i: { email: string; status: string }) => [i.email, i.status])).toEqual([[email, 'revoked']]);
  });

  it('leaves an earlier invitation that did reach the person open when a new one to the same address fails, and replaces it once one goes out', async () => {
    const teamId = await demoTeamId();
    const email = `down-again-${uid()}@example.test`;
    // the first one goes out through the instance with working mail
    const first = await call('POST', `/api/teams/${teamId}/invitations`, { userId: DEMO.admin, body: { email, role: 'checker' } });
    expect(first.status).toBe(201);
    const firstId = (await first.json()).invitation.id as number;

    await expectMailFailed(await callDown('POST', `/api/teams/${teamId}/invitations`, { userId: DEMO.admin, body: { email, role: 'engineer' } }));

    const rows = await testDb().select().from(invitations).where(and(eq(invitations.teamId, teamId), eq(invitations.email, email))).orderBy(invitations.id);
    expect(rows.map((r) => [r.id === firstId, r.revokedAt === null])).toEqual([
      [true, true],
      [false, false],
    ]);

    // once mail works again, the new invitation that goes out replaces the earlier one
    const third = await call('POST', `/api/teams/${teamId}/invitations`, { userId: DEMO.admin, body: { email, role: 'engineer' } });
    expect(third.status).toBe(201);
    const thirdId = (await third.json()).invitation.id as number;
    const after = await testDb().select().from(invitations).where(and(eq(invitations.teamId, teamId), eq(invitations.email, email))).orderBy(invitations.id);
    expect(after.filter((r) => r.revokedAt === null).map((r) => r.id)).toEqual([thirdId]);
  });
});

// sign-up and reset put their mail in the queue and answer at once; whichever app instance's
// worker can reach a mail server sends it (here the test stack's own instance)
/**
 * The queued message of an instance without mail: this instance's worker may have tried it and
 * failed (then it waits in the queue with the reason, for another try), or the test stack's own
 * instance, which shares the queue, may have sent it already. It is never given up on at once.
 */
async function queuedOrSent(email: string, purpose: string) {
  const end = Date.now() + 5000;
  for (;;) {
    const mail = await outboundTo(email);
    expect(mail).toHaveLength(1);
    expect(mail[0].purpose).toBe(purpose);
    expect(['queued', 'sent']).toContain(mail[0].status);
    if (mail[0].status === 'sent' || mail[0].attempts > 0 || Date.now() > end) {
      if (mail[0].status === 'queued') {
        expect(mail[0].error).toMatch(/ECONNREFUSED|connect/i);
        expect(mail[0].nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
      }
      return mail[0];
    }
    await new Promise((r) => setTimeout(r, 200));
  }
}

// sign-up and reset put their mail in the queue and answer at once, whatever the mail server does
describe('signing up while this instance’s mail server does not answer', () => {
  it('answers 202 as usual, keeps the account unconfirmed, and keeps the link in the queue until it goes out', async () => {
    const email = `down-signup-${uid()}@example.test`;
    const res = await callDown('POST', '/api/auth/signup', { body: { name: 'Ilse Varga', email, password: 'a long enough password' } });
    expect(res.status).toBe(202);
    const body = await res.json();
    expect(body).toEqual({ sent: true, message: expect.stringContaining(email) });

    const [user] = await testDb().select().from(users).where(eq(users.email, email));
    expect(user.emailVerifiedAt).toBeNull();
    await queuedOrSent(email, 'verify');
  });
});

describe('asking for a password reset while this instance’s mail server does not answer', () => {
  it('answers exactly as for an unknown address, and keeps the link in the queue until it goes out', async () => {
    const { email } = await makeUser();
    const res = await callDown('POST', '/api/auth/reset-request', { body: { email } });
    expect(res.status).toBe(202);
    expect(await res.json()).toEqual({ sent: true, message: 'If an account uses this address, a reset link is on its way. It lasts 1 hour.' });
    await queuedOrSent(email, 'reset');
  });

  it('answers 202 as usual for an address without an account, and queues no mail at all', async () => {
    const email = `down-nobody-${uid()}@example.test`;
    const res = await callDown('POST', '/api/auth/reset-request', { body: { email } });
    expect(res.status).toBe(202);
    expect(await res.json()).toEqual({ sent: true, message: 'If an account uses this address, a reset link is on its way. It lasts 1 hour.' });
    expect(await outboundTo(email)).toEqual([]);
    expect(await inboxFor(email)).toEqual([]);
  });
});

describe('resending the verification link while the mail server does not answer', () => {
  it('answers 503 saying the message could not be sent, and the address stays unconfirmed', async () => {
    const { id, email } = await makeUser({ verified: false });
    const message = await expectMailFailed(await callDown('POST', '/api/auth/resend-verification', { userId: id }));
    expect(message).toBe('The message could not be sent: the mail server did not answer. Try again in a minute.');
    const mail = await outboundTo(email);
    expect(mail.map((m) => [m.purpose, m.status])).toEqual([['verify', 'failed']]);
    expect(await inboxFor(email)).toEqual([]);
    const [user] = await testDb().select().from(users).where(eq(users.id, id));
    expect(user.emailVerifiedAt).toBeNull();
  });
});
