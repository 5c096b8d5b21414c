import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { resetBody } from '../../../lib/schemas/api';
import { resetPassword } from '../../../lib/server/auth/accounts';
import { clientIp, failure, json } from '../../../lib/server/services/respond';

/** set a new password with the mailed token; every session of the account ends */
export const POST: APIRoute = async (ctx) => {
  const body = await readJson(ctx.request, resetBody);
  if ('response' in body) return body.response;
  const result = await resetPassword(body.data.token, body.data.password, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ reset: true });
};
