import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { eq } from 'drizzle-orm';
import { baseUrl, useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { sessionFor, SESSION_COOKIE, testDb, demoAssembly } from '../support/db';
import { assemblies, jobs, memberships, revisions, teams, users } from '../../src/lib/server/db/schema';
import { DEMO_ASSEMBLIES } from '../../src/lib/server/seed/demoJob';

const browser = useBrowser();

const ids = (page: Page) => page.getByTestId('layer-card').evaluateAll((els) => els.map((e) => e.getAttribute('data-layer-id')));
const names = (page: Page) => page.getByTestId('layer-card').evaluateAll((els) => els.map((e) => e.getAttribute('data-name')));
const figure = async (page: Page, id: string) => (await page.getByTestId(id).textContent())?.trim() ?? '';

/**
 * a change made in the page, timed: `commit` until React has written it to the DOM (the stack's
 * order, or the figures after an edit), and `longestFrame`, the longest interval between painted
 * frames from just before the change until 300 ms after it (16.7 ms at 60 Hz when no frame is missed), ms
 */
function timed(page: Page, action: 'key' | 'input', arg: string): Promise<{ commit: number; longestFrame: number }> {
  return page.evaluate(
    ([action, arg]) =>
      new Promise<{ commit: number; longestFrame: number }>((resolve) => {
        const watched = document.querySelector(action === 'key' ? '[data-testid="layer-stack"]' : '[data-testid="fig-resistance"]')!;
        const frames: number[] = [];
        let t0 = 0;
        let commit = -1;
        const observer = new MutationObserver(() => {
          if (commit >= 0) return;
          commit = performance.now() - t0;
          observer.disconnect();
        });
        const tick = (now: number) => {
          frames.push(now);
          if (frames.length === 2) {
            // change right after a frame, so the work has the whole next frame
            observer.observe(watched, { childList: true, subtree: true, characterData: true });
            t0 = performance.now();
            if (action === 'key') {
              document.activeElement!.dispatchEvent(new KeyboardEvent('keydown', { key: ' ', code: arg, bubbles: true, cancelable: true }));
            } else {
              const input = document.activeElement as HTMLInputElement;
              Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!.call(input, arg);
              input.dispatchEvent(new Event('input', { bubbles: true }));
            }
          }
          if (frames.length > 2 && now - frames[1] > 300) {
            let longest = 0;
            for (let i = 2; i < frames.length; i++) longest = Math.max(longest, frames[i] - frames[i - 1]);
            resolve({ commit, longestFrame: longest });
          } else requestAnimationFrame(tick);
        };
        requestAnimationFrame(tick);
      }),
    [action, arg] as const,
  );
}

const WOOL = 'Stone wool slab for rendered facades (140 kg/m³)';
const BRICK = 'Clay brick, protected (1700 kg/m³)';
const RENDER = 'Cement–sand render (1800 kg/m³)';
const PLASTER = 'Dense gypsum plaster (1300 kg/m³)';

describe('probe', () => {
  it('with-climate', async () => {
    const id = await demoAssembly('Stair tower, timber frame infill');
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${id}`);
    await page.getByTestId('layer-card').first().waitFor();
    for (let i = 0; i < 4; i++) await page.getByRole('button', { name: /^Duplicate / }).nth(i).click();
    expect(await page.getByTestId('layer-card').count()).toBe(10);

    const reorder: { commit: number; longestFrame: number }[] = [];
    const edit: { commit: number; longestFrame: number }[] = [];
    for (let round = 0; round < 8; round++) {
      const card = round % 2 === 0 ? 0 : 1;
      await page.getByTestId('layer-card').nth(card).getByTestId('drag-handle').focus();
      const before = await ids(page);
      await page.keyboard.press('Space');
      await page.waitForTimeout(80);
      await page.keyboard.press(round % 2 === 0 ? 'ArrowDown' : 'ArrowUp');
      await page.waitForTimeout(150);
      reorder.push(await timed(page, 'key', 'Space'));
      await expect.poll(() => ids(page)).not.toEqual(before);
    }
    const thickness = page.getByTestId('layer-card').nth(3).locator('input[data-field="thickness"]');
    await thickness.focus();
    // the figure changes with each value (R of the layer), so each edit is seen committing
    for (let round = 0; round < 10; round++) {
      edit.push(await timed(page, 'input', String(140 + round)));
      await page.waitForTimeout(150);
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const line = (xs: { commit: number; longestFrame: number }[]) =>
      `commit median ${median(xs.map((x) => x.commit)).toFixed(1)} ms (max ${Math.max(...xs.map((x) => x.commit)).toFixed(1)}), ` +
      `longest frame around it median ${median(xs.map((x) => x.longestFrame)).toFixed(1)} ms (max ${Math.max(...xs.map((x) => x.longestFrame)).toFixed(1)})`;
    // the figures for the report
    console.log(`[with-climate] 10 layers, reorder by keyboard drop: ${line(reorder)}`);
    console.log(`[with-climate] 10 layers, thickness edit: ${line(edit)}`);
    // a generous sanity bound only (a loaded shared machine); the real measure is the logged one
    
    
    expect(await thickness.inputValue()).toBe('149');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('without-climate', async () => {
    const id = await demoAssembly('Stair tower, timber frame infill');
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${id}`);
    await page.getByTestId('layer-card').first().waitFor();
    await page.getByTestId('climate-toggle').click();
    await page.getByTestId('climate-remove').click();
    await page.getByTestId('moisture-empty').waitFor();
    for (let i = 0; i < 4; i++) await page.getByRole('button', { name: /^Duplicate / }).nth(i).click();
    expect(await page.getByTestId('layer-card').count()).toBe(10);

    const reorder: { commit: number; longestFrame: number }[] = [];
    const edit: { commit: number; longestFrame: number }[] = [];
    for (let round = 0; round < 8; round++) {
      const card = round % 2 === 0 ? 0 : 1;
      await page.getByTestId('layer-card').nth(card).getByTestId('drag-handle').focus();
      const before = await ids(page);
      await page.keyboard.press('Space');
      await page.waitForTimeout(80);
      await page.keyboard.press(round % 2 === 0 ? 'ArrowDown' : 'ArrowUp');
      await page.waitForTimeout(150);
      reorder.push(await timed(page, 'key', 'Space'));
      await expect.poll(() => ids(page)).not.toEqual(before);
    }
    const thickness = page.getByTestId('layer-card').nth(3).locator('input[data-field="thickness"]');
    await thickness.focus();
    // the figure changes with each value (R of the layer), so each edit is seen committing
    for (let round = 0; round < 10; round++) {
      edit.push(await timed(page, 'input', String(140 + round)));
      await page.waitForTimeout(150);
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const line = (xs: { commit: number; longestFrame: number }[]) =>
      `commit median ${median(xs.map((x) => x.commit)).toFixed(1)} ms (max ${Math.max(...xs.map((x) => x.commit)).toFixed(1)}), ` +
      `longest frame around it median ${median(xs.map((x) => x.longestFrame)).toFixed(1)} ms (max ${Math.max(...xs.map((x) => x.longestFrame)).toFixed(1)})`;
    // the figures for the report
    console.log(`[without-climate] 10 layers, reorder by keyboard drop: ${line(reorder)}`);
    console.log(`[without-climate] 10 layers, thickness edit: ${line(edit)}`);
    // a generous sanity bound only (a loaded shared machine); the real measure is the logged one
    
    
    expect(await thickness.inputValue()).toBe('149');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('with-climate-again', async () => {
    const id = await demoAssembly('Stair tower, timber frame infill');
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${id}`);
    await page.getByTestId('layer-card').first().waitFor();
    for (let i = 0; i < 4; i++) await page.getByRole('button', { name: /^Duplicate / }).nth(i).click();
    expect(await page.getByTestId('layer-card').count()).toBe(10);

    const reorder: { commit: number; longestFrame: number }[] = [];
    const edit: { commit: number; longestFrame: number }[] = [];
    for (let round = 0; round < 8; round++) {
      const card = round % 2 === 0 ? 0 : 1;
      await page.getByTestId('layer-card').nth(card).getByTestId('drag-handle').focus();
      const before = await ids(page);
      await page.keyboard.press('Space');
      await page.waitForTimeout(80);
      await page.keyboard.press(round % 2 === 0 ? 'ArrowDown' : 'ArrowUp');
      await page.waitForTimeout(150);
      reorder.push(await timed(page, 'key', 'Space'));
      await expect.poll(() => ids(page)).not.toEqual(before);
    }
    const thickness = page.getByTestId('layer-card').nth(3).locator('input[data-field="thickness"]');
    await thickness.focus();
    // the figure changes with each value (R of the layer), so each edit is seen committing
    for (let round = 0; round < 10; round++) {
      edit.push(await timed(page, 'input', String(140 + round)));
      await page.waitForTimeout(150);
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const line = (xs: { commit: number; longestFrame: number }[]) =>
      `commit median ${median(xs.map((x) => x.commit)).toFixed(1)} ms (max ${Math.max(...xs.map((x) => x.commit)).toFixed(1)}), ` +
      `longest frame around it median ${median(xs.map((x) => x.longestFrame)).toFixed(1)} ms (max ${Math.max(...xs.map((x) => x.longestFrame)).toFixed(1)})`;
    // the figures for the report
    console.log(`[with-climate-again] 10 layers, reorder by keyboard drop: ${line(reorder)}`);
    console.log(`[with-climate-again] 10 layers, thickness edit: ${line(edit)}`);
    // a generous sanity bound only (a loaded shared machine); the real measure is the logged one
    
    
    expect(await thickness.inputValue()).toBe('149');
    expect(errors).toEqual([]);
    await context.close();
  });

});
