// fixtures for the accounts, teams and saved-work system tests: rows made straight in the
// test database (fast, and independent of the endpoints under test), and an HTTP helper.
import { randomBytes } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import { testDb, sessionFor, SESSION_COOKIE } from '../support/db';
import { baseUrl } from '../support/browser';
import { assemblies, invitations, jobs, memberships, revisionEvents, revisions, shareLinks, teams, users, type RevisionState, type Role } from '../../src/lib/server/db/schema';
import { hashToken, newToken } from '../../src/lib/server/tokens';
import { hashPassword } from '../../src/lib/server/auth/password';
import { defaultExposure, type WorkbenchDocument } from '../../src/lib/schemas/workbench';

export const DEMO = { admin: 'demo-admin', engineer: 'demo-engineer', checker: 'demo-checker' } as const;

export const uid = () => randomBytes(5).toString('hex');

export async function demoTeamId(): Promise<number> {
  const rows = await testDb().select({ teamId: memberships.teamId }).from(memberships).where(eq(memberships.userId, DEMO.admin)).orderBy(memberships.createdAt).limit(1);
  return rows[0].teamId;
}

/** a person, optionally in a team; the password is "correct horse battery" */
export const PASSWORD = 'correct horse battery';
export async function makeUser(opts: { name?: string; email?: string; teamId?: number; role?: Role; verified?: boolean } = {}) {
  const id = `t-${uid()}`;
  const email = opts.email ?? `${id}@example.test`;
  await testDb()
    .insert(users)
    .values({ id, email, name: opts.name ?? `Person ${id}`, passwordHash: await hashPassword(PASSWORD), emailVerifiedAt: opts.verified === false ? null : new Date() });
  if (opts.teamId) await testDb().insert(memberships).values({ teamId: opts.teamId, userId: id, role: opts.role ?? 'engineer' });
  return { id, email };
}

export async function makeTeam(name = `Other studio ${uid()}`): Promise<number> {
  const [t] = await testDb().insert(teams).values({ name }).$returningId();
  return t.id;
}

export async function makeJob(teamId: number, name = `Job ${uid()}`): Promise<number> {
  const [j] = await testDb().insert(jobs).values({ teamId, name }).$returningId();
  return j.id;
}

/** a small valid workbench document: one brick layer (typical values, from memory) */
export function smallDocument(thickness = 0.2): WorkbenchDocument {
  return {
    version: 2,
    layers: [
      { id: 'a', name: 'Brick', materialRef: null, materialClass: 'masonry', thickness, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: null, source: 'typical value (from memory)', note: '' },
    ],
    exposure: defaultExposure(),
  };
}

export async function makeAssembly(jobId: number, name = `Assembly ${uid()}`): Promise<number> {
  const [a] = await testDb().insert(assemblies).values({ jobId, name, element: 'wall' }).$returningId();
  return a.id;
}

/** a revision on top of the assembly's newest, in the given state */
export async function makeRevision(assemblyId: number, state: RevisionState = 'draft', authorId: string = DEMO.engineer): Promise<number> {
  const head = await testDb().select({ number: revisions.number }).from(revisions).where(eq(revisions.assemblyId, assemblyId)).orderBy(desc(revisions.number)).limit(1);
  const [r] = await testDb()
    .insert(revisions)
    .values({ assemblyId, number: (head[0]?.number ?? 0) + 1, model: smallDocument(), state, authorId })
    .$returningId();
  await testDb().insert(revisionEvents).values({ revisionId: r.id, fromState: null, toState: state, actorId: authorId });
  return r.id;
}

export async function headRevisionId(assemblyId: number): Promise<number> {
  const head = await testDb().select({ id: revisions.id }).from(revisions).where(eq(revisions.assemblyId, assemblyId)).orderBy(desc(revisions.number)).limit(1);
  return head[0].id;
}

export async function makeShare(revisionId: number, opts: { expiresAt?: Date | null; revokedAt?: Date | null } = {}): Promise<{ id: number; token: string }> {
  const token = newToken();
  const [s] = await testDb()
    .insert(shareLinks)
    .values({ revisionId, tokenHash: hashToken(token), expiresAt: opts.expiresAt ?? null, revokedAt: opts.revokedAt ?? null, createdBy: DEMO.engineer })
    .$returningId();
  return { id: s.id, token };
}

export async function makeInvitation(teamId: number, email: string, role: Role = 'checker', expiresAt = new Date(Date.now() + 86400_000)): Promise<{ id: number; token: string }> {
  const token = newToken();
  const [i] = await testDb().insert(invitations).values({ teamId, email, role, tokenHash: hashToken(token), invitedBy: DEMO.admin, expiresAt }).$returningId();
  return { id: i.id, token };
}

export async function ensureMember(teamId: number, userId: string, role: Role) {
  const rows = await testDb().select().from(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
  if (rows[0]) await testDb().update(memberships).set({ role }).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
  else await testDb().insert(memberships).values({ teamId, userId, role });
}

/** an HTTP call to the app as a user (a fresh session each call) or as nobody */
export async function call(method: string, path: string, opts: { userId?: string | null; body?: unknown; cookie?: string } = {}): Promise<Response> {
  // browsers send Origin with every POST; Astro refuses a bodiless cross-site POST without it
  const headers: Record<string, string> = { origin: new URL(baseUrl()).origin };
  if (opts.userId) headers.cookie = `${SESSION_COOKIE}=${await sessionFor(opts.userId)}`;
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.body !== undefined) headers['content-type'] = 'application/json';
  return fetch(baseUrl() + path, { method, headers, body: opts.body === undefined ? undefined : JSON.stringify(opts.body), redirect: 'manual' });
}
