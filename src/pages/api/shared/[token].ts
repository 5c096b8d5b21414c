import type { APIRoute } from 'astro';
import { openShare } from '../../../lib/server/services/shares';
import { clientIp, failure, json } from '../../../lib/server/services/respond';

/** what a guest's Shared view shows, and nothing else of the team; no account needed */
export const GET: APIRoute = async (ctx) => {
  const result = await openShare(ctx.params.token ?? '', clientIp(ctx), ctx.url.searchParams.get('record') !== '0');
  if (!result.ok) return failure(result);
  return json(result.shared);
};
