import type { APIRoute } from 'astro';
import { authorize } from '../../../../../lib/server/access';
import { readQuery } from '../../../../../lib/server/http';
import { listQuery } from '../../../../../lib/schemas/api';
import { listMembers } from '../../../../../lib/server/services/teams';
import { idOf, json } from '../../../../../lib/server/services/respond';

const query = listQuery(['name', 'email', 'role', 'joinedAt'], 'name');

export const GET: APIRoute = async ({ locals, params, url }) => {
  const auth = await authorize(locals, idOf(params.id));
  if ('response' in auth) return auth.response;
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  return json(await listMembers(auth.member.teamId, q.data));
};
