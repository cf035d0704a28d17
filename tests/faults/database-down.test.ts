// The database dies (SIGKILL of mariadbd) in the middle of a write load and comes
// back: the app answers 2xx or 503 throughout, never hangs, never crashes, keeps
// its PID, serves again within 30 s without a restart, and loses nothing it
// acknowledged; the trail chain still verifies.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startFaultDatabase, FAULT_PASSWORD, type FaultDatabase } from './helpers/fault-database';
import { startAppProcess, stopAllAppProcesses, type AppProcess } from './helpers/app-process';
import { ApiClient } from './helpers/http-client';
import { startLoad } from './helpers/load';

let database: FaultDatabase;
let app: AppProcess;
let client: ApiClient;

beforeAll(async () => {
  database = await startFaultDatabase('faultsdbdown');
  const admin = await database.createUser(['admin'], 'admin');
  app = await startAppProcess({ databaseUrl: database.url, label: 'database-down' });
  client = new ApiClient(app.url);
  await client.signIn(admin.email, FAULT_PASSWORD);
});

afterAll(async () => {
  await stopAllAppProcesses();
  await database?.stop();
});

describe('when the database is killed during a write load and started again', () => {
  it('then every answer is 2xx or 503, the process survives, service resumes and every acknowledged write is kept', async () => {
    const pid = app.pid;
    const load = startLoad(
      4,
      (n) => ({ code: `DD-${n}`, name: `Down test area ${n}` }),
      (body) => client.call('POST', '/api/areas', body, 20_000),
    );

    await new Promise((resolve) => setTimeout(resolve, 2_000));
    database.kill();
    const killedAt = load.elapsed();
    await new Promise((resolve) => setTimeout(resolve, 5_000));
    await database.restart();
    const restartedAt = load.elapsed();
    const recoveredAt = await load.waitForSuccessAfter(restartedAt, 30_000);
    await new Promise((resolve) => setTimeout(resolve, 1_000));
    const records = await load.stop();

    const statuses = new Map<number, number>();
    for (const record of records) statuses.set(record.status, (statuses.get(record.status) ?? 0) + 1);
    console.log(
      `database down: ${records.length} requests, statuses ${JSON.stringify(Object.fromEntries(statuses))}, ` +
        `killed at ${Math.round(killedAt)} ms, restarted at ${Math.round(restartedAt)} ms, ` +
        `first 2xx ${Math.round(recoveredAt - restartedAt)} ms after the restart, slowest answer ${Math.round(Math.max(...records.map((r) => r.ms)))} ms`,
    );

    const unexpected = records.filter((record) => !(record.status === 201 || record.status === 503));
    expect(unexpected.map((record) => ({ status: record.status, error: record.error, body: record.body }))).toEqual([]);
    expect(records.filter((record) => record.status === 503).length).toBeGreaterThan(0);
    expect(records.filter((record) => record.at > killedAt && record.status === 201).length).toBeGreaterThan(0);
    for (const record of records.filter((r) => r.status === 503)) {
      expect((record.body as { error: { code: string } }).error.code).toMatch(/database_unavailable|overloaded/);
    }

    expect(app.alive()).toBe(true);
    expect(app.pid).toBe(pid);
    expect(recoveredAt - restartedAt).toBeLessThan(30_000);

    const acknowledged = records.filter((record) => record.status === 201).map((record) => record.input.code);
    const rows = await database.sequelize.query<{ code: string }>('SELECT code FROM areas WHERE code LIKE ?', {
      replacements: ['DD-%'],
      type: QueryTypes.SELECT,
    });
    const stored = new Set(rows.map((row) => row.code));
    expect(acknowledged.filter((code) => !stored.has(code))).toEqual([]);

    const verify = await client.call('GET', '/api/trail/verify');
    expect(verify.status).toBe(200);
    expect(verify.body).toMatchObject({ ok: true });
    expect((verify.body as { entries: number }).entries).toBeGreaterThanOrEqual(acknowledged.length);
  });
});
