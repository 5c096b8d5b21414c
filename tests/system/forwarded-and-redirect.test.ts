// who the client is (X-Forwarded-For believed only from a configured proxy), the sign-in,
// reset and sign-up limits that hang on it (kept in MariaDB, so two instances count together),
// and where "next" may send the browser after signing in (only this origin)
import { describe, it, expect, beforeAll, beforeEach, afterAll } from 'vitest';
import { desc, eq, sql } from 'drizzle-orm';
import { closeTestDb, sessionFor, testDb, SESSION_COOKIE } from '../support/db';
import { baseUrl } from '../support/browser';
import { auditLog, outboundMail } from '../../src/lib/server/db/schema';
import { startApp, type AppProcess } from '../../src/stack/app';
import { freePort } from '../../src/stack/util';
import { DEMO, PASSWORD, makeUser, uid } from './teamFixtures';

/** a second instance on the same database that trusts a proxy on loopback */
let proxied: AppProcess;

beforeAll(async () => {
  if (!process.env.WALLPULSE_OUT_DIR) throw new Error('WALLPULSE_OUT_DIR is not set: run the tests with `npm test`, which builds the app there');
  const port = await freePort();
  proxied = await startApp(process.cwd(), { PUBLIC_BASE_URL: `http://127.0.0.1:${port}`, TRUSTED_PROXIES: 'loopback' }, '127.0.0.1', port);
});

/** the limits this file used up must not reach the files after it (they come from 127.0.0.1 too) */
async function forgetLimits() {
  await testDb()
    .execute(sql`delete from rate_limits where \`key\` like '%127.0.0.1%' or \`key\` like '%example.test%' or \`key\` like '%203.0.113.%'`)
    // a build without the shared limits has no such table
    .catch(() => undefined);
}

beforeEach(forgetLimits);

afterAll(async () => {
  await forgetLimits();
  await proxied?.stop();
  await closeTestDb();
});

async function signIn(base: string, email: string, password: string, forwardedFor?: string): Promise<Response> {
  const headers: Record<string, string> = { origin: base, 'content-type': 'application/json' };
  if (forwardedFor) headers['x-forwarded-for'] = forwardedFor;
  return fetch(`${base}/api/auth/signin`, { method: 'POST', headers, body: JSON.stringify({ email, password }) });
}

const auditIps = async (email: string) =>
  (await testDb().select({ ip: auditLog.ip, action: auditLog.action }).from(auditLog).where(eq(auditLog.target, email)).orderBy(auditLog.id)).map((r) => r.ip);

describe('the client address', () => {
  it('ignores a made-up X-Forwarded-For: forged addresses get no fresh tries, and the audit log keeps the socket address', async () => {
    const { email } = await makeUser();
    for (let i = 0; i < 5; i++) expect((await signIn(baseUrl(), email, `wrong guess ${i}`, `198.51.100.${i + 1}`)).status).toBe(401);
    const right = await signIn(baseUrl(), email, PASSWORD, '198.51.100.99');
    expect(right.status).toBe(429);
    expect(new Set(await auditIps(email))).toEqual(new Set(['127.0.0.1']));
    await forgetLimits();
  });

  it('believes X-Forwarded-For from a trusted proxy: the audit log keeps the forwarded client, limited per client', async () => {
    const { email } = await makeUser();
    for (let i = 0; i < 5; i++) expect((await signIn(proxied.url, email, `wrong guess ${i}`, '203.0.113.7')).status).toBe(401);
    expect((await signIn(proxied.url, email, PASSWORD, '203.0.113.7')).status).toBe(429);
    // another client behind the same proxy has its own count for this address
    expect((await signIn(proxied.url, email, PASSWORD, '203.0.113.8')).status).toBe(200);
    const ips = await auditIps(email);
    expect(ips.slice(0, 5)).toEqual(Array(5).fill('203.0.113.7'));
    expect(ips.at(-1)).toBe('203.0.113.8');
  });

  it('keeps the count in the database: failures on one instance count on the other', async () => {
    const { email } = await makeUser();
    for (let i = 0; i < 3; i++) expect((await signIn(baseUrl(), email, `wrong ${i}`)).status).toBe(401);
    // the proxied instance sees 127.0.0.1 too when no proxy header is given
    for (let i = 0; i < 2; i++) expect((await signIn(proxied.url, email, `wrong again ${i}`)).status).toBe(401);
    expect((await signIn(baseUrl(), email, PASSWORD)).status).toBe(429);
    expect((await signIn(proxied.url, email, PASSWORD)).status).toBe(429);
    await forgetLimits();
  });

  it('limits one source trying many accounts, whatever the addresses', async () => {
    const answers: number[] = [];
    for (let i = 0; i < 32; i++) answers.push((await signIn(baseUrl(), `nobody-${uid()}@example.test`, 'not the password', `192.0.2.${i}`)).status);
    expect(answers.slice(0, 30)).toEqual(Array(30).fill(401));
    expect(answers.slice(30)).toEqual([429, 429]);
    // a person with the right password from that source waits too, until the window passes
    expect((await signIn(baseUrl(), 'tomas@demo.wallpulse.test', 'wallpulse-demo')).status).toBe(429);
    await forgetLimits();
  });

  it('limits password-reset requests per address: the fourth in an hour is refused and sends nothing', async () => {
    const { email } = await makeUser();
    const answers: number[] = [];
    for (let i = 0; i < 5; i++) {
      const res = await fetch(`${baseUrl()}/api/auth/reset-request`, { method: 'POST', headers: { origin: baseUrl(), 'content-type': 'application/json', 'x-forwarded-for': `198.51.100.${i}` }, body: JSON.stringify({ email }) });
      answers.push(res.status);
    }
    expect(answers).toEqual([202, 202, 202, 429, 429]);
    expect(await testDb().select().from(outboundMail).where(eq(outboundMail.toAddress, email))).toHaveLength(3);
    await forgetLimits();
  });

  it('limits sign-ups per address', async () => {
    const email = `twice-${uid()}@example.test`;
    const answers: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await fetch(`${baseUrl()}/api/auth/signup`, { method: 'POST', headers: { origin: baseUrl(), 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Twice', email, password: 'a long enough password' }) });
      answers.push(res.status);
    }
    expect(answers).toEqual([202, 202, 202, 429]);
    await forgetLimits();
  });
});

// where "next" leads after signing in
const HOSTILE_NEXT = [
  '%2F%09%2Fevil.example%2F',
  '/%09/evil.example/',
  '//evil.example/',
  '%2F%2Fevil.example',
  '/\\evil.example',
  '%2F%5Cevil.example',
  '/%5C/evil.example',
  'https://evil.example/',
  'https:evil.example',
  'javascript:alert(1)',
  '%20//evil.example',
  '/%0D%0ASet-Cookie:%20stolen=1',
  '/%0A/evil.example',
  '%0D%0A//evil.example',
  '/%E2%80%A8/evil.example',
  '/.%2F%2Fevil.example',
  '///evil.example',
  '\\\\evil.example',
];

describe('the next address after signing in', () => {
  const origin = () => new URL(baseUrl()).origin;

  it('sends a signed-in person only to a path of this origin, and never answers 500', async () => {
    const cookie = `${SESSION_COOKIE}=${await sessionFor(DEMO.engineer)}`;
    for (const next of HOSTILE_NEXT) {
      const res = await fetch(`${baseUrl()}/signin?next=${next}`, { headers: { cookie }, redirect: 'manual' });
      expect(res.status, next).toBeGreaterThanOrEqual(300);
      expect(res.status, next).toBeLessThan(400);
      const location = res.headers.get('location') ?? '';
      expect(new URL(location, baseUrl()).origin, `${next} → ${location}`).toBe(origin());
      expect(location, next).toMatch(/^\/(?![/\\])/);
      expect(res.headers.get('set-cookie') ?? '', next).not.toMatch(/stolen/);
    }
  });

  it('sends a person who signs in through the form only to a path of this origin', async () => {
    const { email } = await makeUser();
    for (const next of HOSTILE_NEXT.slice(0, 6)) {
      const res = await fetch(`${baseUrl()}/signin?next=${next}`, {
        method: 'POST',
        headers: { origin: baseUrl(), 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams({ email, password: PASSWORD }).toString(),
        redirect: 'manual',
      });
      expect(res.status, next).toBe(303);
      expect(new URL(res.headers.get('location') ?? '', baseUrl()).origin, next).toBe(origin());
    }
    await forgetLimits();
  });

  it('keeps a same-origin next as it was, query included', async () => {
    const cookie = `${SESSION_COOKIE}=${await sessionFor(DEMO.engineer)}`;
    const res = await fetch(`${baseUrl()}/signin?next=${encodeURIComponent('/jobs?team=1&x=%2F')}`, { headers: { cookie }, redirect: 'manual' });
    expect(res.headers.get('location')).toBe('/jobs?team=1&x=%2F');
  });
});

describe('the audit log', () => {
  it('records the address the server trusts for a successful sign-in', async () => {
    const { email } = await makeUser();
    expect((await signIn(baseUrl(), email, PASSWORD, '198.51.100.200')).status).toBe(200);
    const [row] = await testDb().select().from(auditLog).where(eq(auditLog.target, email)).orderBy(desc(auditLog.id)).limit(1);
    expect(row).toMatchObject({ action: 'sign_in', ip: '127.0.0.1' });
  });
});
