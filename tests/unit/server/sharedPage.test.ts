// the Shared view's page cache: least recently used goes first, bounded in entries and in bytes
import { describe, expect, it } from 'vitest';
import { cachedSharedPage, keepSharedPage, sharedPageCount, sharedPageKey, SHARED_PAGE_BYTES, SHARED_PAGE_ENTRIES } from '../../../src/lib/server/services/sharedPage';

const page = (html: string) => ({ html, headers: [['content-type', 'text/html']] as [string, string][] });

describe('the shared page cache', () => {
  it('keys a page by revision and newest kept run', () => {
    expect(sharedPageKey(12, 40)).not.toBe(sharedPageKey(12, 41));
    expect(sharedPageKey(12, null)).not.toBe(sharedPageKey(12, 40));
  });

  it('keeps at most its number of entries, letting the least recently used go', () => {
    for (let i = 0; i < SHARED_PAGE_ENTRIES; i++) keepSharedPage(`e:${i}`, page(`<p>${i}</p>`));
    // e:0 is read, so e:1 is now the least recently used
    expect(cachedSharedPage('e:0')?.html).toBe('<p>0</p>');
    keepSharedPage('e:new', page('<p>new</p>'));
    expect(sharedPageCount()).toBe(SHARED_PAGE_ENTRIES);
    expect(cachedSharedPage('e:1')).toBeUndefined();
    expect(cachedSharedPage('e:0')?.html).toBe('<p>0</p>');
    expect(cachedSharedPage('e:new')?.html).toBe('<p>new</p>');
  });

  it('keeps at most its bytes of HTML', () => {
    // pages of a fifth of the bound each (two bytes a character): at most five fit
    const big = 'x'.repeat(Math.floor(SHARED_PAGE_BYTES / 10) - 10);
    for (let i = 0; i < 8; i++) keepSharedPage(`b:${i}`, page(big + i));
    const kept = Array.from({ length: 8 }, (_, i) => cachedSharedPage(`b:${i}`) !== undefined);
    expect(kept.filter(Boolean).length).toBeLessThanOrEqual(5);
    expect(kept.slice(5)).toEqual([true, true, true]);
    expect(kept[0]).toBe(false);
  });
});
