// The database hangs (SIGSTOP of mariadbd: connections stay open, nothing
// answers) in the middle of a write load, then resumes (SIGCONT). Requests end
// in 503 within the bounded waits (pool acquire, socket silence) instead of
// hanging, /api/health answers within a second throughout, every acknowledged
// write is in the database afterwards, and the app serves again by itself.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startFaultDatabase, FAULT_PASSWORD, type FaultDatabase } from './helpers/fault-database';
import { startAppProcess, stopAllAppProcesses, type AppProcess } from './helpers/app-process';
import { ApiClient } from './helpers/http-client';
import { startLoad } from './helpers/load';

/** The app's bounded waits in this test (DATABASE_ACQUIRE_TIMEOUT_MS, DATABASE_QUERY_TIMEOUT_MS). */
const ACQUIRE_MS = 2_000;
const SOCKET_MS = 4_000;
const PAUSE_MS = 10_000;

let database: FaultDatabase;
let app: AppProcess;
let client: ApiClient;
let paused = false;

beforeAll(async () => {
  database = await startFaultDatabase('faultsdbhung');
  const admin = await database.createUser(['admin'], 'admin');
  app = await startAppProcess({
    databaseUrl: database.url,
    label: 'database-hung',
    env: { DATABASE_ACQUIRE_TIMEOUT_MS: String(ACQUIRE_MS), DATABASE_QUERY_TIMEOUT_MS: String(SOCKET_MS) },
  });
  client = new ApiClient(app.url);
  await client.signIn(admin.email, FAULT_PASSWORD);
});

afterAll(async () => {
  // Never leave a stopped server behind: it could not be shut down.
  if (paused) database.resume();
  await stopAllAppProcesses();
  await database?.stop();
});

async function probeHealth(): Promise<{ status: number; ms: number; retryAfter: string | null }> {
  const started = performance.now();
  try {
    const response = await fetch(`${app.url}/api/health`, { signal: AbortSignal.timeout(5_000) });
    await response.arrayBuffer();
    return { status: response.status, ms: performance.now() - started, retryAfter: response.headers.get('retry-after') };
  } catch {
    return { status: 0, ms: performance.now() - started, retryAfter: null };
  }
}

describe('when the database hangs during a write load and then resumes', () => {
  it('then clients get 503 within the bounded waits, health answers within a second, nothing acknowledged is lost and service resumes', async () => {
    const pid = app.pid;
    const load = startLoad(
      4,
      (n) => ({ code: `HG-${n}`, name: `Hung test area ${n}` }),
      (body) => client.call('POST', '/api/areas', body, 30_000),
    );
    await new Promise((resolve) => setTimeout(resolve, 2_000));
    database.pause();
    paused = true;
    const pausedAt = load.elapsed();

    const health: Awaited<ReturnType<typeof probeHealth>>[] = [];
    while (load.elapsed() - pausedAt < PAUSE_MS) {
      health.push(await probeHealth());
      await new Promise((resolve) => setTimeout(resolve, 500));
    }
    database.resume();
    paused = false;
    const resumedAt = load.elapsed();
    const recoveredAt = await load.waitForSuccessAfter(resumedAt, 20_000);
    await new Promise((resolve) => setTimeout(resolve, 1_000));
    const records = await load.stop();
    const healthAfter = await probeHealth();

    // Requests that began while the server was stopped and ended before it resumed.
    const duringPause = records.filter((record) => record.at >= pausedAt && record.at + record.ms <= resumedAt);
    const statuses = new Map<number, number>();
    for (const record of records) statuses.set(record.status, (statuses.get(record.status) ?? 0) + 1);
    const slowest = Math.max(...records.map((record) => record.ms));
    const pauseTimes = duringPause.map((record) => record.ms).sort((a, b) => a - b);
    const median = pauseTimes[Math.floor(pauseTimes.length / 2)] ?? 0;
    console.log(
      `database hung: ${records.length} requests, statuses ${JSON.stringify(Object.fromEntries(statuses))}; ` +
        `${duringPause.length} answered during the ${PAUSE_MS} ms stop, median ${Math.round(median)} ms, slowest ${Math.round(slowest)} ms; ` +
        `health during the stop: ${health.map((probe) => `${probe.status}/${Math.round(probe.ms)}ms`).join(' ')}; ` +
        `first 2xx ${Math.round(recoveredAt - resumedAt)} ms after SIGCONT`,
    );

    // Only 201 or 503, and the 503s say why.
    const unexpected = records.filter((record) => !(record.status === 201 || record.status === 503));
    expect(unexpected.map((record) => ({ status: record.status, error: record.error, body: record.body }))).toEqual([]);
    for (const record of records.filter((r) => r.status === 503)) {
      expect((record.body as { error: { code: string } }).error.code).toMatch(/database_unavailable|overloaded/);
    }
    // Quickly: no request waits longer than the socket silence limit plus the pool wait and a margin.
    expect(duringPause.length).toBeGreaterThan(3);
    expect(duringPause.every((record) => record.status === 503)).toBe(true);
    expect(slowest).toBeLessThan(SOCKET_MS + ACQUIRE_MS + 1_500);
    expect(median).toBeLessThan(SOCKET_MS + 1_000);

    // Health: within a second every time, 503 with Retry-After while stopped, 200 after.
    expect(health.length).toBeGreaterThan(5);
    expect(health.filter((probe) => probe.ms >= 1_000)).toEqual([]);
    expect(health.filter((probe) => probe.status !== 503)).toEqual([]);
    expect(health.every((probe) => probe.retryAfter !== null)).toBe(true);
    expect(healthAfter.status).toBe(200);

    // Recovery without a restart.
    expect(app.alive()).toBe(true);
    expect(app.pid).toBe(pid);
    expect(recoveredAt - resumedAt).toBeLessThan(15_000);

    // Nothing acknowledged is lost.
    const acknowledged = records.filter((record) => record.status === 201).map((record) => record.input.code);
    expect(acknowledged.length).toBeGreaterThan(10);
    const rows = await database.sequelize.query<{ code: string }>('SELECT code FROM areas WHERE code LIKE ?', {
      replacements: ['HG-%'],
      type: QueryTypes.SELECT,
    });
    const stored = new Set(rows.map((row) => row.code));
    expect(acknowledged.filter((code) => !stored.has(code))).toEqual([]);

    const verify = await client.call('GET', '/api/trail/verify');
    expect(verify.status).toBe(200);
    expect(verify.body).toMatchObject({ ok: true });
  });
});
