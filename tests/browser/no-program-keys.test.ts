// no screen shows a program key: every page, as each role of the demo team and as a guest with
// a share link, is read as a person sees it (folded parts opened) and no camelCase or
// snake_case token may appear in its visible text.
import { describe, it, expect, beforeAll } from 'vitest';
import type { Page } from 'playwright-core';
import { eq } from 'drizzle-orm';
import { openPage, useBrowser } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL, testDb } from '../support/db';
import { assemblies } from '../../src/lib/server/db/schema';
import { DEMO } from '../system/teamFixtures';
import { issuedRecord, type IssuedRecord } from '../system/recordFixtures';

const browser = useBrowser();
let record: IssuedRecord;
let pages: string[];
let guestPages: string[];

/** a word with a capital after lower-case letters (decrementFactor), or words joined by underscores (in_check) */
const PROGRAM_KEY = /\b[a-z]+[A-Z][A-Za-z0-9]*\b|\b[a-z]+_[a-z_]+\b/g;
/** units and symbols written the way the trade writes them (s_d, p_i: ISO 13788's subscripts in plain text) */
const ALLOWED = new Set(['kWh', 'mWh', 'kJ', 'kPa', 'mPa', 's_d', 'p_i', 'p_e', 'p_sat']);

async function keysOn(page: Page, url: string): Promise<string[]> {
  const res = await page.goto(url);
  expect(res?.status(), url).toBeLessThan(400);
  await page.waitForLoadState('networkidle');
  // the workbench settles after its first run or the kept run's load
  await page.waitForTimeout(800);
  await page.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
  const text = await page.evaluate(() => document.body.innerText);
  return (text.match(PROGRAM_KEY) ?? []).filter((t) => !ALLOWED.has(t));
}

beforeAll(async () => {
  record = await issuedRecord();
  const heavy = await demoAssembly(DEMO_HEAVY_WALL);
  const jobOf = async (id: number) => (await testDb().select({ jobId: assemblies.jobId }).from(assemblies).where(eq(assemblies.id, id)))[0].jobId;
  pages = [
    '/',
    '/jobs',
    `/jobs/${await jobOf(record.assemblyId)}`,
    `/jobs/${await jobOf(heavy)}`,
    `/assemblies/${record.assemblyId}`,
    `/assemblies/${heavy}`,
    `/assemblies/${record.assemblyId}/history?rev=${record.revisionId}`,
    `/assemblies/${record.assemblyId}/report`,
    `/assemblies/${heavy}/report`,
    '/library',
    '/team',
  ];
  guestPages = [`/s/${record.token}`, '/', '/signin', '/signup', '/reset'];
});

describe('no program keys on any screen', () => {
  for (const [role, userId] of [
    ['admin', DEMO.admin],
    ['engineer', DEMO.engineer],
    ['checker', DEMO.checker],
  ] as const) {
    it(`as the ${role}`, async () => {
      const { page, context } = await openPage(browser(), { userId });
      const found: Record<string, string[]> = {};
      for (const url of pages) {
        const keys = await keysOn(page, url);
        if (keys.length) found[url] = keys;
      }
      expect(found).toEqual({});
      await context.close();
    });
  }

  it('as a guest with a share link', async () => {
    const { page, context } = await openPage(browser());
    const found: Record<string, string[]> = {};
    for (const url of guestPages) {
      const keys = await keysOn(page, url);
      if (keys.length) found[url] = keys;
    }
    expect(found).toEqual({});
    await context.close();
  });
});
