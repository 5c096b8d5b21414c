// the run length fields of the Exposure pane: together they stay within the engine's ten years,
// and the field says so in its own words instead of the engine's duration message.
import { describe, it, expect, beforeAll } from 'vitest';
import { useBrowser, openPage } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL } from '../support/db';

const browser = useBrowser();
let assemblyId: number;

beforeAll(async () => {
  assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
});

describe('the run length of the Exposure pane', () => {
  it('keeps a repeating day within the engine\'s ten years with no warm-up days, and keeps the last valid days', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${assemblyId}`);
    const exposure = page.getByTestId('exposure-pane');
    const days = exposure.getByLabel('Days to report');
    await days.waitFor();
    const run = page.getByTestId('run');
    // a daily sine starts in its periodic state: the run is the reported days alone, and there is no warm-up field
    await expect(run.textContent()).resolves.toMatch(/^Run( again)? 3 days$/);
    await expect(exposure.getByLabel('Warm-up days').count()).resolves.toBe(0);
    await expect(exposure.getByTestId('periodic-start-note').textContent()).resolves.toMatch(/periodic state/);
    // 3653 days > 3652, the engine's ten years in whole days
    await days.fill('3653');
    await expect(exposure.getByRole('alert').textContent()).resolves.toBe('Days to report must be at most 3652 (ten years)');
    await expect(days.getAttribute('aria-invalid')).resolves.toBe('true');
    // the document kept 3 days: the run button is unchanged, and no engine message shows
    await expect(run.textContent()).resolves.toMatch(/^Run( again)? 3 days$/);
    await expect(page.getByTestId('run-issues').count()).resolves.toBe(0);
    await expect(page.getByTestId('response-pane').textContent()).resolves.not.toMatch(/duration/);
    await days.fill('3652');
    await expect(exposure.getByRole('alert').count()).resolves.toBe(0);
    await expect(run.textContent()).resolves.toMatch(/^Run( again)? 3652 days$/);
    expect(errors).toEqual([]);
    await context.close();
  });
});
