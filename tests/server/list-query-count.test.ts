// No N+1: a list request runs the same number of SQL queries whatever its page
// size. Counted at Sequelize's query log for a page of 1 and a page of 100 rows.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, makeUser, signIn, type SignedIn, type TestContext } from '../helpers/test-app';
import { makeActionRow } from '../helpers/evidence-owners';

let context: TestContext;
let quality: SignedIn;
let admin: SignedIn;

beforeAll(async () => {
  context = createTestContext();
  quality = await signIn(context.app, await makeUser({ roles: ['quality_manager'] }));
  admin = await signIn(context.app, await makeUser({ roles: ['admin'] }));
  const owner = await makeUser({ roles: ['technician'] });
  for (let i = 0; i < 105; i += 1) await makeActionRow(context.deps.sequelize, { ownerId: owner.id, createdById: quality.user.id });
  for (let i = 0; i < 100; i += 1) await makeUser({ roles: ['technician'] });
});
afterAll(() => context.close());

/** The SQL statements one request runs (session load included), after a warm-up request. */
async function queriesFor(agent: SignedIn, url: string): Promise<{ count: number; rows: number; statements: string[] }> {
  await agent.agent.get(url).expect(200);
  // Sequelize reads options.logging on every query; its typings do not expose the field.
  const sequelize = context.deps.sequelize as unknown as { options: { logging: unknown } };
  const statements: string[] = [];
  const original = sequelize.options.logging;
  sequelize.options.logging = (sql: string) => void statements.push(sql.replace(/^Executing \([^)]*\): /, '').slice(0, 120));
  try {
    const response = await agent.agent.get(url);
    expect(response.status).toBe(200);
    return { count: statements.length, rows: response.body.items.length, statements };
  } finally {
    sequelize.options.logging = original;
  }
}

describe.each([
  ['findings', '/api/findings?sort=-number', () => quality],
  ['findings filtered by state', '/api/findings?state=action_open&sort=dueDate', () => quality],
  ['corrective actions', '/api/actions', () => quality],
  ['users', '/api/users', () => admin],
])('when the %s list is read with a page of 1 and a page of 100', (_name, url, who) => {
  it('then both run the same number of SQL queries', async () => {
    const small = await queriesFor(who(), `${url}${url.includes('?') ? '&' : '?'}pageSize=1`);
    const large = await queriesFor(who(), `${url}${url.includes('?') ? '&' : '?'}pageSize=100`);
    expect(small.rows).toBe(1);
    expect(large.rows).toBe(100);
    expect(large.count, `page of 100:\n${large.statements.join('\n')}\npage of 1:\n${small.statements.join('\n')}`).toBe(small.count);
    expect(small.count).toBeGreaterThanOrEqual(2); // at least the page and its total: the counting works
    expect(large.count).toBeLessThanOrEqual(6);
  });
});
