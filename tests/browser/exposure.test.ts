// the Exposure pane's sun by place and sky: a place preset gives the irradiance on the face and the
// sky's long-wave loss, shown with their values; the run then starts periodic and reports its accuracy.
import { describe, it, expect, beforeAll } from 'vitest';
import { useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL } from '../support/db';

const browser = useBrowser();
let assemblyId: number;

beforeAll(async () => {
  assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
});

describe('the Exposure pane: sun by place and sky', () => {
  it('sets a sol-air day by place preset and face, shows the irradiance and the sky loss, and runs it to figures with an accuracy estimate', async () => {
    const { page, context, requests, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto(`/assemblies/${assemblyId}`);
    const exposure = page.getByTestId('exposure-pane');
    const pane = page.getByTestId('response-pane');
    await pane.getByTestId('figures').waitFor();

    // amplitude is typed, the swing is read beside it
    await exposure.getByLabel('Amplitude').fill('7');
    await expect.poll(() => exposure.getByTestId('swing-readout').textContent()).toMatch(/14 K/);

    await exposure.getByRole('radio', { name: 'Sol-air day' }).click();
    const preset = exposure.getByTestId('place-preset');
    await expect(preset.inputValue()).resolves.toBe('harrow-lane');
    const peak = exposure.getByTestId('irradiance-peak');
    // a west wall at Leeds in late July: the clear-day sun peaks in the late afternoon (BST)
    await expect(peak.textContent()).resolves.toMatch(/^peak \d{3} W\/m² at 1[6-9]:\d0$/);
    // ISO 13790 §11.4.6 on a wall with emissivity 0.9: 0.5 × 5 × 0.9 × 11 K = 24.75 W/m², × R_se 0.04 = 0.99 K
    await expect(exposure.getByTestId('sky-loss').textContent()).resolves.toMatch(/24\.8 W\/m².*0\.99 K/);

    const westPeak = await peak.textContent();
    await preset.selectOption('plymouth');
    await expect.poll(() => exposure.getByLabel('Latitude').inputValue()).toBe('50.37');
    await exposure.getByTestId('face-compass').selectOption('south');
    await expect.poll(() => peak.textContent()).not.toBe(westPeak);
    // a south wall peaks around solar noon: 13:00–13:40 BST at Plymouth (longitude 4.1° W)
    await expect(peak.textContent()).resolves.toMatch(/at 13:[0-4]0$/);
    // a flat roof sees the whole sky: twice the wall's loss
    await exposure.getByLabel('Tilt').fill('0');
    await expect.poll(() => exposure.getByTestId('sky-loss').textContent()).toMatch(/49\.5 W\/m²/);
    await screenshot(page, 'exposure-sun-by-place');
    await exposure.screenshot({ path: 'tests/artifacts/exposure-pane-sun.png' });

    // the run: periodic start, no warm-up, an accuracy estimate under 1 % at the default step and cells
    await expect.poll(() => pane.getByTestId('run-state').textContent(), { timeout: 10_000 }).toMatch(/Unsaved run/);
    await expect(pane.getByTestId('run').textContent()).resolves.toBe('Run 3 days');
    const accuracy = pane.locator('[data-figure="accuracyEstimate"] [data-cell="simulated"]');
    await expect.poll(async () => Number(await accuracy.textContent())).toBeLessThan(1);
    await expect(pane.locator('[data-figure="mesh"]').textContent()).resolves.toMatch(/Crank–Nicolson steps, periodic start/);
    await expect(pane.locator('[data-figure="bookkeepingClosure"]').textContent()).resolves.toMatch(/bookkeeping closure/);
    await expect(pane.getByTestId('accuracy-warning').count()).resolves.toBe(0);
    await screenshot(page, 'response-sun-by-place');

    // R_se = 0 holds the surface at the air: sun and sky no longer apply, and the pane says so
    await exposure.getByLabel('R_se').fill('0');
    await expect(exposure.getByTestId('rse-zero-warning').textContent()).resolves.toMatch(/no longer apply/);

    // the custom half sine stays
    await exposure.getByRole('radio', { name: 'Custom half sine' }).click();
    await expect(exposure.getByLabel('Peak irradiance on the face').inputValue()).resolves.toBe('550');
    expect(outsideRequests(requests)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });
});
