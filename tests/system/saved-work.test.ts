// jobs → assemblies → revisions → runs, the stale-save guard, the check workflow and share links
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { and, count, eq } from 'drizzle-orm';
import { closeTestDb, testDb } from '../support/db';
import { auditLog, revisions, shareLinks } from '../../src/lib/server/db/schema';
import { hashToken } from '../../src/lib/server/tokens';
import { DEMO, call, demoTeamId, makeAssembly, makeJob, makeRevision, makeShare, smallDocument, uid } from './teamFixtures';
import { packRun, toBase64, unpackRun } from '../../src/lib/workbench/keptRun';
import { runDocument, type RunDone } from '../../src/lib/workbench/runDocument';

let teamId: number;
beforeAll(async () => {
  teamId = await demoTeamId();
});
afterAll(closeTestDb);

const revisionCount = async (assemblyId: number) =>
  (await testDb().select({ n: count() }).from(revisions).where(eq(revisions.assemblyId, assemblyId)))[0].n;

describe('jobs', () => {
  it('names the field when a job has no name', async () => {
    const res = await call('POST', '/api/jobs', { userId: DEMO.engineer, body: { teamId, name: '   ', reference: 'x'.repeat(61) } });
    expect(res.status).toBe(422);
    const { error } = await res.json();
    expect(error.fields.name).toBe('Job name must not be empty');
    expect(error.fields.reference).toMatch(/at most 60/);
  });

  it('lists jobs a page at a time, sorted and filtered on the server', async () => {
    const tag = uid();
    for (const name of ['Beta', 'Alpha', 'Gamma']) {
      expect((await call('POST', '/api/jobs', { userId: DEMO.engineer, body: { teamId, name: `${name} ${tag}`, client: `Client ${tag}` } })).status).toBe(201);
    }
    const page1 = await (await call('GET', `/api/jobs?teamId=${teamId}&q=${tag}&sort=name&pageSize=2&page=1`, { userId: DEMO.checker })).json();
    expect(page1.total).toBe(3);
    expect(page1.items.map((j: { name: string }) => j.name)).toEqual([`Alpha ${tag}`, `Beta ${tag}`]);
    const page2 = await (await call('GET', `/api/jobs?teamId=${teamId}&q=${tag}&sort=name&pageSize=2&page=2`, { userId: DEMO.checker })).json();
    expect(page2.items.map((j: { name: string }) => j.name)).toEqual([`Gamma ${tag}`]);
    const desc = await (await call('GET', `/api/jobs?teamId=${teamId}&q=${tag}&sort=-name`, { userId: DEMO.checker })).json();
    expect(desc.items[0].name).toBe(`Gamma ${tag}`);
    const bad = await call('GET', `/api/jobs?teamId=${teamId}&sort=password&pageSize=1000`, { userId: DEMO.checker });
    expect(bad.status).toBe(422);
    const fields = (await bad.json()).error.fields;
    expect(fields.sort).toMatch(/sort must be one of/);
    expect(fields.pageSize).toMatch(/at most 100/);
  });
});

describe('assemblies', () => {
  it('starts a new assembly at revision 1 with the ISO 6946 inside surface resistance of its element', async () => {
    const jobId = await makeJob(teamId);
    // ISO 6946 conventional surface resistances: R_si 0.13 (horizontal), 0.10 (upward), 0.17 (downward) m²K/W; R_se 0.04
    const expected = { wall: [0.13, 'horizontal'], roof: [0.1, 'upward'], floor: [0.17, 'downward'] } as const;
    for (const element of ['wall', 'roof', 'floor'] as const) {
      const res = await call('POST', `/api/jobs/${jobId}/assemblies`, { userId: DEMO.engineer, body: { name: `${element} ${uid()}`, element } });
      expect(res.status).toBe(201);
      const { assembly } = await res.json();
      const got = await (await call('GET', `/api/assemblies/${assembly.id}`, { userId: DEMO.engineer })).json();
      expect(got.assembly).toMatchObject({ element, jobId, teamId });
      expect(got.head).toMatchObject({ number: 1, state: 'draft', authorName: 'Tomas Reyes' });
      expect(got.head.model.exposure.insideSurfaceResistance).toBe(expected[element][0]);
      expect(got.head.model.exposure.heatFlowDirection).toBe(expected[element][1]);
      expect(got.head.model.exposure.outsideSurfaceResistance).toBe(0.04);
      expect(got.head.model.layers.length).toBeGreaterThanOrEqual(3);
      expect(got.role).toBe('engineer');
    }
    const bad = await call('POST', `/api/jobs/${jobId}/assemblies`, { userId: DEMO.engineer, body: { name: 'x', element: 'window' } });
    expect((await bad.json()).error.fields.element).toMatch(/wall, roof or floor/);
  });
});

describe('saving revisions', () => {
  it('saves on top of the newest revision, and answers a stale base with 409 and the newest revision, writing nothing', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const first = await makeRevision(assemblyId);
    const ok = await call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.engineer, body: { baseRevisionId: first, model: smallDocument(0.25), note: 'thicker brick' } });
    expect(ok.status).toBe(201);
    const { revision } = await ok.json();
    expect(revision).toMatchObject({ number: 2, state: 'draft' });

    // someone else still has revision 1 open
    const before = await revisionCount(assemblyId);
    const stale = await call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.admin, body: { baseRevisionId: first, model: smallDocument(0.3), note: 'mine' } });
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.error.code).toBe('stale');
    expect(body.error.message).toMatch(/^Revision 2 was saved by Tomas Reyes at .+ after you opened this one\.$/);
    expect(body.head).toMatchObject({ id: revision.id, number: 2, authorName: 'Tomas Reyes' });
    expect(body.head.model.layers[0].thickness).toBe(0.25);
    expect(await revisionCount(assemblyId)).toBe(before);

    // "save on top": resend with the newest as the base
    const onTop = await call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.admin, body: { baseRevisionId: body.head.id, model: smallDocument(0.3), note: 'mine' } });
    expect(onTop.status).toBe(201);
    expect((await onTop.json()).revision.number).toBe(3);
    const list = await (await call('GET', `/api/assemblies/${assemblyId}/revisions?sort=-number`, { userId: DEMO.checker })).json();
    expect(list.items.map((r: { number: number; authorName: string }) => [r.number, r.authorName])).toEqual([
      [3, 'Noor Haddad'],
      [2, 'Tomas Reyes'],
      [1, 'Tomas Reyes'],
    ]);
  });

  it('lets exactly one of two saves from the same base through', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const base = await makeRevision(assemblyId);
    const body = { baseRevisionId: base, model: smallDocument(), note: 'race' };
    const results = await Promise.all([
      call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.engineer, body }),
      call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.admin, body }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(await revisionCount(assemblyId)).toBe(2);
  });

  it('refuses a document that is not valid, naming the layer field, and has no way to change a saved one', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const base = await makeRevision(assemblyId);
    const doc = smallDocument();
    (doc.layers[0] as { thickness: number }).thickness = -0.1;
    const res = await call('POST', `/api/assemblies/${assemblyId}/revisions`, { userId: DEMO.engineer, body: { baseRevisionId: base, model: doc, note: '' } });
    expect(res.status).toBe(422);
    expect((await res.json()).error.fields['model.layers[0].thickness']).toBe('must be greater than 0 m');
    const patch = await call('PATCH', `/api/revisions/${base}`, { userId: DEMO.engineer, body: { model: smallDocument(0.5) } });
    expect([404, 405]).toContain(patch.status);
  });
});

describe('check workflow', () => {
  it('moves draft → in check → sent back → in check → checked → issued, keeping who, when and why', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const id = await makeRevision(assemblyId);
    const t = (userId: string, to: string, note?: string) => call('POST', `/api/revisions/${id}/transitions`, { userId, body: { to, note } });
    expect((await t(DEMO.engineer, 'in_check')).status).toBe(201);
    const noNote = await t(DEMO.checker, 'sent_back');
    expect(noNote.status).toBe(422);
    expect((await noNote.json()).error.fields.note).toMatch(/required/);
    expect((await t(DEMO.checker, 'sent_back', 'The plaster conductivity looks high.')).status).toBe(201);
    expect((await t(DEMO.engineer, 'in_check', 'Plaster corrected.')).status).toBe(201);
    expect((await call('POST', `/api/revisions/${id}/comments`, { userId: DEMO.checker, body: { body: 'Agreed with the U-value.' } })).status).toBe(201);
    expect((await t(DEMO.checker, 'checked')).status).toBe(201);
    const early = await t(DEMO.engineer, 'checked');
    expect(early.status).toBe(403);
    expect((await t(DEMO.engineer, 'issued')).status).toBe(201);
    const frozen = await t(DEMO.engineer, 'in_check');
    expect(frozen.status).toBe(409);
    expect((await frozen.json()).error.message).toMatch(/Revision \d+ is issued/);

    const detail = await (await call('GET', `/api/revisions/${id}`, { userId: DEMO.checker })).json();
    expect(detail.revision.state).toBe('issued');
    expect(detail.events.map((e: { fromState: string | null; toState: string; actorName: string }) => [e.fromState, e.toState, e.actorName])).toEqual([
      [null, 'draft', 'Tomas Reyes'],
      ['draft', 'in_check', 'Tomas Reyes'],
      ['in_check', 'sent_back', 'Ingrid Solberg'],
      ['sent_back', 'in_check', 'Tomas Reyes'],
      ['in_check', 'checked', 'Ingrid Solberg'],
      ['checked', 'issued', 'Tomas Reyes'],
    ]);
    expect(detail.events[2].note).toBe('The plaster conductivity looks high.');
    expect(detail.comments.map((c: { body: string; authorName: string }) => [c.body, c.authorName])).toEqual([['Agreed with the U-value.', 'Ingrid Solberg']]);
    expect(detail.moves).toEqual([]);
  });

  it('keeps runs with their summary, and the run packed only when sent, given back as the same bytes', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const id = await makeRevision(assemblyId);
    const doc = smallDocument();
    const run = runDocument(doc) as RunDone;
    const packed = packRun(run);
    const res = await call('POST', `/api/revisions/${id}/runs`, { userId: DEMO.engineer, body: { exposure: doc.exposure, summary: { uValue: 1.92, timeLagHours: 6.1, label: 'base case', peak: null }, packed: toBase64(packed) } });
    expect(res.status).toBe(201);
    const { run: kept } = await res.json();
    const figuresOnly = await call('POST', `/api/revisions/${id}/runs`, { userId: DEMO.engineer, body: { exposure: doc.exposure, summary: { uValue: 1.92 } } });
    expect(figuresOnly.status).toBe(201);
    const list = await (await call('GET', `/api/revisions/${id}/runs`, { userId: DEMO.checker })).json();
    expect(list.items.map((r: { hasSeries: boolean }) => r.hasSeries)).toEqual([false, true]);
    expect(list.items[1]).toMatchObject({ id: kept.id, summary: { uValue: 1.92, timeLagHours: 6.1, label: 'base case', peak: null }, hasSeries: true, packedBytes: packed.length });
    const bytes = await call('GET', `/api/runs/${kept.id}/packed`, { userId: DEMO.checker });
    expect(bytes.headers.get('content-type')).toBe('application/octet-stream');
    const back = new Uint8Array(await bytes.arrayBuffer());
    expect(back).toEqual(packed);
    expect(unpackRun(back).figures).toEqual(run.figures);
    expect((await call('GET', `/api/runs/${JSON.parse(await figuresOnly.text()).run.id}/packed`, { userId: DEMO.checker })).status).toBe(404);
    const bad = await call('POST', `/api/revisions/${id}/runs`, { userId: DEMO.engineer, body: { exposure: {}, summary: { uValue: 'x'.repeat(300) } } });
    expect(bad.status).toBe(422);
    // bytes that are not a packed run are refused with the field named
    const junk = await call('POST', `/api/revisions/${id}/runs`, { userId: DEMO.engineer, body: { exposure: doc.exposure, summary: {}, packed: toBase64(new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8, 9])) } });
    expect(junk.status).toBe(422);
    expect((await junk.json()).error.fields.packed).toMatch(/^The packed run cannot be read: not a packed run/);
  });
});

describe('share links', () => {
  it('shares only an issued revision, and says so', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const id = await makeRevision(assemblyId, 'checked');
    const res = await call('POST', `/api/revisions/${id}/shares`, { userId: DEMO.engineer, body: {} });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/Only an issued revision can be shared/);
  });

  it('keeps only the sha256 of a 256-bit token, shows the guest that revision alone, counts the openings, and stops on revoke', async () => {
    const jobId = await makeJob(teamId, `Shared job ${uid()}`);
    const assemblyId = await makeAssembly(jobId, 'Shared wall');
    const id = await makeRevision(assemblyId, 'issued');
    // a layer taken from the team's library names the material's id; the guest does not see it
    await testDb()
      .update(revisions)
      .set({ model: { ...smallDocument(), layers: [{ ...smallDocument().layers[0], materialRef: 'team:41' }] } })
      .where(eq(revisions.id, id));
    const made = await call('POST', `/api/revisions/${id}/shares`, { userId: DEMO.engineer, body: { label: 'for the architect', expiresInDays: 14 } });
    expect(made.status).toBe(201);
    const { share } = await made.json();
    const token = new URL(share.url).pathname.split('/').pop()!;
    expect(Buffer.from(token, 'base64url').length).toBe(32);
    const [row] = await testDb().select().from(shareLinks).where(eq(shareLinks.id, share.id));
    expect(row.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);

    const guest = await call('GET', `/api/shared/${token}`);
    expect(guest.status).toBe(200);
    const shared = await guest.json();
    expect(Object.keys(shared).sort()).toEqual(['assembly', 'job', 'revision', 'runs']);
    expect(shared.assembly).toEqual({ name: 'Shared wall', element: 'wall' });
    expect(Object.keys(shared.job)).toEqual(['name']);
    expect(Object.keys(shared.revision).sort()).toEqual(['createdAt', 'model', 'number', 'state']);
    expect(shared.revision.model.layers[0]).toMatchObject({ name: 'Brick', thickness: 0.2, materialRef: null });
    // nothing of the team: no people, no ids, no other assemblies
    const text = JSON.stringify(shared);
    for (const secret of ['Tomas', 'demo-engineer', 'Calder Row', 'teamId', 'authorId', 'team:']) expect(text).not.toContain(secret);

    const page = await call('GET', `/s/${token}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Shared wall');
    expect(html).not.toContain('Tomas Reyes');
    const [opened] = await testDb().select().from(shareLinks).where(eq(shareLinks.id, share.id));
    expect(opened.openCount).toBe(2);
    expect(opened.lastOpenedAt).not.toBeNull();
    const listed = await (await call('GET', `/api/teams/${teamId}/shares?q=${encodeURIComponent('for the architect')}&sort=-createdAt`, { userId: DEMO.checker })).json();
    expect(listed.items.find((s: { id: number }) => s.id === share.id)).toMatchObject({ openCount: 2, status: 'active', label: 'for the architect' });

    expect((await call('POST', `/api/shares/${share.id}/revoke`, { userId: DEMO.engineer })).status).toBe(200);
    const gone = await call('GET', `/api/shared/${token}`);
    expect(gone.status).toBe(410);
    const gonePage = await call('GET', `/s/${token}`);
    expect(gonePage.status).toBe(410);
    expect(await gonePage.text()).toContain('This link was withdrawn');

    const actions = await testDb()
      .select({ action: auditLog.action })
      .from(auditLog)
      .where(and(eq(auditLog.teamId, teamId), eq(auditLog.target, `share:${share.id}`)))
      .orderBy(auditLog.id);
    expect(actions.map((a) => a.action)).toEqual(['share_created', 'share_opened', 'share_opened', 'share_revoked']);
    const log = await (await call('GET', `/api/audit?teamId=${teamId}&q=share:${share.id}`, { userId: DEMO.admin })).json();
    expect(log.total).toBe(4);
    expect(log.items[0].targetText).toBe('“for the architect”, Shared wall R1');
  });

  it('shows a clear page for an expired link and for one that never existed', async () => {
    const assemblyId = await makeAssembly(await makeJob(teamId));
    const id = await makeRevision(assemblyId, 'issued');
    const { token } = await makeShare(id, { expiresAt: new Date(Date.now() - 1000) });
    const expired = await call('GET', `/s/${token}`);
    expect(expired.status).toBe(410);
    expect(await expired.text()).toContain('This link has expired');
    const unknown = await call('GET', `/s/${'z'.repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(await unknown.text()).toContain('This link does not work');
  });
});
