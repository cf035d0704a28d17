// The database dies (SIGKILL of mariadbd) in the middle of a write load and comes
// back: the app answers 2xx or 503 throughout, never hangs, never crashes, keeps
// its PID, serves again within 30 s without a restart, and loses nothing it
// acknowledged; the trail chain still verifies.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startFaultDatabase, FAULT_PASSWORD, type FaultDatabase } from './helpers/fault-database';
import { startAppProcess, stopAllAppProcesses, type AppProcess } from './helpers/app-process';
import { ApiClient, type CallResult } from './helpers/http-client';
import { startLoad } from './helpers/load';

let database: FaultDatabase;
let app: AppProcess;
let client: ApiClient;
let asOwner: ApiClient;
let asQuality: ApiClient;
let actionIds: number[] = [];

beforeAll(async () => {
  database = await startFaultDatabase('faultsdbdown');
  const admin = await database.createUser(['admin'], 'admin');
  const quality = await database.createUser(['quality_manager'], 'quality');
  const owner = await database.createUser(['level3'], 'owner');
  const { makeActionRow } = await import('../helpers/evidence-owners');
  for (let i = 0; i < 3; i += 1) actionIds.push((await makeActionRow(database.sequelize, { ownerId: owner.id, createdById: quality.id })).id);
  app = await startAppProcess({ databaseUrl: database.url, label: 'database-down' });
  client = new ApiClient(app.url);
  await client.signIn(admin.email, FAULT_PASSWORD);
  asOwner = new ApiClient(app.url);
  await asOwner.signIn(owner.email, FAULT_PASSWORD);
  asQuality = new ApiClient(app.url);
  await asQuality.signIn(quality.email, FAULT_PASSWORD);
});

/**
 * Extension requests and rejections on one action, in turn. After a 503 the
 * outcome is unknown (the commit may have happened), so the worker reads the
 * action again before sending the next event: every answer stays 2xx or 503.
 */
function transitionWorker(actionId: number, stopped: () => boolean, statuses: number[]) {
  return (async () => {
    let current: { version: number; pending: boolean } | null = null;
    for (let k = 0; !stopped(); k += 1) {
      if (!current) {
        const view = await asQuality.call('GET', `/api/actions/${actionId}`, undefined, 20_000);
        statuses.push(view.status);
        if (view.status === 200) {
          const body = view.body as { version: number; pendingExtension: unknown };
          current = { version: body.version, pending: body.pendingExtension != null };
        } else await new Promise((resolve) => setTimeout(resolve, 100));
        continue;
      }
      const result: CallResult = current.pending
        ? await asQuality.call('POST', `/api/actions/${actionId}/events`, { type: 'REJECT_EXTENSION', version: current.version, reason: `Due date stands (${k})` }, 20_000)
        : await asOwner.call('POST', `/api/actions/${actionId}/events`, { type: 'REQUEST_EXTENSION', version: current.version, dueDate: '2027-06-30', reason: `Probe on order (${k})` }, 20_000);
      statuses.push(result.status);
      if (result.status === 200) current = { version: (result.body as { version: number }).version, pending: !current.pending };
      else current = null;
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  })();
}

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
    let stopTransitions = false;
    const transitionStatuses: number[] = [];
    const transitions = actionIds.map((id) => transitionWorker(id, () => stopTransitions, transitionStatuses));

    await new Promise((resolve) => setTimeout(resolve, 2_000));
    database.kill();
    const killedAt = load.elapsed();
    await new Promise((resolve) => setTimeout(resolve, 5_000));
    await database.restart();
    const restartedAt = load.elapsed();
    const recoveredAt = await load.waitForSuccessAfter(restartedAt, 30_000);
    await new Promise((resolve) => setTimeout(resolve, 1_000));
    const records = await load.stop();
    stopTransitions = true;
    await Promise.all(transitions);

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

    // The workflow transitions met the outage the same way, and every action still agrees with its trail.
    expect(transitionStatuses.filter((status) => status !== 200 && status !== 503)).toEqual([]);
    expect(transitionStatuses.filter((status) => status === 200).length).toBeGreaterThan(3);
    for (const id of actionIds) {
      const [row] = await database.sequelize.query<{ version: number; pending_extension: unknown }>(
        'SELECT version, pending_extension FROM corrective_actions WHERE id = ?',
        { replacements: [id], type: QueryTypes.SELECT },
      );
      const entries = await database.sequelize.query<{ event: string }>(
        "SELECT event FROM trail_entries WHERE record_type = 'action' AND record_id = ? AND event IN ('REQUEST_EXTENSION', 'REJECT_EXTENSION') ORDER BY seq",
        { replacements: [String(id)], type: QueryTypes.SELECT },
      );
      expect(entries.length, `action ${id}`).toBe(row.version);
      expect(row.pending_extension !== null, `action ${id}`).toBe(entries[entries.length - 1]?.event === 'REQUEST_EXTENSION');
    }
    console.log(`database down, transitions: ${transitionStatuses.length} answers, ${transitionStatuses.filter((status) => status === 200).length} × 200`);

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
