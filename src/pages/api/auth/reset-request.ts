import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { resetRequestBody } from '../../../lib/schemas/api';
import { requestPasswordReset } from '../../../lib/server/auth/accounts';
import { json } from '../../../lib/server/services/respond';

/** mail a reset link when the address has an account; the answer is the same either way */
export const POST: APIRoute = async ({ request }) => {
  const body = await readJson(request, resetRequestBody);
  if ('response' in body) return body.response;
  try {
    await requestPasswordReset(body.data.email);
  } catch (err) {
    // a different answer when mail fails would tell who has an account; the failure is kept in outbound_mail
    console.error(`password reset mail failed: ${err instanceof Error ? err.message : String(err)}`);
  }
  return json({ sent: true, message: 'If an account uses this address, a reset link is on its way. It lasts 1 hour.' }, 202);
};
