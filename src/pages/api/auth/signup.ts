import type { APIRoute } from 'astro';
import { readJson } from '../../../lib/server/http';
import { signUpBody } from '../../../lib/schemas/api';
import { createUser, sendVerification } from '../../../lib/server/auth/accounts';
import { startSession } from '../../../lib/server/auth/session';
import { failure, json } from '../../../lib/server/services/respond';

/** make an account, sign it in and mail the address-confirmation link */
export const POST: APIRoute = async ({ request, cookies }) => {
  const body = await readJson(request, signUpBody);
  if ('response' in body) return body.response;
  const made = await createUser(body.data);
  if (!made.ok) return failure(made);
  await startSession(cookies, made.value.id);
  let verificationSent = true;
  try {
    await sendVerification(made.value);
  } catch {
    // the account stands; the link can be asked for again (POST /api/auth/resend-verification)
    verificationSent = false;
  }
  return json({ user: { id: made.value.id, name: made.value.name, email: made.value.email, emailVerified: false }, verificationSent }, 201);
};
