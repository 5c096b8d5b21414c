// share links: a 256-bit random token mailed or copied once, only its sha256 kept;
// optional expiry, revocable; a guest sees one issued revision and nothing else.
import { and, count, eq, like, or, sql } from 'drizzle-orm';
import { PUBLIC_BASE_URL } from 'astro:env/server';
import { db } from '../db';
import { assemblies, jobs, revisions, runs, shareLinks, users } from '../db/schema';
import { audit } from '../audit';
import { hashToken, tokenPair, DAY_MS } from '../tokens';
import type { ListQuery } from '../../schemas/api';
import type { ShareRow } from '../../schemas/rows';
import { likePattern, offsetOf, orderFor, pageOf, type Page } from './list';
import { fail, type Fail } from './teams';
import { runsOf } from './runs';

export const shareUrl = (token: string) => `${PUBLIC_BASE_URL}/s/${token}`;

export async function createShare(
  revisionId: number,
  actor: { id: string; teamId: number },
  input: { label: string; expiresInDays?: number | null },
  ip = '',
): Promise<{ ok: true; share: { id: number; url: string; expiresAt: Date | null } } | Fail> {
  const rev = (await db.select({ state: revisions.state, number: revisions.number }).from(revisions).where(eq(revisions.id, revisionId)).limit(1))[0];
  if (!rev) return fail(404, 'not_found', 'Not found.');
  if (rev.state !== 'issued') {
    return fail(409, 'not_issued', `Only an issued revision can be shared. Revision ${rev.number} is ${rev.state.replace('_', ' ')}: have it checked and issue it first.`);
  }
  const { token, hash } = tokenPair();
  const expiresAt = input.expiresInDays ? new Date(Date.now() + input.expiresInDays * DAY_MS) : null;
  const [row] = await db.insert(shareLinks).values({ revisionId, tokenHash: hash, label: input.label, createdBy: actor.id, expiresAt }).$returningId();
  await audit({ action: 'share_created', teamId: actor.teamId, actorId: actor.id, target: `share:${row.id}`, detail: { revisionId, label: input.label, expiresAt }, ip });
  return { ok: true, share: { id: row.id, url: shareUrl(token), expiresAt } };
}

const statusOf = (r: { revokedAt: Date | null; expiresAt: Date | null }): ShareRow['status'] =>
  r.revokedAt ? 'revoked' : r.expiresAt && r.expiresAt.getTime() <= Date.now() ? 'expired' : 'active';

export async function listShares(teamId: number, q: ListQuery, revisionId?: number): Promise<Page<ShareRow>> {
  const p = likePattern(q.q);
  const where = and(
    eq(jobs.teamId, teamId),
    revisionId ? eq(shareLinks.revisionId, revisionId) : undefined,
    q.q ? or(like(shareLinks.label, p), like(assemblies.name, p), like(jobs.name, p)) : undefined,
  );
  const base = () =>
    db
      .select({
        id: shareLinks.id,
        label: shareLinks.label,
        revisionId: shareLinks.revisionId,
        revisionNumber: revisions.number,
        assemblyId: assemblies.id,
        assemblyName: assemblies.name,
        jobName: jobs.name,
        createdByName: users.name,
        createdAt: shareLinks.createdAt,
        expiresAt: shareLinks.expiresAt,
        revokedAt: shareLinks.revokedAt,
        lastOpenedAt: shareLinks.lastOpenedAt,
        openCount: shareLinks.openCount,
      })
      .from(shareLinks)
      .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
      .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
      .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
      .leftJoin(users, eq(users.id, shareLinks.createdBy));
  const rows = await base()
    .where(where)
    .orderBy(
      ...orderFor(q.sort, {
        createdAt: shareLinks.createdAt,
        label: shareLinks.label,
        assemblyName: assemblies.name,
        lastOpenedAt: shareLinks.lastOpenedAt,
        openCount: shareLinks.openCount,
        expiresAt: shareLinks.expiresAt,
      }),
    )
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db
    .select({ n: count() })
    .from(shareLinks)
    .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
    .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(where);
  return pageOf(rows.map((r) => ({ ...r, status: statusOf(r) })), q, n);
}

export async function teamOfShare(shareId: number): Promise<number | null> {
  const rows = await db
    .select({ teamId: jobs.teamId })
    .from(shareLinks)
    .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
    .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(eq(shareLinks.id, shareId))
    .limit(1);
  return rows[0]?.teamId ?? null;
}

export async function revokeShare(shareId: number, actor: { id: string; teamId: number }, ip = ''): Promise<{ ok: true; revokedAt: Date } | Fail> {
  const row = (await db.select({ revokedAt: shareLinks.revokedAt }).from(shareLinks).where(eq(shareLinks.id, shareId)).limit(1))[0];
  if (!row) return fail(404, 'not_found', 'Not found.');
  if (row.revokedAt) return { ok: true, revokedAt: row.revokedAt };
  const revokedAt = new Date();
  await db.update(shareLinks).set({ revokedAt }).where(eq(shareLinks.id, shareId));
  await audit({ action: 'share_revoked', teamId: actor.teamId, actorId: actor.id, target: `share:${shareId}`, ip });
  return { ok: true, revokedAt };
}

/** the document without the links to the team's library (they name the team's material ids) */
function withoutLibraryRefs(model: unknown): unknown {
  if (!model || typeof model !== 'object' || !Array.isArray((model as { layers?: unknown }).layers)) return model;
  const doc = model as { layers: Record<string, unknown>[] };
  return { ...doc, layers: doc.layers.map((l) => ({ ...l, materialRef: null })) };
}

/** what a guest may see: one revision, its assembly's name and element, its job's name, its runs */
export interface SharedRevision {
  assembly: { name: string; element: 'wall' | 'roof' | 'floor' };
  job: { name: string };
  revision: { number: number; state: string; createdAt: Date; model: unknown };
  runs: { createdAt: Date; exposure: unknown; summary: unknown }[];
}

/** a share link that works, as checked (and counted) for one opening */
export interface ShareCheck {
  ok: true;
  linkId: number;
  revisionId: number;
  teamId: number;
  /** the newest run kept with the revision (any kind), null without one: a new run changes the page */
  newestRunId: number | null;
}

const NOT_FOUND = 'This link does not lead to anything. Check that the whole link was copied.';

/**
 * Check a share link and count the opening: one indexed read of the link (with its revision's
 * team and newest kept run), then the count and the audit row, written side by side. Unknown →
 * 404; revoked or expired → 410 with a message for the guest. Runs on every opening, also when
 * the page itself comes from the cache, so a withdrawn or expired link stops working at once.
 */
export async function checkShare(token: string, ip = ''): Promise<ShareCheck | Fail> {
  if (!token || token.length < 20 || token.length > 100) return fail(404, 'share_not_found', NOT_FOUND);
  const rows = await db
    .select({
      id: shareLinks.id,
      revokedAt: shareLinks.revokedAt,
      expiresAt: shareLinks.expiresAt,
      revisionId: shareLinks.revisionId,
      teamId: jobs.teamId,
      newestRunId: sql<number | null>`(select max(${runs.id}) from ${runs} where ${runs.revisionId} = ${shareLinks.revisionId})`,
    })
    .from(shareLinks)
    .innerJoin(revisions, eq(revisions.id, shareLinks.revisionId))
    .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(eq(shareLinks.tokenHash, hashToken(token)))
    .limit(1);
  const row = rows[0];
  if (!row) return fail(404, 'share_not_found', NOT_FOUND);
  if (row.revokedAt) return fail(410, 'share_revoked', 'This link was withdrawn by the team that shared it. Ask them for a new one if you still need it.');
  if (row.expiresAt && row.expiresAt.getTime() <= Date.now()) return fail(410, 'share_expired', 'This link has expired. Ask the team that shared it for a new one.');
  // every opening is counted and audited, whoever asks and however
  await Promise.all([
    db
      .update(shareLinks)
      .set({ lastOpenedAt: new Date(), openCount: sql`${shareLinks.openCount} + 1` })
      .where(eq(shareLinks.id, row.id)),
    audit({ action: 'share_opened', teamId: row.teamId, target: `share:${row.id}`, ip }),
  ]);
  const newest = row.newestRunId === null ? null : Number(row.newestRunId);
  return { ok: true, linkId: row.id, revisionId: row.revisionId, teamId: row.teamId, newestRunId: Number.isFinite(newest) ? newest : null };
}

/** what a checked link shows: the revision, its assembly and job, and its kept runs */
export async function sharedOf(check: ShareCheck): Promise<{ ok: true; shared: SharedRevision; revisionId: number; newestRunId: number | null } | Fail> {
  const rows = await db
    .select({
      number: revisions.number,
      state: revisions.state,
      createdAt: revisions.createdAt,
      model: revisions.model,
      assemblyName: assemblies.name,
      element: assemblies.element,
      jobName: jobs.name,
    })
    .from(revisions)
    .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(eq(revisions.id, check.revisionId))
    .limit(1);
  const row = rows[0];
  if (!row) return fail(404, 'share_not_found', NOT_FOUND);
  const kept = await runsOf(check.revisionId);
  const runs = kept.map((r) => ({ createdAt: r.createdAt, exposure: r.exposure, summary: r.summary }));
  return {
    ok: true,
    shared: {
      assembly: { name: row.assemblyName, element: row.element },
      job: { name: row.jobName },
      revision: { number: row.number, state: row.state, createdAt: row.createdAt, model: withoutLibraryRefs(row.model) },
      runs,
    },
    // for the server's own use (the cached view), never sent to the guest
    revisionId: check.revisionId,
    newestRunId: kept.find((r) => r.hasSeries)?.id ?? null,
  };
}

/**
 * Open a share link as a guest: records the opening (count, time, audit row) and reads what it shows.
 * Unknown → 404; revoked or expired → 410 with a message for the guest.
 */
export async function openShare(token: string, ip = ''): Promise<{ ok: true; shared: SharedRevision; revisionId: number; newestRunId: number | null } | Fail> {
  const check = await checkShare(token, ip);
  if (!check.ok) return check;
  return sharedOf(check);
}
