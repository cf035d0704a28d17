import path from 'node:path';
// The organisation's policy over HTTP: every setting with its default and basis,
// admin-only edits with optimistic locking, and the edit changing checklist results.
import { readFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { POLICY_SETTINGS, DEFAULT_POLICY } from '../../shared/domain/policy';
import { PolicySetting, TechniqueRevision, TrailEntry } from '../../server/models';
import { createTestContext, signedInAs, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

async function resetPolicy() {
  const admin = await signedInAs(context, ['admin']);
  const current = await admin.agent.get('/api/policy');
  const values = Object.fromEntries(POLICY_SETTINGS.map((setting) => [setting.key, null]));
  const reset = await admin.patch('/api/policy').send({ version: current.body.version, values });
  expect(reset.status).toBe(200);
}
beforeEach(resetPolicy);

const BOBBIN = JSON.parse(readFileSync(path.join(import.meta.dirname, '../shared/fixtures/heat-exchanger-bobbin.json'), 'utf8'));

describe('policy settings', () => {
  it('when anyone signed in reads the policy, then every setting shows its default, basis and current value', async () => {
    expect((await request(context.app).get('/api/policy')).status).toBe(401);
    const technician = await signedInAs(context, ['technician']);
    const response = await technician.agent.get('/api/policy');
    expect(response.status).toBe(200);
    expect(response.body.settings).toHaveLength(POLICY_SETTINGS.length);
    const fill = response.body.settings.find((setting: { key: string }) => setting.key === 'fillFactorMinInternal');
    expect(fill).toMatchObject({ defaultValue: 0.8, value: 0.8, isDefault: true, basis: 'common practice, no single source' });
    expect(response.body.policy).toEqual(DEFAULT_POLICY);
  });

  it('when a non-admin edits, then 403; bad values 400; stale version 409', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const level3 = await signedInAs(context, ['level3']);
    const admin = await signedInAs(context, ['admin']);
    const { version } = (await admin.agent.get('/api/policy')).body;
    expect((await request(context.app).patch('/api/policy').send({ version, values: {} })).status).toBe(401);
    expect((await quality.patch('/api/policy').send({ version, values: { fillFactorMinInternal: 0.9 } })).status).toBe(403);
    expect((await level3.patch('/api/policy').send({ version, values: { fillFactorMinInternal: 0.9 } })).status).toBe(403);

    const tooHigh = await admin.patch('/api/policy').send({ version, values: { fillFactorMinInternal: 1.5 } });
    expect(tooHigh.status).toBe(400);
    expect(tooHigh.body.error.details[0]).toMatchObject({ path: 'values.fillFactorMinInternal', message: 'fillFactorMinInternal must be between 0.1 and 1' });
    const unknown = await admin.patch('/api/policy').send({ version, values: { noSuchSetting: 1 } });
    expect(unknown.status).toBe(400);
    const window = await admin.patch('/api/policy').send({ version, values: { limitFrequencyRatioMin: 20 } });
    expect(window.status).toBe(400);
    expect(window.body.error.details[0].path).toBe('values.limitFrequencyRatioMin');
    const fraction = await admin.patch('/api/policy').send({ version, values: { findingDueDaysMajor: 2.5 } });
    expect(fraction.status).toBe(400);

    expect((await admin.patch('/api/policy').send({ version: version + 3, values: { fillFactorMinInternal: 0.9 } })).status).toBe(409);
    expect(await PolicySetting.count()).toBe(0);
  });

  it('when the admin raises the internal fill-factor minimum, then a bobbin technique that passed now fails, stored verdicts follow, and it is on the trail', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const created = await level3.post('/api/techniques').send({ technique: { ...BOBBIN, code: `P-${randomBytes(4).toString('hex')}` } });
    expect(created.status).toBe(201);
    const id = created.body.id;
    const fillBefore = (await level3.agent.get(`/api/techniques/${id}/checklist`)).body.output.results.find(
      (result: { rule: string }) => result.rule === 'fill-factor',
    );
    // η = (15.5 / 16.57)² ≈ 0.875 passes the default minimum of 0.8.
    expect(fillBefore.status).toBe('pass');

    const admin = await signedInAs(context, ['admin']);
    const { version } = (await admin.agent.get('/api/policy')).body;
    const edited = await admin.patch('/api/policy').send({ version, values: { fillFactorMinInternal: 0.9 } });
    expect(edited.status).toBe(200);
    expect(edited.body.version).toBe(version + 1);
    const setting = edited.body.settings.find((item: { key: string }) => item.key === 'fillFactorMinInternal');
    expect(setting).toMatchObject({ value: 0.9, defaultValue: 0.8, isDefault: false, updatedBy: { id: admin.user.id } });

    const after = (await level3.agent.get(`/api/techniques/${id}/checklist`)).body.output;
    expect(after.policy.fillFactorMinInternal).toBe(0.9);
    expect(after.results.find((result: { rule: string }) => result.rule === 'fill-factor').status).toBe('fail');
    const stored = await TechniqueRevision.findOne({ where: { techniqueId: id } });
    expect(stored!.failedRules).toContain('fill-factor');

    // The live preview uses the same policy.
    const preview = await level3.post('/api/checklist/evaluate').send({ ...BOBBIN });
    expect(preview.body.results.find((result: { rule: string }) => result.rule === 'fill-factor').status).toBe('fail');

    const entry = await TrailEntry.findOne({ where: { recordType: 'policy', event: 'POLICY_UPDATED' }, order: [['seq', 'DESC']] });
    expect(entry!.userId).toBe(admin.user.id);
    expect(entry!.changes).toMatchObject({ fillFactorMinInternal: { before: 0.8, after: 0.9, default: 0.8 } });

    // Back to the default: the row goes, so a later change of the default applies.
    const reset = await admin.patch('/api/policy').send({ version: edited.body.version, values: { fillFactorMinInternal: null } });
    expect(reset.status).toBe(200);
    expect(await PolicySetting.count({ where: { key: 'fillFactorMinInternal' } })).toBe(0);
    expect((await TechniqueRevision.findOne({ where: { techniqueId: id } }))!.failedRules).not.toContain('fill-factor');
  });
});
