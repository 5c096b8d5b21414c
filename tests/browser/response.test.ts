import { describe, it, expect, beforeAll } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import Papa from 'papaparse';
import { useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL } from '../support/db';

const browser = useBrowser();
let assemblyId: number;

beforeAll(async () => {
  assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
});

/** records every main-thread task over 50 ms (the Long Tasks API) from the first script on */
async function watchLongTasks(page: Page) {
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: number[] };
    w.__longTasks = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__longTasks.push(e.duration);
    }).observe({ type: 'longtask', buffered: true });
  });
}
const longTasks = (page: Page) => page.evaluate(() => (window as unknown as { __longTasks: number[] }).__longTasks.slice());
const clearLongTasks = (page: Page) => page.evaluate(() => void ((window as unknown as { __longTasks: number[] }).__longTasks.length = 0));
const profilePixels = (page: Page) => page.getByTestId('profile-canvas').evaluate((c) => (c as HTMLCanvasElement).toDataURL());

describe('Response pane', () => {
  it('runs three days in the worker without blocking the page, plays the profile, and scrubs to the CSV export value at 15:00', async () => {
    const { page, context, requests, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await watchLongTasks(page);
    await page.goto(`/assemblies/${assemblyId}`);
    const pane = page.getByTestId('response-pane');
    // the default exposure reports three days from its periodic start, and runs by itself
    await expect(pane.getByTestId('run').textContent()).resolves.toMatch(/^Run( again)? 3 days$/);
    await pane.getByTestId('figures').waitFor();

    await page.waitForTimeout(300);
    await clearLongTasks(page);
    await pane.getByTestId('run').click();
    await pane.getByTestId('run-progress').waitFor({ state: 'detached' });
    await page.waitForTimeout(200);
    expect(await longTasks(page)).toEqual([]);
    // the run is of the saved revision: it can be kept with it (the runs API of the revision)
    await pane.getByRole('button', { name: /Keep this run with revision \d+/ }).click();
    await expect(pane.getByTestId('run-saved').textContent()).resolves.toMatch(/Kept with revision \d+ \(run \d+\)/);
    await expect.poll(() => pane.getByTestId('kept-runs').locator('summary').textContent()).toMatch(/^\d+ runs? kept with revision \d+$/);
    const decrement = await pane.locator('[data-figure="decrementFactor"] [data-cell="simulated"]').textContent();
    const analytic = await pane.locator('[data-figure="decrementFactor"] [data-cell="analytic"]').textContent();
    // from the periodic start the fitted decrement factor agrees with ISO 13786 to the shown decimals, give or take one
    expect(Math.abs(Number(decrement) - Number(analytic))).toBeLessThanOrEqual(0.002);

    // playing moves the profile between frames
    const before = await profilePixels(page);
    const timeBefore = await pane.getByTestId('playback-time').textContent();
    await pane.getByTestId('play').click();
    await page.waitForTimeout(400);
    const during = await profilePixels(page);
    const timeDuring = await pane.getByTestId('playback-time').textContent();
    await pane.getByTestId('play').click();
    expect(during).not.toBe(before);
    expect(timeDuring).not.toBe(timeBefore);

    // scrub to 15:00 of day 1 with the keyboard: 15-minute outputs, 60 steps from the start
    const scrub = pane.getByTestId('scrub');
    await scrub.focus();
    await page.keyboard.press('Home');
    for (let i = 0; i < 60; i++) await page.keyboard.press('ArrowRight');
    await expect(pane.getByTestId('playback-time').textContent()).resolves.toBe('day 1, 15:00');
    const shownSurface = await pane.getByTestId('readout-inside-surface').textContent();

    const [download] = await Promise.all([page.waitForEvent('download'), pane.getByTestId('export-csv').click()]);
    const csv = Papa.parse<Record<string, string>>(readFileSync((await download.path())!, 'utf8'), { header: true, skipEmptyLines: true, comments: '#' });
    const row = csv.data.find((r) => r.day === '1' && r['time of day'] === '15:00');
    expect(row).toBeDefined();
    expect(Number(row!['inside surface (°C)']).toFixed(2)).toBe(shownSurface);

    await screenshot(page, 'response-pane');

    // an edit of the exposure re-runs by itself (a 3-day run); the new run is not of the saved revision
    const before15 = await pane.locator('[data-figure="insideSurfaceMax"] [data-cell="simulated"]').textContent();
    await page.getByTestId('exposure-pane').getByLabel('Daily mean').fill('30');
    await expect.poll(() => pane.locator('[data-figure="insideSurfaceMax"] [data-cell="simulated"]').textContent()).not.toBe(before15);
    await expect(pane.getByTestId('run-state').textContent()).resolves.toMatch(/Unsaved run/);
    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('cancels a run of three thousand days from its progress bar, keeps the last figures, and runs again in a fresh worker', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${assemblyId}`);
    const pane = page.getByTestId('response-pane');
    await pane.getByTestId('figures').waitFor();
    const exposure = page.getByTestId('exposure-pane');
    await exposure.getByLabel('Days to report').fill('3000');
    await exposure.getByLabel('Time step').selectOption('60');
    await expect(pane.textContent()).resolves.toMatch(/press Run/);
    await pane.getByTestId('run').click();
    const bar = pane.getByRole('progressbar', { name: 'Run progress' });
    await expect.poll(() => bar.getAttribute('aria-valuenow').then(Number), { timeout: 20_000 }).toBeGreaterThan(0);
    await pane.getByRole('button', { name: 'Cancel' }).click();
    await pane.getByTestId('run-progress').waitFor({ state: 'detached', timeout: 2000 });
    await expect(pane.getByTestId('stale-banner').textContent()).resolves.toMatch(/Changed since the run: days to report; time step\. To bring them up to date, press Run\./);
    await pane.getByTestId('figures').waitFor();
    // back to a short run: it runs by itself again
    const before = await pane.getByTestId('run-state').textContent();
    await exposure.getByLabel('Days to report').fill('2');
    // the first run of a fresh worker (the cancelled one was ended) on a busy machine: allow it time
    await expect.poll(() => pane.getByTestId('run-state').textContent(), { timeout: 20_000 }).not.toBe(before);
    await expect(pane.getByTestId('run').textContent()).resolves.toBe('Run again 2 days');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('imports an hourly CSV: names the one bad line, then keeps a good file for the team and runs it', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${assemblyId}`);
    await page.getByTestId('response-pane').getByTestId('figures').waitFor();
    const exposure = page.getByTestId('exposure-pane');
    await exposure.getByRole('radio', { name: 'Uploaded series' }).click();
    await exposure.getByRole('button', { name: 'Import a CSV file…' }).click();

    const lines = ['time,air temperature'];
    for (let h = 0; h < 72; h++) lines.push(`2025-07-${String(14 + Math.floor(h / 24)).padStart(2, '0')} ${String(h % 24).padStart(2, '0')}:00,${(18 + 6 * Math.cos((2 * Math.PI * (h - 15)) / 24)).toFixed(2)}`);
    const bad = lines.slice();
    bad[9] = bad[9].replace(/,[^,]*$/, ',n/a'); // line 10 of the file
    await exposure.getByTestId('csv-file').setInputFiles({ name: 'harrow-lane-bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad.join('\n')) });
    const problems = exposure.getByTestId('csv-problems');
    await expect(problems.textContent()).resolves.toMatch(/1 problem in harrow-lane-bad\.csv/);
    await expect(problems.textContent()).resolves.toContain('Line 10: air temperature: "n/a" is not a number');

    await exposure.getByTestId('csv-file').setInputFiles({ name: 'harrow-lane-july.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\n')) });
    await expect(exposure.getByTestId('csv-ok').textContent()).resolves.toMatch(/72 hours read/);
    await exposure.getByTestId('csv-preview-chart').locator('canvas').first().waitFor();
    await exposure.getByRole('button', { name: 'Keep for the team' }).click();
    // the import closes once the upload is kept (a refusal would stay open with its message)
    await exposure.getByTestId('csv-import').waitFor({ state: 'detached', timeout: 15_000 }).catch(async (e) => {
      throw new Error(`the upload was not kept: ${await exposure.getByTestId('csv-import').textContent()} (${e})`);
    });
    await expect
      .poll(() => exposure.getByTestId('upload-picker').locator('select').first().locator('option:checked').textContent({ timeout: 1000 }).catch(() => ''), { timeout: 15_000 })
      .toMatch(/harrow-lane-july — 72 h/);
    // the run follows by itself and says the outdoor air is an uploaded series
    await expect.poll(() => page.getByTestId('response-pane').textContent(), { timeout: 15_000 }).toMatch(/uploaded series/);
    await screenshot(page, 'exposure-upload');
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('Report page', () => {
  it('prints the build-up, the exposure, the analytic and simulated figures, the assumptions and the cautions', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-checker' });
    const res = await page.goto(`/assemblies/${assemblyId}/report`);
    expect(res?.status()).toBe(200);
    const report = page.getByTestId('report');
    await expect(report.locator('h1').textContent()).resolves.toBe('West wall, brick with external insulation');
    await expect(report.textContent()).resolves.toMatch(/Stone wool slab/);
    const figures = await page.getByTestId('report-figures').textContent();
    expect(figures).toMatch(/U-value \d\.\d{3} W\/m²K/);
    expect(figures).toMatch(/Decrement factor/);
    // the ISO 13788 moisture check has replaced the dew-point screening (the demo wall carries a monthly climate)
    expect(figures).toMatch(/Moisture, interstitial \(ISO 13788\)/);
    await expect(page.getByTestId('caution').textContent()).resolves.toMatch(/qualified professional/);
    await expect(report.textContent()).resolves.toMatch(/ISO 13788/);
    await page.emulateMedia({ media: 'print' });
    await expect(page.locator('header.no-print').isVisible()).resolves.toBe(false);
    await screenshot(page, 'report-print');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('answers 404 for an assembly of no team of the reader', async () => {
    const { page, context } = await openPage(browser(), { userId: 'demo-checker' });
    const res = await page.goto('/assemblies/999999/report');
    expect(res?.status()).toBe(404);
    await context.close();
  });
});
