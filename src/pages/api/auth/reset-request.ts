import type { APIRoute } from 'astro';
import { apiError, readJson } from '../../../lib/server/http';
import { resetRequestBody } from '../../../lib/schemas/api';
import { requestPasswordReset } from '../../../lib/server/auth/accounts';
import { tryAgainIn } from '../../../lib/server/auth/rateLimit';
import { clientIp, json } from '../../../lib/server/services/respond';

/** queue a reset link when the address has an account; the answer is the same either way, in content and time */
export const POST: APIRoute = async (ctx) => {
  const body = await readJson(ctx.request, resetRequestBody);
  if ('response' in body) return body.response;
  const wait = await requestPasswordReset(body.data.email, clientIp(ctx));
  if (wait > 0) return apiError(429, 'rate_limited', `Several reset links were asked for already. ${tryAgainIn(wait)}`);
  return json({ sent: true, message: 'If an account uses this address, a reset link is on its way. It lasts 1 hour.' }, 202);
};
