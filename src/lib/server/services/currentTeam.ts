import { teamsOf, type Member } from '../access';

/** the team a page works in: ?team= when the person belongs to it, else their first team */
export async function currentTeam(userId: string, url: URL): Promise<{ current: Member | null; all: Member[] }> {
  const all = await teamsOf(userId);
  const wanted = Number(url.searchParams.get('team'));
  const current = all.find((m) => m.teamId === wanted) ?? all[0] ?? null;
  return { current, all };
}

/** a same-site path to go to after signing in; anything else becomes /jobs */
export function safeNext(value: string | null | undefined): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/jobs';
  return value;
}
