// the home page's next step: sign in or make an account when signed out, the jobs when signed in
import { describe, it, expect } from 'vitest';
import { useBrowser, openPage, screenshot } from '../support/browser';

const browser = useBrowser();

describe('the next step on the home page', () => {
  it('offers Sign in and Create an account when signed out, with the demo sign-ins while the demo team exists', async () => {
    const { page, context, errors } = await openPage(browser());
    await page.goto('/');
    const next = page.getByTestId('home-next');
    await expect(next.getByRole('link', { name: 'Sign in' }).getAttribute('href')).resolves.toBe('/signin');
    await expect(next.getByRole('link', { name: 'Create an account' }).getAttribute('href')).resolves.toBe('/signup');
    // the test stack seeds the demo team: its three sign-ins are listed with the password
    const demo = next.getByTestId('demo-sign-ins');
    await expect(demo.textContent()).resolves.toMatch(/password wallpulse-demo/);
    for (const email of ['noor@demo.wallpulse.test', 'tomas@demo.wallpulse.test', 'ingrid@demo.wallpulse.test']) await expect(demo.textContent()).resolves.toContain(email);
    await expect(next.getByRole('link', { name: 'Open your jobs' }).count()).resolves.toBe(0);
    await next.getByRole('link', { name: 'Create an account' }).click();
    await page.waitForURL(/\/signup$/);
    await screenshot(page, 'home-next-signup');
    await page.goto('/');
    await screenshot(page, 'home-signed-out');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('offers Open your jobs when signed in, and leads there', async () => {
    const { page, context, errors } = await openPage(browser(), { userId: 'demo-engineer' });
    await page.goto('/');
    const next = page.getByTestId('home-next');
    await expect(next.getByRole('link', { name: 'Sign in' }).count()).resolves.toBe(0);
    await expect(next.getByRole('link', { name: 'Create an account' }).count()).resolves.toBe(0);
    await screenshot(page, 'home-signed-in');
    await next.getByRole('link', { name: 'Open your jobs' }).click();
    await page.waitForURL(/\/jobs/);
    expect(errors).toEqual([]);
    await context.close();
  });
});
