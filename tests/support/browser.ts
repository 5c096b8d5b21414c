import { afterAll, beforeAll } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { testEnv } from './env';
import { closeTestDb, sessionFor, SESSION_COOKIE } from './db';

/** where screenshots and traces are kept after a run */
export const ARTIFACTS = path.resolve('tests/artifacts');

export function baseUrl(): string {
  return testEnv('WALLPULSE_BASE_URL');
}

/**
 * Debian's Chromium, headless, with the flags this machine needs (no GPU, no
 * background networking, a fresh profile). Every request a page makes is
 * recorded, so tests can prove that nothing leaves 127.0.0.1.
 */
export async function launch(): Promise<{ browser: Browser; close(): Promise<void> }> {
  // playwright gives every launch a fresh temporary profile of its own
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
  return {
    browser,
    close: () => browser.close(),
  };
}

/**
 * The set-up every browser test file shares: one Chromium launched before the file's
 * tests, closed after them together with the test database pool. Call it at the top of
 * the file; the getter returns the browser once it is up.
 */
export function useBrowser(): () => Browser {
  let launched: Awaited<ReturnType<typeof launch>> | undefined;
  beforeAll(async () => {
    launched = await launch();
  });
  afterAll(async () => {
    await launched?.close();
    await closeTestDb();
  });
  return () => {
    if (!launched) throw new Error('the browser is not launched yet: call the getter inside a test or hook');
    return launched.browser;
  };
}

export interface WatchedPage {
  page: Page;
  context: BrowserContext;
  /** every URL the page asked for */
  requests: string[];
  /** console errors and uncaught page errors */
  errors: string[];
}

/** a page in a new context; signed in as userId when given (a session row made directly) */
export async function openPage(browser: Browser, opts: { userId?: string; viewport?: { width: number; height: number } } = {}): Promise<WatchedPage> {
  const context = await browser.newContext({ viewport: opts.viewport ?? { width: 1440, height: 900 }, baseURL: baseUrl() });
  if (opts.userId) {
    const url = new URL(baseUrl());
    await context.addCookies([{ name: SESSION_COOKIE, value: await sessionFor(opts.userId), domain: url.hostname, path: '/', httpOnly: true, sameSite: 'Lax' }]);
  }
  const page = await context.newPage();
  const requests: string[] = [];
  const errors: string[] = [];
  page.on('request', (r) => requests.push(r.url()));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(e.message));
  return { page, context, requests, errors };
}

/** requests that went anywhere but the app on loopback (data: and blob: URLs are local) */
export function outsideRequests(requests: string[]): string[] {
  return requests.filter((u) => {
    if (u.startsWith('data:') || u.startsWith('blob:')) return false;
    const host = new URL(u).hostname;
    return host !== '127.0.0.1' && host !== 'localhost';
  });
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
