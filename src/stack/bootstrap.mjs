// The entry of `npm start` and `npm test`: install the locked packages when the
// lock file changed since the last install, then hand over to the TypeScript
// stack runner. Plain JavaScript, because nothing else is installed yet.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { spawn, spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = fileURLToPath(new URL('../..', import.meta.url));
const lockFile = path.join(root, 'package-lock.json');
const stamp = path.join(root, 'node_modules', '.wallpulse-lock');

function lockHash() {
  return createHash('sha256').update(readFileSync(lockFile)).digest('hex');
}

if (!existsSync(stamp) || readFileSync(stamp, 'utf8') !== lockHash()) {
  console.log('[wallpulse] installing packages from package-lock.json (npm ci)');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error('[wallpulse] npm ci failed');
    process.exit(r.status ?? 1);
  }
  writeFileSync(stamp, lockHash());
}

const tsx = path.join(root, 'node_modules', 'tsx', 'dist', 'cli.mjs');
const child = spawn(process.execPath, [tsx, path.join(root, 'src/stack/cli.ts'), ...process.argv.slice(2)], {
  cwd: root,
  stdio: 'inherit',
});
// the runner stops what it started on these signals; pass them on and wait for it
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => child.kill(signal));
}
// npm may die of a signal without passing it on; when our parent goes, stop too
const parent = process.ppid;
const watch = setInterval(() => {
  if (process.ppid !== parent) {
    clearInterval(watch);
    child.kill('SIGTERM');
  }
}, 500);
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
