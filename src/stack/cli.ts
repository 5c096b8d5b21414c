/**
 * The stack runner behind `npm start`, `npm test` and `npm run dev`.
 *
 *   start  private MariaDB (unless DATABASE_URL) -> migrations -> demo seed ->
 *          fake SMTP (unless SMTP_URL) -> build if sources changed -> the app
 *   test   the same on a throwaway database and ports, then type checks,
 *          unit + integration tests, the built app, browser and system tests,
 *          and removes everything it made
 *   dev    the same services as start, with `astro dev` instead of the build
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startMariaDb, ensureDebianPackage, type MariaServer } from './mariadb';
import { prepareDatabase } from './database';
import { startFakeSmtp } from './fakeSmtp';
import { ensureBuilt } from './build';
import { startApp, type AppProcess } from './app';
import { freePort, log, portFrom } from './util';
import { DEMO_PEOPLE, DEMO_PASSWORD } from '../lib/server/seed/demoTeam';

const root = fileURLToPath(new URL('../..', import.meta.url));
const command = process.argv[2] ?? 'start';

type Stopper = () => Promise<void>;
const stoppers: Stopper[] = [];
let stopping = false;

/** stop in the reverse order of start: app, mail, database */
async function stopAll(code: number): Promise<void> {
  // a second signal (npm and the shell both pass one on) must not cut the shutdown short
  if (stopping) return;
  stopping = true;
  for (const stop of stoppers.reverse()) {
    try {
      await stop();
    } catch (err) {
      log(`while stopping: ${(err as Error).message}`);
    }
  }
  process.exit(code);
}

for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
  process.on(signal, () => {
    log(`${signal} received, stopping`);
    void stopAll(signal === 'SIGINT' ? 130 : 143);
  });
}

interface Services {
  databaseUrl: string;
  smtpUrl: string;
}

async function startServices(dataDir: string, dbPort: number, smtpPort: number): Promise<Services> {
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const server: MariaServer = await startMariaDb({ dir: path.join(dataDir, 'mariadb'), port: dbPort, database: 'wallpulse', user: 'wallpulse' });
    stoppers.push(() => server.stop());
    databaseUrl = server.url;
  } else {
    log('using the database that DATABASE_URL names');
  }
  const database = await prepareDatabase(databaseUrl, root);
  stoppers.push(() => database.close());
  let smtpUrl = process.env.SMTP_URL;
  if (!smtpUrl) {
    const smtp = await startFakeSmtp(database.db, smtpPort);
    stoppers.push(() => smtp.stop());
    smtpUrl = smtp.url;
  } else {
    log('sending mail through the server that SMTP_URL names');
  }
  return { databaseUrl, smtpUrl };
}

async function start(): Promise<void> {
  const t0 = Date.now();
  const host = process.env.HOST ?? '127.0.0.1';
  const port = portFrom('PORT', 4321);
  const dataDir = path.resolve(root, process.env.WALLPULSE_DATA_DIR ?? '.data');
  mkdirSync(dataDir, { recursive: true });
  const services = await startServices(dataDir, portFrom('DB_PORT', 3307), portFrom('SMTP_PORT', 2525));
  ensureBuilt(root);
  const publicBaseUrl = process.env.PUBLIC_BASE_URL ?? `http://${host}:${port}`;
  const app = await startApp(root, { DATABASE_URL: services.databaseUrl, SMTP_URL: services.smtpUrl, PUBLIC_BASE_URL: publicBaseUrl }, host, port);
  stoppers.push(() => app.stop());
  app.child.once('exit', (code) => {
    if (!stopping) {
      log(`the app exited (code ${code}); stopping the rest`);
      void stopAll(code ?? 1);
    }
  });
  log(`Wallpulse is running at ${app.url} (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s). Ctrl-C stops it.`);
  log(`demo sign-ins (password "${DEMO_PASSWORD}"): ${DEMO_PEOPLE.map((p) => `${p.email} (${p.role})`).join(', ')}`);
}

async function dev(): Promise<void> {
  const dataDir = path.resolve(root, process.env.WALLPULSE_DATA_DIR ?? '.data');
  mkdirSync(dataDir, { recursive: true });
  const services = await startServices(dataDir, portFrom('DB_PORT', 3307), portFrom('SMTP_PORT', 2525));
  const child = spawn(process.execPath, [path.join(root, 'node_modules/astro/astro.js'), 'dev'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, DATABASE_URL: services.databaseUrl, SMTP_URL: services.smtpUrl, ASTRO_TELEMETRY_DISABLED: '1' },
  });
  stoppers.push(async () => {
    child.kill('SIGTERM');
  });
  child.once('exit', (code) => void stopAll(code ?? 0));
}

interface VitestCounts {
  passed: number;
  failed: number;
  skipped: number;
}

/** run vitest projects; the JSON reporter gives the counts for the closing line */
// asynchronous on purpose: the fake SMTP server lives in this process and must keep answering while the tests send mail
async function vitest(projects: string[], env: Record<string, string>, reportFile: string, filters: string[] = []): Promise<VitestCounts & { ok: boolean }> {
  const args = [path.join(root, 'node_modules/vitest/vitest.mjs'), 'run', '--config', 'tests/vitest.config.ts'];
  for (const p of projects) args.push('--project', p);
  // `npm test -- some/file.test.ts`: only the named files, and no complaint from a phase that has none of them
  if (filters.length > 0) args.push('--passWithNoTests', ...filters);
  args.push('--reporter=default', '--reporter=json', `--outputFile.json=${reportFile}`);
  const child = spawn(process.execPath, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
  const r = await new Promise<{ status: number | null }>((resolve) => child.once('exit', (status) => resolve({ status })));
  let counts: VitestCounts = { passed: 0, failed: 0, skipped: 0 };
  if (existsSync(reportFile)) {
    const report = JSON.parse(readFileSync(reportFile, 'utf8')) as {
      numPassedTests: number;
      numFailedTests: number;
      numPendingTests: number;
      numTodoTests: number;
      numFailedTestSuites: number;
    };
    // a file that fails to load has no failed test of its own; count it, so the summary never reads 0 failed
    const failed = report.numFailedTests || report.numFailedTestSuites;
    counts = { passed: report.numPassedTests, failed, skipped: report.numPendingTests + report.numTodoTests };
  }
  return { ...counts, ok: r.status === 0 };
}

function step(name: string, cmd: string, args: string[]): boolean {
  log(name);
  const r = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' } });
  if (r.status !== 0) log(`${name}: FAILED`);
  return r.status === 0;
}

async function test(): Promise<void> {
  const t0 = Date.now();
  // file filters after `npm test --` run only those test files (and skip the type checks)
  const filters = process.argv.slice(3);
  ensureDebianPackage('chromium', 'chromium');
  const dataDir = path.join(root, '.data', `test-${process.pid}`);
  rmSync(dataDir, { recursive: true, force: true });
  mkdirSync(dataDir, { recursive: true });
  stoppers.unshift(async () => rmSync(dataDir, { recursive: true, force: true }));
  // a throwaway database and ports of its own, so a running `npm start` is left alone
  delete process.env.DATABASE_URL;
  delete process.env.SMTP_URL;
  const smtpPort = await freePort();
  const services = await startServices(dataDir, await freePort(), smtpPort);
  const env = {
    WALLPULSE_OUT_DIR: path.join(dataDir, 'dist'),
    DATABASE_URL: services.databaseUrl,
    SMTP_URL: services.smtpUrl,
    WALLPULSE_TEST_DATA_DIR: dataDir,
    ASTRO_TELEMETRY_DISABLED: '1',
  };
  Object.assign(process.env, env);

  let ok = true;
  const total: VitestCounts = { passed: 0, failed: 0, skipped: 0 };
  const add = (c: VitestCounts & { ok: boolean }) => {
    total.passed += c.passed;
    total.failed += c.failed;
    total.skipped += c.skipped;
    ok &&= c.ok;
  };

  if (filters.length === 0) {
    ok = step('type check: the thermal engine alone (ES2022, no DOM, no Node types)', 'npx', ['tsc', '-p', 'src/lib/thermal/tsconfig.json']) && ok;
    ok = step('type check: the moisture check alone (ES2022, no DOM, no Node types)', 'npx', ['tsc', '-p', 'src/lib/moisture/tsconfig.json']) && ok;
    ok = step('type check: astro check', process.execPath, [path.join(root, 'node_modules/astro/astro.js'), 'check', '--minimumSeverity', 'warning']) && ok;
  }
  add(await vitest(['unit', 'integration'], env, path.join(dataDir, 'vitest-1.json'), filters));

  try {
    ensureBuilt(root);
    const port = await freePort();
    const app: AppProcess = await startApp(root, { ...env, PUBLIC_BASE_URL: `http://127.0.0.1:${port}` }, '127.0.0.1', port);
    stoppers.push(() => app.stop());
    add(await vitest(['e2e'], { ...env, WALLPULSE_BASE_URL: app.url }, path.join(dataDir, 'vitest-2.json'), filters));
  } catch (err) {
    log(`could not run the browser tests: ${(err as Error).message}`);
    ok = false;
  }

  log(`all tests finished in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
  console.log(`summary: ${total.passed} passed, ${total.failed} failed, ${total.skipped} skipped`);
  await stopAll(ok && total.failed === 0 ? 0 : 1);
}

const commands: Record<string, () => Promise<void>> = { start, test, dev };
const run = commands[command];
if (!run) {
  console.error(`unknown command "${command}"; use start, test or dev`);
  process.exit(2);
}
run().catch(async (err: Error) => {
  console.error(`[wallpulse] ${err.message}`);
  await stopAll(1);
});
