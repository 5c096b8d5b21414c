import type { APIRoute } from 'astro';
import { openShare } from '../../../lib/server/services/shares';
import { clientIp, failure, json } from '../../../lib/server/services/respond';

/** what a guest's Shared view shows, and nothing else of the team; no account needed. every call is counted and audited as an opening */
export const GET: APIRoute = async (ctx) => {
  const result = await openShare(ctx.params.token ?? '', clientIp(ctx));
  if (!result.ok) return failure(result);
  return json(result.shared);
};
