// the workbench at common desktop widths: nothing cut off on the right, and a table too wide
// for its box scrolls inside it and says so.
import { describe, it, expect, beforeAll } from 'vitest';
import { useBrowser, openPage, screenshot } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL } from '../support/db';

const browser = useBrowser();
let assemblyId: number;

beforeAll(async () => {
  assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
});

describe('the figures per layer under the stack', () => {
  for (const width of [1280, 1440]) {
    it(`shows every column, the Lumped one included, inside its box at ${width} px`, async () => {
      const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer', viewport: { width, height: 900 } });
      await page.goto(`/assemblies/${assemblyId}`);
      const table = page.getByRole('table', { name: 'Figures per layer' });
      await table.waitFor();
      const box = page.getByTestId('layer-figures-box');
      const lumped = table.getByRole('columnheader', { name: 'Lumped' });
      const [b, l] = [await box.boundingBox(), await lumped.boundingBox()];
      expect(b && l).toBeTruthy();
      // the last column ends inside the box, and the page itself does not scroll sideways
      await expect(box.getAttribute('data-overflow')).resolves.toBe('false');
      expect(l!.x + l!.width).toBeLessThanOrEqual(b!.x + b!.width + 0.5);
      expect(b!.x + b!.width).toBeLessThanOrEqual(width);
      await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(width);
      // the profile canvas stays inside its bordered box
      await page.getByTestId('profile-canvas').waitFor();
      const edges = await page.getByTestId('profile-canvas').evaluate((c) => ({ canvas: c.getBoundingClientRect().right, box: c.parentElement!.getBoundingClientRect().right }));
      expect(edges.canvas).toBeLessThanOrEqual(edges.box);
      await table.scrollIntoViewIfNeeded();
      await screenshot(page, `workbench-engineer-${width}`);
      expect(errors).toEqual([]);
      await context.close();
    });
  }

  it('scrolls sideways inside its own box on a narrow window, with a visible note and fade, and reaches the Lumped column', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer', viewport: { width: 560, height: 900 } });
    await page.goto(`/assemblies/${assemblyId}`);
    const box = page.getByTestId('layer-figures-box');
    await box.waitFor();
    await expect.poll(() => box.getAttribute('data-overflow')).toBe('true');
    const note = page.getByTestId('layer-figures-scroll-note');
    await expect(note.textContent()).resolves.toMatch(/More columns to the right/);
    await expect(box.getAttribute('tabindex')).resolves.toBe('0');
    // it takes focus, and scrolled to its end it shows the last column
    await box.focus();
    await box.evaluate((el) => el.scrollTo({ left: el.scrollWidth }));
    await expect.poll(() => note.textContent()).toMatch(/more columns to the left/);
    const [b, l] = [await box.boundingBox(), await page.getByRole('columnheader', { name: 'Lumped' }).boundingBox()];
    expect(l!.x + l!.width).toBeLessThanOrEqual(b!.x + b!.width + 0.5);
    await box.scrollIntoViewIfNeeded();
    await screenshot(page, 'workbench-figures-narrow');
    expect(errors).toEqual([]);
    await context.close();
  });
});
