import { describe, it, expect } from 'vitest';
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';

const browser = useBrowser();

describe('Library screen', () => {
  it('sorts and filters the table, adds a team material through a checked form, and previews a CSV with line-numbered problems', async () => {
    const run = Date.now().toString(36);
    const { page, context, requests, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto('/library');
    const rows = page.getByTestId('material-row');
    await rows.first().waitFor();
    expect(await page.getByRole('note').filter({ hasText: 'Typical values' }).count()).toBe(1);
    expect(await rows.count()).toBeGreaterThanOrEqual(40);

    // sort by conductivity, highest first: copper (380 W/(m·K), ISO 10456 Table 3, from memory) leads
    const lambda = page.getByRole('button', { name: /λ \[W\/\(m·K\)\]/ });
    for (let i = 0; i < 3 && (await page.locator('th[aria-sort="descending"]').count()) === 0; i++) await lambda.click();
    expect(await page.locator('th[aria-sort="descending"]').textContent()).toContain('λ');
    expect(await rows.first().textContent()).toContain('Copper');

    // class filter and search
    await page.getByLabel('Class').selectOption('air');
    await expect.poll(() => rows.count()).toBe(5);
    await page.getByLabel('Search').fill('25 mm');
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain('Unventilated air layer, 25 mm');
    await page.getByLabel('Class').selectOption('');
    await page.getByLabel('Search').fill('');

    // a new team material: the form names what is missing, then accepts the corrected values
    await page.getByTestId('new-material').click();
    const form = page.getByTestId('material-form');
    await form.getByLabel('Name').fill(`Façade PIR ${run}`);
    await form.getByLabel('Conductivity [W/(m·K)]').fill('-0.02');
    await form.getByRole('button', { name: 'Add to the library' }).click();
    expect(await form.getByText('Conductivity must be greater than 0 W/(m·K)').count()).toBe(1);
    expect(await form.getByText('Density is required').count()).toBe(1);
    await form.getByLabel('Conductivity [W/(m·K)]').fill('0.022');
    await form.getByLabel('Density [kg/m³]').fill('32');
    await form.getByLabel('Specific heat [J/(kg·K)]').fill('1400');
    await form.getByLabel('Vapour resistance factor μ [–]').fill('60');
    await form.getByLabel('Source of the values').fill('declaration of performance (test)');
    await form.getByRole('button', { name: 'Add to the library' }).click();
    await form.waitFor({ state: 'detached' });
    await page.getByLabel('Search').fill(run);
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain('0.022');

    // a CSV with a problem: the preview names the line and the import button stays off
    const dir = mkdtempSync(path.join(tmpdir(), 'wallpulse-csv-'));
    const file = path.join(dir, 'materials.csv');
    writeFileSync(file, `name,class,conductivity,density,specific heat,mu,source\nGood ${run},board,0.2,700,1000,10,sheet\nBad ${run},board,0,700,1000,10,sheet\n`);
    await page.getByRole('button', { name: 'Import CSV…' }).click();
    const dialog = page.getByTestId('csv-import');
    await dialog.getByLabel('CSV file').setInputFiles(file);
    await expect.poll(() => dialog.getByTestId('import-problems').textContent()).toContain('Line 3: Conductivity must be greater than 0 W/(m·K)');
    expect(await dialog.getByRole('button', { name: /^Import/ }).isDisabled()).toBe(true);
    await screenshot(page, 'library-import');
    await dialog.getByRole('button', { name: 'Cancel' }).click();

    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('shows a checker the table without the editing controls', async () => {
    const { page, context } = await openPage(browser(), { userId: 'demo-checker' });
    await page.goto('/library');
    await page.getByTestId('material-row').first().waitFor();
    expect(await page.getByTestId('new-material').count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Import CSV…' }).count()).toBe(0);
    expect(await page.getByRole('link', { name: 'Export all (CSV)' }).count()).toBe(1);
    await context.close();
  });
});
