import { defineMiddleware, sequence } from 'astro:middleware';
import { PUBLIC_BASE_URL } from 'astro:env/server';
import { lucia } from './lib/server/auth/lucia';
import { apiError, isFormContentType, isJsonContentType } from './lib/server/http';
import { errorId, isDatabaseUnavailable, shortReason } from './lib/server/failures';
import { problemPage } from './lib/server/problemPage';
import { startMailWorker } from './lib/server/mail';
import { BASE_HEADERS } from './stack/headers.mjs';
import { checkShare } from './lib/server/services/shares';
import { cachedSharedPage, keepSharedPage, sharedPageKey } from './lib/server/services/sharedPage';
import { clientIp } from './lib/server/services/respond';

// the outbound mail queue is sent from this process (mail.ts); the middleware is loaded with the app
startMailWorker();

/**
 * Added to the policy Astro writes for a page. Server-rendered style attributes (computed
 * widths and colours) cannot load or run anything, so they are allowed. Inline event handlers
 * are not, with one exact exception: `window.print()`, the print button of the report page
 * (src/pages/assemblies/[id]/report.astro); once that button gets a script of its own the hash can go.
 */
const PAGE_ATTRIBUTE_POLICY = "style-src-attr 'unsafe-inline'; script-src-attr 'unsafe-hashes' 'sha256-MguIPR6qNR8D3B+eAlK+bIRTZe8t3wkOY4B/56Me9FU='";

/** seconds a client should wait before trying again while the database is away */
const RETRY_AFTER_S = 15;

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const publicOrigin = (() => {
  try {
    return new URL(PUBLIC_BASE_URL).origin;
  } catch {
    return null;
  }
})();

const hasBody = (request: Request) =>
  Number(request.headers.get('content-length') ?? 0) > 0 || request.headers.has('transfer-encoding');

/**
 * The guard around every request: refuses cross-site writes and bodies of the wrong type,
 * and turns any error below it into a clear answer: 503 with Retry-After while the database
 * is away, 500 with an error id otherwise (JSON for the API, a page for the rest). The log
 * gets one short line per error, never the failed statement's parameters.
 */
const guard = defineMiddleware(async (context, next) => {
  const { request, url } = context;
  const isApi = url.pathname.startsWith('/api/');
  const refuse = (status: number, code: string, title: string, message: string) =>
    isApi ? apiError(status, code, message) : problemPage(status, title, [message]);

  if (!SAFE_METHODS.has(request.method)) {
    // a write from another site: the browser says where it comes from (Origin, Sec-Fetch-Site)
    const origin = request.headers.get('origin');
    const crossOrigin = origin !== null && origin !== url.origin && origin !== publicOrigin;
    if (crossOrigin || request.headers.get('sec-fetch-site') === 'cross-site') {
      return refuse(403, 'cross_site', 'Refused', 'Requests that change something must come from Wallpulse’s own pages.');
    }
    const type = request.headers.get('content-type');
    if (isApi && hasBody(request) && !isJsonContentType(type)) {
      return apiError(415, 'unsupported_media_type', 'Send the request body as JSON, with Content-Type: application/json.');
    }
    // pages take only what an HTML form sends (a form always names its content type)
    if (!isApi) {
      if (!isFormContentType(type)) {
        return problemPage(415, 'This form could not be read', ['The page accepts only what its own form sends. Go back, and send the form again from the page.']);
      }
      try {
        await request.clone().formData();
      } catch {
        return problemPage(400, 'This form could not be read', ['The form arrived damaged. Go back, and send it again from the page.']);
      }
    }
  }

  let response: Response;
  try {
    response = await next();
  } catch (err) {
    if (isDatabaseUnavailable(err)) {
      console.error(`[wallpulse] database unavailable on ${request.method} ${url.pathname}: ${shortReason(err)}`);
      const headers = { 'retry-after': String(RETRY_AFTER_S) };
      if (isApi) {
        const res = apiError(503, 'unavailable', 'Wallpulse cannot reach its database just now. Nothing saved is lost; try again in a minute.');
        res.headers.set('retry-after', String(RETRY_AFTER_S));
        return res;
      }
      return problemPage(
        503,
        'Wallpulse is temporarily unavailable',
        [
          'The server cannot reach its database just now, so this page cannot be shown. Nothing saved is lost.',
          'Work you have not saved yet stays in this browser: the workbench keeps your draft and offers it back when you open the assembly again.',
          'Try again in a minute.',
        ],
        headers,
      );
    }
    const id = errorId();
    console.error(`[wallpulse] error ${id} on ${request.method} ${url.pathname}: ${shortReason(err)}`);
    return isApi
      ? apiError(500, 'server_error', `Something went wrong on the server (error ${id}). Try again; if it keeps happening, tell us the error number.`)
      : problemPage(500, 'Something went wrong', [`The server could not answer this page (error ${id}). Try again; if it keeps happening, tell us the error number.`]);
  }

  // an address or method nobody serves: the API's error shape, or a page of our own (Astro's default has an inline style)
  if (response.status === 404 && (response.headers.get('content-type') ?? '').includes('text/html')) {
    const ours = await response.clone().text().then((t) => !t.includes('<title>404: Not Found</title>'), () => true);
    if (!ours) {
      return isApi
        ? apiError(404, 'not_found', `Nothing answers ${request.method} at this address.`)
        : problemPage(404, 'Page not found', ['There is no page at this address. Check the link, or start again from the home page.']);
    }
  }

  try {
    for (const [name, value] of BASE_HEADERS) {
      if (!response.headers.has(name)) response.headers.set(name, value);
    }
    const csp = response.headers.get('content-security-policy');
    if (csp && !csp.includes('style-src-attr')) response.headers.set('content-security-policy', `${csp.replace(/;\s*$/, '')}; ${PAGE_ATTRIBUTE_POLICY}`);
  } catch {
    // a response with immutable headers (Response.redirect) keeps those the server adds
  }
  return response;
});

/** reads the session cookie, refreshes it when lucia says so, and puts user and session on locals */
const session = defineMiddleware(async (context, next) => {
  const sessionId = context.cookies.get(lucia.sessionCookieName)?.value ?? null;
  context.locals.user = null;
  context.locals.session = null;
  // the health check answers for the database itself, with or without a cookie
  if (sessionId && context.url.pathname !== '/api/health') {
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

const SHARED_PATH = /^\/s\/([^/]+)\/?$/;

/**
 * The Shared view of a guest (no one signed in, so the page is the same for every guest): the link
 * is checked, counted and audited on every opening, then the page of the revision and its newest
 * kept run comes from the cache, or is rendered once and kept. A signed-in person's page carries
 * their own header and is rendered each time (the page counts the opening itself).
 */
const sharedPage = defineMiddleware(async (context, next) => {
  const m = context.request.method === 'GET' && !context.locals.user ? SHARED_PATH.exec(context.url.pathname) : null;
  if (!m) return next();
  let token: string;
  try {
    token = decodeURIComponent(m[1]);
  } catch {
    return next();
  }
  const result = await checkShare(token, clientIp(context));
  context.locals.shareCheck = { token, result };
  if (!result.ok) return next();
  const key = sharedPageKey(result.revisionId, result.newestRunId);
  const hit = cachedSharedPage(key);
  if (hit) return new Response(hit.html, { status: 200, headers: [...hit.headers, ['x-cache', 'hit']] });
  const response = await next();
  if (response.status !== 200 || !(response.headers.get('content-type') ?? '').includes('text/html')) return response;
  const html = await response.text();
  const headers = [...response.headers].filter(([name]) => name !== 'set-cookie' && name !== 'content-length' && name !== 'x-cache');
  keepSharedPage(key, { html, headers });
  return new Response(html, { status: 200, headers: [...headers, ['x-cache', 'miss']] });
});

export const onRequest = sequence(guard, session, sharedPage);
