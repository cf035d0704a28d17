// Two app servers on one database keep no state of their own: a session made on
// one works on the other, a CSRF token issued by one is accepted by the other,
// signing out on one ends the session on both.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFaultDatabase, FAULT_PASSWORD, type FaultDatabase } from './helpers/fault-database';
import { startAppProcess, stopAllAppProcesses, type AppProcess } from './helpers/app-process';
import { ApiClient } from './helpers/http-client';

let database: FaultDatabase;
let first: AppProcess;
let second: AppProcess;

beforeAll(async () => {
  database = await startFaultDatabase('faultstwo');
  [first, second] = await Promise.all([
    startAppProcess({ databaseUrl: database.url, label: 'two-servers-a' }),
    startAppProcess({ databaseUrl: database.url, label: 'two-servers-b' }),
  ]);
});

afterAll(async () => {
  await stopAllAppProcesses();
  await database?.stop();
});

describe('when two app servers share one database', () => {
  it('then a session signed in on one works on the other, including a change with its CSRF token', async () => {
    const admin = await database.createUser(['admin'], 'admin');
    const onFirst = new ApiClient(first.url);
    await onFirst.signIn(admin.email, FAULT_PASSWORD);
    const onSecond = onFirst.withBaseUrl(second.url);

    const session = await onSecond.call('GET', '/api/session');
    expect(session.status).toBe(200);
    expect(session.body).toMatchObject({ user: { id: admin.id } });

    const created = await onSecond.call('POST', '/api/areas', { code: 'TWO-1', name: 'Made on the second server' });
    expect(created.status).toBe(201);
    const listed = await onFirst.call('GET', '/api/areas');
    expect((listed.body as { items: { code: string }[] }).items.map((area) => area.code)).toContain('TWO-1');

    const signedOut = await onSecond.call('DELETE', '/api/session');
    expect(signedOut.status).toBe(204);
    const after = await onFirst.call('GET', '/api/session');
    expect(after.status).toBe(401);
  });

  it('then a forged CSRF token is refused by both', async () => {
    const admin = await database.createUser(['admin'], 'admin2');
    const onFirst = new ApiClient(first.url);
    await onFirst.signIn(admin.email, FAULT_PASSWORD);
    for (const server of [first, second]) {
      const forged = onFirst.withBaseUrl(server.url);
      forged.csrfToken = 'not-the-token';
      const refused = await forged.call('POST', '/api/areas', { code: `FORGED-${server.port}`.slice(0, 16), name: `Forged ${server.port}` });
      expect(refused.status).toBe(403);
    }
  });
});
