// A real createApp() on the run's MariaDB, plus factories for fresh users and
// signed-in Supertest agents. Each test file builds its own.
import { randomBytes } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import request from 'supertest';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig, type AppConfig } from '../../server/config/env';
import { createSequelize } from '../../server/db/sequelize';
import { migrateWithAccounts } from '../../server/db/privileges';
import { createLogger } from '../../server/lib/logger';
import type { AppDeps } from '../../server/app-deps';
import type { Sequelize } from 'sequelize';
import { Area, RoleAssignment, User, initModels } from '../../server/models';
import { hashPassword } from '../../server/auth/passwords';
import type { Role } from '../../shared/roles';

export const TEST_PASSWORD = 'correct horse battery staple';

export interface TestContext {
  app: ReturnType<typeof createApp>;
  deps: AppDeps;
  config: AppConfig;
  clock: { now(): Date; set(date: Date | null): void };
  close(): Promise<void>;
}

export function testConfig(overrides: Record<string, string> = {}): AppConfig {
  return loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: inject('databaseUrl'),
    SESSION_SECRET: 'test-session-secret-that-is-long-enough',
    LOG_LEVEL: 'silent',
    SIGNIN_RATE_LIMIT: '1000',
    SCHEDULER: 'false',
    // The run's own key and anchor log, removed with its database.
    TRAIL_HMAC_KEY: 'test-trail-key-that-is-long-enough-for-hmac',
    TRAIL_ANCHOR_FILE: path.join(inject('databaseDir'), 'trail-anchors.log'),
    ...overrides,
  });
}

// Sequelize models are bound to one instance per process, so every context of a
// test file shares one pool; a context on another URL rebinds the models while it lives.
let shared: { sequelize: Sequelize; users: number } | undefined;

function acquireSequelize(url: string): { sequelize: Sequelize; release(): Promise<void> } {
  if (url === inject('databaseUrl')) {
    shared ??= { sequelize: createSequelize({ url, poolMax: 60 }), users: 0 };
    shared.users += 1;
    const current = shared;
    initModels(current.sequelize);
    return {
      sequelize: current.sequelize,
      async release() {
        current.users -= 1;
        if (current.users === 0) {
          shared = undefined;
          await current.sequelize.close();
        }
      },
    };
  }
  const own = createSequelize({ url, poolMax: 20 });
  return {
    sequelize: own,
    async release() {
      await own.close();
      if (shared) initModels(shared.sequelize);
    },
  };
}

export function createTestContext(overrides: Record<string, string> = {}): TestContext {
  const config = testConfig(overrides);
  const { sequelize, release } = acquireSequelize(config.databaseUrl);
  let fixed: Date | null = null;
  const clock = { now: () => fixed ?? new Date(), set: (date: Date | null) => void (fixed = date) };
  const deps: AppDeps = { config, sequelize, logger: createLogger('silent'), clock };
  const app = createApp(deps);
  return {
    app,
    deps,
    config,
    clock,
    async close() {
      app.close();
      await release();
    },
  };
}

let hashed: Promise<string> | undefined;

export async function makeUser({
  roles,
  areaId = null,
  password,
  displayName,
}: { roles: Role[]; areaId?: number | null; password?: string; displayName?: string }): Promise<User> {
  const passwordHash = password ? await hashPassword(password) : await (hashed ??= hashPassword(TEST_PASSWORD));
  const tag = randomBytes(5).toString('hex');
  const user = await User.create({
    email: `${roles[0]}-${tag}@test.example`,
    displayName: displayName ?? `Test ${roles.join('+')} ${tag}`,
    passwordHash,
    areaId,
    lockedAt: null,
  });
  await RoleAssignment.bulkCreate(roles.map((role) => ({ userId: user.id, role })));
  return user;
}

export async function makeArea(name = `Area ${randomBytes(3).toString('hex')}`): Promise<Area> {
  return Area.create({ code: name.replace(/[^A-Za-z0-9]/g, '').toUpperCase().slice(0, 16), name, leadUserId: null });
}

export interface SignedIn {
  agent: request.Agent;
  csrfToken: string;
  user: User;
  /** Adds the CSRF header to a state-changing request. */
  post(url: string): request.Test;
  patch(url: string): request.Test;
  del(url: string): request.Test;
}

export async function signIn(app: TestContext['app'], user: User, password = TEST_PASSWORD): Promise<SignedIn> {
  const agent = request.agent(app);
  const response = await agent.post('/api/session').send({ email: user.email, password });
  if (response.status !== 200) throw new Error(`sign-in failed: ${response.status} ${JSON.stringify(response.body)}`);
  const csrfToken: string = response.body.csrfToken;
  return {
    agent,
    csrfToken,
    user,
    post: (url) => agent.post(url).set('X-CSRF-Token', csrfToken),
    patch: (url) => agent.patch(url).set('X-CSRF-Token', csrfToken),
    del: (url) => agent.delete(url).set('X-CSRF-Token', csrfToken),
  };
}

export async function signedInAs(context: TestContext, roles: Role[], options: { areaId?: number | null } = {}) {
  const user = await makeUser({ roles, areaId: options.areaId ?? null });
  return signIn(context.app, user);
}

/** Runs SQL as the database's root user over its socket (for tests that tamper on purpose). */
export function rootSql(sql: string): string {
  const result = spawnSync('mariadb', ['--no-defaults', '-S', inject('databaseSocket'), '-uroot', '-N', '-B', '-e', sql], {
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(result.stderr);
  return result.stdout;
}

export function databaseName(): string {
  return new URL(inject('databaseUrl')).pathname.slice(1);
}

/**
 * A database of its own on the run's MariaDB server, migrated, for a test file
 * whose work scans whole tables (schedulers, outbox senders) and must not see
 * the records every other file leaves behind.
 */
export async function createIsolatedDatabase(label: string): Promise<string> {
  const shared = new URL(inject('databaseUrl'));
  const name = `${shared.pathname.slice(1)}_${label.replace(/[^a-z0-9_]/gi, '')}_${randomBytes(3).toString('hex')}`;
  const owner = new URL(inject('databaseOwnerUrl'));
  rootSql(
    `CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; ` +
      `GRANT ALL PRIVILEGES ON \`${name}\`.* TO '${decodeURIComponent(owner.username)}'@'127.0.0.1' WITH GRANT OPTION`,
  );
  const url = new URL(shared.toString());
  url.pathname = `/${name}`;
  owner.pathname = `/${name}`;
  await migrateWithAccounts({ ownerUrl: owner.toString(), appUrl: url.toString() });
  return url.toString();
}
