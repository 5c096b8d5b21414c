import type { APIRoute } from 'astro';
import { authorize } from '../../../../lib/server/access';
import { idOf, json } from '../../../../lib/server/services/respond';

export const GET: APIRoute = async ({ locals, params }) => {
  const auth = await authorize(locals, idOf(params.id));
  if ('response' in auth) return auth.response;
  return json({ team: { id: auth.member.teamId, name: auth.member.teamName }, role: auth.member.role });
};
