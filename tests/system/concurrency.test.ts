// many people pressing "issue" at once: every request is answered within seconds, each
// revision is issued exactly once, and the health check keeps answering throughout. (A
// transaction that took a second pool connection for its audit row used to leave the whole
// app waiting for a connection that never came.)
import { describe, it, expect, afterAll } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { closeTestDb, sessionFor, testDb, SESSION_COOKIE } from '../support/db';
import { baseUrl } from '../support/browser';
import { auditLog, revisions, memberships } from '../../src/lib/server/db/schema';
import { DEMO, call, demoTeamId, makeAssembly, makeJob, makeRevision, makeTeam, makeUser } from './teamFixtures';

afterAll(closeTestDb);

/** an answer within `ms`, or the reason there was none */
async function timed(p: () => Promise<Response>, ms = 10_000): Promise<{ status: number; ms: number }> {
  const t0 = Date.now();
  const res = await Promise.race([p(), new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms))]);
  await res.arrayBuffer();
  return { status: res.status, ms: Date.now() - t0 };
}

/** poll the health check every 200 ms while `work` runs; each answer must come within 3 s */
async function healthDuring<T>(work: Promise<T>): Promise<{ result: T; health: { status: number; ms: number }[] }> {
  const health: { status: number; ms: number }[] = [];
  let done = false;
  const poller = (async () => {
    while (!done) {
      health.push(await timed(() => fetch(`${baseUrl()}/api/health`), 3000).catch(() => ({ status: 0, ms: 3000 })));
      await new Promise((r) => setTimeout(r, 200));
    }
  })();
  try {
    return { result: await work, health };
  } finally {
    done = true;
    await poller;
  }
}

/** sessions made before the burst, so that the requests leave together */
const cookies = (userId: string, n: number) => Promise.all(Array.from({ length: n }, async () => `${SESSION_COOKIE}=${await sessionFor(userId)}`));

const issue = (revisionId: number, cookie: string) => () => call('POST', `/api/revisions/${revisionId}/transitions`, { cookie, body: { to: 'issued', note: '' } });

describe('issuing revisions at the same moment', () => {
  it('answers 10 different revisions issued at once within seconds, each issued once, with one audit row each', async () => {
    const jobId = await makeJob(await demoTeamId());
    const ids: number[] = [];
    for (let i = 0; i < 10; i++) ids.push(await makeRevision(await makeAssembly(jobId), 'checked'));

    const sessions = await cookies(DEMO.engineer, ids.length);
    const { result, health } = await healthDuring(Promise.all(ids.map((id, i) => timed(issue(id, sessions[i])).catch((e: Error) => ({ status: 0, ms: 10_000, error: e.message })))));
    expect(result.map((r) => r.status)).toEqual(ids.map(() => 201));
    expect(Math.max(...result.map((r) => r.ms))).toBeLessThan(10_000);
    expect(health.length).toBeGreaterThan(0);
    expect(health.every((h) => h.status === 200)).toBe(true);

    const states = await testDb().select({ id: revisions.id, state: revisions.state }).from(revisions);
    expect(states.filter((r) => ids.includes(r.id)).map((r) => r.state)).toEqual(ids.map(() => 'issued'));
    for (const id of ids) {
      const rows = await testDb().select().from(auditLog).where(and(eq(auditLog.action, 'revision_issued'), eq(auditLog.target, `revision:${id}`)));
      expect(rows).toHaveLength(1);
    }
  });

  it('answers 20 requests to issue one revision within seconds: exactly one succeeds, the others are told it is issued already', async () => {
    const jobId = await makeJob(await demoTeamId());
    const id = await makeRevision(await makeAssembly(jobId), 'checked');
    const sessions = await cookies(DEMO.engineer, 20);
    const { result, health } = await healthDuring(Promise.all(sessions.map((cookie) => timed(issue(id, cookie)).catch(() => ({ status: 0, ms: 10_000 })))));
    const statuses = result.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    expect(health.every((h) => h.status === 200)).toBe(true);
    const rows = await testDb().select().from(auditLog).where(and(eq(auditLog.action, 'revision_issued'), eq(auditLog.target, `revision:${id}`)));
    expect(rows).toHaveLength(1);
  });

  it('answers 12 role changes in one team at once within seconds, and the team keeps an admin', async () => {
    const teamId = await makeTeam();
    const admin = await makeUser({ teamId, role: 'admin' });
    const others = await Promise.all(Array.from({ length: 12 }, () => makeUser({ teamId, role: 'engineer' })));
    const sessions = await cookies(admin.id, others.length);
    const { result, health } = await healthDuring(
      Promise.all(
        others.map((o, i) =>
          timed(() => call('PATCH', `/api/teams/${teamId}/members/${o.id}`, { cookie: sessions[i], body: { role: i % 2 ? 'checker' : 'admin' } })).catch(() => ({ status: 0, ms: 10_000 })),
        ),
      ),
    );
    expect(result.map((r) => r.status)).toEqual(others.map(() => 200));
    expect(health.every((h) => h.status === 200)).toBe(true);
    const roles = await testDb().select({ role: memberships.role }).from(memberships).where(eq(memberships.teamId, teamId));
    expect(roles.filter((r) => r.role === 'admin')).toHaveLength(7);
  });
});
