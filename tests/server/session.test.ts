import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { User } from '../../server/models';
import { createTestContext, makeUser, signIn, TEST_PASSWORD, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const sessionCookie = (response: request.Response) =>
  ([] as string[]).concat(response.headers['set-cookie'] ?? []).find((cookie) => cookie.startsWith('whorl.sid='));

describe('sign-in', () => {
  it('when the password is right, then it answers the user, packed rules and a CSRF token', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const response = await request(context.app).post('/api/session').send({ email: user.email, password: TEST_PASSWORD });
    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({ id: user.id, email: user.email, roles: ['auditor'] });
    expect(Array.isArray(response.body.rules)).toBe(true);
    expect(response.body.rules.length).toBeGreaterThan(0);
    expect(response.body.csrfToken).toMatch(/^[a-f0-9]{32,}$/);
  });

  it('when the password is wrong, then 401 with a plain message', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const response = await request(context.app).post('/api/session').send({ email: user.email, password: 'not the password' });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('invalid_credentials');
  });

  it('when the e-mail is unknown, then the same 401', async () => {
    const response = await request(context.app).post('/api/session').send({ email: 'nobody@test.example', password: 'whatever-long' });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('invalid_credentials');
  });

  it('when credentials come in the query string, then 400', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const response = await request(context.app)
      .post(`/api/session?email=${encodeURIComponent(user.email)}&password=${encodeURIComponent(TEST_PASSWORD)}`)
      .send({ email: user.email, password: TEST_PASSWORD });
    expect(response.status).toBe(400);
  });

  it('then the session cookie is HttpOnly, SameSite=Lax and not Secure over plain HTTP', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const response = await request(context.app).post('/api/session').send({ email: user.email, password: TEST_PASSWORD });
    const cookie = sessionCookie(response)!;
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });

  it('when served over TLS behind a proxy (COOKIE_SECURE, TRUST_PROXY), then the cookie is Secure', async () => {
    const secure = createTestContext({ COOKIE_SECURE: 'true', TRUST_PROXY: 'true' });
    try {
      const user = await makeUser({ roles: ['auditor'] });
      const response = await request(secure.app)
        .post('/api/session')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: user.email, password: TEST_PASSWORD });
      expect(sessionCookie(response)).toMatch(/;\s*Secure/i);
    } finally {
      await secure.close();
    }
  });

  it('when signing in on an existing session, then the session id changes', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const agent = request.agent(context.app);
    const first = await agent.post('/api/session').send({ email: user.email, password: TEST_PASSWORD });
    const second = await agent.post('/api/session').send({ email: user.email, password: TEST_PASSWORD });
    const id = (cookie: string | undefined) => cookie?.split(';')[0];
    expect(id(sessionCookie(first))).toBeDefined();
    expect(id(sessionCookie(second))).toBeDefined();
    expect(id(sessionCookie(second))).not.toBe(id(sessionCookie(first)));
  });

  it('when signed in, then GET /api/session answers the same user; signed out it is 401', async () => {
    const user = await makeUser({ roles: ['level3'] });
    const signedIn = await signIn(context.app, user);
    const current = await signedIn.agent.get('/api/session');
    expect(current.status).toBe(200);
    expect(current.body.user.id).toBe(user.id);
    expect(current.body.csrfToken).toBe(signedIn.csrfToken);
    expect((await request(context.app).get('/api/session')).status).toBe(401);
  });

  it('when a cookie is replayed after sign-out, then 401', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    const login = await request(context.app).post('/api/session').send({ email: user.email, password: TEST_PASSWORD });
    const cookie = sessionCookie(login)!.split(';')[0];
    const token = login.body.csrfToken;
    expect((await request(context.app).get('/api/session').set('Cookie', cookie)).status).toBe(200);
    const out = await request(context.app).delete('/api/session').set('Cookie', cookie).set('X-CSRF-Token', token);
    expect(out.status).toBe(204);
    expect((await request(context.app).get('/api/session').set('Cookie', cookie)).status).toBe(401);
  });

  it('when a user is deactivated, then their live session stops working', async () => {
    const user = await makeUser({ roles: ['technician'] });
    const signedIn = await signIn(context.app, user);
    expect((await signedIn.agent.get('/api/session')).status).toBe(200);
    await User.update({ active: false }, { where: { id: user.id } });
    expect((await signedIn.agent.get('/api/session')).status).toBe(401);
  });

  it('when the idle timeout passes, then the session ends', async () => {
    const short = createTestContext({ SESSION_IDLE_MINUTES: '1' });
    try {
      const user = await makeUser({ roles: ['auditor'] });
      const signedIn = await signIn(short.app, user);
      const realNow = Date.now;
      try {
        Date.now = () => realNow() + 2 * 60_000;
        expect((await signedIn.agent.get('/api/session')).status).toBe(401);
      } finally {
        Date.now = realNow;
      }
    } finally {
      await short.close();
    }
  });
});

describe('throttling and lockout', () => {
  it('when one address fails 10 times, then the 11th attempt is 429 with Retry-After, and another address still signs in', async () => {
    // Behind a proxy the address is the forwarded one: each test keeps its own.
    const limited = createTestContext({ SIGNIN_RATE_LIMIT: '10', ACCOUNT_LOCK_THRESHOLD: '100', TRUST_PROXY: 'true' });
    const address = `198.51.100.${Math.floor(Math.random() * 250) + 1}`;
    try {
      const user = await makeUser({ roles: ['auditor'] });
      for (let attempt = 1; attempt <= 10; attempt += 1) {
        const response = await request(limited.app).post('/api/session').set('X-Forwarded-For', address).send({ email: user.email, password: `wrong-${attempt}` });
        expect(response.status).toBe(401);
      }
      const eleventh = await request(limited.app).post('/api/session').set('X-Forwarded-For', address).send({ email: user.email, password: TEST_PASSWORD });
      expect(eleventh.status).toBe(429);
      expect(Number(eleventh.headers['retry-after'])).toBeGreaterThan(0);
      expect(eleventh.body.error.code).toBe('too_many_attempts');
      const elsewhere = await request(limited.app).post('/api/session').set('X-Forwarded-For', '192.0.2.77').send({ email: user.email, password: TEST_PASSWORD });
      expect(elsewhere.status).toBe(200);
    } finally {
      await limited.close();
    }
  });

  it('when an account fails 10 times in a row, then it is locked for a while (same 401 even with the right password), an admin can unlock it, with trail entries', async () => {
    const user = await makeUser({ roles: ['auditor'] });
    for (let attempt = 1; attempt <= 10; attempt += 1) {
      const response = await request(context.app).post('/api/session').send({ email: user.email, password: `wrong-${attempt}` });
      expect(response.status).toBe(401);
    }
    const right = await request(context.app).post('/api/session').send({ email: user.email, password: TEST_PASSWORD });
    expect(right.status).toBe(401);
    expect(right.body.error.code).toBe('invalid_credentials');
    const stored = await User.findByPk(user.id);
    expect(stored!.lockedUntil!.getTime()).toBeGreaterThan(Date.now());

    const admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
    expect((await admin.agent.get(`/api/users/${user.id}`)).body.locked).toBe(true);
    const unlock = await admin.post(`/api/users/${user.id}/unlock`).send({});
    expect(unlock.status).toBe(200);
    expect(unlock.body.locked).toBe(false);
    const trail = await admin.agent.get(`/api/trail?record=user:${user.id}`);
    const events = trail.body.items.map((entry: { event: string }) => entry.event);
    expect(events).toContain('ACCOUNT_LOCKED');
    expect(events).toContain('ACCOUNT_UNLOCKED');
    expect((await request(context.app).post('/api/session').send({ email: user.email, password: TEST_PASSWORD })).status).toBe(200);
  });
});
