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
  it('names both fields when days to report and warm-up days pass ten years, and keeps the last valid days', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${assemblyId}`);
    const exposure = page.getByTestId('exposure-pane');
    const days = exposure.getByLabel('Days to report');
    await days.waitFor();
    const run = page.getByTestId('run');
    await expect(run.textContent()).resolves.toBe('Run 7 days');
    // 3650 + 4 warm-up days = 3654 > 3652, the engine's ten years in whole days
    await days.fill('3650');
    await expect(exposure.getByRole('alert').textContent()).resolves.toBe(
      'Days to report plus warm-up days must be at most 3652 (ten years); with 4 warm-up days, at most 3648 days to report',
    );
    await expect(days.getAttribute('aria-invalid')).resolves.toBe('true');
    // the document kept 3 days: the run button and the total are unchanged, and no engine message shows
    await expect(run.textContent()).resolves.toBe('Run 7 days');
    await expect(page.getByTestId('run-issues').count()).resolves.toBe(0);
    await expect(page.getByTestId('response-pane').textContent()).resolves.not.toMatch(/duration/);
    await days.fill('3648');
    await expect(exposure.getByRole('alert').count()).resolves.toBe(0);
    await expect(run.textContent()).resolves.toBe('Run 3652 days');
    // and the warm-up field now checks against the 3648 days
    await exposure.getByLabel('Warm-up days').fill('5');
    await expect(exposure.getByRole('alert').textContent()).resolves.toMatch(/^Days to report plus warm-up days must be at most 3652 \(ten years\); with 3648 days to report, at most 4 warm-up days$/);
    await expect(run.textContent()).resolves.toBe('Run 3652 days');
    expect(errors).toEqual([]);
    await context.close();
  });
});
