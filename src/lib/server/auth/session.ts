import type { AstroCookies } from 'astro';
import { lucia } from './lucia';

/** a new session for the user, its cookie set on the response */
export async function startSession(cookies: AstroCookies, userId: string): Promise<void> {
  const session = await lucia.createSession(userId, {});
  const cookie = lucia.createSessionCookie(session.id);
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}

/** end the current session and blank the cookie */
export async function endSession(cookies: AstroCookies, sessionId: string | null | undefined): Promise<void> {
  if (sessionId) await lucia.invalidateSession(sessionId);
  const blank = lucia.createBlankSessionCookie();
  cookies.set(blank.name, blank.value, blank.attributes);
}
