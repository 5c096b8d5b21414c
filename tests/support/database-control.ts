// stop and start the throwaway test MariaDB from a test (the outage test): the server that
// `npm test` started lives in WALLPULSE_TEST_DATA_DIR/mariadb; stopping is a SHUTDOWN over its
// root socket, starting is src/stack/mariadb.ts again on the same folder and port
import path from 'node:path';
import { existsSync, readFileSync } from 'node:fs';
import mysql from 'mysql2/promise';
import { startMariaDb } from '../../src/stack/mariadb';
import { isAlive, sleep } from '../../src/stack/util';
import { testEnv } from './env';

const folder = () => path.join(testEnv('WALLPULSE_TEST_DATA_DIR'), 'mariadb');

export async function stopTestDatabase(): Promise<void> {
  const dir = folder();
  const pidFile = path.join(dir, 'mysqld.pid');
  const pid = existsSync(pidFile) ? Number(readFileSync(pidFile, 'utf8').trim()) : 0;
  const root = await mysql.createConnection({ socketPath: path.join(dir, 'mysqld.sock'), user: 'root' });
  await root.query('SHUTDOWN');
  await root.end().catch(() => undefined);
  const end = Date.now() + 30_000;
  while (pid && isAlive(pid)) {
    if (Date.now() > end) throw new Error(`MariaDB (pid ${pid}) did not stop within 30 s`);
    await sleep(100);
  }
}

export async function startTestDatabase(): Promise<void> {
  const url = new URL(testEnv('DATABASE_URL'));
  await startMariaDb({ dir: folder(), port: Number(url.port), database: url.pathname.slice(1), user: decodeURIComponent(url.username) });
}
