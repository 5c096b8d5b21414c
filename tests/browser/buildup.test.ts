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

describe('build-up pane', () => {
  it('reorders by mouse and keyboard with the U-value unchanged and the time lag moving, adds from the library, names a bad field, and undoes it all', async () => {
    const id = await demoAssembly('West wall, brick with external insulation');
    const { page, context, requests, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${id}`);
    await page.getByTestId('layer-card').first().waitFor();
    expect(await names(page)).toEqual([RENDER, WOOL, BRICK, PLASTER]);
    const u0 = await figure(page, 'fig-u');
    const lag0 = await figure(page, 'fig-lag');
    const f0 = await figure(page, 'fig-decrement');
    expect(Number(u0)).toBeGreaterThan(0);
    // ISO 13786 for heavy masonry behind outside insulation: a lag of many hours and a small decrement (common practice: lag > 8 h, f < 0.3)
    expect(Number(lag0)).toBeGreaterThan(8);
    expect(Number(f0)).toBeLessThan(0.3);

    // mouse: drag the insulation from outside the brick to inside it
    const handle = page.getByTestId('layer-card').nth(1).getByTestId('drag-handle');
    const from = (await handle.boundingBox())!;
    const target = (await page.getByTestId('layer-card').nth(2).boundingBox())!;
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await page.mouse.down();
    for (let i = 1; i <= 12; i++) {
      await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2 + ((target.y + target.height * 0.8 - from.y - from.height / 2) * i) / 12);
    }
    await page.mouse.up();
    await expect.poll(() => names(page)).toEqual([RENDER, BRICK, WOOL, PLASTER]);
    // series resistances do not depend on their order (ISO 6946: the total resistance is the sum of the layer resistances); the periodic response does (ISO 13786)
    expect(await figure(page, 'fig-u')).toBe(u0);
    const lag1 = await figure(page, 'fig-lag');
    expect(lag1).not.toBe(lag0);
    expect(await figure(page, 'fig-decrement')).not.toBe(f0);
    expect(await page.getByTestId('unsaved').isVisible()).toBe(true);

    // keyboard: pick the insulation up, move it one place towards the outside, drop it
    await page.getByTestId('layer-card').nth(2).getByTestId('drag-handle').focus();
    // dnd-kit's keyboard sensor listens for the next keys a moment after it picks a card up
    await page.keyboard.press('Space');
    await page.waitForTimeout(80);
    await page.keyboard.press('ArrowUp');
    await page.waitForTimeout(80);
    await page.keyboard.press('Space');
    await expect.poll(() => names(page)).toEqual([RENDER, WOOL, BRICK, PLASTER]);
    await expect
      .poll(() => page.locator('[id^="DndLiveRegion"]').first().textContent())
      .toBe(`Moved ${WOOL} to position 2 of 4.`);
    expect(await figure(page, 'fig-u')).toBe(u0);
    expect(await figure(page, 'fig-lag')).toBe(lag0);
    expect(await figure(page, 'fig-lag')).not.toBe(lag1);

    // add a layer from the library, found by searching, with the keyboard
    await page.getByTestId('add-layer').click();
    const picker = page.getByTestId('material-picker');
    await picker.getByRole('searchbox').fill('plasterboard');
    await expect.poll(() => picker.getByRole('listbox').getByRole('option').first().textContent()).toContain('Gypsum plasterboard');
    await page.keyboard.press('Enter');
    await picker.waitFor({ state: 'detached' });
    expect(await names(page)).toEqual([RENDER, WOOL, BRICK, PLASTER, 'Gypsum plasterboard (700 kg/m³)']);
    const u2 = await figure(page, 'fig-u');
    expect(Number(u2)).toBeLessThan(Number(u0));

    // break a field: a clear message on it, and the figures keep the last valid model
    const brickThickness = page.getByTestId('layer-card').nth(2).locator('input[data-field="thickness"]');
    await brickThickness.fill('0');
    const message = page.getByTestId('layer-card').nth(2).getByRole('alert');
    await expect.poll(() => message.textContent()).toBe('Thickness must be greater than 0 mm');
    expect(await brickThickness.getAttribute('aria-invalid')).toBe('true');
    expect(await figure(page, 'fig-u')).toBe(u2);
    await brickThickness.fill('-');
    await expect.poll(() => message.textContent()).toBe('Thickness must be a number in mm');
    await page.getByTestId('layer-card').nth(2).locator('input[data-field="conductivity"]').click();
    expect(await message.textContent()).toBe('Thickness must be a number in mm');
    await screenshot(page, 'buildup');

    // undo everything with Ctrl+Z, back to revision 1 as it was opened
    const undo = page.getByRole('button', { name: 'Undo', exact: true });
    for (let i = 0; i < 10 && (await undo.isEnabled()); i++) await page.keyboard.press('Control+z');
    expect(await undo.isEnabled()).toBe(false);
    expect(await names(page)).toEqual([RENDER, WOOL, BRICK, PLASTER]);
    expect(await figure(page, 'fig-u')).toBe(u0);
    expect(await figure(page, 'fig-lag')).toBe(lag0);
    expect(await page.getByTestId('unsaved').count()).toBe(0);
    expect(await page.getByRole('alert').filter({ hasText: 'Thickness' }).count()).toBe(0);
    // and redo brings the first move back
    await page.keyboard.press('Control+Shift+z');
    expect(await names(page)).toEqual([RENDER, BRICK, WOOL, PLASTER]);

    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('keeps reorders and field edits of ten layers within a frame or two (measured, reported by the run)', async () => {
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
    console.log(`[buildup timing] 10 layers, reorder by keyboard drop: ${line(reorder)}`);
    console.log(`[buildup timing] 10 layers, thickness edit: ${line(edit)}`);
    // a generous sanity bound only (a loaded shared machine); the real measure is the logged one
    expect(median(reorder.map((x) => x.longestFrame))).toBeLessThan(250);
    expect(median(edit.map((x) => x.longestFrame))).toBeLessThan(250);
    expect(await thickness.inputValue()).toBe('149');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('shows a signed-out visitor the sign-in page and another team’s member a 404', async () => {
    const id = await demoAssembly('Plant room, metal sandwich panel');
    const { page, context } = await openPage(browser());
    const res = await page.goto(`/assemblies/${id}`);
    expect(new URL(page.url()).pathname).toBe('/signin');
    expect(new URL(page.url()).searchParams.get('next')).toBe(`/assemblies/${id}`);
    expect(res?.status()).toBe(200);
    await context.close();

    // a member of another team: the assembly is not confirmed to exist
    const db = testDb();
    const userId = `buildup-outsider-${Date.now()}`;
    await db.insert(users).values({ id: userId, email: `${userId}@example.test`, name: 'Outside Engineer', passwordHash: 'x', emailVerifiedAt: new Date() });
    const [team] = await db.insert(teams).values({ name: `Other studio ${userId}` }).$returningId();
    await db.insert(memberships).values({ teamId: team.id, userId, role: 'engineer' });
    const cookie = `${SESSION_COOKIE}=${await sessionFor(userId)}`;
    const page404 = await fetch(`${baseUrl()}/assemblies/${id}`, { headers: { cookie }, redirect: 'manual' });
    expect(page404.status).toBe(404);
    expect(await page404.text()).not.toContain('Plant room');
    const api404 = await fetch(`${baseUrl()}/api/assemblies/${id}`, { headers: { cookie } });
    expect(api404.status).toBe(404);
  });
});

describe('saving the build-up', () => {
  it('offers unsaved work back after a reload, shows what a newer revision changed, and saves on top of it', async () => {
    // a team of its own, so the demo job stays as seeded
    const db = testDb();
    const run = Date.now().toString(36);
    const [team] = await db.insert(teams).values({ name: `Save check ${run}` }).$returningId();
    const people = [`save-eng-${run}`, `save-admin-${run}`];
    for (const [i, id] of people.entries()) {
      await db.insert(users).values({ id, email: `${id}@example.test`, name: i ? 'Second Saver' : 'First Saver', passwordHash: 'x', emailVerifiedAt: new Date() });
      await db.insert(memberships).values({ teamId: team.id, userId: id, role: i ? 'admin' : 'engineer' });
    }
    const [job] = await db.insert(jobs).values({ teamId: team.id, name: 'Save check job' }).$returningId();
    const [assembly] = await db.insert(assemblies).values({ jobId: job.id, name: 'Panel for the save check' }).$returningId();
    const panel = DEMO_ASSEMBLIES.find((a) => a.name.startsWith('Plant room'))!.doc;
    const [rev1] = await db.insert(revisions).values({ assemblyId: assembly.id, number: 1, model: panel, note: 'first', authorId: people[0] }).$returningId();

    const { page, context, errors } = await openPage(browser(), { userId: people[0] });
    await page.goto(`/assemblies/${assembly.id}`);
    await page.getByTestId('layer-card').first().waitFor();
    const outerSteel = page.getByTestId('layer-card').nth(0).locator('input[data-field="thickness"]');
    await outerSteel.fill('0.7');
    await outerSteel.blur();
    await page.waitForTimeout(600); // the draft is written a moment after the last edit

    // reload: the edit is offered back
    await page.reload();
    await page.getByRole('button', { name: 'Restore them' }).click();
    expect(await outerSteel.inputValue()).toBe('0.7');
    expect(await page.getByTestId('unsaved').isVisible()).toBe(true);

    // meanwhile a colleague saves revision 2 with a thicker core
    const theirs = structuredClone(panel);
    theirs.layers[1].thickness = 0.1;
    const cookie = `${SESSION_COOKIE}=${await sessionFor(people[1])}`;
    const saved = await fetch(`${baseUrl()}/api/assemblies/${assembly.id}/revisions`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ baseRevisionId: rev1.id, model: theirs, note: 'core to 100 mm' }),
    });
    expect(saved.status).toBe(201);

    // our save meets it: the dialog says what differs, and saving on top makes revision 3
    await page.getByTestId('save').click();
    await page.getByTestId('save-dialog').getByRole('textbox').fill('thicker outer sheet');
    await page.getByRole('button', { name: 'Save revision 2' }).click();
    const stale = page.getByTestId('stale-dialog');
    await stale.waitFor();
    const text = (await stale.textContent()) ?? '';
    expect(text).toContain('Revision 2 was saved meanwhile');
    expect(text).toContain('has a different thickness for Polyisocyanurate foam, PIR (32 kg/m³)');
    expect(text).toContain('has a different thickness for Steel (7800 kg/m³)');
    await stale.getByRole('button', { name: 'Save on top as revision 3' }).click();
    await expect.poll(() => page.getByTestId('revision-label').textContent()).toBe('Revision 3');
    expect(await page.getByTestId('unsaved').count()).toBe(0);

    const heads = await db.select().from(revisions).where(eq(revisions.assemblyId, assembly.id));
    const head = heads.sort((a, b) => b.number - a.number)[0];
    expect(head.number).toBe(3);
    expect(head.note).toBe('thicker outer sheet');
    expect((head.model as typeof panel).layers[0].thickness).toBeCloseTo(0.0007, 12);
    // nothing was lost: their revision is still there
    expect(heads.find((r) => r.number === 2)?.note).toBe('core to 100 mm');

    // after the save nothing is offered back on reload
    await page.reload();
    await page.getByTestId('layer-card').first().waitFor();
    expect(await page.getByRole('button', { name: 'Restore them' }).count()).toBe(0);
    // the browser logs the expected 409 answer as a failed resource; nothing else may fail
    expect(errors.filter((e) => !e.includes('status of 409'))).toEqual([]);
    await context.close();
  });
});
