import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { signUpBody } from '../../../lib/schemas/api';
import { SIGN_UP_SENT, signUp } from '../../../lib/server/auth/accounts';
import { clientIp, failure, json } from '../../../lib/server/services/respond';

/**
 * Make an account and mail its confirmation link (which signs it in). The answer is the same
 * for an address that has an account already: its owner gets a message instead.
 */
export const POST: APIRoute = async (ctx) => {
  const body = await readJson(ctx.request, signUpBody);
  if ('response' in body) return body.response;
  const result = await signUp(body.data, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ sent: true, message: SIGN_UP_SENT(result.value.email) }, 202);
};
