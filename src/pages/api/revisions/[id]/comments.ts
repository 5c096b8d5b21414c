import type { APIRoute } from 'astro';
import { authorize, teamOfRevision } from '../../../../lib/server/access';
import { readJson } from '../../../../lib/server/http';
import { commentBody } from '../../../../lib/schemas/api';
import { addComment, commentsOf } from '../../../../lib/server/services/revisions';
import { idOf, json } from '../../../../lib/server/services/respond';

export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  return json({ items: await commentsOf(id!) });
};

/** any member of the team may comment */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  const body = await readJson(request, commentBody);
  if ('response' in body) return body.response;
  const made = await addComment(id!, auth.member.userId, body.data.body);
  return json({ comment: { id: made.id, body: body.data.body, authorName: locals.user!.name, createdAt: made.createdAt } }, 201);
};
