import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { signInBody } from '../../../lib/schemas/api';
import { signIn } from '../../../lib/server/auth/accounts';
import { startSession } from '../../../lib/server/auth/session';
import { clientIp, failure, json } from '../../../lib/server/services/respond';

export const POST: APIRoute = async (ctx) => {
  const body = await readJson(ctx.request, signInBody);
  if ('response' in body) return body.response;
  const result = await signIn(body.data.email, body.data.password, clientIp(ctx));
  if (!result.ok) return failure(result);
  await startSession(ctx.cookies, result.value.id);
  const u = result.value;
  return json({ user: { id: u.id, name: u.name, email: u.email, emailVerified: u.emailVerifiedAt !== null } });
};
