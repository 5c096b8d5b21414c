import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { tokenBody } from '../../../lib/schemas/api';
import { verifyEmail } from '../../../lib/server/auth/accounts';
import { startSession } from '../../../lib/server/auth/session';
import { failure, json } from '../../../lib/server/services/respond';

/** confirm an address with the token from the mailed link (single use); the link proved the mailbox, so it signs in too */
export const POST: APIRoute = async ({ request, cookies }) => {
  const body = await readJson(request, tokenBody);
  if ('response' in body) return body.response;
  const result = await verifyEmail(body.data.token);
  if (!result.ok) return failure(result);
  await startSession(cookies, result.value.userId);
  return json({ verified: true });
};
