// read-only use of the workbench: a checker runs the saved settings without changing them,
// and a guest with a share link runs the issued revision with nothing offered to keep.
import { describe, it, expect, beforeAll } from 'vitest';
import { useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL } from '../support/db';
import { DEMO, demoTeamId, makeAssembly, makeJob, makeRevision, makeShare, uid } from '../system/teamFixtures';

const browser = useBrowser();
let assemblyId: number;

beforeAll(async () => {
  assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
});

describe('the workbench for a checker', () => {
  it('shows the exposure fields read-only with a note why, and still runs and plays the saved settings', async () => {
    const { page, context, requests, errors } = await openPage(browser(), { userId: DEMO.checker });
    await page.goto(`/assemblies/${assemblyId}`);
    const exposure = page.getByTestId('exposure-pane');
    await exposure.waitFor();
    await expect(exposure.getByTestId('exposure-read-only').textContent()).resolves.toMatch(/Read only.*checker/);

    // every number field is read-only, every choice and list disabled; typing changes nothing
    const inputs = exposure.locator('input');
    const count = await inputs.count();
    expect(count).toBeGreaterThan(5);
    for (let i = 0; i < count; i++) await expect(inputs.nth(i).getAttribute('readonly')).resolves.not.toBeNull();
    for (const radio of await exposure.getByRole('radio').all()) expect(await radio.isDisabled()).toBe(true);
    for (const select of await exposure.locator('select').all()) expect(await select.isDisabled()).toBe(true);
    const mean = exposure.getByLabel('Daily mean');
    const before = await mean.inputValue();
    await mean.press('End');
    await page.keyboard.type('9');
    await expect(mean.inputValue()).resolves.toBe(before);
    await expect(exposure.getByRole('button', { name: 'ISO 6946 values' }).count()).resolves.toBe(0);
    await expect(page.getByTestId('unsaved').count()).resolves.toBe(0);

    // the run: Run and Play work; the run is the checker's own, not offered for keeping
    const pane = page.getByTestId('response-pane');
    await pane.getByTestId('figures').waitFor();
    await pane.getByTestId('run').click();
    await pane.getByTestId('run-progress').waitFor({ state: 'detached' });
    await expect(pane.getByTestId('run-origin').textContent()).resolves.toMatch(/^Computed in your browser from revision \d+; not kept$/);
    await expect(pane.getByRole('button', { name: /Keep this run/ }).count()).resolves.toBe(0);
    await expect(pane.getByText('Unsaved run').count()).resolves.toBe(0);
    const time = pane.getByTestId('playback-time');
    const startTime = await time.textContent();
    await pane.getByTestId('play').click();
    await expect.poll(() => time.textContent(), { timeout: 5000 }).not.toBe(startTime);
    await pane.getByTestId('play').click();

    await screenshot(page, 'workbench-checker');
    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('the Shared view', () => {
  it('runs the issued revision in the guest browser with no unsaved badge and no keep button', async () => {
    const teamId = await demoTeamId();
    const made = await makeAssembly(await makeJob(teamId, `Harrow Lane share ${uid()}`), 'North wall, as surveyed');
    const revisionId = await makeRevision(made, 'issued');
    const { token } = await makeShare(revisionId);

    const guest = await openPage(browser());
    const res = await guest.page.goto(`/s/${token}`);
    expect(res?.status()).toBe(200);
    await guest.page.getByTestId('shared-playback').scrollIntoViewIfNeeded();
    const state = guest.page.getByTestId('run-state');
    await state.waitFor({ timeout: 20_000 });
    await expect(state.getByTestId('run-origin').textContent()).resolves.toBe('Computed in your browser from the issued revision');
    const text = await guest.page.getByTestId('shared-view').textContent();
    expect(text).not.toMatch(/Unsaved/i);
    expect(text).not.toMatch(/Keep this run|Save the revision/);
    await expect(guest.page.getByRole('button', { name: /Keep/ }).count()).resolves.toBe(0);
    expect(guest.requests.filter((u) => u.includes('/api/'))).toEqual([]);
    await screenshot(guest.page, 'shared-view-guest');
    expect(outsideRequests(guest.requests)).toEqual([]);
    expect(guest.errors).toEqual([]);
    await guest.context.close();
  });
});
