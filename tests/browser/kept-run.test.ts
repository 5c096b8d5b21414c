// a run kept with a revision is first-class: the checker opening the revision sees the
// engineer's run without running anything; an edit dims it and says what changed; a new run
// is compared with the kept one; the live tiles say when a field holds a value not accepted.
import { describe, it, expect, beforeAll } from 'vitest';
import { openPage, screenshot, useBrowser } from '../support/browser';
import { issuedRecord, type IssuedRecord } from '../system/recordFixtures';
import { formatFigure } from '../../src/lib/workbench/figureDefs';

const browser = useBrowser();
let record: IssuedRecord;
beforeAll(async () => {
  // a saved revision with a kept run, not yet sent to check
  record = await issuedRecord({ issue: false });
});

describe('a kept run', () => {
  it('is what a checker sees on opening the revision, with when, by whom and under which exposure, and nothing runs', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-checker' });
    await page.goto(`/assemblies/${record.assemblyId}`);
    const pane = page.getByTestId('response-pane');
    await expect(pane.getByTestId('run-origin').textContent()).resolves.toMatch(new RegExp(`^Kept run of revision ${record.revisionNumber}, .+ by Tomas Reyes$`));
    const decrement = pane.locator('[data-figure="decrementFactor"] [data-cell="simulated"]');
    await expect(decrement.textContent()).resolves.toBe(formatFigure('decrementFactorSimulated', record.summary.decrementFactorSimulated));
    await expect(pane.locator('[data-figure="peakHeatLoss"] [data-cell="simulated"]').textContent()).resolves.toBe(formatFigure('peakHeatLossWm2', record.summary.peakHeatLossWm2));
    // the kept run stays: nothing ran by itself in the checker's browser
    await page.waitForTimeout(1500);
    await expect(pane.getByTestId('run-origin').textContent()).resolves.toMatch(/^Kept run of revision/);
    await expect(pane.getByTestId('run-progress').count()).resolves.toBe(0);
    await expect(pane.getByTestId('run').textContent()).resolves.toBe('Run again 3 days'); // a repeating day starts in its periodic state: the 3 reported days, no warm-up
    await expect(pane.getByTestId('stale-banner').count()).resolves.toBe(0);
    await pane.getByTestId('profile-canvas').waitFor();
    await screenshot(page, 'kept-run-checker');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('is dimmed with a banner naming what changed after an edit, and a new run is compared with it', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${record.assemblyId}`);
    const pane = page.getByTestId('response-pane');
    await expect(pane.getByTestId('run-origin').textContent()).resolves.toMatch(/^Kept run of revision/);

    // a run longer than the auto-run limit waits: the kept results are dimmed and the banner names the setting
    const exposure = page.getByTestId('exposure-pane');
    await exposure.getByLabel('Days to report').fill('10');
    await expect(pane.getByTestId('stale-banner').textContent()).resolves.toMatch(/Changed since the run: days to report\. To bring them up to date, press Run\./);
    await expect(pane.getByTestId('run-results').getAttribute('data-stale')).resolves.toBe('true');
    await screenshot(page, 'kept-run-stale');

    // back to three days and a warmer day: a short run follows by itself and is compared with the kept one
    await exposure.getByLabel('Days to report').fill('3');
    await exposure.getByLabel('Daily mean').fill('27');
    await pane.getByTestId('run-comparison').waitFor({ timeout: 30_000 });
    await expect(pane.getByTestId('run-state').textContent()).resolves.toMatch(/^Unsaved run/);
    // a warmer day brings more heat into the room: the peak heat gain rises against the kept run's
    const row = pane.getByTestId('run-comparison').locator('[data-compare="peakHeatGainWm2"]');
    await expect(row.locator('td').nth(0).textContent()).resolves.toBe(formatFigure('peakHeatGainWm2', record.summary.peakHeatGainWm2));
    await expect(row.locator('td').nth(2).textContent()).resolves.toMatch(/^\+\d/);
    await expect(pane.getByTestId('run-results').getAttribute('data-stale')).resolves.toBe('false');

    // a field that holds a value not accepted: the live tiles say they show the last valid input
    const thickness = page.getByTestId('layer-card').nth(0).locator('input[data-field="thickness"]');
    await thickness.fill('0');
    await page.getByTestId('live-invalid').waitFor();
    await screenshot(page, 'kept-run-compared');
    await thickness.fill('102');
    await page.getByTestId('live-invalid').waitFor({ state: 'detached' });
    expect(errors).toEqual([]);
    await context.close();
  });
});
