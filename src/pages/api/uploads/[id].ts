import type { APIRoute } from 'astro';
import { authorize } from '../../../lib/server/access';
import { apiError } from '../../../lib/server/http';
import { getUpload } from '../../../lib/server/uploads';

/** one upload with its series (members of its team) */
export const GET: APIRoute = async ({ locals, params }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const id = Number(params.id);
  if (!Number.isInteger(id) || id <= 0) return apiError(404, 'not_found', 'Not found.');
  const upload = await getUpload(id);
  const auth = await authorize(locals, upload?.teamId ?? null);
  if ('response' in auth) return auth.response;
  return Response.json({ upload }, { headers: { 'cache-control': 'private, no-store' } });
};
