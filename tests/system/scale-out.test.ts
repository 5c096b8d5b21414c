// two app instances on one MariaDB behave as one service: a session made on one is good on the
// other, saves and their stale-save guard are shared, a share link made on one opens (and, once
// withdrawn, stays shut) on the other, and wrong passwords spread over both count as one.
// instance A is the app `npm test` started; B is a second process of the same build started here.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { sql } from 'drizzle-orm';
import { closeTestDb, testDb } from '../support/db';
import { baseUrl } from '../support/browser';
import { testEnv } from '../support/env';
import { DEMO, PASSWORD, call, demoTeamId, makeAssembly, makeJob, makeRevision, makeUser, smallDocument, uid } from './teamFixtures';
import { startApp, type AppProcess } from '../../src/stack/app';
import { freePort } from '../../src/stack/util';

let b: AppProcess;
let A: string;
let B: string;

beforeAll(async () => {
  A = baseUrl();
  const port = await freePort();
  // the settings instances share: the same database, mail server and public address
  b = await startApp(
    process.cwd(),
    { DATABASE_URL: testEnv('DATABASE_URL'), SMTP_URL: testEnv('SMTP_URL'), PUBLIC_BASE_URL: A },
    '127.0.0.1',
    port,
  );
  B = b.url;
});
afterAll(async () => {
  await b?.stop();
  await closeTestDb();
});

/** a request to one instance, as a browser on that origin would send it */
async function at(base: string, method: string, path: string, opts: { cookie?: string; body?: unknown } = {}): Promise<Response> {
  const headers: Record<string, string> = { origin: new URL(base).origin };
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.body !== undefined) headers['content-type'] = 'application/json';
  return fetch(base + path, { method, headers, body: opts.body === undefined ? undefined : JSON.stringify(opts.body), redirect: 'manual' });
}

const signIn = (base: string, email: string, password: string) => at(base, 'POST', '/api/auth/signin', { body: { email, password } });

/** the session cookie of a sign-in answer, as "name=value" */
function sessionCookie(res: Response): string {
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('wallpulse_session='));
  if (!cookie) throw new Error('no session cookie in the answer');
  return cookie.split(';')[0];
}

describe('two instances on one database', () => {
  it('are two processes answering on two ports', async () => {
    expect(B).not.toBe(A);
    expect(b.child.pid).toBeGreaterThan(0);
    for (const base of [A, B]) expect((await fetch(`${base}/api/health`)).status).toBe(200);
  });

  it('share sessions: signed in on A, the session works on B; signed out on B, it is gone on A', async () => {
    const person = await makeUser({ name: `Scale ${uid()}` });
    const res = await signIn(A, person.email, PASSWORD);
    expect(res.status).toBe(200);
    const cookie = sessionCookie(res);
    const me = await at(B, 'GET', '/api/auth/me', { cookie });
    expect(me.status).toBe(200);
    expect((await me.json()).user.email).toBe(person.email);
    expect((await at(B, 'GET', '/jobs', { cookie })).status).toBe(200);
    expect((await at(B, 'POST', '/api/auth/signout', { cookie })).status).toBe(204);
    expect((await at(A, 'GET', '/api/auth/me', { cookie })).status).toBe(401);
  });

  it('share saves: a save on A is the head on B, and a save on B from the old base answers 409 with A’s revision', async () => {
    const assemblyId = await makeAssembly(await makeJob(await demoTeamId()));
    const base = await makeRevision(assemblyId);
    const saved = await call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.engineer, body: { baseRevisionId: base, model: smallDocument(0.25), note: 'saved on A' } });
    expect(saved.status).toBe(201);
    const onA = (await saved.json()).revision;
    const cookie = sessionCookie(await signIn(A, 'tomas@demo.wallpulse.test', 'wallpulse-demo'));
    const seen = await (await at(B, 'GET', `/api/assemblies/${assemblyId}`, { cookie })).json();
    expect(seen.head).toMatchObject({ id: onA.id, number: 2, note: 'saved on A' });
    const stale = await at(B, 'POST', `/api/assemblies/${assemblyId}/revisions`, { cookie, body: { baseRevisionId: base, model: smallDocument(0.3), note: 'saved on B' } });
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.error.code).toBe('stale');
    expect(body.head).toMatchObject({ id: onA.id, number: 2 });
    // and B's save on the new head lands on top of A's
    const fresh = await at(B, 'POST', `/api/assemblies/${assemblyId}/revisions`, { cookie, body: { baseRevisionId: onA.id, model: smallDocument(0.3), note: 'saved on B' } });
    expect(fresh.status).toBe(201);
    expect((await fresh.json()).revision.number).toBe(3);
  });

  it('share share links: made on A, opened on B; withdrawn on A, shut on B', async () => {
    const assemblyName = `Shared across ${uid()}`;
    const assemblyId = await makeAssembly(await makeJob(await demoTeamId()), assemblyName);
    const revisionId = await makeRevision(assemblyId, 'issued');
    const made = await call('POST', `/api/revisions/${revisionId}/shares`, { userId: DEMO.engineer, body: { label: 'for the architect' } });
    expect(made.status).toBe(201);
    const { share } = await made.json();
    const token = new URL(share.url).pathname.split('/').pop()!;
    expect(new URL(share.url).origin).toBe(new URL(A).origin);
    const api = await fetch(`${B}/api/shared/${token}`);
    expect(api.status).toBe(200);
    expect((await api.json()).assembly.name).toBe(assemblyName);
    const page = await fetch(`${B}/s/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(assemblyName);
    // the page on A first, so any cache of A has it too
    expect((await fetch(`${A}/s/${token}`)).status).toBe(200);

    expect((await call('POST', `/api/shares/${share.id}/revoke`, { userId: DEMO.engineer })).status).toBe(200);
    expect((await fetch(`${B}/api/shared/${token}`)).status).toBe(410);
    expect((await fetch(`${B}/s/${token}`)).status).toBe(410);
    expect((await fetch(`${A}/s/${token}`)).status).toBe(410);
  });

  it('count wrong passwords as one: spread over A and B they lock the account as soon as on one instance, on both', async () => {
    let failures = 0;
    try {
      // how many wrong passwords one instance takes before it locks an account
      const alone = await makeUser();
      let limit = 0;
      for (; limit < 12; limit++) {
        const res = await signIn(A, alone.email, 'not the password');
        if (res.status === 429) break;
        failures++;
        expect(res.status).toBe(401);
      }
      expect(limit).toBeGreaterThan(0);
      expect(limit).toBeLessThan(12);

      // the same number spread over the two instances locks another account too
      const spread = await makeUser();
      for (let i = 0; i < limit; i++) {
        const res = await signIn(i % 2 ? B : A, spread.email, 'not the password');
        failures++;
        expect(res.status).toBe(401);
      }
      for (const base of [A, B]) {
        const locked = await signIn(base, spread.email, PASSWORD);
        expect(locked.status).toBe(429);
        expect((await locked.json()).error.code).toBe('rate_limited');
      }
    } finally {
      // give back what these failures added to this machine's count across accounts, so later
      // tests that sign in from 127.0.0.1 start where they would have without this one
      await testDb().execute(sql`update rate_limits set points = greatest(points - ${failures}, 0) where \`key\` = 'signin-source:127.0.0.1'`);
    }
  });
});
