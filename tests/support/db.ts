import { randomBytes } from 'node:crypto';
import { and, eq, desc, like } from 'drizzle-orm';
import { createDb, type Database } from '../../src/lib/server/db/client';
import { assemblies, jobs, sessions, smtpInbox } from '../../src/lib/server/db/schema';
import { DEMO_JOB_NAME } from '../../src/lib/server/seed/demoJob';
import { testEnv } from './env';

let cached: { db: Database; close(): Promise<void> } | null = null;

/** a small pool on the throwaway test database */
export function testDb(): Database {
  if (!cached) {
    const { db, pool } = createDb(testEnv('DATABASE_URL'), 3);
    cached = { db, close: () => pool.end() };
  }
  return cached.db;
}

export async function closeTestDb(): Promise<void> {
  await cached?.close();
  cached = null;
}

/** a session row for a user, as lucia would write it; returns the cookie value */
export async function sessionFor(userId: string): Promise<string> {
  const id = randomBytes(20).toString('hex');
  await testDb().insert(sessions).values({ id, userId, expiresAt: new Date(Date.now() + 86400_000) });
  return id;
}

export const SESSION_COOKIE = 'wallpulse_session';

/** the newest message the fake SMTP server received for an address, waiting for it a little */
export async function lastMailTo(address: string, timeoutMs = 10_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const rows = await testDb()
      .select()
      .from(smtpInbox)
      .where(like(smtpInbox.envelopeTo, `%${address.toLowerCase()}%`))
      .orderBy(desc(smtpInbox.id))
      .limit(1);
    if (rows[0]) return rows[0];
    if (Date.now() > end) throw new Error(`no mail arrived for ${address} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** the id of one of the seeded demo job's assemblies, by its name */
export async function demoAssembly(name: string): Promise<number> {
  const rows = await testDb()
    .select({ id: assemblies.id })
    .from(assemblies)
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(and(eq(jobs.name, DEMO_JOB_NAME), eq(assemblies.name, name)))
    .limit(1);
  if (!rows[0]) throw new Error(`the demo assembly “${name}” is not seeded`);
  return rows[0].id;
}

/** the heavy demo wall most browser tests open */
export const DEMO_HEAVY_WALL = 'West wall, brick with external insulation';

export { eq };
