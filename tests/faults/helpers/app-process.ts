// Starts and stops app servers (server-process.ts) as child processes with their
// output in a log file, never inherited. Every process started is remembered so
// stopAllAppProcesses() can end them in an afterAll, even when a test failed.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, openSync, closeSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { findFreePort } from '../../../server/db/local-mariadb';

export const ROOT = path.resolve(import.meta.dirname, '../../..');
const ENTRY = path.join(ROOT, 'tests/faults/helpers/server-process.ts');
export const FAULT_LOG_DIR = path.join(ROOT, 'tests/output/faults');

export interface AppProcess {
  pid: number;
  port: number;
  url: string;
  logFile: string;
  child: ChildProcess;
  alive(): boolean;
  /** Resolves with the exit code (or signal) once the process has ended. */
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  kill(signal: NodeJS.Signals): void;
  stop(): Promise<void>;
  /** Resident memory of the process in bytes, from /proc. */
  rssBytes(): number;
  log(): string;
}

const started = new Set<AppProcess>();

export interface StartAppOptions {
  databaseUrl: string;
  label: string;
  env?: Record<string, string>;
  port?: number;
  /** Extra node flags, e.g. ['--cpu-prof', '--cpu-prof-dir=…'] for a profile. */
  nodeArgs?: string[];
}

export async function startAppProcess({ databaseUrl, label, env = {}, port, nodeArgs = [] }: StartAppOptions): Promise<AppProcess> {
  mkdirSync(FAULT_LOG_DIR, { recursive: true });
  const listenPort = port ?? (await findFreePort());
  const logFile = path.join(FAULT_LOG_DIR, `${label}-${listenPort}.log`);
  const fd = openSync(logFile, 'a');
  const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', ENTRY], {
    cwd: ROOT,
    stdio: ['ignore', fd, fd],
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(listenPort),
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'fault-test-session-secret-long-enough-for-it',
      LOG_LEVEL: 'error',
      SCHEDULER: 'false',
      SIGNIN_RATE_LIMIT: '10000',
      ...env,
    },
  });
  closeSync(fd);
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => {
    child.once('exit', (code, signal) => resolve({ code, signal }));
  });
  let running = true;
  void exited.then(() => {
    running = false;
  });
  const url = `http://127.0.0.1:${listenPort}`;
  const app: AppProcess = {
    pid: child.pid!,
    port: listenPort,
    url,
    logFile,
    child,
    alive: () => running,
    exited,
    kill(signal) {
      if (running) child.kill(signal);
    },
    async stop() {
      started.delete(app);
      if (!running) return;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
      await exited;
      clearTimeout(timer);
    },
    rssBytes() {
      const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
      const match = /VmRSS:\s+(\d+) kB/.exec(status);
      return match ? Number(match[1]) * 1024 : 0;
    },
    log: () => readFileSync(logFile, 'utf8'),
  };
  started.add(app);
  await waitForHttp(app, 60_000);
  return app;
}

/** Waits until the server answers anything at all on /api/health (200 up, 503 database down). */
export async function waitForHttp(app: AppProcess, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (!app.alive()) throw new Error(`app process exited during start-up; see ${app.logFile}:\n${app.log().slice(-2000)}`);
    try {
      const response = await fetch(`${app.url}/api/health`, { signal: AbortSignal.timeout(2_000) });
      await response.arrayBuffer();
      return;
    } catch {
      if (Date.now() > deadline) throw new Error(`app did not answer within ${timeoutMs} ms; see ${app.logFile}`);
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
  }
}

export async function stopAllAppProcesses(): Promise<void> {
  await Promise.all([...started].map((app) => app.stop()));
}
