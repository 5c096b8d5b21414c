// every endpoint of accounts, teams and saved work, called as each kind of caller, with
// the status code each must get. "guest" holds a share link but no account; "outsider"
// is the admin of another team.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { like } from 'drizzle-orm';
import { closeTestDb, testDb } from '../support/db';
import { teams } from '../../src/lib/server/db/schema';
import {
  DEMO,
  call,
  demoTeamId,
  ensureMember,
  headRevisionId,
  makeAssembly,
  makeInvitation,
  makeJob,
  makeRevision,
  makeShare,
  makeTeam,
  makeUser,
  smallDocument,
  uid,
} from './teamFixtures';

type Who = 'anonymous' | 'guest' | 'checker' | 'engineer' | 'admin' | 'outsider';
const WHO: Who[] = ['anonymous', 'guest', 'checker', 'engineer', 'admin', 'outsider'];

interface Case {
  name: string;
  method: string;
  /** the path and body for this caller (fresh fixtures where the call changes state) */
  prepare: (who: Who) => Promise<{ path: string; body?: unknown }> | { path: string; body?: unknown };
  expect: Record<Who, number>;
}

const s = (anonymous: number, guest: number, checker: number, engineer: number, admin: number, outsider: number): Record<Who, number> => ({
  anonymous,
  guest,
  checker,
  engineer,
  admin,
  outsider,
});
const MEMBERS_READ = s(401, 401, 200, 200, 200, 404);
const EDITORS_CREATE = s(401, 401, 403, 201, 201, 404);
const EDITORS_OK = s(401, 401, 403, 200, 200, 404);
const CHECKERS_CREATE = s(401, 401, 201, 403, 201, 404);
const ADMINS_OK = s(401, 401, 403, 403, 200, 404);
const ALL = (code: number) => s(code, code, code, code, code, code);

let teamId: number;
let otherTeamId: number;
let inviteTeamId: number;
let outsider: { id: string; email: string };
let target: { id: string; email: string };
let jobId: number;
let assemblyId: number;
let issuedRevisionId: number;
let runId: number;
let shareToken: string;
const TEAM_PREFIX = `Matrix team ${uid()}`;

const userOf = (who: Who): string | null =>
  who === 'checker' ? DEMO.checker : who === 'engineer' ? DEMO.engineer : who === 'admin' ? DEMO.admin : who === 'outsider' ? outsider.id : null;
const emailOf: Record<string, string> = {
  [DEMO.checker]: 'ingrid@demo.wallpulse.test',
  [DEMO.engineer]: 'tomas@demo.wallpulse.test',
  [DEMO.admin]: 'noor@demo.wallpulse.test',
};

beforeAll(async () => {
  teamId = await demoTeamId();
  otherTeamId = await makeTeam();
  inviteTeamId = await makeTeam(`${TEAM_PREFIX} invitations`);
  outsider = await makeUser({ teamId: otherTeamId, role: 'admin', verified: false });
  emailOf[outsider.id] = outsider.email;
  target = await makeUser({ teamId, role: 'engineer' });
  jobId = await makeJob(teamId, `Matrix job ${uid()}`);
  assemblyId = await makeAssembly(jobId, 'Matrix assembly');
  await makeRevision(assemblyId, 'draft');
  issuedRevisionId = await makeRevision(assemblyId, 'issued');
  const run = await call('POST', `/api/revisions/${issuedRevisionId}/runs`, { userId: DEMO.engineer, body: { exposure: smallDocument().exposure, summary: { uValue: 1.9 } } });
  runId = ((await run.json()) as { run: { id: number } }).run.id;
  shareToken = (await makeShare(issuedRevisionId)).token;
});

afterAll(async () => {
  await testDb().delete(teams).where(like(teams.name, `${TEAM_PREFIX}%`));
  await closeTestDb();
});

const revisionIn = (state: 'draft' | 'in_check' | 'checked') => async () => ({ path: `/api/revisions/${await makeRevision(assemblyId, state)}/transitions` });

const CASES: Case[] = [
  // accounts
  { name: 'GET /api/auth/me', method: 'GET', prepare: () => ({ path: '/api/auth/me' }), expect: s(401, 401, 200, 200, 200, 200) },
  {
    name: 'POST /api/auth/signup',
    method: 'POST',
    prepare: () => ({ path: '/api/auth/signup', body: { name: 'Matrix Person', email: `signup-${uid()}@example.test`, password: 'a long enough password' } }),
    // answered the same whether or not the address has an account; the mailed link signs in
    expect: ALL(202),
  },
  {
    name: 'POST /api/auth/signin (wrong password)',
    method: 'POST',
    prepare: (who) => ({ path: '/api/auth/signin', body: { email: `nobody-${who}-${uid()}@example.test`, password: 'not the password' } }),
    expect: ALL(401),
  },
  { name: 'POST /api/auth/signout', method: 'POST', prepare: () => ({ path: '/api/auth/signout' }), expect: ALL(204) },
  { name: 'POST /api/auth/verify (unknown token)', method: 'POST', prepare: () => ({ path: '/api/auth/verify', body: { token: 'x'.repeat(43) } }), expect: ALL(410) },
  // the demo people are confirmed already; the outsider is not
  { name: 'POST /api/auth/resend-verification', method: 'POST', prepare: () => ({ path: '/api/auth/resend-verification' }), expect: s(401, 401, 409, 409, 409, 202) },
  { name: 'POST /api/auth/reset-request', method: 'POST', prepare: () => ({ path: '/api/auth/reset-request', body: { email: `nobody-${uid()}@example.test` } }), expect: ALL(202) },
  { name: 'POST /api/auth/reset (unknown token)', method: 'POST', prepare: () => ({ path: '/api/auth/reset', body: { token: 'y'.repeat(43), password: 'a long enough password' } }), expect: ALL(410) },
  // teams
  { name: 'GET /api/teams', method: 'GET', prepare: () => ({ path: '/api/teams' }), expect: s(401, 401, 200, 200, 200, 200) },
  { name: 'POST /api/teams', method: 'POST', prepare: () => ({ path: '/api/teams', body: { name: `${TEAM_PREFIX} ${uid()}` } }), expect: s(401, 401, 201, 201, 201, 201) },
  { name: 'GET /api/teams/:id', method: 'GET', prepare: () => ({ path: `/api/teams/${teamId}` }), expect: MEMBERS_READ },
  { name: 'GET /api/teams/:id/members', method: 'GET', prepare: () => ({ path: `/api/teams/${teamId}/members` }), expect: MEMBERS_READ },
  {
    name: 'PATCH /api/teams/:id/members/:userId',
    method: 'PATCH',
    prepare: async () => {
      await ensureMember(teamId, target.id, 'engineer');
      return { path: `/api/teams/${teamId}/members/${target.id}`, body: { role: 'checker' } };
    },
    expect: ADMINS_OK,
  },
  {
    name: 'DELETE /api/teams/:id/members/:userId (someone else)',
    method: 'DELETE',
    prepare: async () => {
      await ensureMember(teamId, target.id, 'engineer');
      return { path: `/api/teams/${teamId}/members/${target.id}` };
    },
    expect: s(401, 401, 403, 403, 204, 404),
  },
  { name: 'GET /api/teams/:id/invitations', method: 'GET', prepare: () => ({ path: `/api/teams/${teamId}/invitations` }), expect: ADMINS_OK },
  {
    name: 'POST /api/teams/:id/invitations',
    method: 'POST',
    prepare: () => ({ path: `/api/teams/${teamId}/invitations`, body: { email: `invitee-${uid()}@example.test`, role: 'checker' } }),
    expect: s(401, 401, 403, 403, 201, 404),
  },
  {
    name: 'POST /api/invitations/:id/revoke',
    method: 'POST',
    prepare: async () => ({ path: `/api/invitations/${(await makeInvitation(teamId, `revoke-${uid()}@example.test`)).id}/revoke` }),
    expect: ADMINS_OK,
  },
  {
    // signed in: an invitation to a throwaway team for the caller's own address; signed out: a new address without name and password
    name: 'POST /api/invitations/accept',
    method: 'POST',
    prepare: async (who) => {
      const user = userOf(who);
      const email = user ? emailOf[user] : `new-${uid()}@example.test`;
      return { path: '/api/invitations/accept', body: { token: (await makeInvitation(inviteTeamId, email)).token } };
    },
    expect: s(422, 422, 200, 200, 200, 200),
  },
  { name: 'GET /api/teams/:id/shares', method: 'GET', prepare: () => ({ path: `/api/teams/${teamId}/shares` }), expect: MEMBERS_READ },
  { name: 'GET /api/audit?teamId=', method: 'GET', prepare: () => ({ path: `/api/audit?teamId=${teamId}` }), expect: ADMINS_OK },
  // jobs and assemblies
  { name: 'GET /api/jobs?teamId=', method: 'GET', prepare: () => ({ path: `/api/jobs?teamId=${teamId}` }), expect: MEMBERS_READ },
  { name: 'POST /api/jobs', method: 'POST', prepare: () => ({ path: '/api/jobs', body: { teamId, name: `Matrix job ${uid()}` } }), expect: EDITORS_CREATE },
  { name: 'GET /api/jobs/:id', method: 'GET', prepare: () => ({ path: `/api/jobs/${jobId}` }), expect: MEMBERS_READ },
  { name: 'PATCH /api/jobs/:id', method: 'PATCH', prepare: () => ({ path: `/api/jobs/${jobId}`, body: { client: 'Matrix client' } }), expect: EDITORS_OK },
  { name: 'GET /api/jobs/:id/assemblies', method: 'GET', prepare: () => ({ path: `/api/jobs/${jobId}/assemblies` }), expect: MEMBERS_READ },
  { name: 'POST /api/jobs/:id/assemblies', method: 'POST', prepare: () => ({ path: `/api/jobs/${jobId}/assemblies`, body: { name: `Roof ${uid()}`, element: 'roof' } }), expect: EDITORS_CREATE },
  { name: 'GET /api/assemblies/:id', method: 'GET', prepare: () => ({ path: `/api/assemblies/${assemblyId}` }), expect: MEMBERS_READ },
  { name: 'PATCH /api/assemblies/:id', method: 'PATCH', prepare: () => ({ path: `/api/assemblies/${assemblyId}`, body: { description: 'Matrix description' } }), expect: EDITORS_OK },
  { name: 'GET /api/assemblies/:id/revisions', method: 'GET', prepare: () => ({ path: `/api/assemblies/${assemblyId}/revisions` }), expect: MEMBERS_READ },
  {
    name: 'POST /api/assemblies/:id/revisions',
    method: 'POST',
    prepare: async () => ({ path: `/api/assemblies/${assemblyId}/revisions`, body: { baseRevisionId: await headRevisionId(assemblyId), model: smallDocument(), note: 'matrix' } }),
    expect: EDITORS_CREATE,
  },
  // revisions and the check workflow
  { name: 'GET /api/revisions/:id', method: 'GET', prepare: () => ({ path: `/api/revisions/${issuedRevisionId}` }), expect: MEMBERS_READ },
  { name: 'POST /api/revisions/:id/transitions draft → in_check', method: 'POST', prepare: async () => ({ ...(await revisionIn('draft')()), body: { to: 'in_check' } }), expect: EDITORS_CREATE },
  { name: 'POST /api/revisions/:id/transitions in_check → checked', method: 'POST', prepare: async () => ({ ...(await revisionIn('in_check')()), body: { to: 'checked' } }), expect: CHECKERS_CREATE },
  {
    name: 'POST /api/revisions/:id/transitions in_check → sent_back',
    method: 'POST',
    prepare: async () => ({ ...(await revisionIn('in_check')()), body: { to: 'sent_back', note: 'Check the brick conductivity' } }),
    expect: CHECKERS_CREATE,
  },
  { name: 'POST /api/revisions/:id/transitions in_check → draft', method: 'POST', prepare: async () => ({ ...(await revisionIn('in_check')()), body: { to: 'draft' } }), expect: EDITORS_CREATE },
  { name: 'POST /api/revisions/:id/transitions checked → issued', method: 'POST', prepare: async () => ({ ...(await revisionIn('checked')()), body: { to: 'issued' } }), expect: EDITORS_CREATE },
  { name: 'GET /api/revisions/:id/comments', method: 'GET', prepare: () => ({ path: `/api/revisions/${issuedRevisionId}/comments` }), expect: MEMBERS_READ },
  { name: 'POST /api/revisions/:id/comments', method: 'POST', prepare: () => ({ path: `/api/revisions/${issuedRevisionId}/comments`, body: { body: 'Looks right.' } }), expect: s(401, 401, 201, 201, 201, 404) },
  { name: 'GET /api/revisions/:id/runs', method: 'GET', prepare: () => ({ path: `/api/revisions/${issuedRevisionId}/runs` }), expect: MEMBERS_READ },
  {
    name: 'POST /api/revisions/:id/runs',
    method: 'POST',
    prepare: () => ({ path: `/api/revisions/${issuedRevisionId}/runs`, body: { exposure: smallDocument().exposure, summary: { uValue: 1.9, note: 'matrix' } } }),
    expect: EDITORS_CREATE,
  },
  { name: 'GET /api/runs/:id', method: 'GET', prepare: () => ({ path: `/api/runs/${runId}` }), expect: MEMBERS_READ },
  { name: 'GET /api/revisions/:id/shares', method: 'GET', prepare: () => ({ path: `/api/revisions/${issuedRevisionId}/shares` }), expect: MEMBERS_READ },
  { name: 'POST /api/revisions/:id/shares', method: 'POST', prepare: () => ({ path: `/api/revisions/${issuedRevisionId}/shares`, body: { label: 'matrix', expiresInDays: 3 } }), expect: EDITORS_CREATE },
  { name: 'POST /api/shares/:id/revoke', method: 'POST', prepare: async () => ({ path: `/api/shares/${(await makeShare(issuedRevisionId)).id}/revoke` }), expect: EDITORS_OK },
  // what a guest may open: the shared revision, with or without an account
  { name: 'GET /api/shared/:token', method: 'GET', prepare: () => ({ path: `/api/shared/${shareToken}` }), expect: ALL(200) },
  // the screens: signed-out people are sent to sign in, other teams' things are not found
  { name: 'GET /jobs', method: 'GET', prepare: () => ({ path: '/jobs' }), expect: s(302, 302, 200, 200, 200, 200) },
  { name: 'GET /team', method: 'GET', prepare: () => ({ path: '/team' }), expect: s(302, 302, 200, 200, 200, 200) },
  { name: 'GET /jobs/:id', method: 'GET', prepare: () => ({ path: `/jobs/${jobId}` }), expect: s(302, 302, 200, 200, 200, 404) },
  { name: 'GET /assemblies/:id/history', method: 'GET', prepare: () => ({ path: `/assemblies/${assemblyId}/history` }), expect: s(302, 302, 200, 200, 200, 404) },
  { name: 'GET /s/:token', method: 'GET', prepare: () => ({ path: `/s/${shareToken}` }), expect: ALL(200) },
];

describe('authorization matrix', () => {
  for (const c of CASES) {
    it(`answers ${c.name} with ${WHO.map((w) => `${w} ${c.expect[w]}`).join(', ')}`, async () => {
      const got: Record<string, number> = {};
      for (const who of WHO) {
        const { path, body } = await c.prepare(who);
        const res = await call(c.method, path, { userId: userOf(who), body });
        got[who] = res.status;
        // every error is the one JSON shape
        if (res.status >= 400 && path.startsWith('/api/')) {
          const json = (await res.json()) as { error?: { code?: string; message?: string } };
          expect(typeof json.error?.code, `${c.name} as ${who}`).toBe('string');
          expect(typeof json.error?.message, `${c.name} as ${who}`).toBe('string');
        } else await res.arrayBuffer();
      }
      expect(got).toEqual(c.expect);
    });
  }

  it('gives another team a 404 for ids that exist, the same answer as for ids that do not', async () => {
    const existing = await call('GET', `/api/assemblies/${assemblyId}`, { userId: outsider.id });
    const missing = await call('GET', '/api/assemblies/999999999', { userId: outsider.id });
    expect(existing.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(await existing.json()).toEqual(await missing.json());
  });

  it('sets no session cookie for a guest who opens a share link', async () => {
    const res = await call('GET', `/s/${shareToken}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('set-cookie') ?? '').not.toMatch(/wallpulse_session=\w/);
  });
});
