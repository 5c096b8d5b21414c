import { defineMiddleware, sequence } from 'astro:middleware';
import { lucia } from './lib/server/auth/lucia';

/** reads the session cookie, refreshes it when lucia says so, and puts user and session on locals */
const session = defineMiddleware(async (context, next) => {
  const sessionId = context.cookies.get(lucia.sessionCookieName)?.value ?? null;
  context.locals.user = null;
  context.locals.session = null;
  if (sessionId) {
    const { session, user } = await lucia.validateSession(sessionId);
    if (session?.fresh) {
      const cookie = lucia.createSessionCookie(session.id);
      context.cookies.set(cookie.name, cookie.value, cookie.attributes);
    }
    if (!session) {
      const blank = lucia.createBlankSessionCookie();
      context.cookies.set(blank.name, blank.value, blank.attributes);
    }
    context.locals.user = user;
    context.locals.session = session;
  }
  return next();
});

/** headers every response carries; the app loads nothing from another origin */
const securityHeaders = defineMiddleware(async (_context, next) => {
  const response = await next();
  response.headers.set('x-content-type-options', 'nosniff');
  response.headers.set('referrer-policy', 'same-origin');
  response.headers.set('x-frame-options', 'DENY');
  return response;
});

export const onRequest = sequence(securityHeaders, session);
