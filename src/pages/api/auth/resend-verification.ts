import type { APIRoute } from 'astro';
import { apiError } from '../../../lib/server/http';
import { resendVerification } from '../../../lib/server/auth/accounts';
import { json } from '../../../lib/server/services/respond';

export const POST: APIRoute = async ({ locals }) => {
  const user = locals.user;
  if (!user) return apiError(401, 'unauthenticated', 'Sign in first.');
  if (user.emailVerified) return apiError(409, 'already_verified', 'Your address is confirmed already.');
  const result = await resendVerification(user);
  if (result.limited) return apiError(429, 'rate_limited', result.limited);
  if (!result.sent) return apiError(503, 'mail_failed', 'The message could not be sent: the mail server did not answer. Try again in a minute.');
  return json({ sent: true }, 202);
};
