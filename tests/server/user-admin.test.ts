import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { ROLES, type Role } from '../../shared/roles';
import { User } from '../../server/models';
import { createTestContext, makeArea, makeUser, signIn, signedInAs, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const newUserBody = (tag: string) => ({
  email: `new-${tag}-${Date.now()}@test.example`,
  displayName: `New ${tag}`,
  password: 'a long enough passphrase',
  roles: ['technician'],
});

describe('user administration', () => {
  it('when signed out, then every user-admin route is 401', async () => {
    expect((await request(context.app).get('/api/users')).status).toBe(401);
    expect((await request(context.app).post('/api/users').send(newUserBody('anon'))).status).toBe(401);
  });

  for (const role of ROLES.filter((r): r is Exclude<Role, 'admin'> => r !== 'admin')) {
    it(`when a ${role} calls the admin routes, then reading is allowed and every change is 403`, async () => {
      const session = await signedInAs(context, [role]);
      const target = await makeUser({ roles: ['technician'] });
      expect((await session.agent.get('/api/users')).status).toBe(200);
      expect((await session.post('/api/users').send(newUserBody(role))).status).toBe(403);
      expect((await session.patch(`/api/users/${target.id}`).send({ version: target.version, displayName: 'Changed' })).status).toBe(403);
      expect((await session.post(`/api/users/${target.id}/unlock`).send({})).status).toBe(403);
      expect((await User.findByPk(target.id))!.displayName).toBe(target.displayName);
    });
  }

  it('when an admin creates, edits, assigns roles and area, and deactivates a user, then each works and is on the trail', async () => {
    const admin = await signedInAs(context, ['admin']);
    const area = await makeArea();
    const body = newUserBody('admin');
    const created = await admin.post('/api/users').send({ ...body, areaId: area.id });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email: body.email, roles: ['technician'], areaId: area.id, areaName: area.name, active: true });

    const edited = await admin
      .patch(`/api/users/${created.body.id}`)
      .send({ version: created.body.version, displayName: 'Renamed Person', roles: ['level3', 'technician'] });
    expect(edited.status).toBe(200);
    expect(edited.body.roles).toEqual(['level3', 'technician']);

    const stale = await admin.patch(`/api/users/${created.body.id}`).send({ version: created.body.version, displayName: 'Again' });
    expect(stale.status).toBe(409);

    const deactivated = await admin.patch(`/api/users/${created.body.id}`).send({ version: edited.body.version, active: false });
    expect(deactivated.status).toBe(200);
    expect(deactivated.body.active).toBe(false);
    expect(await User.count({ where: { id: created.body.id } })).toBe(1);

    const signInAfter = await request(context.app).post('/api/session').send({ email: body.email, password: body.password });
    expect(signInAfter.status).toBe(401);

    const trail = await admin.agent.get(`/api/trail?record=user:${created.body.id}`);
    expect(trail.body.items.map((entry: { event: string }) => entry.event)).toEqual(['USER_CREATED', 'USER_UPDATED', 'USER_DEACTIVATED']);
  });

  it('when an admin lists users with a filter and paging, then the page and total are right', async () => {
    const admin = await signedInAs(context, ['admin']);
    const tag = `Pager${Date.now()}`;
    for (let index = 0; index < 3; index += 1) await makeUser({ roles: ['auditor'], displayName: `${tag} ${index}` });
    const page = await admin.agent.get(`/api/users?q=${tag}&pageSize=2&page=2&sort=-displayName`);
    expect(page.status).toBe(200);
    expect(page.body.total).toBe(3);
    expect(page.body.items.map((user: { displayName: string }) => user.displayName)).toEqual([`${tag} 0`]);
  });

  it('when the admin tries to deactivate themself, then 422', async () => {
    const adminUser = await makeUser({ roles: ['admin'] });
    const admin = await signIn(context.app, adminUser);
    const response = await admin.patch(`/api/users/${adminUser.id}`).send({ version: adminUser.version, active: false });
    expect(response.status).toBe(422);
  });
});
