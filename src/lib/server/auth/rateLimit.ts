/**
 * Failed sign-ins counted per e-mail + IP in this process's memory (a restart
 * forgets them; several app processes would each count their own). Five
 * failures within 15 minutes lock that pair out until the window has passed.
 */
export const MAX_FAILURES = 5;
export const WINDOW_MS = 15 * 60_000;

const failures = new Map<string, number[]>();

function key(email: string, ip: string): string {
  return `${email.toLowerCase()}|${ip}`;
}

function recent(k: string, now: number): number[] {
  const list = (failures.get(k) ?? []).filter((t) => now - t < WINDOW_MS);
  if (list.length) failures.set(k, list);
  else failures.delete(k);
  return list;
}

/** seconds until the pair may try again, or 0 when it may try now */
export function lockedFor(email: string, ip: string, now = Date.now()): number {
  const list = recent(key(email, ip), now);
  if (list.length < MAX_FAILURES) return 0;
  return Math.ceil((list[0] + WINDOW_MS - now) / 1000);
}

export function recordFailure(email: string, ip: string, now = Date.now()): void {
  const k = key(email, ip);
  failures.set(k, [...recent(k, now), now]);
}

export function clearFailures(email: string, ip: string): void {
  failures.delete(key(email, ip));
}
