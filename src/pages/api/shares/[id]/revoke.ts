import type { APIRoute } from 'astro';
import { authorize, can } from '../../../../lib/server/access';
import { revokeShare, teamOfShare } from '../../../../lib/server/services/shares';
import { clientIp, failure, idOf, json } from '../../../../lib/server/services/respond';

export const POST: APIRoute = async (ctx) => {
  const id = idOf(ctx.params.id);
  const auth = await authorize(ctx.locals, id ? await teamOfShare(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const result = await revokeShare(id!, { id: auth.member.userId, teamId: auth.member.teamId }, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ share: { id, revokedAt: result.revokedAt } });
};
