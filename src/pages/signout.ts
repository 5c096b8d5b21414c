import type { APIRoute } from 'astro';
import { endSession } from '../lib/server/auth/session';
import { audit } from '../lib/server/audit';
import { clientIp } from '../lib/server/services/respond';

/** the header's sign-out button posts here */
export const POST: APIRoute = async (ctx) => {
  if (ctx.locals.user) await audit({ action: 'sign_out', actorId: ctx.locals.user.id, ip: clientIp(ctx) });
  await endSession(ctx.cookies, ctx.locals.session?.id);
  return ctx.redirect('/signin?signedOut=1', 303);
};
