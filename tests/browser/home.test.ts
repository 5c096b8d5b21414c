import { describe, it, expect } from 'vitest';
import { useBrowser, openPage, outsideRequests, screenshot, baseUrl } from '../support/browser';

const browser = useBrowser();

describe('home page', () => {
  it('says what Wallpulse does, carries the caution, and loads nothing from outside 127.0.0.1', async () => {
    const { page, requests, errors, context } = await openPage(browser());
    const res = await page.goto('/');
    expect(res?.status()).toBe(200);
    await expect(page.locator('h1').textContent()).resolves.toMatch(/wall or roof/i);
    await expect(page.getByTestId('caution').textContent()).resolves.toMatch(/qualified professional/);
    await page.waitForLoadState('networkidle');
    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await screenshot(page, 'home');
    await context.close();
  });

  it('renders its text in the bundled Source Sans 3, served by the app itself', async () => {
    const { page, requests, context } = await openPage(browser());
    await page.goto('/');
    await page.evaluate(() => document.fonts.ready);
    const loaded = await page.evaluate(() => document.fonts.check('16px "Source Sans 3"'));
    expect(loaded).toBe(true);
    const family = await page.locator('h1').evaluate((el) => getComputedStyle(el).fontFamily);
    expect(family).toContain('Source Sans 3');
    const fonts = requests.filter((u) => u.endsWith('.woff2'));
    expect(fonts.length).toBeGreaterThan(0);
    for (const u of fonts) expect(u.startsWith(baseUrl())).toBe(true);
    await context.close();
  });
});

describe('/api/health', () => {
  it('reports the version and a database that answers', async () => {
    const res = await fetch(`${baseUrl()}/api/health`);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ status: 'ok', db: 'ok' });
    expect(body.version).toMatch(/^\d+\.\d+\.\d+/);
  });
});
