import type { APIRoute } from 'astro';
import { authorize, teamOfRevision } from '../../../../lib/server/access';
import { commentsOf, eventsOf, getRevision, movesFor } from '../../../../lib/server/services/revisions';
import { idOf, json } from '../../../../lib/server/services/respond';

/** one revision with its document, its history of states and its comments */
export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  const [revision, events, comments] = await Promise.all([getRevision(id!), eventsOf(id!), commentsOf(id!)]);
  return json({ revision, events, comments, moves: movesFor(revision!.state, auth.member.role), role: auth.member.role });
};
