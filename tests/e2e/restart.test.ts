// `npm start` twice on one data folder: the second start keeps what the first wrote, is quicker, and
// stopping leaves no process behind.
import { afterAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import mysql from 'mysql2/promise';

const ROOT = resolve(import.meta.dirname, '../..');
const NAME = `${process.env.TEST_INSTANCE ?? 'test'}-restart`;
const base = Number(process.env.TEST_APP_PORT ?? 3100);
const PORT = base + 50;
const DB_PORT = Number(process.env.TEST_DB_PORT ?? 3308) + 20;
const STANDINS = Number(process.env.TEST_STANDIN_PORT_BASE ?? 4500) + 50;
const dataDir = join(ROOT, '.data', NAME);

let current: ChildProcess | null = null;

function start(): Promise<{ child: ChildProcess; seconds: number; output: string[] }> {
  const t0 = Date.now();
  const output: string[] = [];
  const child = spawn(process.execPath, ['scripts/start.mjs'], {
    cwd: ROOT,
    detached: true,
    env: {
      ...process.env,
      NODE_ENV: 'development',
      RACKTURN_INSTANCE: NAME,
      PORT: String(PORT),
      DB_PORT: String(DB_PORT),
      STANDIN_PORT_BASE: String(STANDINS),
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  current = child;
  return new Promise((resolveStart, reject) => {
    const timer = setTimeout(() => reject(new Error(`npm start not ready after 100 s:\n${output.join('')}`)), 100_000);
    const onData = (b: Buffer) => {
      output.push(b.toString());
      if (output.join('').includes('ready in')) {
        clearTimeout(timer);
        resolveStart({ child, seconds: (Date.now() - t0) / 1000, output });
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (b: Buffer) => output.push(b.toString()));
    child.on('exit', (code) => {
      console.log(`npm start exited (${code}):\n${output.join('')}`);
      reject(new Error(`npm start exited early (${code})`));
    });
  });
}

async function stop(child: ChildProcess): Promise<number | null> {
  child.removeAllListeners('exit');
  if (child.exitCode !== null) throw new Error(`npm start had already exited with ${child.exitCode}`);
  const exited = new Promise<number | null>((r) => child.once('exit', (c) => r(c)));
  process.kill(child.pid!, 'SIGTERM');
  const code = await exited;
  current = null;
  return code;
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

async function signIn(): Promise<string> {
  const res = await fetch(`http://127.0.0.1:${PORT}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'coach@rackturn.test', password: 'rackturn-demo' }),
  });
  expect(res.status).toBe(200);
  return res.headers.get('set-cookie')!.split(';')[0]!;
}

afterAll(async () => {
  if (current) await stop(current);
  rmSync(dataDir, { recursive: true, force: true });
  rmSync(join(ROOT, '.tmp', `dist-${NAME}`), { recursive: true, force: true });
});

describe('npm start, stopped and started again', () => {
  it('keeps the data, starts faster the second time and leaves nothing running', async () => {
    rmSync(dataDir, { recursive: true, force: true });
    const first = await start();
    const cookie = await signIn();
    const me = await (await fetch(`http://127.0.0.1:${PORT}/api/auth/me`, { headers: { cookie } })).json();
    expect(me.teamName).toBe('Copperkettle Barbell Club');

    // Write something, straight into this instance's database.
    const secrets = JSON.parse(readFileSync(join(dataDir, 'secrets.json'), 'utf8'));
    const conn = await mysql.createConnection({
      host: '127.0.0.1',
      port: DB_PORT,
      user: 'rackturn',
      password: secrets.dbPassword,
      database: 'rackturn',
    });
    await conn.query(
      "UPDATE teams SET name = 'Copperkettle Barbell Club (renamed)' WHERE name = 'Copperkettle Barbell Club'",
    );
    await conn.end();

    const pid = Number(readFileSync(join(dataDir, 'mysqld.pid'), 'utf8'));
    expect(await stop(first.child)).toBe(0);
    expect(isAlive(pid)).toBe(false);
    await expect(fetch(`http://127.0.0.1:${PORT}/api/health`)).rejects.toThrow();

    const second = await start();
    const cookie2 = await signIn();
    const me2 = await (await fetch(`http://127.0.0.1:${PORT}/api/auth/me`, { headers: { cookie: cookie2 } })).json();
    expect(me2.teamName).toBe('Copperkettle Barbell Club (renamed)');
    expect(second.output.join('')).not.toMatch(/initialising MariaDB/);
    console.log(`npm start: first ${first.seconds.toFixed(1)} s, second ${second.seconds.toFixed(1)} s`);
    expect(second.seconds).toBeLessThan(15);
    const pid2 = Number(readFileSync(join(dataDir, 'mysqld.pid'), 'utf8'));
    expect(await stop(second.child)).toBe(0);
    expect(isAlive(pid2)).toBe(false);
    expect(existsSync(join(dataDir, 'mysqld.sock'))).toBe(false);
  }, 240_000);
});
