// the database stops under a running app: the API answers 503 in the one error shape with
// Retry-After, pages show a clear "temporarily unavailable" page, the workbench's unsaved draft
// stays in the browser, and once the database is back the same app answers again, without a restart
import { describe, it, expect, afterAll } from 'vitest';
import { closeTestDb, demoAssembly, DEMO_HEAVY_WALL, sessionFor, SESSION_COOKIE } from '../support/db';
import { baseUrl, launch } from '../support/browser';
import { startTestDatabase, stopTestDatabase } from '../support/database-control';
import { draftStorageKey } from '../../src/lib/workbench/draftStorage';
import { DEMO, demoTeamId, headRevisionId } from './teamFixtures';

let stopped = false;
afterAll(async () => {
  // never leave the rest of the run without its database
  if (stopped) await startTestDatabase();
  await closeTestDb();
});

const get = (path: string, cookie?: string, init: RequestInit = {}) =>
  fetch(baseUrl() + path, { redirect: 'manual', ...init, headers: { origin: baseUrl(), ...(cookie ? { cookie } : {}), ...(init.headers ?? {}) } });

async function expectUnavailableJson(res: Response) {
  expect(res.status).toBe(503);
  expect(res.headers.get('content-type')).toMatch(/application\/json/);
  expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
  const body = await res.json();
  expect(Object.keys(body)).toEqual(['error']);
  expect(body.error.code).toBe('unavailable');
  expect(body.error.message).toMatch(/database/);
}

async function expectUnavailablePage(res: Response) {
  expect(res.status).toBe(503);
  expect(res.headers.get('content-type')).toMatch(/text\/html/);
  expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
  const html = await res.text();
  expect(html).toMatch(/temporarily unavailable/);
  expect(html).toMatch(/Nothing saved is lost/);
}

describe('while the database is stopped', () => {
  it('answers 503 with Retry-After, shows a clear page, keeps the draft, and recovers without a restart', async () => {
    const cookie = `${SESSION_COOKIE}=${await sessionFor(DEMO.engineer)}`;
    const teamId = await demoTeamId();
    const assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
    const headId = await headRevisionId(assemblyId);
    expect((await get(`/api/jobs?teamId=${teamId}`, cookie)).status).toBe(200);

    // an unsaved draft in the workbench, as the browser keeps it
    const { browser, close } = await launch();
    try {
      const context = await browser.newContext({ baseURL: baseUrl() });
      const url = new URL(baseUrl());
      await context.addCookies([{ name: SESSION_COOKIE, value: cookie.split('=')[1], domain: url.hostname, path: '/', httpOnly: true, sameSite: 'Lax' }]);
      const page = await context.newPage();
      await page.goto(`/assemblies/${assemblyId}`);
      await page.getByTestId('layer-card').first().waitFor();
      // an edit the person has not saved: the workbench keeps it as a draft in the browser
      const outer = page.getByTestId('layer-card').nth(0).locator('input[data-field="thickness"]');
      const edited = String(Number(await outer.inputValue()) + 7);
      await outer.fill(edited);
      await outer.blur();
      await page.waitForTimeout(600); // the draft is written a moment after the last edit
      const key = draftStorageKey(assemblyId, headId);
      const draftOf = () => page.evaluate((k) => localStorage.getItem(k), key);
      expect(await draftOf()).not.toBeNull();

      await stopTestDatabase();
      stopped = true;

      // the API: the one error shape, Retry-After, for reads and writes
      await expectUnavailableJson(await get(`/api/jobs?teamId=${teamId}`, cookie));
      await expectUnavailableJson(await get('/api/auth/me', cookie));
      await expectUnavailableJson(await get('/api/teams', cookie, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Outage studio' }) }));
      await expectUnavailableJson(await get('/api/auth/signin', undefined, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'tomas@demo.wallpulse.test', password: 'wallpulse-demo' }) }));
      const health = await get('/api/health');
      expect(health.status).toBe(503);
      expect((await health.json()).db).toBe('down');

      // pages of a signed-in person, the home page too
      for (const path of ['/', '/jobs', `/assemblies/${assemblyId}`, '/team', '/library']) await expectUnavailablePage(await get(path, cookie));
      // a page that needs no database still answers for someone signed out
      expect((await get('/')).status).toBe(200);

      // the browser: the page says so, and the draft is still there
      const res = await page.reload();
      expect(res?.status()).toBe(503);
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/temporarily unavailable/);
      expect(await draftOf()).not.toBeNull();

      await startTestDatabase();
      stopped = false;

      // the same app process answers again once its pool reconnects
      const end = Date.now() + 30_000;
      while ((await get('/api/health')).status !== 200) {
        if (Date.now() > end) throw new Error('the app did not see the database again within 30 s');
        await new Promise((r) => setTimeout(r, 250));
      }
      expect((await get(`/api/jobs?teamId=${teamId}`, cookie)).status).toBe(200);
      expect((await get('/jobs', cookie)).status).toBe(200);
      // back in the workbench, the unsaved edit is offered back
      await page.goto(`/assemblies/${assemblyId}`);
      await page.getByRole('button', { name: 'Restore them' }).click();
      expect(await outer.inputValue()).toBe(edited);
    } finally {
      await close();
    }
  });
});
