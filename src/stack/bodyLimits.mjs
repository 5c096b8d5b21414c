// The largest request body each kind of address accepts, counted in bytes as they arrive
// (serve.mjs). The README's "Limits" table states the same figures.
export const KB = 1024;
export const MB = 1024 * KB;

/** [method, path pattern, limit in bytes, what it is for]; the first match wins */
export const BODY_LIMITS = [
  // a kept run with its series, and an uploaded hourly weather series (ten years of hours is about 1.5 MB)
  ['POST', /^\/api\/revisions\/[^/]+\/runs\/?$/, 8 * MB, 'a run with its series'],
  ['POST', /^\/api\/uploads\/?$/, 8 * MB, 'an hourly weather upload'],
  // a saved revision: the whole workbench document
  ['POST', /^\/api\/assemblies\/[^/]+\/revisions\/?$/, 2 * MB, 'a revision'],
  // a materials CSV (the text itself is limited to 1 MB)
  ['POST', /^\/api\/materials\/import\/?$/, 2 * MB, 'a materials CSV import'],
  // a job backup file restored into a team (MAX_BACKUP_BYTES of src/lib/schemas/backup.ts)
  ['POST', /^\/api\/teams\/[^/]+\/import\/?$/, 16 * MB, 'a job backup file'],
];

/** every other body: forms, sign-in and the other JSON endpoints */
export const DEFAULT_BODY_LIMIT = 64 * KB;

export function bodyLimitFor(method, pathname) {
  for (const [m, pattern, limit] of BODY_LIMITS) if (m === method && pattern.test(pathname)) return limit;
  return DEFAULT_BODY_LIMIT;
}

export function formatBytes(n) {
  return n >= MB ? `${n / MB} MB` : `${n / KB} KB`;
}
