// The app server is SIGKILLed in the middle of a burst of changes. Each change is
// one transaction holding the record's new fields, its version bump and its trail
// entry, so after a restart every record must agree with its trail: as many
// entries as version bumps, the stored fields equal to the last entry's "after".
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startFaultDatabase, FAULT_PASSWORD, type FaultDatabase } from './helpers/fault-database';
import { startAppProcess, stopAllAppProcesses } from './helpers/app-process';
import { ApiClient } from './helpers/http-client';
import { verifyTrail } from '../../server/services/trail.service';

let database: FaultDatabase;

/** Lets the burst run until enough changes were acknowledged (the machine may be busy), then a little more. */
async function burstUnder(enough: () => boolean): Promise<void> {
  const deadline = Date.now() + 30_000;
  while (!enough() && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 50));
  await new Promise((resolve) => setTimeout(resolve, 200 + Math.random() * 300));
}

beforeAll(async () => {
  database = await startFaultDatabase('faultskill');
});

afterAll(async () => {
  await stopAllAppProcesses();
  await database?.stop();
});

describe('when the app is killed with SIGKILL during a burst of user updates', () => {
  it('then after a restart no record is half-changed: version, fields and trail agree', async () => {
    const admin = await database.createUser(['admin'], 'admin');
    const targets = await Promise.all(Array.from({ length: 12 }, (_, i) => database.createUser(['technician'], `target${i}`)));
    const first = await startAppProcess({ databaseUrl: database.url, label: 'app-killed-1' });
    const client = new ApiClient(first.url);
    await client.signIn(admin.email, FAULT_PASSWORD);

    let stopping = false;
    let acknowledged = 0;
    const failures: number[] = [];
    const workers = targets.map(async (target) => {
      let version = 0;
      for (let k = 1; !stopping; k += 1) {
        const result = await client.call('PATCH', `/api/users/${target.id}`, { version, displayName: `Renamed ${target.id}-${k}` }, 10_000);
        if (result.status === 200) {
          version = (result.body as { version: number }).version;
          acknowledged += 1;
        } else {
          failures.push(result.status);
          return; // the process is gone (status 0); stop this worker
        }
      }
    });
    await burstUnder(() => acknowledged >= 20);
    first.kill('SIGKILL');
    const exit = await first.exited;
    stopping = true;
    await Promise.all(workers);
    expect(exit.signal).toBe('SIGKILL');
    expect(acknowledged).toBeGreaterThanOrEqual(20);
    // Every worker was cut off by the kill (no answer), not refused by the app.
    expect(failures.every((status) => status === 0)).toBe(true);

    const second = await startAppProcess({ databaseUrl: database.url, label: 'app-killed-2' });
    const again = new ApiClient(second.url);
    await again.signIn(admin.email, FAULT_PASSWORD);

    let updates = 0;
    for (const target of targets) {
      const [row] = await database.sequelize.query<{ version: number; display_name: string }>(
        'SELECT version, display_name FROM users WHERE id = ?',
        { replacements: [target.id], type: QueryTypes.SELECT },
      );
      const entries = await database.sequelize.query<{ changes: string | { displayName: { after: string } } }>(
        "SELECT changes FROM trail_entries WHERE record_type = 'user' AND record_id = ? AND event = 'USER_UPDATED' ORDER BY seq",
        { replacements: [String(target.id)], type: QueryTypes.SELECT },
      );
      expect(entries.length, `user ${target.id}: one trail entry per version bump`).toBe(row.version);
      updates += entries.length;
      if (entries.length) {
        const last = entries[entries.length - 1].changes;
        const parsed = typeof last === 'string' ? JSON.parse(last) : last;
        expect(row.display_name).toBe(parsed.displayName.after);
      } else {
        expect(row.display_name).toBe(target.displayName);
      }
      // The restarted server serves the same state.
      const view = await again.call('GET', `/api/users/${target.id}`);
      expect(view.body).toMatchObject({ version: row.version, displayName: row.display_name });
    }
    // Acknowledged changes are all there; at most one per worker may have committed without its answer arriving.
    expect(updates).toBeGreaterThanOrEqual(acknowledged);
    expect(updates).toBeLessThanOrEqual(acknowledged + targets.length);
    const trail = await verifyTrail(database.sequelize);
    expect(trail.ok).toBe(true);
    console.log(`app killed: ${acknowledged} acknowledged updates, ${updates} committed, trail of ${trail.entries} entries intact`);
  });
});

describe('when the app is killed with SIGKILL during a burst of workflow transitions', () => {
  it('then after a restart every corrective action agrees with its trail: state, snapshot, columns and version', async () => {
    const { makeActionRow } = await import('../helpers/evidence-owners');
    const quality = await database.createUser(['quality_manager'], 'quality');
    const owner = await database.createUser(['level3'], 'owner');
    const actions = [];
    for (let i = 0; i < 10; i += 1) actions.push(await makeActionRow(database.sequelize, { ownerId: owner.id, createdById: quality.id }));
    const first = await startAppProcess({ databaseUrl: database.url, label: 'transitions-killed-1' });
    const asOwner = new ApiClient(first.url);
    await asOwner.signIn(owner.email, FAULT_PASSWORD);
    const asQuality = new ApiClient(first.url);
    await asQuality.signIn(quality.email, FAULT_PASSWORD);

    let stopping = false;
    let acknowledged = 0;
    const workers = actions.map(async (action) => {
      let version = 0;
      for (let k = 0; !stopping; k += 1) {
        const request = k % 2 === 0
          ? asOwner.call('POST', `/api/actions/${action.id}/events`, { type: 'REQUEST_EXTENSION', version, dueDate: '2027-06-30', reason: `Probe on order (${k})` }, 10_000)
          : asQuality.call('POST', `/api/actions/${action.id}/events`, { type: 'REJECT_EXTENSION', version, reason: `Due date stands (${k})` }, 10_000);
        const result = await request;
        if (result.status !== 200) {
          expect(result.status, JSON.stringify(result.body)).toBe(0); // cut off by the kill, never refused
          return;
        }
        version = (result.body as { version: number }).version;
        acknowledged += 1;
      }
    });
    await burstUnder(() => acknowledged >= 20);
    first.kill('SIGKILL');
    await first.exited;
    stopping = true;
    await Promise.all(workers);
    expect(acknowledged).toBeGreaterThanOrEqual(20);

    const second = await startAppProcess({ databaseUrl: database.url, label: 'transitions-killed-2' });
    const again = new ApiClient(second.url);
    await again.signIn(quality.email, FAULT_PASSWORD);
    let committed = 0;
    for (const action of actions) {
      const [row] = await database.sequelize.query<{ version: number; state: string; snapshot: string | object; pending_extension: string | object | null }>(
        'SELECT version, state, snapshot, pending_extension FROM corrective_actions WHERE id = ?',
        { replacements: [action.id], type: QueryTypes.SELECT },
      );
      const parse = <T,>(value: unknown): T => (typeof value === 'string' ? JSON.parse(value) : value) as T;
      const snapshot = parse<{ value: string; context: { pendingExtension: unknown } }>(row.snapshot);
      const entries = await database.sequelize.query<{ event: string }>(
        "SELECT event FROM trail_entries WHERE record_type = 'action' AND record_id = ? ORDER BY seq",
        { replacements: [String(action.id)], type: QueryTypes.SELECT },
      );
      const transitions = entries.filter((entry) => entry.event === 'REQUEST_EXTENSION' || entry.event === 'REJECT_EXTENSION');
      expect(transitions.length, `action ${action.id}: one trail entry per version bump`).toBe(row.version);
      committed += transitions.length;
      // The snapshot, the queryable columns and the trail tell the same story.
      expect(snapshot.value).toBe(row.state);
      expect(parse(row.pending_extension)).toEqual(snapshot.context.pendingExtension);
      const last = transitions[transitions.length - 1]?.event;
      expect(snapshot.context.pendingExtension !== null, `action ${action.id} after ${last}`).toBe(last === 'REQUEST_EXTENSION');
      const view = await again.call('GET', `/api/actions/${action.id}`);
      expect(view.body).toMatchObject({ version: row.version, state: row.state });
    }
    expect(committed).toBeGreaterThanOrEqual(acknowledged);
    expect(committed).toBeLessThanOrEqual(acknowledged + actions.length);
    const trail = await verifyTrail(database.sequelize);
    expect(trail.ok).toBe(true);
    console.log(`transitions killed: ${acknowledged} acknowledged, ${committed} committed, trail of ${trail.entries} entries intact`);
  });
});
