// a job backup file: export → import into another team → export gives the same file (but for the
// ids and the new job's own dates), every revision document byte for byte; authors who are not
// members become the importing person, named in a note; a bad or foreign file changes nothing.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { sql } from 'drizzle-orm';
import { closeTestDb, testDb } from '../support/db';
import { baseUrl } from '../support/browser';
import { DEMO, call, demoTeamId, ensureMember, makeTeam, makeUser, smallDocument, uid } from './teamFixtures';
import { MAX_BACKUP_BYTES } from '../../src/lib/schemas/backup';
import { packRun, toBase64 } from '../../src/lib/workbench/keptRun';
import { runDocument, type RunDone } from '../../src/lib/workbench/runDocument';
import { summaryOf } from '../../src/lib/workbench/figures';
import { sessionFor, SESSION_COOKIE } from '../support/db';

const TABLES = ['jobs', 'assemblies', 'revisions', 'revision_events', 'runs', 'comments', 'uploads', 'share_links', 'audit_log'] as const;

async function rows<T = Record<string, unknown>>(query: ReturnType<typeof sql>): Promise<T[]> {
  const [result] = (await testDb().execute(query)) as unknown as [T[]];
  return result;
}

async function tableCounts(): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const t of TABLES) out[t] = Number((await rows<{ n: number }>(sql`select count(*) as n from ${sql.identifier(t)}`))[0].n);
  return out;
}

/** POST the file to the import endpoint as a person */
async function restore(teamId: number, userId: string, body: string): Promise<Response> {
  return fetch(`${baseUrl()}/api/teams/${teamId}/import`, {
    method: 'POST',
    headers: { origin: new URL(baseUrl()).origin, 'content-type': 'application/json', cookie: `${SESSION_COOKIE}=${await sessionFor(userId)}` },
    body,
  });
}

async function download(jobId: number, userId: string = DEMO.engineer): Promise<{ text: string; file: Record<string, any>; res: Response }> {
  const res = await call('GET', `/api/jobs/${jobId}/export`, { userId });
  const text = await res.text();
  return { res, text, file: res.ok ? JSON.parse(text) : null };
}

/** the parts of a file that belong to the copy itself: when it was exported, from where, the new job's dates */
function withoutCopyStamps(file: Record<string, any>) {
  const { exportedAt: _e, source: _s, ...rest } = file;
  const { createdAt: _c, updatedAt: _u, ...job } = file.job;
  return { ...rest, job };
}

const ok = async (res: Response, status = 201) => {
  if (res.status !== status) throw new Error(`${res.url}: ${res.status} ${await res.text()}`);
  return res.json();
};

let teamId: number;
let jobId: number;
let uploadId: number;
beforeAll(async () => {
  teamId = await demoTeamId();
  // a job made through the API as people use it, so every row is stored the app's own way
  jobId = (await ok(await call('POST', '/api/jobs', { userId: DEMO.engineer, body: { teamId, name: `Backup source ${uid()}`, reference: 'HL-07', client: 'Harrow Lane trust', location: 'Harrow Lane' } }))).job.id;
  const wall = (await ok(await call('POST', `/api/jobs/${jobId}/assemblies`, { userId: DEMO.engineer, body: { name: 'North wall, brick', element: 'wall', description: 'Solid brick with render' } }))).assembly;
  const roof = (await ok(await call('POST', `/api/jobs/${jobId}/assemblies`, { userId: DEMO.admin, body: { name: 'Reading room roof', element: 'roof' } }))).assembly;

  // two days of hourly outdoor values with irradiance (a made-up day for the test, not weather data)
  const air = Array.from({ length: 48 }, (_, h) => Number((14 + 6 * Math.sin((2 * Math.PI * (h - 9)) / 24)).toFixed(2)));
  const irradiance = Array.from({ length: 48 }, (_, h) => Math.max(0, Math.round(500 * Math.sin((Math.PI * ((h % 24) - 6)) / 12))));
  uploadId = (
    await ok(
      await call('POST', '/api/uploads', {
        userId: DEMO.engineer,
        body: { teamId, name: 'Two test days', fileName: 'two-days.csv', mapping: { timeColumn: null, temperatureColumn: 0, irradianceColumn: 1, temperatureUnit: 'C' }, series: { step: 3600, air, irradiance } },
      }),
    )
  ).upload.id;

  const head = (await ok(await call('GET', `/api/assemblies/${wall.id}`, { userId: DEMO.engineer }), 200)).head;
  const doc = smallDocument(0.215);
  doc.exposure.outdoor = { mode: 'series', uploadId, absorptance: 0.7 };
  doc.layers[0].note = 'Ünïcode “quotes” and a \\ backslash\nnew line';
  const saved = (await ok(await call('POST', `/api/assemblies/${wall.id}/revisions`, { userId: DEMO.engineer, body: { baseRevisionId: head.id, model: doc, note: 'On the uploaded days' } }))).revision;
  for (const [to, who] of [
    ['in_check', DEMO.engineer],
    ['checked', DEMO.checker],
    ['issued', DEMO.engineer],
  ] as const) {
    await ok(await call('POST', `/api/revisions/${saved.id}/transitions`, { userId: who, body: { to, note: `to ${to}` } }));
  }
  await ok(await call('POST', `/api/revisions/${saved.id}/comments`, { userId: DEMO.checker, body: { body: 'Brick λ 0.77 W/(m·K) is a typical value; confirm with the survey.' } }));
  // a run kept with its series, packed as the browser packs it (the same wall under the default sine day)
  const kept = runDocument(smallDocument(0.215)) as RunDone;
  if (kept.kind !== 'done') throw new Error('the test wall does not run');
  await ok(
    await call('POST', `/api/revisions/${saved.id}/runs`, {
      userId: DEMO.engineer,
      body: { exposure: doc.exposure, summary: summaryOf(kept.figures), packed: toBase64(packRun(kept)) },
    }),
  );
  const roofHead = (await ok(await call('GET', `/api/assemblies/${roof.id}`, { userId: DEMO.admin }), 200)).head;
  await ok(await call('POST', `/api/revisions/${roofHead.id}/runs`, { userId: DEMO.admin, body: { exposure: roofHead.model.exposure, summary: { uValue: 0.18 } } }));
  await ok(await call('POST', `/api/revisions/${roofHead.id}/comments`, { userId: DEMO.admin, body: { body: 'Roof first pass.' } }));
});
afterAll(closeTestDb);

describe('exporting a job', () => {
  it('answers one versioned file with the job, its assemblies, revisions, check trail, comments, runs and the uploads it uses', async () => {
    const { res, file } = await download(jobId);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="wallpulse-job-backup-source-[a-z0-9]+-\d{4}-\d{2}-\d{2}\.json"$/);
    expect(file).toMatchObject({ format: 'wallpulse-job-backup', version: 1, job: { reference: 'HL-07', client: 'Harrow Lane trust' } });
    expect(file.assemblies.map((a: { name: string }) => a.name)).toEqual(['North wall, brick', 'Reading room roof']);
    const [wall, roof] = file.assemblies;
    expect(wall.revisions.map((r: { number: number }) => r.number)).toEqual([1, 2]);
    expect(wall.revisions[1]).toMatchObject({ parentNumber: 1, state: 'issued', note: 'On the uploaded days' });
    expect(wall.revisions[1].events.map((e: { toState: string }) => e.toState)).toEqual(['draft', 'in_check', 'checked', 'issued']);
    // the document names the file's upload, not the database's id
    expect(wall.revisions[1].model.exposure.outdoor).toEqual({ mode: 'series', uploadId: 1, absorptance: 0.7 });
    expect(file.uploads).toHaveLength(1);
    expect(file.uploads[0]).toMatchObject({ key: 1, name: 'Two test days', fileName: 'two-days.csv' });
    expect(file.uploads[0].series.air).toHaveLength(48);
    // runs as stored: column → stored text
    const run = wall.revisions[1].runs[0];
    expect(Object.keys(run.columns)).toEqual(expect.arrayContaining(['exposure', 'summary', 'created_at']));
    expect(JSON.parse(run.columns.exposure).outdoor.uploadId).toBe(1);
    // binary columns as base64 (the kept run's packed series)
    expect(run.columns.packed).toEqual({ $base64: expect.stringMatching(/^[A-Za-z0-9+/]+={0,2}$/) });
    expect(Buffer.from(run.columns.packed.$base64, 'base64').subarray(0, 4).toString('latin1')).toBe('WPR1');
    expect(roof.revisions[0].runs).toHaveLength(1);
    expect(roof.revisions[0].comments[0].body).toBe('Roof first pass.');
    expect(file.people.map((p: { name: string }) => p.name).sort()).toEqual(['Ingrid Solberg', 'Noor Haddad', 'Tomas Reyes']);
    expect(JSON.stringify(file)).not.toMatch(/password|token_hash|passwordHash/);
  });

  it('is for engineers and admins of the job’s team only', async () => {
    expect((await download(jobId, DEMO.checker)).res.status).toBe(403);
    const stranger = await makeUser({ teamId: await makeTeam(), role: 'admin' });
    expect((await download(jobId, stranger.id)).res.status).toBe(404);
    expect((await call('GET', `/api/jobs/${jobId}/export`)).status).toBe(401);
  });
});

describe('restoring a job from its backup', () => {
  it('round-trips exactly: export → import → export is the same file but for ids and the copy’s dates, every document byte for byte', async () => {
    const first = await download(jobId);
    // another team with the same people, so every author stays who they were
    const otherTeam = await makeTeam(`Restore target ${uid()}`);
    for (const [id, role] of [
      [DEMO.admin, 'admin'],
      [DEMO.engineer, 'engineer'],
      [DEMO.checker, 'checker'],
    ] as const)
      await ensureMember(otherTeam, id, role);
    const res = await restore(otherTeam, DEMO.engineer, first.text);
    const restored = await ok(res);
    expect(restored.counts).toEqual({ assemblies: 2, revisions: 3, runs: 2, comments: 2, uploads: 1 });
    expect(restored.reassigned).toEqual([]);
    expect(restored.job.id).not.toBe(jobId);
    expect(restored.job.teamId).toBe(otherTeam);

    const second = await download(restored.job.id);
    expect(second.file.source.jobId).toBe(restored.job.id);
    expect(JSON.stringify(withoutCopyStamps(second.file))).toBe(JSON.stringify(withoutCopyStamps(first.file)));

    // in the database: each copied document is the original's stored text, byte for byte (the upload's id
    // being the copy's own), and each run row the original's stored values
    const docs = (job: number) =>
      rows<{ name: string; number: number; model: string; state: string }>(
        sql`select a.name, r.number, r.model, r.state from revisions r join assemblies a on a.id = r.assembly_id where a.job_id = ${job} order by a.id, r.number`,
      );
    const [orig, copy] = [await docs(jobId), await docs(restored.job.id)];
    expect(copy.length).toBe(orig.length);
    const newUpload = (await rows<{ id: number }>(sql`select id from uploads where team_id = ${otherTeam}`))[0].id;
    expect(newUpload).not.toBe(uploadId);
    for (let i = 0; i < orig.length; i++) {
      const expected = orig[i].model.replace(`"uploadId":${uploadId},`, `"uploadId":${newUpload},`);
      expect(Buffer.from(copy[i].model).equals(Buffer.from(expected))).toBe(true);
      expect(copy[i]).toMatchObject({ name: orig[i].name, number: orig[i].number, state: orig[i].state });
    }
    expect(orig.some((d) => d.model.includes(`"uploadId":${uploadId},`))).toBe(true);
    const runRows = (job: number) =>
      rows<Record<string, unknown>>(
        sql`select u.* from runs u join revisions r on r.id = u.revision_id join assemblies a on a.id = r.assembly_id where a.job_id = ${job} order by u.id`,
      );
    const strip = (r: Record<string, unknown>) => {
      const { id: _i, revision_id: _r, ...rest } = r;
      return { ...rest, exposure: String(rest.exposure).replace(`"uploadId":${newUpload},`, `"uploadId":${uploadId},`) };
    };
    expect((await runRows(restored.job.id)).map(strip)).toEqual((await runRows(jobId)).map(strip));
    const series = (await rows<{ series: string }>(sql`select u.series from uploads u where u.id in (${uploadId}, ${newUpload}) order by u.id`)).map((r) => r.series);
    expect(series[1]).toBe(series[0]);
  });

  it('records authors who are not members of the importing team under the importing person, naming them in the job’s notes', async () => {
    const { text } = await download(jobId);
    const team = await makeTeam(`Client studio ${uid()}`);
    const importer = await makeUser({ name: 'Ada Importer', teamId: team, role: 'engineer' });
    const restored = await ok(await restore(team, importer.id, text));
    expect([...restored.reassigned].sort()).toEqual(['Ingrid Solberg', 'Noor Haddad', 'Tomas Reyes']);
    const again = (await download(restored.job.id, importer.id)).file;
    expect(again.people).toEqual([{ key: 'p1', name: 'Ada Importer', email: importer.email }]);
    expect(again.job.notes).toMatch(/Restored from a backup file of \d{4}-\d{2}-\d{2}: the work of .*Tomas Reyes.* \(not members of this team\) is recorded under Ada Importer\./);
    expect(again.assemblies[0].revisions[1].author).toBe('p1');
    expect(again.assemblies[0].revisions[1].comments[0]).toMatchObject({ author: 'p1', body: expect.stringContaining('confirm with the survey') });
  });

  it('is for engineers and admins of the importing team only', async () => {
    const { text } = await download(jobId);
    const before = await tableCounts();
    expect((await restore(teamId, DEMO.checker, text)).status).toBe(403);
    const stranger = await makeUser({ teamId: await makeTeam(), role: 'admin' });
    expect((await restore(teamId, stranger.id, text)).status).toBe(404);
    const anonymous = await fetch(`${baseUrl()}/api/teams/${teamId}/import`, { method: 'POST', headers: { origin: new URL(baseUrl()).origin, 'content-type': 'application/json' }, body: text });
    expect(anonymous.status).toBe(401);
    expect(await tableCounts()).toEqual(before);
  });
});

describe('a bad or foreign backup file', () => {
  let good: Record<string, any>;
  beforeAll(async () => {
    good = (await download(jobId)).file;
  });
  const edited = (edit: (f: any) => void) => {
    const f = structuredClone(good);
    edit(f);
    return JSON.stringify(f);
  };

  const cases: [string, () => string, number, string, RegExp, string?][] = [
    ['malformed JSON', () => JSON.stringify(good).slice(0, 500), 400, 'bad_json', /not valid JSON/],
    ['another program’s file', () => JSON.stringify({ type: 'FeatureCollection', features: [] }), 422, 'not_a_backup', /not a Wallpulse job backup/, 'format'],
    ['a later format version', () => edited((f) => (f.version = 2)), 422, 'unsupported_version', /format version 2; this Wallpulse restores version 1/, 'version'],
    ['a file nested 10,000 levels deep', () => `{"format":"wallpulse-job-backup","version":1,"job":${'['.repeat(10_000)}${']'.repeat(10_000)}}`, 422, 'too_deep', /deeper than 32 levels/],
    ['the wrong shape (an assembly without a name)', () => edited((f) => delete f.assemblies[0].name), 422, 'invalid', /assembly 1: name is required/, 'assemblies[0].name'],
    [
      'a document that fails the schema (a negative thickness)',
      () => edited((f) => (f.assemblies[0].revisions[1].model.layers[0].thickness = -0.1)),
      422,
      'invalid',
      /assembly 1, revision 2, layer 1: thickness must be greater than 0 m/,
      'assemblies[0].revisions[1].model.layers[0].thickness',
    ],
    ['a document naming an upload the file lacks', () => edited((f) => (f.uploads = [])), 422, 'invalid', /assembly 1, revision 2, exposure, outdoor: upload id names the upload 1, which is not in the file's uploads/],
    ['a kept run whose packed series is not one', () => edited((f) => (f.assemblies[0].revisions[1].runs[0].columns.packed = { $base64: Buffer.from('not a packed run').toString('base64') })), 422, 'invalid', /assembly 1, revision 2, run 1: packed holds a packed run that cannot be read/],
    ['a run column this version does not keep', () => edited((f) => (f.assemblies[1].revisions[0].runs[0].columns.colour = 'red')), 422, 'invalid', /assembly 2, revision 1, run 1: colour is not a column of a run/],
    ['a revision on top of one that is not there', () => edited((f) => (f.assemblies[0].revisions[1].parentNumber = 9)), 422, 'invalid', /assembly 1, revision 2: parent number must name an earlier revision/],
    // passes every check but the database's: the last row of the file fails, so the rows written before it must go too
    ['a row the database refuses (a year past 9999), after other rows were written', () => edited((f) => (f.assemblies[1].revisions[0].runs[0].columns.created_at = '+010000-01-01T00:00:00.000Z')), 422, 'not_restored', /could not be written/],
  ];

  for (const [what, body, status, code, message, field] of cases) {
    it(`answers ${what} with ${status} naming the problem, and changes nothing`, async () => {
      const before = await tableCounts();
      const res = await restore(teamId, DEMO.engineer, body());
      expect(res.status).toBe(status);
      const { error } = await res.json();
      expect(error.code).toBe(code);
      expect(error.message).toMatch(message);
      expect(error.message).toMatch(/nothing was restored/);
      if (field) expect(error.fields[field]).toBeTruthy();
      expect(await tableCounts()).toEqual(before);
    });
  }

  it(`refuses a file larger than ${MAX_BACKUP_BYTES / 1024 / 1024} MB as it arrives, and changes nothing`, async () => {
    const before = await tableCounts();
    const padded = JSON.stringify({ ...good, padding: 'x'.repeat(MAX_BACKUP_BYTES) });
    // sent in chunks without a length, so the limit must count the bytes as they come
    let at = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (at >= padded.length) return controller.close();
        controller.enqueue(new TextEncoder().encode(padded.slice(at, (at += 1 << 20))));
      },
    });
    const res = await fetch(`${baseUrl()}/api/teams/${teamId}/import`, {
      method: 'POST',
      headers: { origin: new URL(baseUrl()).origin, 'content-type': 'application/json', cookie: `${SESSION_COOKIE}=${await sessionFor(DEMO.engineer)}` },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
    expect((await res.json()).error.message).toMatch(/larger than 16 MB/);
    expect(await tableCounts()).toEqual(before);
  });
});
