import type { APIRoute } from 'astro';
import { authorize, teamOfRevision } from '../../../../lib/server/access';
import { readJson } from '../../../../lib/server/http';
import { transitionBody } from '../../../../lib/schemas/api';
import { transition } from '../../../../lib/server/services/revisions';
import { clientIp, failure, idOf, json } from '../../../../lib/server/services/respond';

/** move a revision through the check workflow; the role rules are in services/revisions.ts */
export const POST: APIRoute = async (ctx) => {
  const id = idOf(ctx.params.id);
  const auth = await authorize(ctx.locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  const body = await readJson(ctx.request, transitionBody);
  if ('response' in body) return body.response;
  const result = await transition(id!, { id: auth.member.userId, role: auth.member.role, teamId: auth.member.teamId }, body.data.to, body.data.note, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ revision: { id, state: result.state }, event: { id: result.eventId } }, 201);
};
