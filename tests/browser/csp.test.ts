// every page, opened in Chromium as each role of the demo team, signed out, and as a guest at a
// share link, runs under the app's Content-Security-Policy without a single violation: the
// app's own scripts (inline ones by hash), its Web Worker and its bundled fonts, nothing else
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { demoAssembly, DEMO_HEAVY_WALL } from '../support/db';
import { DEMO, demoTeamId, headRevisionId, makeAssembly, makeJob, makeRevision, makeShare } from '../system/teamFixtures';

const browser = useBrowser();

/** record every CSP violation the page reports, from the first script on */
async function watchViolations(page: Page): Promise<string[]> {
  const violations: string[] = [];
  await page.exposeFunction('__reportCspViolation', (text: string) => violations.push(text));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __reportCspViolation(t: string): void }).__reportCspViolation(`${e.violatedDirective} blocked ${e.blockedURI || '(inline)'} at ${e.sourceFile}:${e.lineNumber} ${e.sample}`);
    });
  });
  page.on('console', (m) => {
    if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
  });
  return violations;
}

async function visit(page: Page, path: string): Promise<void> {
  const res = await page.goto(path);
  expect(res?.headers()['content-security-policy'], path).toMatch(/script-src '(self|none)'/);
  expect(res?.headers()['permissions-policy'], path).toMatch(/camera=\(\)/);
  await page.waitForLoadState('networkidle');
}

describe('the Content-Security-Policy in Chromium', () => {
  it('is never violated on any page, for any role, signed out, or as a guest', async () => {
    const teamId = await demoTeamId();
    const assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
    const jobId = await makeJob(teamId, 'Policy check job');
    const issuedAssembly = await makeAssembly(jobId, 'Policy check wall');
    const issued = await makeRevision(issuedAssembly, 'issued');
    const share = await makeShare(issued);
    const headId = await headRevisionId(assemblyId);
    void headId;

    const memberPages = ['/', '/jobs', `/jobs/${jobId}`, `/assemblies/${assemblyId}`, `/assemblies/${assemblyId}/history`, `/assemblies/${issuedAssembly}/report`, '/library', '/team'];
    const openPages = ['/', '/signin', '/signup', '/reset', `/reset/${'x'.repeat(43)}`, `/verify/${'x'.repeat(43)}`, `/invite/${'x'.repeat(43)}`, '/no-such-page'];
    const all: string[] = [];
    for (const who of [DEMO.admin, DEMO.engineer, DEMO.checker, null]) {
      const watched = await openPage(browser(), who ? { userId: who } : {});
      const violations = await watchViolations(watched.page);
      for (const path of who ? memberPages : openPages) await visit(watched.page, path);
      if (who === DEMO.engineer) {
        // the workbench's Web Worker runs the simulation: open the response and let it run
        await visit(watched.page, `/assemblies/${assemblyId}`);
        const response = watched.page.getByRole('tab', { name: /Response/ });
        if (await response.count()) {
          await response.first().click();
          await watched.page.waitForTimeout(3000);
        }
        await screenshot(watched.page, 'csp-workbench');
      }
      all.push(...violations.map((v) => `${who ?? 'signed out'}: ${v}`));
      expect(outsideRequests(watched.requests)).toEqual([]);
      await watched.context.close();
    }
    // a guest at a share link
    const guest = await openPage(browser());
    const guestViolations = await watchViolations(guest.page);
    await visit(guest.page, `/s/${share.token}`);
    await screenshot(guest.page, 'csp-shared');
    all.push(...guestViolations.map((v) => `guest: ${v}`));
    await guest.context.close();

    expect(all).toEqual([]);
  });
});
