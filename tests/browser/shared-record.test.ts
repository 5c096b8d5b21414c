// the Shared view of an issued revision reads without JavaScript: its figures and charts are
// drawn on the server from the run kept with the revision; every opening is counted, also
// through the API; a withdrawn link answers 410 Gone.
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { baseUrl, openPage, screenshot, useBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { shareLinks } from '../../src/lib/server/db/schema';
import { hashToken } from '../../src/lib/server/tokens';
import { DEMO, call } from '../system/teamFixtures';
import { issuedRecord, type IssuedRecord } from '../system/recordFixtures';
import { formatFigure } from '../../src/lib/workbench/figureDefs';
import { moistureReport, MOISTURE_DEFERRAL } from '../../src/lib/moisture/index';
import { twoLayerDocument } from '../system/recordFixtures';

const browser = useBrowser();
let record: IssuedRecord;
beforeAll(async () => {
  record = await issuedRecord();
});

const opens = async (token: string) => (await testDb().select({ n: shareLinks.openCount }).from(shareLinks).where(eq(shareLinks.tokenHash, hashToken(token))))[0].n;

describe('the Shared view', () => {
  it('shows the kept run’s figures and charts with JavaScript turned off', async () => {
    const context = await browser().newContext({ javaScriptEnabled: false, baseURL: baseUrl(), viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const res = await page.goto(`/s/${record.token}`);
    expect(res?.status()).toBe(200);
    await expect(page.getByTestId('shared-run-origin').textContent()).resolves.toMatch(/^From the run kept with this revision on /);
    const table = page.getByTestId('shared-figure-table');
    // the same figures the engineer kept, to the decimals the figure definitions give them
    await expect(table.locator('[data-figure="decrementFactor"] [data-cell="simulated"]').textContent()).resolves.toBe(formatFigure('decrementFactorSimulated', record.summary.decrementFactorSimulated));
    await expect(table.locator('[data-figure="timeLag"] [data-cell="simulated"]').textContent()).resolves.toBe(formatFigure('timeLagSimulatedH', record.summary.timeLagSimulatedH));
    await expect(table.locator('[data-figure="peakHeatLoss"] [data-cell="simulated"]').textContent()).resolves.toBe(formatFigure('peakHeatLossWm2', record.summary.peakHeatLossWm2));
    // the engine's housekeeping stays with the team
    await expect(table.locator('[data-figure="mesh"]').count()).resolves.toBe(0);
    for (const id of ['chart-surface', 'chart-flux', 'chart-profile']) await expect(page.getByTestId(id).count()).resolves.toBe(1);
    await expect(page.getByTestId('shared-verdicts').textContent()).resolves.toMatch(/Moisture \(ISO 13788\)/);
    // the moisture check as the client reads it: the verdict in words, the Glaser diagrams of the
    // key month and the method's cautions, but not the engineer's table of months
    const m = moistureReport(twoLayerDocument())!;
    const verdict = await page.getByTestId('moisture-verdict').innerText();
    expect(verdict).toContain(`${m.verdict.label}.`);
    expect(verdict).toContain(m.verdict.text);
    await expect(page.locator('[data-testid="moisture-section"] svg[aria-label^="Glaser diagram"]').count()).resolves.toBe(2);
    await expect(page.getByTestId('moisture-cautions').innerText()).resolves.toContain(MOISTURE_DEFERRAL);
    await expect(page.getByTestId('moisture-months').count()).resolves.toBe(0);
    const text = await page.locator('body').innerText();
    expect(text).not.toMatch(/Add a layer/);
    await screenshot(page, 'shared-view-no-js');
    await context.close();
  });

  it('counts and audits every opening, the page and the API alike, whatever the query says', async () => {
    const before = await opens(record.token);
    expect((await fetch(`${baseUrl()}/s/${record.token}`)).status).toBe(200);
    expect((await fetch(`${baseUrl()}/api/shared/${record.token}?record=0`)).status).toBe(200);
    expect((await fetch(`${baseUrl()}/s/${record.token}?record=0`)).status).toBe(200);
    expect(await opens(record.token)).toBe(before + 3);
  });

  it('renders the page of an issued revision once and serves it from the cache, still counting every opening', async () => {
    const fresh = await issuedRecord();
    const before = await opens(fresh.token);
    const first = await fetch(`${baseUrl()}/s/${fresh.token}`);
    const firstHtml = await first.text();
    expect(first.status).toBe(200);
    expect(first.headers.get('x-cache')).toBe('miss');
    const second = await fetch(`${baseUrl()}/s/${fresh.token}?record=0`);
    expect(second.status).toBe(200);
    expect(second.headers.get('x-cache')).toBe('hit');
    await expect(second.text()).resolves.toBe(firstHtml);
    // the cached answer keeps the page's own headers
    expect(second.headers.get('cache-control')).toBe('no-store');
    expect(second.headers.get('x-robots-tag')).toBe('noindex');
    expect(second.headers.get('content-security-policy')).toBe(first.headers.get('content-security-policy'));
    expect(await opens(fresh.token)).toBe(before + 2);
    // a link that expires stops working at once, though its page is in the cache
    await testDb().update(shareLinks).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(shareLinks.tokenHash, hashToken(fresh.token)));
    const expired = await fetch(`${baseUrl()}/s/${fresh.token}`);
    expect(expired.status).toBe(410);
    expect(expired.headers.get('x-cache')).toBeNull();
    await expect(expired.text()).resolves.toContain('This link has expired');
    expect(await opens(fresh.token)).toBe(before + 2);
  });

  it('answers 410 Gone for a withdrawn link, at once though its page is in the cache', async () => {
    expect((await fetch(`${baseUrl()}/s/${record.token}`)).headers.get('x-cache')).toBe('hit');
    const list = await (await call('GET', `/api/revisions/${record.revisionId}/shares`, { userId: DEMO.engineer })).json();
    expect((await call('POST', `/api/shares/${list.items[0].id}/revoke`, { userId: DEMO.engineer })).status).toBe(200);
    const res = await fetch(`${baseUrl()}/s/${record.token}`);
    expect(res.status).toBe(410);
    expect(res.statusText).toBe('Gone');
    await expect(res.text()).resolves.toContain('This link was withdrawn');
  });

  it('has its Report as the team reads it, with the PDF link', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: DEMO.checker, viewport: { width: 1100, height: 900 } });
    const res = await page.goto(`/assemblies/${record.assemblyId}/report`);
    expect(res?.status()).toBe(200);
    await expect(page.getByTestId('report-pdf').getAttribute('href')).resolves.toBe(`/assemblies/${record.assemblyId}/report.pdf?revision=${record.revisionNumber}`);
    await expect(page.getByTestId('check-trail').textContent()).resolves.toContain(record.notes.checked);
    await screenshot(page, 'report');
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByTestId('report-pdf').isVisible()).resolves.toBe(false);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('hydrates the playback on top with JavaScript', async () => {
    const fresh = await issuedRecord();
    const guest = await openPage(browser());
    await guest.page.goto(`/s/${fresh.token}`);
    await guest.page.getByTestId('shared-playback').scrollIntoViewIfNeeded();
    await guest.page.getByTestId('shared-playback').getByTestId('profile-canvas').waitFor({ timeout: 30_000 });
    await screenshot(guest.page, 'shared-view');
    expect(guest.errors).toEqual([]);
    await guest.context.close();
  });
});
