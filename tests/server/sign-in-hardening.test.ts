// Sign-in as an attacker would try it: lock someone out, tell accounts apart,
// burn the limiter with malformed requests, keep a session after a password
// change, set a guessable password, vary the e-mail's case, forge the Origin.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { User } from '../../server/models';
import { createTestContext, makeUser, signIn, TEST_PASSWORD, type TestContext } from '../helpers/test-app';

// Behind a proxy (TRUST_PROXY) the client address is the forwarded one: each test uses its own,
// so address pauses never reach other test files signing in from 127.0.0.1.
let context: TestContext;
beforeAll(() => {
  context = createTestContext({ TRUST_PROXY: 'true', ACCOUNT_LOCK_THRESHOLD: '3', SIGNIN_RATE_LIMIT: '1000', ACCOUNT_LOCK_MAX_MINUTES: '60' });
});
afterAll(() => context.close());

let nextAddress = 1;
const freshAddress = () => `203.0.113.${(nextAddress++ % 250) + 1}`;
const attempt = (email: string, password: string, address = '203.0.113.251') =>
  request(context.app).post('/api/session').set('X-Forwarded-For', address).send({ email, password });

describe('temporary lockout', () => {
  it('when an anonymous client fails an account’s password 3 times, then it locks for 1 minute, the next lock 2 minutes, and after it expires the right password works', async () => {
    const user = await makeUser({ roles: ['admin'] });
    const start = new Date();
    try {
      context.clock.set(start);
      for (let i = 0; i < 3; i += 1) expect((await attempt(user.email, `wrong-${i}`)).status).toBe(401);
      const locked = await User.findByPk(user.id);
      expect(locked!.lockedUntil!.getTime() - start.getTime()).toBe(60_000);
      expect((await attempt(user.email, TEST_PASSWORD)).status).toBe(401);

      // Past the minute: locked again by three more failures, now for two minutes.
      context.clock.set(new Date(start.getTime() + 61_000));
      for (let i = 0; i < 3; i += 1) expect((await attempt(user.email, `wrong-again-${i}`)).status).toBe(401);
      expect((await User.findByPk(user.id))!.lockedUntil!.getTime() - (start.getTime() + 61_000)).toBe(120_000);

      context.clock.set(new Date(start.getTime() + 61_000 + 119_000));
      expect((await attempt(user.email, TEST_PASSWORD)).status).toBe(401);
      context.clock.set(new Date(start.getTime() + 61_000 + 121_000));
      expect((await attempt(user.email, TEST_PASSWORD)).status).toBe(200);
      expect(await User.findByPk(user.id)).toMatchObject({ failedSignIns: 0, lockouts: 0, lockedUntil: null });
    } finally {
      context.clock.set(null);
    }
  });

  it('when the locks keep coming, then none lasts longer than ACCOUNT_LOCK_MAX_MINUTES (nobody, the last administrator included, is locked for good)', async () => {
    const user = await makeUser({ roles: ['admin'] });
    await User.update({ lockouts: 30 }, { where: { id: user.id } });
    const start = new Date();
    try {
      context.clock.set(start);
      for (let i = 0; i < 3; i += 1) await attempt(user.email, `wrong-${i}`);
      expect((await User.findByPk(user.id))!.lockedUntil!.getTime() - start.getTime()).toBe(60 * 60_000);
    } finally {
      context.clock.set(null);
    }
  });

  it('when `npm run unlock -- EMAIL` runs on the server, then the lock is lifted at once and the trail says so', async () => {
    const user = await makeUser({ roles: ['admin'] });
    for (let i = 0; i < 3; i += 1) await attempt(user.email, `wrong-${i}`);
    expect((await attempt(user.email, TEST_PASSWORD)).status).toBe(401);
    const run = await promisify(execFile)('npx', ['tsx', 'scripts/unlock.ts', `  ${user.email.toUpperCase()} `], {
      encoding: 'utf8',
      // The server's trail key and anchor log: the unlock is chained like any other entry.
      env: {
        ...process.env,
        DATABASE_URL: context.config.databaseUrl,
        TRAIL_HMAC_KEY: context.config.trail.hmacKey,
        TRAIL_ANCHOR_FILE: context.config.trail.anchorFile,
      },
    });
    expect(run.stdout).toContain('sign-in lock lifted');
    expect((await attempt(user.email, TEST_PASSWORD)).status).toBe(200);
    const admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const events = (await admin.agent.get(`/api/trail?record=user:${user.id}`)).body.items.map((entry: { event: string }) => entry.event);
    expect(events).toContain('ACCOUNT_UNLOCKED');
  }, 120_000);
});

describe('one answer for every refusal', () => {
  it('when the account is unknown, locked or deactivated, then the answer is the same 401', async () => {
    const locked = await makeUser({ roles: ['technician'] });
    for (let i = 0; i < 3; i += 1) await attempt(locked.email, `wrong-${i}`);
    const deactivated = await makeUser({ roles: ['technician'] });
    await User.update({ active: false }, { where: { id: deactivated.id } });
    const wrong = await makeUser({ roles: ['technician'] });

    const answers = await Promise.all([
      attempt('nobody-at-all@test.example', TEST_PASSWORD),
      attempt(locked.email, TEST_PASSWORD),
      attempt(deactivated.email, TEST_PASSWORD),
      attempt(wrong.email, 'not the password'),
    ]);
    for (const answer of answers) {
      expect(answer.status).toBe(401);
      expect(answer.body).toEqual(answers[0].body);
    }
  });

  it('when a non-administrator lists people, then no lock state is shown; an administrator sees it in full', async () => {
    const locked = await makeUser({ roles: ['technician'] });
    for (let i = 0; i < 3; i += 1) await attempt(locked.email, `wrong-${i}`);
    const reader = await signIn(context.app, await makeUser({ roles: ['quality_manager'] }));
    const listed = await reader.agent.get('/api/users').query({ q: locked.email });
    expect(listed.status).toBe(200);
    expect(listed.body.items[0]).not.toHaveProperty('locked');
    expect(listed.body.items[0]).not.toHaveProperty('lockedUntil');
    expect((await reader.agent.get(`/api/users/${locked.id}`)).body).not.toHaveProperty('locked');
    const csv = await reader.agent.get('/api/users.csv').query({ q: locked.email });
    expect(csv.text).not.toContain('locked');

    const admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const seen = await admin.agent.get('/api/users').query({ q: locked.email });
    expect(seen.body.items[0]).toMatchObject({ locked: true, lockedUntil: expect.any(String) });
  });
});

describe('what counts', () => {
  it('when an address sends malformed sign-ins, then none counts (400 each) and the right password still works', async () => {
    const limited = createTestContext({ TRUST_PROXY: 'true', SIGNIN_RATE_LIMIT: '3', ACCOUNT_LOCK_THRESHOLD: '3' });
    const address = freshAddress();
    try {
      const user = await makeUser({ roles: ['auditor'] });
      const malformed = [{}, { email: user.email }, { email: 'not an e-mail', password: 'x' }, { email: user.email, password: '' }, { email: user.email, password: 'x', extra: 1 }];
      for (let round = 0; round < 4; round += 1) {
        for (const body of malformed) {
          expect((await request(limited.app).post('/api/session').set('X-Forwarded-For', address).send(body)).status).toBe(400);
        }
      }
      const right = await request(limited.app).post('/api/session').set('X-Forwarded-For', address).send({ email: user.email, password: TEST_PASSWORD });
      expect(right.status).toBe(200);
      expect((await User.findByPk(user.id))!.failedSignIns).toBe(0);
    } finally {
      await limited.close();
    }
  });

  it('when the e-mail comes with spaces and capitals, then it is the same account', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const response = await attempt(`  ${user.email.toUpperCase()}\t`, TEST_PASSWORD);
    expect(response.status).toBe(200);
    expect(response.body.user.id).toBe(user.id);
  });
});

describe('sessions end when the password or roles change', () => {
  it('when a person changes their own password, then their other sessions end and this one goes on', async () => {
    const user = await makeUser({ roles: ['technician'] });
    const here = await signIn(context.app, user);
    const elsewhere = await signIn(context.app, user);
    const changed = await here.post('/api/session/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'tidal basin kestrel 4417' });
    expect(changed.status).toBe(200);
    expect((await here.agent.get('/api/session')).status).toBe(200);
    expect((await elsewhere.agent.get('/api/session')).status).toBe(401);
    expect((await attempt(user.email, 'tidal basin kestrel 4417')).status).toBe(200);
  });

  it('when an administrator resets a password, then the person’s sessions end and they must choose their own before anything else', async () => {
    const admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const user = await makeUser({ roles: ['technician'] });
    const live = await signIn(context.app, user);
    const reset = await admin.patch(`/api/users/${user.id}`).send({ version: user.version, password: 'granite lantern 8812 wharf' });
    expect(reset.status).toBe(200);
    expect(reset.body.passwordChangeRequired).toBe(true);
    expect((await live.agent.get('/api/session')).status).toBe(401);

    const next = await signIn(context.app, user, 'granite lantern 8812 wharf');
    expect((await next.agent.get('/api/session')).body.user.passwordChangeRequired).toBe(true);
    const blocked = await next.agent.get('/api/findings');
    expect(blocked.status).toBe(403);
    expect(blocked.body.error.code).toBe('password_change_required');
    const own = await next.post('/api/session/password').send({ currentPassword: 'granite lantern 8812 wharf', newPassword: 'quiet orchard 5531 ferry' });
    expect(own.status).toBe(200);
    expect(own.body.user.passwordChangeRequired).toBe(false);
    expect((await next.agent.get('/api/findings')).status).toBe(200);
  });

  it('when an administrator changes a person’s roles, then that person’s sessions end', async () => {
    const admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const user = await makeUser({ roles: ['technician'] });
    const live = await signIn(context.app, user);
    const changed = await admin.patch(`/api/users/${user.id}`).send({ version: user.version, roles: ['technician', 'level3'] });
    expect(changed.status).toBe(200);
    expect((await live.agent.get('/api/session')).status).toBe(401);
    expect((await admin.agent.get('/api/session')).status).toBe(200);
  });
});

describe('guessable passwords', () => {
  it('when a common, repetitive or demo password is chosen, then 400 with the reason at the password field; a phrase of one’s own is taken', async () => {
    const admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const body = (password: string) => ({ email: `pw-${Date.now()}-${Math.random().toString(36).slice(2)}@test.example`, displayName: 'Password Test', password, roles: ['technician'] });
    for (const password of ['password1234', 'aaaaaaaaaaaa', 'whorl-demo-2026', 'qwertyuiop123', 'abcdefghijklm']) {
      const refused = await admin.post('/api/users').send(body(password));
      expect(refused.status, password).toBe(400);
      expect(refused.body.error.details, password).toEqual([expect.objectContaining({ path: 'password', message: expect.stringMatching(/common or breached|demo password|repeated or sequential/) })]);
    }
    expect((await admin.post('/api/users').send(body('ledger harbour 2291 moss'))).status).toBe(201);

    const self = await signIn(context.app, await makeUser({ roles: ['technician'] }));
    const own = await self.post('/api/session/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'password1234' });
    expect(own.status).toBe(400);
    expect(own.body.error.details).toEqual([expect.objectContaining({ path: 'newPassword', message: expect.stringContaining('common or breached') })]);
  });
});

describe('no self-granted signing roles', () => {
  it('when an administrator adds a signing role to themself, then 403 and nothing changes; another administrator may add it', async () => {
    const first = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const refused = await first.patch(`/api/users/${first.user.id}`).send({ version: first.user.version, roles: ['admin', 'quality_manager'] });
    expect(refused.status).toBe(403);
    expect((await first.agent.get(`/api/users/${first.user.id}`)).body.roles).toEqual(['admin']);
    const refusedAccountable = await first.patch(`/api/users/${first.user.id}`).send({ version: first.user.version, roles: ['accountable_manager', 'admin'] });
    expect(refusedAccountable.status).toBe(403);
    // Other changes of their own stay allowed.
    expect((await first.patch(`/api/users/${first.user.id}`).send({ version: first.user.version, roles: ['admin', 'auditor'] })).status).toBe(200);

    const second = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    const current = (await second.agent.get(`/api/users/${first.user.id}`)).body;
    const granted = await second.patch(`/api/users/${first.user.id}`).send({ version: current.version, roles: ['admin', 'auditor', 'quality_manager'] });
    expect(granted.status).toBe(200);
    expect(granted.body.roles).toEqual(['admin', 'auditor', 'quality_manager']);
  });
});

describe('Origin is compared with PUBLIC_URL', () => {
  it('when Origin and Host agree but are not the public address, then 403; the public address is accepted whatever the Host', async () => {
    const public_ = createTestContext({ PUBLIC_URL: 'https://whorl.example' });
    try {
      const user = await makeUser({ roles: ['auditor'] });
      const forged = await request(public_.app).post('/api/session').set('Host', 'evil.example').set('Origin', 'http://evil.example').send({ email: user.email, password: TEST_PASSWORD });
      expect(forged.status).toBe(403);
      expect(forged.body.error.code).toBe('cross_origin');
      const genuine = await request(public_.app).post('/api/session').set('Host', 'internal:5180').set('Origin', 'https://whorl.example').send({ email: user.email, password: TEST_PASSWORD });
      expect(genuine.status).toBe(200);
    } finally {
      await public_.close();
    }
  });
});
