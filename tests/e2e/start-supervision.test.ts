// `npm start` supervises its services (issue 19, item 6): kill the schedule worker by its PID and
// the app, the mail catcher and PostgreSQL stay up while the worker is started again (the log says
// so); then one SIGTERM to `npm start` stops everything. Run exactly as a user runs it, through
// npm, on ports and a data folder of its own, with the build under test (NEXT_DIST_DIR) so that
// it does not build again.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort } from './reliability-helpers';

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

async function answers(url: string): Promise<number> {
  try {
    return (await fetch(url, { signal: AbortSignal.timeout(5000) })).status;
  } catch {
    return 0;
  }
}

function portOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = new net.Socket();
    socket.setTimeout(1000);
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
    socket.once('timeout', () => {
      socket.destroy();
      resolve(false);
    });
    socket.connect(port, '127.0.0.1');
  });
}

async function until(what: string, condition: () => boolean | Promise<boolean>, timeoutMs: number, log: () => string): Promise<void> {
  const started = Date.now();
  while (!(await condition())) {
    if (Date.now() - started > timeoutMs) throw new Error(`${what} did not happen within ${timeoutMs / 1000} s; output:\n${log().slice(-4000)}`);
    await sleep(250);
  }
}

let child: ChildProcess | undefined;
let dataDir: string | undefined;

afterAll(async () => {
  // If the test failed half-way, stop what it started (the npm process group) and its database.
  if (child?.pid && child.exitCode === null) {
    try {
      process.kill(child.pid, 'SIGTERM');
    } catch {
      // already gone
    }
    await sleep(5000);
  }
  if (dataDir) fs.rmSync(dataDir, { recursive: true, force: true });
});

describe('npm start', () => {
  it('starts a killed worker again and keeps the rest up; one SIGTERM stops everything', async () => {
    const [appPort, pgPort, smtpPort, mailPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'ampwarden-start-'));
    fs.chmodSync(dataDir, 0o755);
    let output = '';
    // The environment of a person at a terminal: none of the test run's database or mail settings.
    const env: Record<string, string> = {};
    for (const [key, value] of Object.entries(process.env)) if (value !== undefined && !/^(DATABASE_|SMTP_|MAIL_|APP_URL|NEXTAUTH_|AMPWARDEN_)/.test(key)) env[key] = value;
    Object.assign(env, {
      PORT: String(appPort),
      AMPWARDEN_PG_PORT: String(pgPort),
      AMPWARDEN_SMTP_PORT: String(smtpPort),
      AMPWARDEN_MAIL_HTTP_PORT: String(mailPort),
      AMPWARDEN_DATA_DIR: dataDir,
      NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? '.next',
    });
    const npm = spawn('npm', ['start'], { env: env as NodeJS.ProcessEnv, stdio: ['ignore', 'pipe', 'pipe'] });
    child = npm;
    npm.stdout?.on('data', (chunk) => (output += chunk));
    npm.stderr?.on('data', (chunk) => (output += chunk));
    const log = () => output;
    const app = `http://127.0.0.1:${appPort}`;

    await until('the app answering /api/health', async () => (await answers(`${app}/api/health`)) === 200, 150_000, log);
    const workerPid = () => [...output.matchAll(/worker started \(pid (\d+)\)/g)].map((m) => Number(m[1]));
    await until('the worker started', () => workerPid().length === 1, 30_000, log);
    const [firstWorker] = workerPid();
    expect(alive(firstWorker)).toBe(true);

    process.kill(firstWorker, 'SIGKILL');
    await until('the worker started again', () => workerPid().length === 2, 30_000, log);
    expect(output).toMatch(new RegExp(`worker \\(pid ${firstWorker}\\) exited with status \\d+ after \\d+ s; starting it again in \\d+ s`));
    const secondWorker = workerPid()[1];
    expect(secondWorker).not.toBe(firstWorker);
    expect(alive(secondWorker)).toBe(true);
    // The rest stayed up: the app with its database, the mail catcher.
    expect(await answers(`${app}/api/health`)).toBe(200);
    expect(await answers(`http://127.0.0.1:${mailPort}/messages`)).toBe(200);
    // The worker's own log says so too.
    expect(fs.readFileSync(path.join(dataDir, 'worker.log'), 'utf8')).toMatch(/worker \(pid \d+\) exited/);

    process.kill(npm.pid!, 'SIGTERM');
    await until('npm start to exit', () => npm.exitCode !== null || npm.signalCode !== null, 60_000, log);
    await until('every service to stop', async () => !alive(secondWorker) && !(await portOpen(appPort)) && !(await portOpen(mailPort)) && !(await portOpen(pgPort)), 30_000, log);
    expect(output).toMatch(/ampwarden: stopped/);
  });
});
