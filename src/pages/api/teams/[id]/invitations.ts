import type { APIRoute } from 'astro';
import { authorize, can } from '../../../../lib/server/access';
import { readJson, readQuery } from '../../../../lib/server/http';
import { invitationBody, listQuery } from '../../../../lib/schemas/api';
import { invite, listInvitations } from '../../../../lib/server/services/invitations';
import { clientIp, failure, idOf, json } from '../../../../lib/server/services/respond';

const query = listQuery(['createdAt', 'email', 'role', 'expiresAt'], '-createdAt');

export const GET: APIRoute = async ({ locals, params, url }) => {
  const auth = await authorize(locals, idOf(params.id), can.administer);
  if ('response' in auth) return auth.response;
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  return json(await listInvitations(auth.member.teamId, q.data));
};

/** invite someone by e-mail (admins); the link lasts 7 days */
export const POST: APIRoute = async (ctx) => {
  const auth = await authorize(ctx.locals, idOf(ctx.params.id), can.administer);
  if ('response' in auth) return auth.response;
  const body = await readJson(ctx.request, invitationBody);
  if ('response' in body) return body.response;
  const result = await invite(auth.member.teamId, { id: auth.member.userId, name: ctx.locals.user!.name }, body.data.email, body.data.role, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ invitation: { id: result.id, email: body.data.email, role: body.data.role } }, 201);
};
