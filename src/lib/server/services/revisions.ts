// revisions (immutable saves of the workbench document), the check workflow, comments and runs.
import { and, asc, count, desc, eq, like, or, sql } from 'drizzle-orm';
import { db } from '../db';
import { assemblies, comments, revisionEvents, revisions, runs, users, type RevisionState, type Role } from '../db/schema';
import { can } from '../access';
import { audit } from '../audit';
import type { ListQuery } from '../../schemas/api';
import type { RevisionRow } from '../../schemas/rows';
import type { WorkbenchDocument } from '../../schemas/workbench';
import { likePattern, offsetOf, orderFor, pageOf, type Page } from './list';
import { fail, type Fail } from './teams';

export interface HeadRevision {
  id: number;
  number: number;
  state: RevisionState;
  note: string;
  model: unknown;
  authorId: string | null;
  authorName: string | null;
  createdAt: Date;
}

const revisionColumns = {
  id: revisions.id,
  number: revisions.number,
  state: revisions.state,
  note: revisions.note,
  model: revisions.model,
  authorId: revisions.authorId,
  authorName: users.name,
  createdAt: revisions.createdAt,
};

/** the newest revision of an assembly */
export async function headOf(assemblyId: number): Promise<HeadRevision | null> {
  const rows = await db
    .select(revisionColumns)
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(eq(revisions.assemblyId, assemblyId))
    .orderBy(desc(revisions.number))
    .limit(1);
  return rows[0] ?? null;
}

export type SaveOutcome =
  | { ok: true; revision: { id: number; number: number; state: RevisionState; createdAt: Date } }
  | { ok: false; stale: true; head: HeadRevision };

/**
 * Save a new revision on top of baseRevisionId. When someone saved after the editor
 * opened its base, nothing is written and the current head comes back (a 409 for the
 * client, which shows what changed and may resend with the head as its base).
 */
export async function saveRevision(assemblyId: number, userId: string, baseRevisionId: number | null, model: WorkbenchDocument, note: string): Promise<SaveOutcome> {
  const result = await db.transaction(async (tx) => {
    // one saver at a time per assembly
    await tx.execute(sql`select id from assemblies where id = ${assemblyId} for update`);
    const heads = await tx
      .select({ id: revisions.id, number: revisions.number })
      .from(revisions)
      .where(eq(revisions.assemblyId, assemblyId))
      .orderBy(desc(revisions.number))
      .limit(1);
    const head = heads[0] ?? null;
    if ((head?.id ?? null) !== baseRevisionId) return { stale: true as const };
    const number = (head?.number ?? 0) + 1;
    const createdAt = new Date();
    const [row] = await tx
      .insert(revisions)
      .values({ assemblyId, number, parentId: head?.id ?? null, model, note, state: 'draft', authorId: userId, createdAt })
      .$returningId();
    await tx.insert(revisionEvents).values({ revisionId: row.id, fromState: null, toState: 'draft', actorId: userId, note: note ? `Saved: ${note}` : 'Saved' });
    await tx.update(assemblies).set({ updatedAt: createdAt }).where(eq(assemblies.id, assemblyId));
    return { stale: false as const, revision: { id: row.id, number, state: 'draft' as const, createdAt } };
  });
  if (!result.stale) return { ok: true, revision: result.revision };
  const head = await headOf(assemblyId);
  return { ok: false, stale: true, head: head! };
}

const runCount = sql<number>`(select count(*) from ${runs} where ${runs.revisionId} = ${revisions.id})`.mapWith(Number);
const commentCount = sql<number>`(select count(*) from ${comments} where ${comments.revisionId} = ${revisions.id})`.mapWith(Number);

export async function listRevisions(assemblyId: number, q: ListQuery): Promise<Page<RevisionRow>> {
  const p = likePattern(q.q);
  const where = and(eq(revisions.assemblyId, assemblyId), q.q ? or(like(revisions.note, p), like(users.name, p), like(revisions.state, p)) : undefined);
  const items = await db
    .select({
      id: revisions.id,
      number: revisions.number,
      state: revisions.state,
      note: revisions.note,
      authorName: users.name,
      createdAt: revisions.createdAt,
      runCount,
      commentCount,
    })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(where)
    .orderBy(...orderFor(q.sort, { number: revisions.number, state: revisions.state, createdAt: revisions.createdAt, authorName: users.name }))
    .limit(q.pageSize)
    .offset(offsetOf(q));
  const [{ n }] = await db.select({ n: count() }).from(revisions).leftJoin(users, eq(users.id, revisions.authorId)).where(where);
  return pageOf(items, q, n);
}

export async function getRevision(revisionId: number) {
  const rows = await db
    .select({ ...revisionColumns, assemblyId: revisions.assemblyId, parentId: revisions.parentId })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(eq(revisions.id, revisionId))
    .limit(1);
  return rows[0] ?? null;
}

export async function eventsOf(revisionId: number) {
  return db
    .select({
      id: revisionEvents.id,
      fromState: revisionEvents.fromState,
      toState: revisionEvents.toState,
      note: revisionEvents.note,
      actorName: users.name,
      createdAt: revisionEvents.createdAt,
    })
    .from(revisionEvents)
    .leftJoin(users, eq(users.id, revisionEvents.actorId))
    .where(eq(revisionEvents.revisionId, revisionId))
    .orderBy(asc(revisionEvents.createdAt), asc(revisionEvents.id));
}

export async function commentsOf(revisionId: number) {
  return db
    .select({ id: comments.id, body: comments.body, authorName: users.name, authorId: comments.authorId, createdAt: comments.createdAt })
    .from(comments)
    .leftJoin(users, eq(users.id, comments.authorId))
    .where(eq(comments.revisionId, revisionId))
    .orderBy(asc(comments.createdAt), asc(comments.id));
}

export async function addComment(revisionId: number, userId: string, body: string) {
  const createdAt = new Date();
  const [row] = await db.insert(comments).values({ revisionId, authorId: userId, body, createdAt }).$returningId();
  return { id: row.id, createdAt };
}

// --- the check workflow ---

/** a state a move leads to: every state is one (draft, when withdrawn from the check) */
export type Target = RevisionState;

interface Rule {
  from: RevisionState[];
  who: (role: Role) => boolean;
  whoText: string;
  noteRequired?: boolean;
}

/** which moves exist and who may make them */
export const TRANSITIONS: Record<Target, Rule> = {
  in_check: { from: ['draft', 'sent_back'], who: can.edit, whoText: 'an engineer or admin' },
  checked: { from: ['in_check'], who: can.check, whoText: 'a checker or admin' },
  sent_back: { from: ['in_check'], who: can.check, whoText: 'a checker or admin', noteRequired: true },
  issued: { from: ['checked'], who: can.edit, whoText: 'an engineer or admin' },
  // withdraw from check, or pick a sent-back revision up again
  draft: { from: ['in_check', 'sent_back'], who: can.edit, whoText: 'an engineer or admin' },
};

const STATE_TEXT: Record<RevisionState, string> = { draft: 'draft', in_check: 'in check', checked: 'checked', sent_back: 'sent back', issued: 'issued' };
export const stateText = (s: RevisionState) => STATE_TEXT[s];

/** the moves a role may make from a state (for the buttons) */
export function movesFor(state: RevisionState, role: Role): Target[] {
  return (Object.keys(TRANSITIONS) as Target[]).filter((t) => TRANSITIONS[t].from.includes(state) && TRANSITIONS[t].who(role));
}

export async function transition(
  revisionId: number,
  actor: { id: string; role: Role; teamId: number },
  to: Target,
  note: string,
  ip = '',
): Promise<{ ok: true; state: RevisionState; eventId: number } | (Fail & { fields?: Record<string, string> })> {
  const rule = TRANSITIONS[to];
  if (!rule.who(actor.role)) return fail(403, 'forbidden', `Only ${rule.whoText} may move a revision to ${STATE_TEXT[to]}; your role is ${actor.role}.`);
  if (rule.noteRequired && !note) return { ...fail(422, 'invalid', 'Say why the revision goes back: a note is required.'), fields: { note: 'Note is required when sending a revision back' } };
  return db.transaction(async (tx) => {
    await tx.execute(sql`select id from revisions where id = ${revisionId} for update`);
    const rows = await tx.select({ state: revisions.state, number: revisions.number }).from(revisions).where(eq(revisions.id, revisionId)).limit(1);
    const row = rows[0];
    if (!row) return fail(404, 'not_found', 'Not found.');
    if (!rule.from.includes(row.state)) {
      return fail(
        409,
        'bad_transition',
        `Revision ${row.number} is ${STATE_TEXT[row.state]}; it can move to ${STATE_TEXT[to]} only from ${rule.from.map((s) => STATE_TEXT[s]).join(' or ')}.`,
      );
    }
    await tx.update(revisions).set({ state: to }).where(eq(revisions.id, revisionId));
    const [ev] = await tx.insert(revisionEvents).values({ revisionId, fromState: row.state, toState: to, actorId: actor.id, note }).$returningId();
    if (to === 'issued') await audit({ action: 'revision_issued', teamId: actor.teamId, actorId: actor.id, target: `revision:${revisionId}`, ip }, tx);
    return { ok: true as const, state: to as RevisionState, eventId: ev.id };
  });
}

// runs kept with a revision: ./runs.ts
