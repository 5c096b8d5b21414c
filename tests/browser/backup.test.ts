// the backup round trip as a person does it in Chromium: "Download backup" on a job's page,
// then "Restore a job from a backup file" on the Jobs page of another team: a wrong file is
// refused with a message naming what is wrong, the right one becomes a new job with the same
// assemblies, linked from the success message.
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { ARTIFACTS, useBrowser, openPage, outsideRequests, screenshot } from '../support/browser';
import { DEMO, call, demoTeamId, ensureMember, makeTeam, smallDocument, uid } from '../system/teamFixtures';

const browser = useBrowser();

describe('job backup, in the browser', () => {
  it('downloads a job’s backup and restores it into another team, refusing a wrong file first', async () => {
    const tag = uid();
    const teamId = await demoTeamId();
    const job = (await (await call('POST', '/api/jobs', { userId: DEMO.engineer, body: { teamId, name: `Harrow Lane porch ${tag}`, client: 'Harrow Lane trust' } })).json()).job;
    const made = (await (await call('POST', `/api/jobs/${job.id}/assemblies`, { userId: DEMO.engineer, body: { name: 'Porch wall, brick', element: 'wall' } })).json()) as {
      assembly: { id: number };
      revision: { id: number };
    };
    await call('POST', `/api/assemblies/${made.assembly.id}/revisions`, { userId: DEMO.engineer, body: { baseRevisionId: made.revision.id, model: smallDocument(0.215), note: 'As surveyed' } });
    await call('POST', `/api/jobs/${job.id}/assemblies`, { userId: DEMO.engineer, body: { name: 'Porch roof', element: 'roof' } });

    // 1. the engineer downloads the backup from the job's page
    const { page, requests, errors } = await openPage(browser(), { userId: DEMO.engineer });
    await page.goto(`/jobs/${job.id}`);
    await page.getByTestId('assemblies-table').getByText('Porch wall, brick').waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download backup' }).click()]);
    expect(download.suggestedFilename()).toMatch(new RegExp(`^wallpulse-job-harrow-lane-porch-${tag}-\\d{4}-\\d{2}-\\d{2}\\.json$`));
    const saved = path.join(ARTIFACTS, download.suggestedFilename());
    await download.saveAs(saved);
    const text = readFileSync(saved, 'utf8');
    const file = JSON.parse(text);
    expect(file).toMatchObject({ format: 'wallpulse-job-backup', version: 1 });
    expect(file.assemblies.map((a: { name: string }) => a.name)).toEqual(['Porch wall, brick', 'Porch roof']);

    // 2. in another team, the Jobs page restores it
    const otherTeam = await makeTeam(`Porch partners ${tag}`);
    await ensureMember(otherTeam, DEMO.engineer, 'engineer');
    await page.goto(`/jobs?team=${otherTeam}`);
    await page.getByRole('button', { name: 'Restore a job from a backup file' }).click();
    const form = page.getByRole('form', { name: 'Restore a job from a backup file' });
    await form.getByRole('button', { name: 'Restore job' }).click();
    await form.getByText('Choose a backup file (.json) first.').waitFor();

    // a file of a later version is refused, naming the version
    await form.getByLabel('Backup file').setInputFiles({ name: 'later.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify({ ...file, version: 3 })) });
    await form.getByRole('button', { name: 'Restore job' }).click();
    const refused = form.getByTestId('restore-error');
    await refused.waitFor();
    expect(await refused.textContent()).toMatch(/format version 3; this Wallpulse restores version 1; nothing was restored/);
    // a document that fails the schema: the message names the field and its unit
    const bad = structuredClone(file);
    bad.assemblies[0].revisions[1].model.layers[0].thickness = 0;
    await form.getByLabel('Backup file').setInputFiles({ name: 'bad.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(bad)) });
    await form.getByRole('button', { name: 'Restore job' }).click();
    await form.getByText(/assembly 1, revision 2, layer 1: thickness must be greater than 0 m/).waitFor();
    await screenshot(page, 'backup-restore-refused');
    await expect(page.getByTestId('jobs-table').getByText(`Harrow Lane porch ${tag}`).count()).resolves.toBe(0);

    // the downloaded file itself goes in, with progress and a link to the new job
    await form.getByLabel('Backup file').setInputFiles(saved);
    await form.getByRole('button', { name: 'Restore job' }).click();
    const done = form.getByTestId('restore-done');
    await done.waitFor();
    expect(await done.textContent()).toMatch(/Restored Harrow Lane porch .*: 2 assemblies, 3 revisions, 0 runs, 0 comments, 0 uploaded series\./);
    await screenshot(page, 'backup-restore-done');
    await done.getByRole('link', { name: `Harrow Lane porch ${tag}` }).click();
    await page.waitForURL(/\/jobs\/\d+$/);
    const newJob = Number(new URL(page.url()).pathname.split('/').pop());
    expect(newJob).not.toBe(job.id);
    await page.getByTestId('assemblies-table').getByText('Porch wall, brick').waitFor();
    await page.getByTestId('assemblies-table').getByText('Porch roof').waitFor();
    // the restored wall's newest revision is its saved revision 2
    await expect(page.getByTestId('assemblies-table').getByRole('row', { name: /Porch wall, brick/ }).textContent()).resolves.toMatch(/R2/);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(`Harrow Lane porch ${tag}`);
    await screenshot(page, 'backup-restored-job');

    // the restored job's own backup holds the same assemblies and documents
    const again = await (await call('GET', `/api/jobs/${newJob}/export`, { userId: DEMO.engineer })).json();
    expect(again.assemblies.map((a: { revisions: { model: unknown }[] }) => a.revisions.map((r) => JSON.stringify(r.model)))).toEqual(
      file.assemblies.map((a: { revisions: { model: unknown }[] }) => a.revisions.map((r) => JSON.stringify(r.model))),
    );
    expect(outsideRequests(requests)).toEqual([]);
    // the refused files answer 422, which Chromium logs as a failed resource; nothing else may fail
    expect(errors.filter((e) => !/status of 422/.test(e))).toEqual([]);
  });
});
