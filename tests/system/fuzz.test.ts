// A seeded property-based fuzz (fast-check) of bad requests across every API route and every
// form page, as anonymous, guest (holds a share link, no account) and each role of the demo
// team: malformed JSON, JSON of the wrong shape or too deep, text, broken multipart, no
// content type, form fields nobody asked for, hostile path parameters and queries, methods a
// route does not have, other sites' origins. Every answer must be below 500, the API's errors
// must carry the one JSON error shape, and the database must be unchanged afterwards: the row
// count and CHECKSUM TABLE of every table, except
//   - sessions: the fuzz makes a session for each signed-in request, and lucia extends them;
//   - rate_limits: bad sign-ins, reset and sign-up requests are counted there by design;
//   - audit_log: failed sign-ins are recorded by design;
//   - outbound_mail and smtp_inbox: the mail worker may still be sending mail that earlier test
//     files queued (no row may be added to outbound_mail, which is checked instead).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import fc from 'fast-check';
import { desc, eq, sql } from 'drizzle-orm';
import { closeTestDb, sessionFor, testDb, SESSION_COOKIE } from '../support/db';
import { baseUrl } from '../support/browser';
import { assemblies, invitations, jobs, materials, outboundMail, revisions, runs, shareLinks, uploads } from '../../src/lib/server/db/schema';
import { DEMO, demoTeamId, makeShare } from './teamFixtures';

const SEED = 20261202;
/** property runs, each a batch of BATCH requests sent together */
const RUNS = 870;
const BATCH = 6;
const CHANGING_TABLES = new Set(['sessions', 'rate_limits', 'audit_log', 'outbound_mail', 'smtp_inbox']);

type Who = 'anonymous' | 'guest' | 'checker' | 'engineer' | 'admin';
const WHO: Who[] = ['anonymous', 'guest', 'checker', 'engineer', 'admin'];
const USER_OF: Record<Who, string | null> = { anonymous: null, guest: null, checker: DEMO.checker, engineer: DEMO.engineer, admin: DEMO.admin };

/** the real ids the routes are called with (besides hostile ones) */
interface Ids {
  team: string;
  job: string;
  assembly: string;
  revision: string;
  run: string;
  upload: string;
  material: string;
  invitation: string;
  share: string;
  member: string;
  token: string;
}
let ids: Ids;

/**
 * Every route and form page. `objects`: JSON objects with the route's own field names (of the
 * wrong types) are bad requests there, since a required text field is never given as text;
 * elsewhere (optional fields only, or no body) a well-formed object could be a good request,
 * so those get only malformed bodies. `real`: real ids are safe for any bad request there; the
 * destructive bodiless ones get hostile ids only.
 */
interface Route {
  path: string;
  methods: string[];
  kind: 'api' | 'form' | 'page';
  objects?: boolean;
  real?: boolean;
}
const ROUTES: Route[] = [
  { path: '/api/health', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/auth/me', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/auth/signin', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/auth/signup', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/auth/signout', methods: ['POST'], kind: 'api', real: true },
  { path: '/api/auth/verify', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/auth/resend-verification', methods: ['POST'], kind: 'api', real: true },
  { path: '/api/auth/reset-request', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/auth/reset', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/teams', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/teams/{team}', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/teams/{team}/members', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/teams/{team}/members/{member}', methods: ['PATCH', 'DELETE'], kind: 'api' },
  { path: '/api/teams/{team}/invitations', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/teams/{team}/shares', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/invitations/{invitation}/revoke', methods: ['POST'], kind: 'api' },
  { path: '/api/invitations/accept', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/audit', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/jobs', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/jobs/{job}', methods: ['GET', 'PATCH'], kind: 'api', real: true },
  { path: '/api/jobs/{job}/assemblies', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/assemblies/{assembly}', methods: ['GET', 'PATCH'], kind: 'api', real: true },
  { path: '/api/assemblies/{assembly}/revisions', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/revisions/{revision}', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/revisions/{revision}/comments', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/revisions/{revision}/runs', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/revisions/{revision}/shares', methods: ['GET', 'POST'], kind: 'api', real: true },
  { path: '/api/revisions/{revision}/transitions', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/runs/{run}', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/shares/{share}/revoke', methods: ['POST'], kind: 'api' },
  { path: '/api/shared/{token}', methods: ['POST', 'PATCH', 'DELETE'], kind: 'api', real: true },
  { path: '/api/shared/{badToken}', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/materials', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/materials/{material}', methods: ['GET', 'PATCH', 'DELETE'], kind: 'api' },
  { path: '/api/materials/export.csv', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/materials/import', methods: ['POST'], kind: 'api', objects: true, real: true },
  { path: '/api/uploads', methods: ['GET', 'POST'], kind: 'api', objects: true, real: true },
  { path: '/api/uploads/{upload}', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/jobs/{job}/export', methods: ['GET'], kind: 'api', real: true },
  { path: '/api/teams/{team}/import', methods: ['POST'], kind: 'api', objects: true, real: true },
  // the form pages (and the sign-out button's endpoint)
  { path: '/signin', methods: ['POST'], kind: 'form', real: true },
  { path: '/signup', methods: ['POST'], kind: 'form', real: true },
  { path: '/team', methods: ['POST'], kind: 'form', real: true },
  { path: '/jobs', methods: ['POST'], kind: 'form', real: true },
  { path: '/reset', methods: ['POST'], kind: 'form', real: true },
  { path: '/reset/{badToken}', methods: ['POST', 'GET'], kind: 'form', real: true },
  { path: '/verify/{badToken}', methods: ['POST', 'GET'], kind: 'form', real: true },
  { path: '/invite/{badToken}', methods: ['POST', 'GET'], kind: 'form', real: true },
  { path: '/signout', methods: ['POST'], kind: 'form', real: true },
  // pages called with what they do not expect (a share page with hostile tokens only: a real one counts an opening)
  { path: '/s/{badToken}', methods: ['GET'], kind: 'page', real: true },
  { path: '/jobs/{job}', methods: ['GET', 'POST'], kind: 'page', real: true },
  { path: '/assemblies/{assembly}', methods: ['GET', 'POST'], kind: 'page', real: true },
  { path: '/assemblies/{assembly}/history', methods: ['GET'], kind: 'page', real: true },
  { path: '/library', methods: ['GET', 'POST'], kind: 'page', real: true },
  { path: '/', methods: ['POST', 'PUT', 'DELETE'], kind: 'page', real: true },
];

const FIELD_NAMES = ['name', 'email', 'password', 'role', 'to', 'note', 'body', 'token', 'teamId', 'baseRevisionId', 'model', 'label', 'csv', 'commit', 'exposure', 'summary', 'series', 'element', 'description', 'reference', 'fileName', 'mapping', 'intent', 'teamName', 'confirm', 'next'];

const HOSTILE_IDS = ['0', '-1', 'abc', '99999999', '1e3', '1.5', '%00', '%2e%2e%2f', 'x'.repeat(300), '1%20OR%201=1', '%F0%9F%92%A5', '9'.repeat(30), '%0d%0a', "1'", '%5C'];

interface Body {
  contentType?: string;
  body?: string;
  label: string;
}

/** bodies that are wrong whatever the route: never a well-formed object */
const malformedBody: fc.Arbitrary<Body> = fc.oneof(
  fc.constantFrom('{', '{"a":', '[1,2', 'nul', '{"email":}', '{"a":1}}', "{'a':1}", '\u0000', '', '"\\u', '{"__proto__":{"x":1}', '1e999999').map((body) => ({ contentType: 'application/json', body, label: 'broken JSON' })),
  fc.oneof(fc.integer(), fc.boolean(), fc.constant(null), fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 4 }), fc.string({ maxLength: 40 }), fc.double())
    .map((v) => ({ contentType: 'application/json', body: JSON.stringify(v) ?? 'null', label: 'JSON not an object' })),
  fc.integer({ min: 33, max: 3000 }).map((n) => ({ contentType: 'application/json', body: '{"a":'.repeat(n) + '1' + '}'.repeat(n), label: `JSON ${n} deep` })),
  fc.integer({ min: 33, max: 3000 }).map((n) => ({ contentType: 'application/json', body: '['.repeat(n) + ']'.repeat(n), label: `array ${n} deep` })),
  fc.string({ maxLength: 200 }).map((body) => ({ contentType: 'text/plain', body, label: 'text' })),
  fc.string({ maxLength: 200 }).map((body) => ({ body, label: 'no content type' })),
  fc.constantFrom(
    '--x\r\nContent-Disposition: form-data; name="email"\r\n\r\nabc',
    '--x\r\nbroken',
    'not multipart at all',
    '--x--',
    '--y\r\nContent-Disposition: form-data; name="a"\r\n\r\n1\r\n--y--',
  ).map((body) => ({ contentType: 'multipart/form-data; boundary=x', body, label: 'broken multipart' })),
  fc.constantFrom('multipart/form-data', 'application/xml', 'application/octet-stream', 'application/json; charset=utf-16', 'image/png', 'text/html').chain((contentType) =>
    fc.string({ maxLength: 60 }).map((body) => ({ contentType, body, label: `odd type ${contentType}` })),
  ),
  fc.string({ maxLength: 60 }).map((s) => ({ contentType: 'application/x-www-form-urlencoded', body: `%%${s}&&=&%E0%A4%A`, label: 'broken urlencoded' })),
);

/** a JSON object with the routes' field names, none of them text: wrong wherever a text field is required */
const wrongObject: fc.Arbitrary<Body> = fc
  .dictionary(fc.constantFrom(...FIELD_NAMES), fc.oneof(fc.integer(), fc.boolean(), fc.constant(null), fc.double(), fc.array(fc.integer(), { maxLength: 3 })), { minKeys: 1, maxKeys: 6 })
  .map((o) => ({ contentType: 'application/json', body: JSON.stringify(o), label: 'fields of the wrong type' }));

/** text fields far past every length limit */
const tooLongObject: fc.Arbitrary<Body> = fc
  .subarray(FIELD_NAMES, { minLength: 1, maxLength: 5 })
  .map((keys) => ({ contentType: 'application/json', body: JSON.stringify(Object.fromEntries(keys.map((k) => [k, 'x'.repeat(6000)]))), label: 'text past every limit' }));

/** form fields nobody asked for, as a form would send them */
const strayForm: fc.Arbitrary<Body> = fc
  .dictionary(fc.string({ minLength: 1, maxLength: 8 }).filter((k) => !FIELD_NAMES.includes(k)), fc.string({ maxLength: 30 }), { maxKeys: 4 })
  .map((o) => ({ contentType: 'application/x-www-form-urlencoded', body: new URLSearchParams(o).toString(), label: 'stray form fields' }));

const hostileQuery = fc.oneof(
  fc.constant(''),
  fc.constantFrom('?page=-1', '?pageSize=100000', '?sort=password', '?sort=-;drop', `?q=${'%25'.repeat(300)}`, '?teamId=abc', '?teamId=-5', '?page=1e400', '?team=%00', '?next=//evil.example', '?record=0', '?a[b]=1&a[c]=2'),
  fc.string({ maxLength: 30 }).map((s) => `?q=${encodeURIComponent(s)}&page=${encodeURIComponent(s)}`),
);

interface Probe {
  who: Who;
  route: Route;
  method: string;
  id: string | null;
  query: string;
  body: Body;
  crossSite: boolean;
}

function probeFor(route: Route): fc.Arbitrary<Probe> {
  const bodies = route.objects ? fc.oneof(malformedBody, wrongObject, tooLongObject, strayForm) : fc.oneof(malformedBody, strayForm);
  const methods = [...route.methods, 'PUT', 'DELETE', 'PATCH'].filter((m, i, a) => a.indexOf(m) === i);
  return fc.record({
    who: fc.constantFrom(...WHO),
    route: fc.constant(route),
    method: fc.constantFrom(...methods),
    id: route.real ? fc.option(fc.constantFrom(...HOSTILE_IDS), { freq: 2 }) : fc.constantFrom(...HOSTILE_IDS),
    query: hostileQuery,
    body: bodies,
    crossSite: fc.boolean().chain((b) => (b ? fc.boolean() : fc.constant(false))),
  });
}

const probe = fc.oneof(...ROUTES.map(probeFor));

function urlOf(p: Probe): string {
  const path = p.route.path.replace(/\{(\w+)\}/g, (_, name: string) => {
    if (name === 'badToken') return p.id ?? 'x'.repeat(43);
    return p.id ?? ids[name as keyof Ids];
  });
  return path + p.query;
}

/** one session per role, made again after a request that may have signed it out */
const sessions = new Map<Who, Promise<string>>();
function sessionOf(who: Who, user: string): Promise<string> {
  if (!sessions.has(who)) sessions.set(who, sessionFor(user));
  return sessions.get(who)!;
}

async function send(p: Probe): Promise<{ status: number; type: string; text: string; url: string }> {
  const headers: Record<string, string> = { origin: p.crossSite ? 'https://evil.example' : new URL(baseUrl()).origin };
  const user = USER_OF[p.who];
  if (user) headers.cookie = `${SESSION_COOKIE}=${await sessionOf(p.who, user)}`;
  if (user && p.route.path.includes('signout')) sessions.delete(p.who);
  const hasBody = !['GET', 'HEAD'].includes(p.method);
  if (hasBody && p.body.contentType) headers['content-type'] = p.body.contentType;
  const url = urlOf(p);
  const res = await fetch(baseUrl() + url, { method: p.method, headers, body: hasBody ? (p.body.body ?? '') : undefined, redirect: 'manual' });
  return { status: res.status, type: res.headers.get('content-type') ?? '', text: await res.text(), url };
}

/** row count and CHECKSUM TABLE of every table but the ones requests legitimately change */
async function snapshot(): Promise<Record<string, string>> {
  const [tables] = (await testDb().execute(sql`select table_name as name from information_schema.tables where table_schema = database() order by table_name`)) as unknown as [{ name: string }[]];
  const out: Record<string, string> = {};
  for (const { name } of tables) {
    if (CHANGING_TABLES.has(name)) continue;
    const [[{ n }]] = (await testDb().execute(sql.raw(`select count(*) as n from \`${name}\``))) as unknown as [[{ n: number }]];
    const [[{ Checksum }]] = (await testDb().execute(sql.raw(`checksum table \`${name}\``))) as unknown as [[{ Checksum: string | number }]];
    out[name] = `${n} rows, checksum ${Checksum}`;
  }
  return out;
}

/** the API's error codes that must come as { error: { code, message } } */
const SHAPED = new Set([400, 401, 404, 409, 410, 413, 415, 422, 429]);

let before: Record<string, string>;
let lastMailId: number;

async function forgetLimits() {
  await testDb()
    .execute(sql`delete from rate_limits where \`key\` like '%127.0.0.1%'`)
    // a build without the shared limits has no such table
    .catch(() => undefined);
}

beforeAll(async () => {
  const db = testDb();
  const teamId = await demoTeamId();
  const first = async <T>(rows: Promise<T[]>, fallback: T) => (await rows)[0] ?? fallback;
  const job = await first(db.select({ id: jobs.id }).from(jobs).where(eq(jobs.teamId, teamId)).limit(1), { id: 1 });
  const assembly = await first(db.select({ id: assemblies.id }).from(assemblies).where(eq(assemblies.jobId, job.id)).limit(1), { id: 1 });
  const revision = await first(db.select({ id: revisions.id }).from(revisions).where(eq(revisions.assemblyId, assembly.id)).orderBy(desc(revisions.number)).limit(1), { id: 1 });
  const run = await first(db.select({ id: runs.id }).from(runs).limit(1), { id: 1 });
  const upload = await first(db.select({ id: uploads.id }).from(uploads).where(eq(uploads.teamId, teamId)).limit(1), { id: 1 });
  const material = await first(db.select({ id: materials.id }).from(materials).where(eq(materials.teamId, teamId)).limit(1), { id: 1 });
  const invitation = await first(db.select({ id: invitations.id }).from(invitations).where(eq(invitations.teamId, teamId)).limit(1), { id: 1 });
  const share = await makeShare(revision.id);
  ids = {
    team: String(teamId),
    job: String(job.id),
    assembly: String(assembly.id),
    revision: String(revision.id),
    run: String(run.id),
    upload: String(upload.id),
    material: String(material.id),
    invitation: String(invitation.id),
    share: String(share.id),
    member: DEMO.checker,
    token: share.token,
  };
  await forgetLimits();
  // earlier files' mail has gone out before the picture is taken
  lastMailId = (await db.select({ id: outboundMail.id }).from(outboundMail).orderBy(desc(outboundMail.id)).limit(1))[0]?.id ?? 0;
  before = await snapshot();
});

afterAll(async () => {
  await forgetLimits();
  await testDb().delete(shareLinks).where(eq(shareLinks.id, Number(ids?.share ?? 0)));
  await closeTestDb();
});

describe('bad requests to every route and form page', () => {
  it(`answers ${RUNS * BATCH} generated bad requests without a 5xx, in the one error shape, and changes nothing`, async () => {
    const seen = new Map<string, number>();
    const t0 = Date.now();
    let batches = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(probe, { minLength: BATCH, maxLength: BATCH }), async (batch) => {
        const answers = await Promise.all(batch.map(async (p) => ({ p, res: await send(p) })));
        for (const { p, res } of answers) check(p, res);
        if (++batches % 100 === 0) console.log(`fuzz: ${batches * BATCH} requests after ${((Date.now() - t0) / 1000).toFixed(0)} s`);
      }),
      { seed: SEED, numRuns: RUNS, endOnFailure: true },
    );
    function check(p: Probe, res: Awaited<ReturnType<typeof send>>) {
      const key = `${res.status}`;
      seen.set(key, (seen.get(key) ?? 0) + 1);
      const where = `${p.who} ${p.method} ${res.url} (${p.body.label}${p.crossSite ? ', cross-site' : ''}) → ${res.status} ${res.text.slice(0, 200)}`;
      if (res.status >= 500) throw new Error(`5xx: ${where}`);
      if (res.status === 0) throw new Error(`no answer: ${where}`);
      if (p.route.kind === 'api' && res.url.startsWith('/api/') && SHAPED.has(res.status) && res.text) {
        if (!res.type.includes('application/json')) throw new Error(`not JSON: ${where}`);
        const body = JSON.parse(res.text) as { error?: { code?: unknown; message?: unknown } };
        if (typeof body.error?.code !== 'string' || typeof body.error?.message !== 'string') throw new Error(`not the error shape: ${where}`);
      }
    }
    const seconds = (Date.now() - t0) / 1000;
    console.log(`fuzz: ${RUNS * BATCH} requests in ${seconds.toFixed(1)} s; answers by status: ${JSON.stringify(Object.fromEntries([...seen].sort()))}`);

    expect(await snapshot()).toEqual(before);
    const added = await testDb().select({ id: outboundMail.id, purpose: outboundMail.purpose }).from(outboundMail).where(sql`${outboundMail.id} > ${lastMailId}`);
    expect(added).toEqual([]);
  }, 300_000);
});
