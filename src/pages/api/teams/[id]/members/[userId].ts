import type { APIRoute } from 'astro';
import { authorize, can } from '../../../../../lib/server/access';
import { apiError, readJson } from '../../../../../lib/server/http';
import { roleBody } from '../../../../../lib/schemas/api';
import { changeRole, removeMember } from '../../../../../lib/server/services/teams';
import { clientIp, failure, idOf, json } from '../../../../../lib/server/services/respond';

/** change a member's role (admins) */
export const PATCH: APIRoute = async (ctx) => {
  const auth = await authorize(ctx.locals, idOf(ctx.params.id), can.administer);
  if ('response' in auth) return auth.response;
  const body = await readJson(ctx.request, roleBody);
  if ('response' in body) return body.response;
  const result = await changeRole(auth.member.teamId, auth.member.userId, ctx.params.userId ?? '', body.data.role, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ member: { userId: ctx.params.userId, role: body.data.role, from: result.from } });
};

/** remove a member (admins), or leave the team (anyone, for themself) */
export const DELETE: APIRoute = async (ctx) => {
  const auth = await authorize(ctx.locals, idOf(ctx.params.id));
  if ('response' in auth) return auth.response;
  const target = ctx.params.userId ?? '';
  if (target !== auth.member.userId && !can.administer(auth.member.role)) {
    return apiError(403, 'forbidden', `Only an admin may remove other members; your role is ${auth.member.role}.`);
  }
  const result = await removeMember(auth.member.teamId, auth.member.userId, target, clientIp(ctx));
  if (!result.ok) return failure(result);
  return new Response(null, { status: 204 });
};
