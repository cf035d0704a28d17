// Two app servers on one database keep no state of their own: a session made on
// one works on the other, a CSRF token issued by one is accepted by the other,
// signing out on one ends the session on both, and with both schedulers on a
// due reminder is delivered once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SMTPServer } from 'smtp-server';
import { QueryTypes } from 'sequelize';
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

describe('when two app servers run their schedulers on one database with a reminder due', () => {
  it('then the reminder is delivered once, not once per server', async () => {
    const { makeActionRow } = await import('../helpers/evidence-owners');
    const received: string[] = [];
    const smtp = new SMTPServer({
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      onData(stream, _session, callback) {
        let raw = '';
        stream.on('data', (chunk) => (raw += chunk));
        stream.on('end', () => {
          received.push(raw);
          callback();
        });
      },
    });
    await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', () => resolve()));
    const smtpPort = (smtp.server.address() as { port: number }).port;
    const extra: AppProcess[] = [];
    try {
      const quality = await database.createUser(['quality_manager'], 'quality-mail');
      const owner = await database.createUser(['technician'], 'owner-mail');
      const dueDate = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);
      const action = await makeActionRow(database.sequelize, { ownerId: owner.id, createdById: quality.id, dueDate });
      const env = { SCHEDULER: 'true', SCHEDULER_INTERVAL_SECONDS: '1', SMTP_URL: `smtp://127.0.0.1:${smtpPort}` };
      extra.push(
        ...(await Promise.all([
          startAppProcess({ databaseUrl: database.url, label: 'scheduler-a', env }),
          startAppProcess({ databaseUrl: database.url, label: 'scheduler-b', env }),
        ])),
      );
      const aboutAction = () => received.filter((raw) => raw.includes(action.number) && raw.includes(owner.email));
      const deadline = Date.now() + 45_000;
      while (aboutAction().length === 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 250));
      // Both schedulers keep ticking every second: give a duplicate every chance to appear.
      await new Promise((resolve) => setTimeout(resolve, 8_000));
      expect(aboutAction()).toHaveLength(1);
      const [job] = await database.sequelize.query<{ run_count: number }>("SELECT run_count FROM scheduled_jobs WHERE name LIKE '%remind%'", {
        type: QueryTypes.SELECT,
      });
      expect(Number(job.run_count)).toBe(1);
    } finally {
      await Promise.all(extra.map((app) => app.stop()));
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
    }
  });
});
