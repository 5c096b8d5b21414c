// the Shared view's page, rendered once per issued revision and kept run and served from memory:
// an issued revision never changes, so the page of a guest is the same for every guest until a
// new run is kept with it. the link itself is checked, counted and audited on every opening
// (checkShare) before anything is served, so a withdrawn or expired link stops at once.
// the cache is per app instance and bounded (entries and bytes, least recently used goes first).

/** entries kept: a few hundred issued revisions */
export const SHARED_PAGE_ENTRIES = 300;
/** bytes of HTML kept in all (a page with its charts is about 60–150 kB) */
export const SHARED_PAGE_BYTES = 48 * 1024 * 1024;

export interface CachedPage {
  html: string;
  headers: [string, string][];
}

const pages = new Map<string, CachedPage>();
let bytes = 0;

/** the key of a revision's page: the revision and its newest kept run */
export const sharedPageKey = (revisionId: number, newestRunId: number | null) => `${revisionId}:${newestRunId ?? 'none'}`;

/** the page of a key, now the most recently used; undefined when not kept */
export function cachedSharedPage(key: string): CachedPage | undefined {
  const hit = pages.get(key);
  if (hit) {
    pages.delete(key);
    pages.set(key, hit);
  }
  return hit;
}

/** keep a page, letting the least recently used go while over either bound */
export function keepSharedPage(key: string, page: CachedPage): void {
  const size = page.html.length * 2;
  if (size > SHARED_PAGE_BYTES / 4) return;
  const old = pages.get(key);
  if (old) {
    bytes -= old.html.length * 2;
    pages.delete(key);
  }
  pages.set(key, page);
  bytes += size;
  while (pages.size > SHARED_PAGE_ENTRIES || bytes > SHARED_PAGE_BYTES) {
    const [firstKey, first] = pages.entries().next().value!;
    pages.delete(firstKey);
    bytes -= first.html.length * 2;
  }
}

/** how many pages are kept (for tests) */
export const sharedPageCount = () => pages.size;
