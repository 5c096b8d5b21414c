import type { APIRoute } from 'astro';
import { authorize, can, teamOfAssembly } from '../../../../lib/server/access';
import { apiError, readJson, readQuery } from '../../../../lib/server/http';
import { listQuery, revisionBody } from '../../../../lib/schemas/api';
import { listRevisions, saveRevision } from '../../../../lib/server/services/revisions';
import { idOf, json } from '../../../../lib/server/services/respond';

const query = listQuery(['number', 'state', 'createdAt', 'authorName'], '-number');

export const GET: APIRoute = async ({ locals, params, url }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfAssembly(id) : null);
  if ('response' in auth) return auth.response;
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  return json(await listRevisions(id!, q.data));
};

/**
 * Save the workbench as a new revision. baseRevisionId is the revision the editor
 * started from; when it is no longer the newest, nothing is written and the answer
 * is 409 with the newest revision, so the client can show what changed.
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfAssembly(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const body = await readJson(request, revisionBody);
  if ('response' in body) return body.response;
  const { baseRevisionId, model, note } = body.data;
  const saved = await saveRevision(id!, auth.member.userId, baseRevisionId, model, note);
  if (saved.ok) return json({ revision: saved.revision }, 201);
  const h = saved.head;
  return apiError(
    409,
    'stale',
    `Revision ${h.number} was saved by ${h.authorName ?? 'a former member'} at ${h.createdAt.toISOString()} after you opened this one.`,
    undefined,
    { head: { id: h.id, number: h.number, authorName: h.authorName, createdAt: h.createdAt, model: h.model } },
  );
};
