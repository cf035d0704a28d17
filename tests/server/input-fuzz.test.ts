// Input fuzzing of every create and event route: bodies derived from the routes'
// zod schemas and mutated (wrong types, missing fields, huge strings, unicode,
// __proto__/constructor keys, non-objects). Every answer is a success or one of
// the documented refusals with a JSON error body, never a 500; a refused request
// writes nothing (row counts and the trail head unchanged).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import type { z } from 'zod';
import { createTestContext, makeUser, signIn, type SignedIn, type TestContext } from '../helpers/test-app';
import { makeActionRow, makeFindingRow } from '../helpers/evidence-owners';
import { fuzzBodies } from '../helpers/zod-arbitrary';
import { UserCreateSchema, UserUpdateSchema } from '../../shared/schemas/user';
import { AreaCreateSchema, AreaUpdateSchema } from '../../shared/schemas/area';
import { CertificationCreateSchema } from '../../shared/schemas/certification';
import { EquipmentCreateSchema } from '../../shared/schemas/equipment';
import { ActionCreateSchema, ActionEventSchema, AuditCreateSchema, AuditEventSchema, FindingEventSchema } from '../../shared/schemas/workflow';
import { TechniqueCreateSchema } from '../../shared/schemas/technique-register';
import { RaiseExtentFindingsSchema } from '../../shared/schemas/extent';
import { ContainmentDecisionsSchema, ImpactScopeSchema } from '../../shared/schemas/impact';
import { InspectionFieldsSchema } from '../../shared/schemas/inspection';

const REFUSALS = new Set([400, 403, 404, 409, 413, 415, 422]);
const WRITTEN_TABLES = [
  'users', 'areas', 'role_assignments', 'findings', 'corrective_actions', 'audits', 'techniques', 'technique_revisions', 'certifications', 'equipment',
  'inspections', 'extent_runs', 'containment_decisions', 'trail_entries',
];

let context: TestContext;
let everyone: SignedIn;
let ids: { user: number; area: number; finding: number; action: number; audit: number | null };

beforeAll(async () => {
  context = createTestContext();
  // One person holding every role reaches past the role guards into validation on every route.
  const user = await makeUser({ roles: ['admin', 'quality_manager', 'auditor', 'level3'] });
  everyone = await signIn(context.app, user);
  const target = await makeUser({ roles: ['technician'] });
  const finding = await makeFindingRow(context.deps.sequelize, { authorId: user.id });
  const action = await makeActionRow(context.deps.sequelize, { ownerId: target.id, createdById: user.id });
  const [audit] = await context.deps.sequelize.query<{ id: number }>('SELECT id FROM audits ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  ids = { user: target.id, area: finding.areaId, finding: finding.id, action: action.id, audit: audit?.id ?? null };
});
afterAll(() => context.close());

async function writeState(): Promise<string> {
  const existing = await context.deps.sequelize.query<{ name: string }>(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()',
    { type: QueryTypes.SELECT },
  );
  const present = WRITTEN_TABLES.filter((table) => existing.some((row) => row.name === table));
  const counts = await context.deps.sequelize.query<Record<string, number>>(
    `SELECT ${present.map((table) => `(SELECT COUNT(*) FROM \`${table}\`) AS \`${table}\``).join(', ')}, (SELECT CONCAT(seq, ':', hash) FROM trail_head WHERE id = 1) AS head`,
    { type: QueryTypes.SELECT },
  );
  return JSON.stringify(counts[0]);
}

const routes: [string, 'post' | 'patch', () => string, z.ZodType][] = [
  ['create a user', 'post', () => '/api/users', UserCreateSchema],
  ['edit a user', 'patch', () => `/api/users/${ids.user}`, UserUpdateSchema],
  ['create an area', 'post', () => '/api/areas', AreaCreateSchema],
  ['edit an area', 'patch', () => `/api/areas/${ids.area}`, AreaUpdateSchema],
  ['register a certification', 'post', () => '/api/certifications', CertificationCreateSchema],
  ['register equipment', 'post', () => '/api/equipment', EquipmentCreateSchema],
  ['create a technique', 'post', () => '/api/techniques', TechniqueCreateSchema],
  ['plan an audit', 'post', () => '/api/audits', AuditCreateSchema],
  ['send an audit event', 'post', () => `/api/audits/${ids.audit ?? 1}/events`, AuditEventSchema],
  ['send a finding event', 'post', () => `/api/findings/${ids.finding}/events`, FindingEventSchema],
  ['assign a corrective action', 'post', () => '/api/actions', ActionCreateSchema],
  ['send a corrective action event', 'post', () => `/api/actions/${ids.action}/events`, ActionEventSchema],
  ['record an inspection', 'post', () => '/api/inspections', InspectionFieldsSchema],
  ['raise extent findings', 'post', () => `/api/findings/${ids.finding}/extent-findings`, RaiseExtentFindingsSchema],
  ['record containment decisions', 'post', () => `/api/findings/${ids.finding}/containment-decisions`, ContainmentDecisionsSchema],
  ['set the impact scope', 'patch', () => `/api/findings/${ids.finding}/impact-scope`, ImpactScopeSchema],
];

describe.each(routes)('when fuzzed bodies are sent to %s', (_name, method, url, schema) => {
  it('then every answer is a success or a documented refusal with a JSON error, and refusals write nothing', async () => {
    const statuses: Record<number, number> = {};
    await fc.assert(
      fc.asyncProperty(fuzzBodies(schema), async (body) => {
        const before = await writeState();
        const response = await everyone[method === 'post' ? 'post' : 'patch'](url())
          .set('Content-Type', 'application/json')
          .send(body.text);
        statuses[response.status] = (statuses[response.status] ?? 0) + 1;
        const context = `${body.kind}: ${body.text.slice(0, 300)} → ${response.status} ${JSON.stringify(response.body).slice(0, 300)}`;
        if (response.status >= 200 && response.status < 300) return;
        expect(REFUSALS.has(response.status), context).toBe(true);
        expect(response.headers['content-type'], context).toMatch(/application\/json/);
        expect(typeof response.body?.error?.code, context).toBe('string');
        expect(typeof response.body?.error?.message, context).toBe('string');
        expect(await writeState(), context).toBe(before);
        // Nothing leaked onto the prototype of plain objects.
        expect(({} as Record<string, unknown>).polluted, context).toBeUndefined();
      }),
      { numRuns: 40, seed: 20261201 },
    );
    console.log(`${_name}: answers ${JSON.stringify(statuses)}`);
  });
});
