// the load figures of `npm run bench`: autocannon against the built app on loopback, a few
// seconds per target at 200 requests/s, latency percentiles from every answer.
// uses the app at WALLPULSE_BASE_URL (with DATABASE_URL); run.ts starts one when none is given.
import { createRequire } from 'node:module';
import os from 'node:os';
import { readFileSync, readdirSync, readlinkSync } from 'node:fs';
import type { BenchRow } from './engine.ts';

export const LOAD_GROUP = 'load (autocannon on 127.0.0.1)';
/** requests per second, over all connections */
const RATE = 200;
const CONNECTIONS = 10;
/** seconds measured per target, after a short warm-up */
const SECONDS = 4;

interface Target {
  name: string;
  path: string;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  body?: string;
  /** the p95 target, ms */
  p95Target?: number;
}

// autocannon ships no types; the little of it used here
interface Instance {
  on(event: 'response', fn: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): void;
  on(event: 'reqError', fn: (err: Error) => void): void;
}
type Autocannon = (
  opts: { url: string; method: string; headers?: Record<string, string>; body?: string; connections: number; overallRate?: number; duration?: number; amount?: number; timeout?: number },
  done: (err: Error | null, result: { duration: number }) => void,
) => Instance;
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

interface Measured {
  name: string;
  p50: number;
  p95: number;
  p99: number;
  /** answers per second actually received */
  rate: number;
  answers: number;
  non2xx: Record<string, number>;
  errors: number;
  /** CPU time per answer of the app and of the database server, ms (NaN where unknown) */
  appCpu?: number;
  dbCpu?: number;
}

/** the process listening on a loopback TCP port (Linux /proc), or null where that cannot be read */
function pidListeningOn(port: number): number | null {
  try {
    const hex = port.toString(16).toUpperCase().padStart(4, '0');
    const inodes = new Set<string>();
    for (const file of ['/proc/net/tcp', '/proc/net/tcp6']) {
      for (const line of readFileSync(file, 'utf8').split('\n').slice(1)) {
        const f = line.trim().split(/\s+/);
        // local address ends in :PORT, state 0A is LISTEN
        if (f[1]?.endsWith(`:${hex}`) && f[3] === '0A') inodes.add(f[9]);
      }
    }
    for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
      let fds: string[];
      try {
        fds = readdirSync(`/proc/${pid}/fd`);
      } catch {
        continue;
      }
      for (const fd of fds) {
        try {
          const m = /^socket:\[(\d+)\]$/.exec(readlinkSync(`/proc/${pid}/fd/${fd}`));
          if (m && inodes.has(m[1])) return Number(pid);
        } catch {
          // gone meanwhile
        }
      }
    }
  } catch {
    // not Linux, or /proc not readable
  }
  return null;
}

/** CPU time a process has used, ms (user + system), or NaN */
function cpuMs(pid: number | null): number {
  if (pid === null) return NaN;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // fields 14 and 15 of stat (utime, stime), in clock ticks of 10 ms on Linux
    return (Number(f[11]) + Number(f[12])) * 10;
  } catch {
    return NaN;
  }
}

/** nearest-rank percentile of sorted values */
const percentile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN);

function blast(base: string, t: Target, opts: { overallRate?: number; duration?: number; amount?: number }): Promise<Measured> {
  return new Promise((resolve, reject) => {
    const latencies: number[] = [];
    const non2xx: Record<string, number> = {};
    let errors = 0;
    const instance = autocannon(
      { url: base + t.path, method: t.method ?? 'GET', headers: t.headers, body: t.body, connections: CONNECTIONS, timeout: 10, ...opts },
      (err, result) => {
        if (err) return reject(err);
        const sorted = latencies.slice().sort((a, b) => a - b);
        resolve({
          name: t.name,
          p50: percentile(sorted, 50),
          p95: percentile(sorted, 95),
          p99: percentile(sorted, 99),
          rate: latencies.length / (opts.duration ?? result.duration),
          answers: latencies.length,
          non2xx,
          errors,
        });
      },
    );
    instance.on('response', (_client, statusCode, _bytes, responseTime) => {
      latencies.push(responseTime);
      if (statusCode < 200 || statusCode > 299) non2xx[statusCode] = (non2xx[statusCode] ?? 0) + 1;
    });
    instance.on('reqError', () => errors++);
  });
}

async function api(base: string, method: string, path: string, cookie: string, body?: unknown) {
  const res = await fetch(base + path, {
    method,
    headers: { origin: base, cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return res.json();
}

export async function loadBench(): Promise<BenchRow[]> {
  const base = process.env.WALLPULSE_BASE_URL ?? '';
  // load goes to this machine only
  if (new URL(base).hostname !== '127.0.0.1') throw new Error(`the load bench runs against 127.0.0.1 only, not ${base}`);
  const { testDb, closeTestDb, sessionFor } = await import('../support/db.ts');
  const { jobs } = await import('../../src/lib/server/db/schema.ts');
  const { DEMO_JOB_NAME } = await import('../../src/lib/server/seed/demoJob.ts');
  const { DEMO_PASSWORD } = await import('../../src/lib/server/seed/demoTeam.ts');
  const { eq } = await import('drizzle-orm');
  try {
    const engineer = `wallpulse_session=${await sessionFor('demo-engineer')}`;
    const checker = `wallpulse_session=${await sessionFor('demo-checker')}`;
    const demoJob = (await testDb().select({ id: jobs.id, teamId: jobs.teamId }).from(jobs).where(eq(jobs.name, DEMO_JOB_NAME)).limit(1))[0];
    if (!demoJob) throw new Error('the demo job is not seeded');

    // an issued revision with a share link, made through the API as people do
    const job = await api(base, 'POST', '/api/jobs', engineer, { teamId: demoJob.teamId, name: `Load bench ${new Date().toISOString()}`, notes: 'Made by npm run bench.' });
    const made = await api(base, 'POST', `/api/jobs/${job.job.id}/assemblies`, engineer, { name: 'West wall, as shared', element: 'wall' });
    const rev = made.revision.id;
    await api(base, 'POST', `/api/revisions/${rev}/transitions`, engineer, { to: 'in_check' });
    await api(base, 'POST', `/api/revisions/${rev}/transitions`, checker, { to: 'checked' });
    await api(base, 'POST', `/api/revisions/${rev}/transitions`, engineer, { to: 'issued' });
    const share = await api(base, 'POST', `/api/revisions/${rev}/shares`, engineer, { label: 'load bench' });
    const token = new URL(share.share.url).pathname.split('/').pop();

    const targets: Target[] = [
      { name: 'job read API (GET /api/jobs/:id)', path: `/api/jobs/${demoJob.id}`, headers: { cookie: engineer }, p95Target: 50 },
      { name: 'shared-view page (GET /s/:token)', path: `/s/${token}`, p95Target: 50 },
      { name: 'shared-view API (GET /api/shared/:token)', path: `/api/shared/${token}` },
      {
        name: 'sign-in (POST /api/auth/signin)',
        path: '/api/auth/signin',
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: base },
        body: JSON.stringify({ email: 'tomas@demo.wallpulse.test', password: DEMO_PASSWORD }),
      },
    ];
    // the CPU each answer costs the app and the database: a figure that holds on a busy machine too
    const appPid = pidListeningOn(Number(new URL(base).port));
    const dbPort = Number(new URL(process.env.DATABASE_URL ?? 'mysql://x@127.0.0.1:3306/x').port || 3306);
    const dbPid = pidListeningOn(dbPort);
    const measured: Measured[] = [];
    for (const t of targets) {
      await blast(base, t, { amount: 50 }); // warm-up: code paths compiled, pools filled
      const [app0, db0] = [cpuMs(appPid), cpuMs(dbPid)];
      const m = await blast(base, t, { overallRate: RATE, duration: SECONDS });
      m.appCpu = (cpuMs(appPid) - app0) / m.answers;
      m.dbCpu = (cpuMs(dbPid) - db0) / m.answers;
      measured.push(m);
    }

    // the machine's own load says how far the figures stand for the app alone
    const load = os.loadavg()[0];
    console.log(`\n[${LOAD_GROUP}: ${RATE} requests/s over ${CONNECTIONS} connections, ${SECONDS} s per target; load average ${load.toFixed(1)} on ${os.cpus().length} cores]`);
    const w = Math.max(...measured.map((m) => m.name.length)) + 2;
    console.log(`  ${'target'.padEnd(w)}${'p50'.padStart(9)}${'p95'.padStart(9)}${'p99'.padStart(9)}${'answers/s'.padStart(11)}${'app CPU'.padStart(10)}${'db CPU'.padStart(9)}  not 2xx`);
    const cpu = (v: number | undefined) => (v === undefined || !Number.isFinite(v) ? '—' : `${v.toFixed(1)} ms`);
    for (const m of measured) {
      const bad = Object.entries(m.non2xx).map(([code, n]) => `${n}× ${code}`);
      if (m.errors) bad.push(`${m.errors} errors`);
      console.log(
        `  ${m.name.padEnd(w)}${`${m.p50.toFixed(0)} ms`.padStart(9)}${`${m.p95.toFixed(0)} ms`.padStart(9)}${`${m.p99.toFixed(0)} ms`.padStart(9)}${m.rate.toFixed(0).padStart(11)}${cpu(m.appCpu).padStart(10)}${cpu(m.dbCpu).padStart(9)}  ${bad.join(', ') || '—'}`,
      );
    }
    return measured.map((m, i) => {
      const target = targets[i].p95Target;
      const clean = Object.keys(m.non2xx).length === 0 && m.errors === 0;
      return {
        group: LOAD_GROUP,
        name: `${m.name} p95 at ${RATE}/s`,
        value: m.p95,
        unit: 'ms',
        target: target === undefined ? '' : `< ${target} ms, all 2xx`,
        met: target === undefined ? undefined : m.p95 < target && clean,
      };
    });
  } finally {
    await closeTestDb();
  }
}
