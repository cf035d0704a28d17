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
import { MULTIPART } from '../../server/middlewares/multipart-errors';
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

describe.each(routes)('when a lone UTF-16 surrogate is in the body sent to %s', (_name, method, url) => {
  it('then 400 names the field and says the text has a broken character, and nothing is written', async () => {
    const before = await writeState();
    for (const text of ['{"title":"\\ud800"}', '{"note":"a\\udc00b","version":0}', '{"\\udfff":"key"}']) {
      const response = await everyone[method === 'post' ? 'post' : 'patch'](url()).set('Content-Type', 'application/json').send(text);
      expect(response.status, text).toBe(400);
      expect(response.body.error.details[0].message, text).toContain('broken character');
    }
    expect(await writeState()).toBe(before);
  });
});

// Every route that parses multipart bodies, found by the marker its upload middleware carries.
const MULTIPART_ROUTES: [string, () => string][] = [
  ['upload evidence', () => '/api/evidence'],
  ['preview an inspection import', () => '/api/inspections/import/preview'],
  ['import inspections', () => '/api/inspections/import'],
  ['preview a capability demonstration import', () => '/api/pod-demonstrations/import/preview'],
];

interface Layer {
  route?: { path: string; methods: Record<string, boolean>; stack: { handle: unknown }[] };
  handle: { stack?: Layer[] };
}

function multipartRoutes(stack: Layer[], found: string[] = []): string[] {
  for (const layer of stack) {
    if (layer.route?.stack.some((entry) => typeof entry.handle === 'function' && MULTIPART in (entry.handle as object))) found.push(`/api${layer.route.path}`);
    else if (layer.handle?.stack) multipartRoutes(layer.handle.stack, found);
  }
  return found;
}

const BOUNDARY = 'whorl-fuzz-boundary';
const part = (headers: string, body: string) => `--${BOUNDARY}\r\n${headers}\r\n\r\n${body}\r\n`;
const fileHeaders = 'Content-Disposition: form-data; name="file"; filename="probe.csv"\r\nContent-Type: text/csv';

/** Bodies a multipart parser must refuse: each a 400 with a message, never a 500. */
const MALFORMED: { kind: string; contentType: string; body: string | Buffer }[] = [
  { kind: 'bad part header', contentType: `multipart/form-data; boundary=${BOUNDARY}`, body: `--${BOUNDARY}\r\nContent-Disposition form-data name file\r\n\r\nx\r\n--${BOUNDARY}--\r\n` },
  { kind: 'header line without a colon', contentType: `multipart/form-data; boundary=${BOUNDARY}`, body: `--${BOUNDARY}\r\n${'x'.repeat(100)}\r\n\r\nx\r\n--${BOUNDARY}--\r\n` },
  { kind: 'missing boundary', contentType: 'multipart/form-data', body: part(fileHeaders, 'a,b\r\n1,2') + `--${BOUNDARY}--\r\n` },
  { kind: 'empty boundary', contentType: 'multipart/form-data; boundary=', body: part(fileHeaders, 'a,b') },
  { kind: 'truncated body', contentType: `multipart/form-data; boundary=${BOUNDARY}`, body: part(fileHeaders, 'a,b\r\n1,2').slice(0, -12) },
  { kind: 'no closing boundary', contentType: `multipart/form-data; boundary=${BOUNDARY}`, body: part(fileHeaders, 'a,b\r\n1,2') },
  { kind: 'boundary only', contentType: `multipart/form-data; boundary=${BOUNDARY}`, body: `--${BOUNDARY}` },
  { kind: 'empty body', contentType: `multipart/form-data; boundary=${BOUNDARY}`, body: '' },
];

describe('multipart routes', () => {
  it('then the fuzzed list holds every route that parses multipart bodies', () => {
    const router = (context.app as unknown as { router: { stack: Layer[] } }).router;
    expect(multipartRoutes(router.stack).sort()).toEqual(MULTIPART_ROUTES.map(([, url]) => url()).sort());
  });

  describe.each(MULTIPART_ROUTES)('when malformed multipart bodies are sent to %s', (_name, url) => {
    it.each(MALFORMED)('then “$kind” is a 400 with a message and nothing is written', async ({ contentType, body }) => {
      const before = await writeState();
      const response = await everyone.post(url()).set('Content-Type', contentType).send(body);
      expect(response.status).toBe(400);
      expect(response.headers['content-type']).toMatch(/application\/json/);
      expect(response.body.error.message).toEqual(expect.any(String));
      expect(await writeState()).toBe(before);
    });

    it('then random bytes under a multipart content type are answered with a refusal, never a 500', async () => {
      await fc.assert(
        fc.asyncProperty(fc.uint8Array({ maxLength: 600 }), fc.constantFrom(`multipart/form-data; boundary=${BOUNDARY}`, 'multipart/form-data', 'multipart/form-data; boundary="a b"'), async (bytes, contentType) => {
          const before = await writeState();
          const prefix = Buffer.from(`--${BOUNDARY}\r\n`);
          const response = await everyone.post(url()).set('Content-Type', contentType).send(Buffer.concat([prefix, Buffer.from(bytes)]));
          expect(REFUSALS.has(response.status), `${response.status} ${JSON.stringify(response.body)}`).toBe(true);
          expect(await writeState()).toBe(before);
        }),
        { numRuns: 25, seed: 20261202 },
      );
    });
  });
});
