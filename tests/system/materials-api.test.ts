import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { and, eq, isNull } from 'drizzle-orm';
import { baseUrl } from '../support/browser';
import { closeTestDb, sessionFor, SESSION_COOKIE, testDb } from '../support/db';
import { materials, memberships, teams, users } from '../../src/lib/server/db/schema';
import { DEMO_TEAM_NAME } from '../../src/lib/server/seed/demoTeam';
import { parseMaterialsCsv } from '../../src/lib/materials/csv';

let teamId: number;
let engineer: string;
let checker: string;
let outsider: string;
const run = Date.now().toString(36);

async function api(path: string, cookie: string | null, init: RequestInit & { json?: unknown } = {}) {
  // a browser's fetch sends its origin with every non-GET request; Astro's origin check wants it on a DELETE without a body
  const headers: Record<string, string> = { accept: 'application/json', origin: baseUrl() };
  if (cookie) headers.cookie = `${SESSION_COOKIE}=${cookie}`;
  if (init.json !== undefined) headers['content-type'] = 'application/json';
  const res = await fetch(`${baseUrl()}${path}`, { ...init, headers, body: init.json !== undefined ? JSON.stringify(init.json) : init.body });
  const text = await res.text();
  let body: any = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = text;
  }
  return { status: res.status, body, headers: res.headers };
}

const teamCount = async () => (await testDb().select({ id: materials.id }).from(materials).where(eq(materials.teamId, teamId))).length;

const valid = (name: string) => ({
  teamId,
  name,
  materialClass: 'insulation',
  conductivity: 0.031,
  density: 30,
  specificHeat: 1450,
  vapourResistanceFactor: 50,
  source: 'manufacturer’s declaration of performance (test data)',
});

beforeAll(async () => {
  const db = testDb();
  const [team] = await db.select({ id: teams.id }).from(teams).where(eq(teams.name, DEMO_TEAM_NAME)).limit(1);
  teamId = team.id;
  engineer = await sessionFor('demo-engineer');
  checker = await sessionFor('demo-checker');
  const outsiderId = `materials-outsider-${run}`;
  await db.insert(users).values({ id: outsiderId, email: `${outsiderId}@example.test`, name: 'Outside Engineer', passwordHash: 'x', emailVerifiedAt: new Date() });
  const [other] = await db.insert(teams).values({ name: `Other studio ${run}` }).$returningId();
  await db.insert(memberships).values({ teamId: other.id, userId: outsiderId, role: 'engineer' });
  outsider = await sessionFor(outsiderId);
});
afterAll(async () => {
  await closeTestDb();
});

describe('GET /api/materials', () => {
  it('lists the seeded built-ins with their sources, and the caller’s role', async () => {
    const { status, body } = await api(`/api/materials?teamId=${teamId}`, engineer);
    expect(status).toBe(200);
    const builtins = body.materials.filter((m: any) => m.teamId === null);
    expect(builtins.length).toBeGreaterThanOrEqual(40);
    for (const m of builtins) expect(m.source).not.toBe('');
    expect(body.team).toMatchObject({ id: teamId, role: 'engineer', canEdit: true });
  });

  it('says 401 to a signed-out caller and 404 to a member of another team', async () => {
    expect((await api(`/api/materials?teamId=${teamId}`, null)).status).toBe(401);
    const other = await api(`/api/materials?teamId=${teamId}`, outsider);
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe('not_found');
  });

  it('names a bad query parameter', async () => {
    const { status, body } = await api(`/api/materials?teamId=abc`, engineer);
    expect(status).toBe(422);
    expect(body.error.fields.teamId).toMatch(/team id/);
  });
});

describe('POST /api/materials', () => {
  it('creates a team material', async () => {
    const { status, body } = await api('/api/materials', engineer, { method: 'POST', json: valid(`PIR board ${run}`) });
    expect(status).toBe(201);
    expect(body.material).toMatchObject({ teamId, builtinKey: null, name: `PIR board ${run}`, conductivity: 0.031 });
  });

  it('answers each bad field by name and stores nothing', async () => {
    const before = await teamCount();
    const { status, body } = await api('/api/materials', engineer, {
      method: 'POST',
      json: { ...valid(''), conductivity: -0.2, density: 'heavy', vapourResistanceFactor: 0.5, source: ' ', materialClass: 'plastic' },
    });
    expect(status).toBe(422);
    expect(body.error.code).toBe('invalid');
    expect(body.error.fields).toMatchObject({
      name: 'must not be empty',
      conductivity: 'must be greater than 0 W/(m·K)',
      density: 'must be a number in kg/m³',
      vapourResistanceFactor: 'must be at least 1',
    });
    expect(body.error.fields.materialClass).toMatch(/must be one of masonry/);
    expect(body.error.fields.source).toMatch(/where the values come from/);
    expect(await teamCount()).toBe(before);
  });

  it('refuses a second material of the same name in the team', async () => {
    await api('/api/materials', engineer, { method: 'POST', json: valid(`Twin ${run}`) });
    const { status, body } = await api('/api/materials', engineer, { method: 'POST', json: valid(`twin ${run}`) });
    expect(status).toBe(422);
    expect(body.error.fields.name).toMatch(/already in the team library/);
  });

  it('forbids a checker (403) and hides the team from an outsider (404)', async () => {
    const c = await api('/api/materials', checker, { method: 'POST', json: valid(`Checker's ${run}`) });
    expect(c.status).toBe(403);
    expect(c.body.error.code).toBe('forbidden');
    const o = await api('/api/materials', outsider, { method: 'POST', json: valid(`Outsider's ${run}`) });
    expect(o.status).toBe(404);
  });
});

describe('PATCH and DELETE /api/materials/:id', () => {
  it('edits the fields sent and leaves the others as they were', async () => {
    const created = (await api('/api/materials', engineer, { method: 'POST', json: { ...valid(`Editable ${run}`), notes: 'keep me' } })).body.material;
    const { status, body } = await api(`/api/materials/${created.id}`, engineer, { method: 'PATCH', json: { conductivity: 0.029 } });
    expect(status).toBe(200);
    expect(body.material).toMatchObject({ conductivity: 0.029, density: 30, notes: 'keep me' });
    const bad = await api(`/api/materials/${created.id}`, engineer, { method: 'PATCH', json: { specificHeat: 0 } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.specificHeat).toBe('must be greater than 0 J/(kg·K)');
    const outsiderEdit = await api(`/api/materials/${created.id}`, outsider, { method: 'PATCH', json: { conductivity: 1 } });
    expect(outsiderEdit.status).toBe(404);
    const checkerEdit = await api(`/api/materials/${created.id}`, checker, { method: 'PATCH', json: { conductivity: 1 } });
    expect(checkerEdit.status).toBe(403);
  });

  it('refuses to change a built-in material', async () => {
    const [builtin] = await testDb().select({ id: materials.id }).from(materials).where(isNull(materials.teamId)).limit(1);
    const { status, body } = await api(`/api/materials/${builtin.id}`, engineer, { method: 'PATCH', json: { conductivity: 1 } });
    expect(status).toBe(403);
    expect(body.error.code).toBe('builtin_read_only');
    expect((await api(`/api/materials/${builtin.id}`, engineer, { method: 'DELETE' })).status).toBe(403);
  });

  it('deletes a team material', async () => {
    const created = (await api('/api/materials', engineer, { method: 'POST', json: valid(`Short-lived ${run}`) })).body.material;
    expect((await api(`/api/materials/${created.id}`, checker, { method: 'DELETE' })).status).toBe(403);
    expect((await api(`/api/materials/${created.id}`, engineer, { method: 'DELETE' })).status).toBe(204);
    expect((await api(`/api/materials/${created.id}`, engineer)).status).toBe(404);
  });
});

describe('POST /api/materials/import', () => {
  const header = 'name,class,conductivity [W/(m·K)],density [kg/m³],specific heat [J/(kg·K)],vapour resistance factor μ [–],source,notes';

  it('previews a good file without storing it, then stores all of it', async () => {
    const csv = [header, `Imported board A ${run},board,0.25,900,1000,12,sheet A,`, `Imported wool B ${run},insulation,0.034,45,1030,1,"sheet B, 2025","two\nlines"`].join('\n');
    const before = await teamCount();
    const preview = await api('/api/materials/import', engineer, { method: 'POST', json: { teamId, csv } });
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ valid: true, committed: false, problems: [] });
    expect(preview.body.rows.map((r: any) => r.line)).toEqual([2, 3]);
    expect(await teamCount()).toBe(before);
    const commit = await api('/api/materials/import', engineer, { method: 'POST', json: { teamId, csv, commit: true } });
    expect(commit.status).toBe(201);
    expect(commit.body.created).toBe(2);
    expect(await teamCount()).toBe(before + 2);
  });

  it('reports every problem with its line number, and a rejected file changes nothing', async () => {
    await api('/api/materials', engineer, { method: 'POST', json: valid(`Already here ${run}`) });
    const csv = [
      header,
      `Good one ${run},board,0.2,700,1000,10,sheet,`,
      `Bad numbers ${run},board,-1,seven,1000,10,sheet,`,
      '',
      `Already here ${run},insulation,0.03,30,1400,50,sheet,`,
      `Good one ${run},board,0.2,700,1000,10,sheet,`,
      `No class ${run},,0.2,700,1000,10,,`,
    ].join('\n');
    const before = await teamCount();
    const preview = await api('/api/materials/import', engineer, { method: 'POST', json: { teamId, csv } });
    expect(preview.status).toBe(200);
    expect(preview.body.valid).toBe(false);
    const problems = preview.body.problems.map((p: any) => `${p.line}: ${p.message}`);
    expect(problems).toEqual([
      '3: Conductivity must be greater than 0 W/(m·K)',
      '3: Density must be a number in kg/m³',
      `5: Name “Already here ${run}” is already in the team library`,
      `6: Name “Good one ${run}” is also on line 2`,
      '7: Class must be one of masonry, concrete, timber, insulation, board, metal, membrane, air, render',
      '7: Source must say where the values come from (a product data sheet, a standard’s table)',
    ]);
    const commit = await api('/api/materials/import', engineer, { method: 'POST', json: { teamId, csv, commit: true } });
    expect(commit.status).toBe(422);
    expect(commit.body.error.code).toBe('import_rejected');
    expect(commit.body.error.message).toMatch(/nothing was imported/);
    expect(await teamCount()).toBe(before);
    const names = (await testDb().select({ name: materials.name }).from(materials).where(and(eq(materials.teamId, teamId), eq(materials.name, `Good one ${run}`)))).length;
    expect(names).toBe(0);
  });

  it('names a missing column on the header line', async () => {
    const { body } = await api('/api/materials/import', engineer, { method: 'POST', json: { teamId, csv: 'name,class\nA,board' } });
    expect(body.problems[0]).toMatchObject({ line: 1 });
    expect(body.problems[0].message).toMatch(/lacks the columns “conductivity \[W\/\(m·K\)\]”/);
  });

  it('is for engineers and admins of the team only', async () => {
    const csv = `${header}\nX ${run},board,0.2,700,1000,10,sheet,`;
    expect((await api('/api/materials/import', checker, { method: 'POST', json: { teamId, csv } })).status).toBe(403);
    expect((await api('/api/materials/import', outsider, { method: 'POST', json: { teamId, csv } })).status).toBe(404);
  });
});

describe('GET /api/materials/export.csv', () => {
  it('writes the team’s materials with units in the headers, readable by the import', async () => {
    const res = await fetch(`${baseUrl()}/api/materials/export.csv?teamId=${teamId}&scope=team`, { headers: { cookie: `${SESSION_COOKIE}=${engineer}` } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="wallpulse-materials-team-/);
    const text = await res.text();
    expect(text.replace(/^\uFEFF/, '').split('\r\n')[0]).toBe(
      'name,class,conductivity [W/(m·K)],density [kg/m³],specific heat [J/(kg·K)],vapour resistance factor μ [–],source,notes',
    );
    const parsed = parseMaterialsCsv(text);
    expect(parsed.problems).toEqual([]);
    const wool = parsed.rows.find((r) => r.material.name === `Imported wool B ${run}`);
    expect(wool?.material).toMatchObject({ conductivity: 0.034, notes: 'two\nlines', source: 'sheet B, 2025' });
    expect(parsed.rows.every((r) => r.material.name !== 'Steel (7800 kg/m³)')).toBe(true);
  });

  it('writes the built-ins too with scope=all, and hides another team’s list', async () => {
    const all = await fetch(`${baseUrl()}/api/materials/export.csv?teamId=${teamId}&scope=all`, { headers: { cookie: `${SESSION_COOKIE}=${engineer}` } });
    const rows = parseMaterialsCsv(await all.text()).rows;
    expect(rows.some((r) => r.material.name === 'Steel (7800 kg/m³)')).toBe(true);
    const other = await fetch(`${baseUrl()}/api/materials/export.csv?teamId=${teamId}`, { headers: { cookie: `${SESSION_COOKIE}=${outsider}` } });
    expect(other.status).toBe(404);
  });
});
