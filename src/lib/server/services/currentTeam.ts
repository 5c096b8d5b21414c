import { teamsOf, type Member } from '../access';

/** the team a page works in: ?team= when the person belongs to it, else their first team */
export async function currentTeam(userId: string, url: URL): Promise<{ current: Member | null; all: Member[] }> {
  const all = await teamsOf(userId);
  const wanted = Number(url.searchParams.get('team'));
  const current = all.find((m) => m.teamId === wanted) ?? all[0] ?? null;
  return { current, all };
}

const HOME = '/jobs';
// any origin will do: only whether the path stays on it matters
const BASE = new URL('http://wallpulse.invalid');

/**
 * A same-origin path to go to after signing in; anything else becomes /jobs. Only an absolute
 * path is accepted: no scheme, no `//` or `/\` (another host to a browser), and no control
 * characters at all (a browser drops tab, CR and LF, which turns `/<tab>/evil.example` into
 * `//evil.example`; CR and LF would break the Location header). What is left is parsed against
 * a base with the URL API and must keep its origin; the answer is rebuilt from the parsed parts.
 */
export function safeNext(value: string | null | undefined): string {
  if (!value || value.length > 2000) return HOME;
  if (/[\u0000-\u001f\u007f\\]/.test(value)) return HOME;
  if (!value.startsWith('/') || value.startsWith('//')) return HOME;
  let url: URL;
  try {
    url = new URL(value, BASE);
  } catch {
    return HOME;
  }
  if (url.origin !== BASE.origin || url.pathname.startsWith('//')) return HOME;
  return url.pathname + url.search + url.hash;
}
