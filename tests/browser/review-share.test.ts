// the user's story in Chromium: an admin invites a checker by e-mail, the checker accepts,
// comments and marks the engineer's revision checked, the engineer issues and shares it,
// and a signed-out browser opens the link and sees the same figures.
import { describe, it, expect } from 'vitest';
import { baseUrl, useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { lastMailTo } from '../support/db';
import { DEMO, call, demoTeamId, smallDocument, uid } from '../system/teamFixtures';

const browser = useBrowser();

describe('check and share, in the browser', () => {
  it('goes from invitation to a checked, issued and shared revision that a guest opens', async () => {
    const teamId = await demoTeamId();
    const tag = uid();
    const checkerEmail = `checker-${tag}@example.test`;

    // the engineer's saved work: a job, an assembly, a saved revision 2 on top of the default
    const job = await (await call('POST', '/api/jobs', { userId: DEMO.engineer, body: { teamId, name: `Harrow Lane annex ${tag}` } })).json();
    const made = await (await call('POST', `/api/jobs/${job.job.id}/assemblies`, { userId: DEMO.engineer, body: { name: 'North wall, option A', element: 'wall' } })).json();
    const saved = await call('POST', `/api/assemblies/${made.assembly.id}/revisions`, {
      userId: DEMO.engineer,
      body: { baseRevisionId: made.revision.id, model: smallDocument(0.215), note: 'Solid brick as surveyed' },
    });
    expect(saved.status).toBe(201);
    const historyUrl = `/assemblies/${made.assembly.id}/history`;

    // 1. the admin invites a checker from the Team screen
    const admin = await openPage(browser(), { userId: DEMO.admin });
    await admin.page.goto('/team');
    const inviteForm = admin.page.getByRole('form', { name: 'Invite by e-mail' });
    await inviteForm.getByRole('textbox', { name: 'E-mail' }).fill(checkerEmail);
    await inviteForm.getByLabel('Role').selectOption('checker');
    await inviteForm.getByRole('button', { name: 'Send invitation' }).click();
    await admin.page.getByText(`Invitation sent to ${checkerEmail}`).waitFor();
    await admin.page.getByTestId('invitations-table').getByText(checkerEmail).waitFor();
    await screenshot(admin.page, 'team-invited');

    // 2. the checker opens the mailed link in their own browser and makes an account
    const mail = await lastMailTo(checkerEmail);
    const inviteLink = mail.textBody.match(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/)![0];
    // the link names the address the app runs at (PUBLIC_BASE_URL, read when the server starts)
    expect(inviteLink.startsWith(`${baseUrl()}/invite/`)).toBe(true);
    const checker = await openPage(browser());
    await checker.page.goto(inviteLink);
    await checker.page.getByLabel('Name').fill('Ines Varga');
    await checker.page.getByLabel('Password').fill('a checker passphrase');
    await checker.page.getByRole('button', { name: 'Create account and join' }).click();
    await checker.page.waitForURL(/\/jobs\?team=\d+&joined=1/);
    await checker.page.getByText('Welcome to Calder Row Envelope Studio').waitFor();
    await expect(checker.page.getByTestId('my-role').textContent()).resolves.toContain('checker');

    // 3. the engineer signs in through the form and sends revision 2 to check
    const engineer = await openPage(browser());
    await engineer.page.goto(`/signin?next=${encodeURIComponent(historyUrl)}`);
    await engineer.page.getByRole('textbox', { name: 'E-mail' }).fill('tomas@demo.wallpulse.test');
    await engineer.page.getByLabel('Password').fill('wallpulse-demo');
    await engineer.page.getByRole('button', { name: 'Sign in' }).click();
    await engineer.page.waitForURL(new RegExp(`${historyUrl}`));
    const detailE = engineer.page.getByTestId('revision-detail');
    await detailE.getByRole('heading', { name: /Revision 2/ }).waitFor();
    await detailE.getByRole('button', { name: 'Send to check' }).click();
    await detailE.locator('[data-state="in_check"]').first().waitFor();

    // 4. the checker comments and marks it checked
    await checker.page.goto(historyUrl);
    const detailC = checker.page.getByTestId('revision-detail');
    await detailC.getByRole('heading', { name: /Revision 2/ }).waitFor();
    await detailC.getByPlaceholder('Write a comment on this revision').fill('Brick conductivity agrees with the survey.');
    await detailC.getByRole('button', { name: 'Add comment' }).click();
    await detailC.getByTestId('comments').getByText('Brick conductivity agrees with the survey.').waitFor();
    await detailC.getByRole('button', { name: 'Mark checked' }).click();
    await detailC.getByTestId('history').getByText('In check → Checked').waitFor();
    await expect(detailC.getByTestId('history').textContent()).resolves.toContain('by Ines Varga');
    await screenshot(checker.page, 'history-checked');

    // 5. the engineer issues it and makes a share link
    await engineer.page.reload();
    await detailE.getByRole('button', { name: 'Issue' }).click();
    await detailE.getByTestId('history').getByText('Checked → Issued').waitFor();
    await detailE.getByLabel('Label').fill(`for the architect ${tag}`);
    await detailE.getByRole('button', { name: 'Make a share link' }).click();
    const shareUrl = await detailE.getByTestId('share-url').inputValue();
    expect(shareUrl).toMatch(/\/s\/[A-Za-z0-9_-]{43}$/);
    await screenshot(engineer.page, 'history-issued-shared');

    // 6. a third, signed-out browser opens the link: the same build-up and figures, read-only
    const guest = await openPage(browser());
    const res = await guest.page.goto(new URL(shareUrl).pathname);
    expect(res?.status()).toBe(200);
    await guest.page.getByTestId('shared-view').waitFor();
    // ISO 6946: U = 1 / (R_se + d/λ + R_si) = 1 / (0.04 + 0.215/0.77 + 0.13)
    const expectedU = 1 / (0.04 + 0.215 / 0.77 + 0.13);
    await expect(guest.page.getByTestId('shared-u').textContent()).resolves.toContain(expectedU.toFixed(3));
    await expect(guest.page.getByTestId('shared-layers').textContent()).resolves.toContain('215.0');
    await expect(guest.page.getByTestId('caution').textContent()).resolves.toMatch(/qualified professional/);
    // the playback runs the revision in the guest's browser, with nothing fetched from the team
    await guest.page.getByTestId('shared-playback').scrollIntoViewIfNeeded();
    await guest.page.getByTestId('run-state').waitFor({ timeout: 20_000 });
    expect(guest.requests.filter((u) => u.includes('/api/'))).toEqual([]);
    const html = await guest.page.content();
    expect(html).not.toContain('Tomas Reyes');
    expect(html).not.toContain('Ines Varga');
    await expect(guest.page.getByRole('link', { name: 'Jobs' }).count()).resolves.toBe(0);
    await screenshot(guest.page, 'shared-view');

    // 7. the Team screen lists the link with its opening
    await admin.page.reload();
    const shares = admin.page.getByTestId('shares-table');
    const row = shares.getByRole('row').filter({ hasText: `for the architect ${tag}` });
    await row.waitFor();
    await expect(row.textContent()).resolves.not.toContain('not yet');
    await expect(row.textContent()).resolves.toContain('active');
    await admin.page.getByTestId('audit-table').getByText('Share link opened').first().waitFor();
    await screenshot(admin.page, 'team-audit');

    for (const p of [admin, checker, engineer, guest]) {
      expect(outsideRequests(p.requests)).toEqual([]);
      expect(p.errors).toEqual([]);
      await p.context.close();
    }
  });
});
