import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { log } from './util';

const INPUTS = ['src', 'public', 'astro.config.mjs', 'tsconfig.json', 'package-lock.json'];

function hashTree(root: string): string {
  const h = createHash('sha256');
  const walk = (rel: string) => {
    const abs = path.join(root, rel);
    if (!existsSync(abs)) return;
    const st = statSync(abs);
    if (st.isDirectory()) {
      for (const name of readdirSync(abs).sort()) walk(path.join(rel, name));
    } else {
      h.update(rel).update('\0').update(readFileSync(abs)).update('\0');
    }
  };
  for (const input of INPUTS) walk(input);
  return h.digest('hex');
}

/** where the build goes: dist/, or WALLPULSE_OUT_DIR (the test command's own folder) */
export function outDir(root: string): string {
  return path.resolve(root, process.env.WALLPULSE_OUT_DIR ?? 'dist');
}

/** build the app unless the output folder was built from exactly these sources */
export function ensureBuilt(root: string): void {
  const out = outDir(root);
  const stamp = path.join(out, '.wallpulse-build');
  const digest = hashTree(root);
  if (existsSync(stamp) && readFileSync(stamp, 'utf8') === digest && existsSync(path.join(out, 'server/entry.mjs'))) {
    log(`the build in ${path.relative(root, out)}/ is up to date`);
    return;
  }
  log('building the app (astro build)');
  const r = spawnSync(process.execPath, [path.join(root, 'node_modules/astro/astro.js'), 'build'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' },
  });
  if (r.status !== 0) throw new Error('astro build failed');
  writeFileSync(stamp, digest);
}
