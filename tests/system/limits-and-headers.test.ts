// request bodies are counted as they arrive and refused past the limit of their kind of
// address (chunked ones too), without the app holding them in memory; JSON nesting and string
// lengths are bounded; JSON endpoints refuse other content types and other sites; every
// response, static files and errors included, carries the security headers
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import { eq } from 'drizzle-orm';
import { closeTestDb, demoAssembly, DEMO_HEAVY_WALL, sessionFor, testDb, SESSION_COOKIE } from '../support/db';
import { baseUrl } from '../support/browser';
import { runs, uploads } from '../../src/lib/server/db/schema';
import { startApp, type AppProcess } from '../../src/stack/app';
import { freePort } from '../../src/stack/util';
import { DEMO, demoTeamId, headRevisionId, smallDocument } from './teamFixtures';

let own: AppProcess;
let cookie: string;

beforeAll(async () => {
  if (!process.env.WALLPULSE_OUT_DIR) throw new Error('WALLPULSE_OUT_DIR is not set: run the tests with `npm test`, which builds the app there');
  const port = await freePort();
  // an instance of its own, so its memory can be read while it refuses a large body
  own = await startApp(process.cwd(), { PUBLIC_BASE_URL: `http://127.0.0.1:${port}` }, '127.0.0.1', port);
  cookie = `${SESSION_COOKIE}=${await sessionFor(DEMO.engineer)}`;
});

afterAll(async () => {
  await own?.stop();
  await closeTestDb();
});

/** resident memory of a process now and at its peak, MB (Linux /proc) */
function memoryOf(pid: number): { rss: number; peak: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (name: string) => Number(new RegExp(`${name}:\\s+(\\d+)`).exec(status)?.[1] ?? 0);
  return { rss: kb('VmRSS') / 1024, peak: kb('VmHWM') / 1024 };
}

/** stream `totalBytes` of JSON-looking text in 1 MB chunks (chunked transfer, no Content-Length) */
function streamBody(url: string, path: string, totalBytes: number, headers: Record<string, string> = {}): Promise<{ status: number; body: string; sentBytes: number }> {
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered: { status: number; body: string } | null = null;
    const req = http.request(`${url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', origin: url, ...headers } }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c) => (body += c));
      res.on('end', () => {
        answered = { status: res.statusCode ?? 0, body };
        resolve({ ...answered, sentBytes: sent });
      });
    });
    req.on('error', (err) => {
      // the server closes the connection after its 413; the answer may already be in
      if (!answered) reject(err);
    });
    const chunk = Buffer.alloc(1024 * 1024, 0x20);
    chunk[0] = 0x5b; // "["
    const write = () => {
      while (sent < totalBytes) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once('drain', write);
      }
      req.end();
    };
    write();
  });
}

const post = (path: string, body: string, headers: Record<string, string> = {}) =>
  fetch(`${baseUrl()}${path}`, { method: 'POST', headers: { origin: baseUrl(), 'content-type': 'application/json', cookie, ...headers }, body });

describe('body limits', () => {
  it('refuses a 200 MB body with 413 while the app stays under 400 MB of memory', async () => {
    const before = memoryOf(own.child.pid!);
    const signIn = await streamBody(own.url, '/api/auth/signin', 200 * 1024 * 1024);
    expect(signIn.status).toBe(413);
    expect(JSON.parse(signIn.body).error.code).toBe('too_large');
    const upload = await streamBody(own.url, '/api/uploads', 200 * 1024 * 1024, { cookie });
    expect(upload.status).toBe(413);
    const after = memoryOf(own.child.pid!);
    console.log(`app memory: ${before.rss.toFixed(0)} MB before, ${after.rss.toFixed(0)} MB after, peak ${after.peak.toFixed(0)} MB`);
    expect(after.peak).toBeLessThan(400);
    // it still answers
    expect((await fetch(`${own.url}/api/health`)).status).toBe(200);
  });

  it('counts a chunked run past 8 MB and refuses it, storing nothing', async () => {
    const revisionId = await headRevisionId(await demoAssembly(DEMO_HEAVY_WALL));
    const before = await testDb().select({ id: runs.id }).from(runs).where(eq(runs.revisionId, revisionId));
    const series = 'x'.repeat(12 * 1024 * 1024);
    const body = JSON.stringify({ exposure: {}, summary: {}, series });
    // a ReadableStream body goes out chunked, without Content-Length
    const stream = new ReadableStream({
      start(controller) {
        const bytes = new TextEncoder().encode(body);
        for (let i = 0; i < bytes.length; i += 1 << 20) controller.enqueue(bytes.subarray(i, i + (1 << 20)));
        controller.close();
      },
    });
    const res = await fetch(`${baseUrl()}/api/revisions/${revisionId}/runs`, {
      method: 'POST',
      headers: { origin: baseUrl(), 'content-type': 'application/json', cookie },
      body: stream,
      duplex: 'half',
    } as RequestInit).catch((err: Error) => ({ status: 0, json: async () => ({ error: { code: err.message } }) }));
    expect(res.status).toBe(413);
    const after = await testDb().select({ id: runs.id }).from(runs).where(eq(runs.revisionId, revisionId));
    expect(after.length).toBe(before.length);
  });

  it('refuses a revision over 2 MB, and a layer id over 100 characters', async () => {
    const assemblyId = await demoAssembly(DEMO_HEAVY_WALL);
    const baseRevisionId = await headRevisionId(assemblyId);
    const big = smallDocument();
    big.layers[0].note = 'n'.repeat(1900);
    const huge = JSON.stringify({ baseRevisionId, model: { ...big, padding: 'p'.repeat(3 * 1024 * 1024) }, note: '' });
    expect((await post(`/api/assemblies/${assemblyId}/revisions`, huge)).status).toBe(413);

    const longId = smallDocument();
    longId.layers[0].id = 'i'.repeat(5000);
    const res = await post(`/api/assemblies/${assemblyId}/revisions`, JSON.stringify({ baseRevisionId, model: longId, note: '' }));
    expect(res.status).toBe(422);
    expect(Object.keys((await res.json()).error.fields)).toContain('model.layers[0].id');
    expect(await headRevisionId(assemblyId)).toBe(baseRevisionId);
  });

  it('refuses a sign-in body over 64 KB with the JSON error shape', async () => {
    const res = await post('/api/auth/signin', JSON.stringify({ email: 'a@example.test', password: 'p'.repeat(70 * 1024) }));
    expect(res.status).toBe(413);
    const body = await res.json();
    expect(body.error.code).toBe('too_large');
    expect(body.error.message).toMatch(/64 KB/);
  });

  it('answers 400, not 500, to JSON nested 10,000 levels deep', async () => {
    const deep = '['.repeat(10_000) + ']'.repeat(10_000);
    for (const path of ['/api/auth/signin', '/api/auth/reset-request', '/api/uploads']) {
      const res = await post(path, deep);
      expect(res.status, path).toBe(400);
      expect((await res.json()).error.code).toBe('too_deep');
    }
  });
});

describe('JSON endpoints', () => {
  it('refuse a body that is not JSON with 415', async () => {
    for (const type of ['text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/xml']) {
      const res = await post('/api/teams', 'name=Studio', { 'content-type': type });
      expect(res.status, type).toBe(415);
      expect((await res.json()).error.code).toBe('unsupported_media_type');
    }
  });

  it('refuse a write from another site with 403', async () => {
    const res = await post('/api/teams', JSON.stringify({ name: 'Cross-site studio' }), { origin: 'https://evil.example' });
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe('cross_site');
    const fetchSite = await post('/api/teams', JSON.stringify({ name: 'Cross-site studio' }), { origin: baseUrl(), 'sec-fetch-site': 'cross-site' });
    expect(fetchSite.status).toBe(403);
  });

  it('mark an upload as not to be kept by any cache', async () => {
    const teamId = await demoTeamId();
    const [row] = await testDb()
      .insert(uploads)
      .values({ teamId, name: 'Cache check', fileName: 'cache.csv', mapping: {}, series: { air: [1, 2], irradiance: null, stepSeconds: 3600 }, rowCount: 2, createdBy: DEMO.engineer })
      .$returningId();
    const res = await fetch(`${baseUrl()}/api/uploads/${row.id}`, { headers: { cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toMatch(/no-store/);
    expect(res.headers.get('cache-control')).toMatch(/private/);
    await testDb().delete(uploads).where(eq(uploads.id, row.id));
  });
});

describe('security headers', () => {
  it('are on every response: pages, JSON, static files, redirects and errors', async () => {
    const assets = (await (await fetch(`${baseUrl()}/signin`)).text()).match(/\/_astro\/[^"']+\.(?:js|css)/g) ?? [];
    expect(assets.length).toBeGreaterThan(0);
    const paths = ['/', '/signin', '/api/health', '/favicon.svg', assets[0], '/jobs', '/no-such-page', '/api/no-such-endpoint', '/_astro/missing.js'];
    for (const path of paths) {
      const res = await fetch(`${baseUrl()}${path}`, { redirect: 'manual' });
      const csp = res.headers.get('content-security-policy') ?? '';
      expect(csp, path).toMatch(/default-src 'self'/);
      expect(csp, path).toMatch(/frame-ancestors 'none'/);
      expect(csp, path).toMatch(/object-src 'none'/);
      expect(csp, path).not.toMatch(/unsafe-eval/);
      expect(csp, path).not.toMatch(/script-src[^;]*unsafe-inline/);
      expect(res.headers.get('permissions-policy'), path).toMatch(/camera=\(\)/);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
    }
    const tooLarge = await post('/api/auth/signin', 'x'.repeat(100 * 1024));
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.headers.get('content-security-policy')).toMatch(/default-src 'self'/);
  });

  it('a page’s policy allows its own inline scripts by hash only', async () => {
    const res = await fetch(`${baseUrl()}/signin`);
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toMatch(/script-src 'self'( 'sha256-[A-Za-z0-9+/=]+')*;/);
    expect(csp).toMatch(/worker-src 'self'/);
    expect(csp).toMatch(/font-src 'self'/);
  });
});
