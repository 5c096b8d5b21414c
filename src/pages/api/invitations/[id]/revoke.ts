import type { APIRoute } from 'astro';
import { authorize, can } from '../../../../lib/server/access';
import { revokeInvitation, teamOfInvitation } from '../../../../lib/server/services/invitations';
import { clientIp, failure, idOf, json } from '../../../../lib/server/services/respond';

export const POST: APIRoute = async (ctx) => {
  const id = idOf(ctx.params.id);
  const auth = await authorize(ctx.locals, id ? await teamOfInvitation(id) : null, can.administer);
  if ('response' in auth) return auth.response;
  const result = await revokeInvitation(id!, auth.member.userId, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ revoked: true });
};
