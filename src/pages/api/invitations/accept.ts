import type { APIRoute } from 'astro';
import { apiError, readJson } from '../../../lib/server/http';
import { acceptInvitationBody } from '../../../lib/schemas/api';
import { acceptInvitation, invitationByToken } from '../../../lib/server/services/invitations';
import { createUser } from '../../../lib/server/auth/accounts';
import { startSession } from '../../../lib/server/auth/session';
import { clientIp, failure, json } from '../../../lib/server/services/respond';

/**
 * Accept an invitation: signed in with the invited address, or, with name and
 * password, as a new account for that address (the link proves the mailbox).
 */
export const POST: APIRoute = async (ctx) => {
  const body = await readJson(ctx.request, acceptInvitationBody);
  if ('response' in body) return body.response;
  const { token, name, password } = body.data;
  let user = ctx.locals.user ? { id: ctx.locals.user.id, email: ctx.locals.user.email } : null;
  if (!user) {
    const found = await invitationByToken(token);
    if (!found.ok) return failure(found);
    if (found.invitation.hasAccount) return apiError(401, 'unauthenticated', `An account for ${found.invitation.email} exists: sign in with it, then accept.`);
    const fields: Record<string, string> = {};
    if (!name) fields.name = 'Name is required';
    if (!password) fields.password = 'Password is required';
    if (Object.keys(fields).length) return apiError(422, 'invalid', 'Some fields are not valid.', fields);
    const made = await createUser({ name: name!, email: found.invitation.email, password: password!, verified: true });
    if (!made.ok) return failure(made);
    await startSession(ctx.cookies, made.value.id);
    user = { id: made.value.id, email: made.value.email };
  }
  const result = await acceptInvitation(token, user, clientIp(ctx));
  if (!result.ok) return failure(result);
  return json({ teamId: result.teamId });
};
