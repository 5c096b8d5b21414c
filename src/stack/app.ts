import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { sleep, waitForExit } from './util';
import { outDir } from './build';

export interface AppProcess {
  child: ChildProcess;
  url: string;
  stop(): Promise<void>;
}

/**
 * Run the built app behind our own small server (serve.mjs: trusted client address, body
 * limits, security headers on every response) and wait until /api/health says the database answers.
 */
export async function startApp(root: string, env: Record<string, string>, host: string, port: number): Promise<AppProcess> {
  const child = spawn(process.execPath, [path.join(root, 'src/stack/serve.mjs'), path.join(outDir(root), 'server/entry.mjs')], {
    cwd: root,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, ...env, HOST: host, PORT: String(port), ASTRO_TELEMETRY_DISABLED: '1' },
  });
  const url = `http://${host}:${port}`;
  const started = Date.now();
  let exited = false;
  child.once('exit', () => (exited = true));
  for (;;) {
    if (exited) throw new Error('the app exited during start-up (see its messages above)');
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() - started > 60_000) throw new Error(`the app did not answer on ${url} within 60 s`);
    await sleep(100);
  }
  return {
    child,
    url,
    async stop() {
      if (exited || child.pid === undefined) return;
      child.kill('SIGTERM');
      if (!(await waitForExit(child.pid, 10_000))) child.kill('SIGKILL');
    },
  };
}
