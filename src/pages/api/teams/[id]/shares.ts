import type { APIRoute } from 'astro';
import { authorize } from '../../../../lib/server/access';
import { readQuery } from '../../../../lib/server/http';
import { listQuery } from '../../../../lib/schemas/api';
import { listShares } from '../../../../lib/server/services/shares';
import { idOf, json } from '../../../../lib/server/services/respond';

const query = listQuery(['createdAt', 'label', 'assemblyName', 'lastOpenedAt', 'openCount', 'expiresAt'], '-createdAt');

/** the team's share links with when each was last opened (members) */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const auth = await authorize(locals, idOf(params.id));
  if ('response' in auth) return auth.response;
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  return json(await listShares(auth.member.teamId, q.data));
};
