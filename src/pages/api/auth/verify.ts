import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { tokenBody } from '../../../lib/schemas/api';
import { verifyEmail } from '../../../lib/server/auth/accounts';
import { failure, json } from '../../../lib/server/services/respond';

/** confirm an address with the token from the mailed link (single use) */
export const POST: APIRoute = async ({ request }) => {
  const body = await readJson(request, tokenBody);
  if ('response' in body) return body.response;
  const result = await verifyEmail(body.data.token);
  if (!result.ok) return failure(result);
  return json({ verified: true });
};
