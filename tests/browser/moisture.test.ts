// the Moisture pane: the ISO 13788 verdict of the demo timber-frame pair under the Harrow Lane
// climate, stepping through the months from the keyboard, the climate CSV's line-numbered
// problems, and μ and s_d in the build-up's figures.
import { describe, it, expect, beforeAll } from 'vitest';
import { useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { demoAssembly } from '../support/db';
import { demoClimate } from '../../src/lib/moisture/index.ts';

const browser = useBrowser();
const WITHOUT = 'Stair tower, timber frame without vapour control layer';
const WITH = 'Stair tower, timber frame with vapour control layer';
let withoutId: number;
let withId: number;

beforeAll(async () => {
  withoutId = await demoAssembly(WITHOUT);
  withId = await demoAssembly(WITH);
});

describe('the Moisture pane', () => {
  it('flags the timber frame without a vapour control layer and steps through the months by keyboard', async () => {
    const { page, context, errors, requests } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${withoutId}`);
    const pane = page.getByTestId('moisture-pane');
    const verdict = pane.getByTestId('moisture-verdict');
    await verdict.waitFor();
    // ISO 13788 monthly method (worked by hand in tests/unit/moisture/glaser.test.ts): water accumulates at the plywood
    await expect(verdict.getAttribute('data-verdict')).resolves.toBe('accumulates');
    await expect(verdict.textContent()).resolves.toMatch(/Accumulates: fails\..*still held at the end of the year.*Plywood/);
    await expect(verdict.textContent()).resolves.toMatch(/A hygrothermal specialist and local codes decide\./);
    await expect(pane.getByTestId('moisture-cautions').textContent()).resolves.toMatch(/No air leakage/);

    // January: condensation at the plywood face, shown on the diagram as a condensation bar
    const strip = pane.getByTestId('month-strip');
    const jan = strip.locator('[data-month="1"]');
    await expect(jan.getAttribute('aria-checked')).resolves.toBe('true');
    await expect(pane.getByTestId('month-summary').textContent()).resolves.toMatch(/^January: .*Condensation at Plywood/);
    await expect(pane.getByTestId('glaser-thickness').locator('[data-condensation]').count()).resolves.toBe(1);
    await screenshot(page, 'moisture-timber-without-vcl-january');

    // six steps right from the keyboard: July, when the plywood dries and nothing condenses
    await jan.focus();
    for (let i = 0; i < 6; i++) await page.keyboard.press('ArrowRight');
    await expect(strip.locator('[data-month="7"]').getAttribute('aria-checked')).resolves.toBe('true');
    await expect(page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.month)).resolves.toBe('7');
    await expect(pane.getByTestId('month-summary').textContent()).resolves.toMatch(/^July: .*Drying out: [\d.,]+ g\/m² evaporates\./);
    await expect(pane.getByTestId('glaser-sd').locator('svg').getAttribute('aria-label')).resolves.toBe('Glaser diagram, July, against s_d');
    await expect(pane.getByTestId('glaser-thickness').locator('[data-condensation]').count()).resolves.toBe(0);
    // Home and End reach the ends of the year; the left arrow wraps from January to December
    await page.keyboard.press('Home');
    await page.keyboard.press('ArrowLeft');
    await expect(strip.locator('[data-month="12"]').getAttribute('aria-checked')).resolves.toBe('true');

    // the table of months: July evaporates, October (the start month) condenses
    const table = pane.getByTestId('moisture-months');
    await expect(table.locator('[data-month-row="10"] th').textContent()).resolves.toMatch(/October\s*\(start\)/);
    const july = await table.locator('[data-month-row="7"] td').allTextContents();
    expect(Number(july[2])).toBe(0); // condensed
    expect(Number(july[3].replace(/,/g, ''))).toBeGreaterThan(0); // evaporated
    await strip.locator('[data-month="7"]').click();
    await pane.scrollIntoViewIfNeeded();
    await screenshot(page, 'moisture-timber-without-vcl-july');

    // μ and s_d per layer in the build-up's figures: plywood 200 × 18 mm = 3.60 m
    const plyRow = page.getByTestId('layer-figures').first();
    await expect(plyRow.locator('[data-cell="mu"]').textContent()).resolves.toBe('200');
    await expect(plyRow.locator('[data-cell="sd"]').textContent()).resolves.toBe('3.60');
    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('passes the same frame with a vapour control layer, and shows the verdict among the Response figures', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${withId}`);
    const verdict = page.getByTestId('moisture-verdict');
    await verdict.waitFor();
    await expect(verdict.getAttribute('data-verdict')).resolves.not.toBe('accumulates');
    await expect(verdict.textContent()).resolves.toMatch(/dries out within the year|No interstitial condensation/);
    await expect(page.getByTestId('moisture-surface-verdict').textContent()).resolves.toMatch(/no mould or surface condensation risk/);
    // the run of the Response pane carries the same verdict
    const row = page.locator('[data-figure="moistureVerdict"]');
    await row.waitFor({ timeout: 60_000 });
    await expect(row.textContent()).resolves.toMatch(/Condenses, dries out within the year|No condensation/);
    await expect(page.getByTestId('moisture-figures-note').textContent()).resolves.toMatch(/A hygrothermal specialist and local codes decide\./);
    await screenshot(page, 'moisture-timber-with-vcl');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('names a bad line of a pasted climate by its number and keeps the months it had', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${withoutId}`);
    const pane = page.getByTestId('moisture-pane');
    await pane.getByTestId('moisture-verdict').waitFor();
    await pane.getByTestId('climate-toggle').click();
    const editor = pane.getByTestId('climate-editor');
    await editor.getByRole('button', { name: 'Paste or read a CSV…' }).click();
    const rows = ['month,temperature,relative humidity', ...Array.from({ length: 12 }, (_, i) => `${i + 1},${i},80`)];
    rows[3] = '3,mild,80';
    await editor.getByTestId('climate-csv').fill(rows.join('\n'));
    await editor.getByTestId('climate-csv-apply').click();
    await expect(editor.getByTestId('climate-csv-problems').textContent()).resolves.toMatch(/^line 4: temperature "mild" is not a number in °C/);
    await expect(editor.getByLabel('March outdoor temperature (°C)').inputValue()).resolves.toBe(String(demoClimate('harrow-lane').months[2].temperature));
    // a bad cell names its field and unit, and the verdict stays on the last valid climate
    await editor.getByLabel('January outdoor relative humidity (%)').fill('130');
    await expect(editor.getByRole('alert').filter({ hasText: 'Outdoor relative humidity must be at most 100 %' }).count()).resolves.toBe(1);
    await expect(pane.getByTestId('moisture-verdict').getAttribute('data-verdict')).resolves.toBe('accumulates');
    // a valid paste replaces the months: a mild year lets this frame dry out
    rows[3] = '3,10,75';
    const mild = rows.map((r, i) => (i === 0 ? r : `${i},${12 + (i % 3)},75`));
    await editor.getByTestId('climate-csv').fill(mild.join('\n'));
    await editor.getByTestId('climate-csv-apply').click();
    await expect(editor.getByLabel('January outdoor temperature (°C)').inputValue()).resolves.toBe('13');
    await screenshot(page, 'moisture-climate-editor');
    expect(errors).toEqual([]);
    await context.close();
  });
});
