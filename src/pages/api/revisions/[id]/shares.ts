import type { APIRoute } from 'astro';
import { authorize, can, teamOfRevision } from '../../../../lib/server/access';
import { readJson } from '../../../../lib/server/http';
import { listQuery, shareBody } from '../../../../lib/schemas/api';
import { readQuery } from '../../../../lib/server/http';
import { createShare, listShares } from '../../../../lib/server/services/shares';
import { clientIp, failure, idOf, json } from '../../../../lib/server/services/respond';

const query = listQuery(['createdAt', 'label', 'lastOpenedAt', 'openCount', 'expiresAt'], '-createdAt');

export const GET: APIRoute = async ({ locals, params, url }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  return json(await listShares(auth.member.teamId, q.data, id!));
};

/** a share link for an issued revision; the URL (with its token) is in this answer only */
export const POST: APIRoute = async (ctx) => {
  const id = idOf(ctx.params.id);
  const auth = await authorize(ctx.locals, id ? await teamOfRevision(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const body = await readJson(ctx.request, shareBody);
  if ('response' in body) return body.response;
  const result = await createShare(id!, { id: auth.member.userId, teamId: auth.member.teamId }, body.data, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ share: result.share }, 201);
};
