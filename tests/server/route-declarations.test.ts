import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REQUIREMENT, type Requirement } from '../../server/middlewares/authorize';
import { createTestContext, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

interface Layer {
  route?: { path: string; methods: Record<string, boolean>; stack: { handle: unknown }[] };
  handle: { stack?: Layer[] } & Record<symbol, unknown>;
}

interface FoundRoute {
  path: string;
  methods: string[];
  declared: boolean;
  guard: string;
}

function describeGuard(requirement: Requirement | undefined): string {
  if (!requirement) return 'NONE';
  return requirement.kind === 'can' ? `can ${requirement.action} ${requirement.subject}` : requirement.kind;
}

function collectRoutes(stack: Layer[], found: FoundRoute[] = []) {
  for (const layer of stack) {
    if (layer.route) {
      const guards = layer.route.stack.filter((entry) => typeof entry.handle === 'function' && REQUIREMENT in (entry.handle as object));
      const requirement = guards[0] ? ((guards[0].handle as Record<symbol, unknown>)[REQUIREMENT] as Requirement) : undefined;
      found.push({ path: layer.route.path, methods: Object.keys(layer.route.methods), declared: guards.length > 0, guard: describeGuard(requirement) });
    } else if (layer.handle?.stack) {
      collectRoutes(layer.handle.stack, found);
    }
  }
  return found;
}

describe('deny by default', () => {
  it('then every API route declares what it needs', () => {
    const router = (context.app as unknown as { router: { stack: Layer[] } }).router;
    const routes = collectRoutes(router.stack);
    expect(routes.length).toBeGreaterThan(8);
    const undeclared = routes.filter((route) => !route.declared).map((route) => `${route.methods.join(',')} ${route.path}`);
    expect(undeclared).toEqual([]);
  });
});

/**
 * The guard each route's resource needs. A route that loosens its guard (a
 * CASL rule replaced by "signed-in" or "public", or by a rule on another
 * subject or action) fails here, and a new route must be added with its guard.
 * "signed-in" routes check the loaded record's rule in their service (events,
 * register links) or serve only the person themself (session, home).
 */
const EXPECTED_GUARDS: [string, string][] = [
  ['GET /health', 'public'],
  ['POST /session', 'public'],
  ['GET /session', 'signed-in'],
  ['POST /session/password', 'signed-in'],
  ['DELETE /session', 'signed-in'],
  ['GET /users', 'can read User'],
  ['GET /users/:id', 'can read User'],
  ['POST /users', 'can create User'],
  ['PATCH /users/:id', 'can update User'],
  ['POST /users/:id/unlock', 'can unlock User'],
  ['GET /areas', 'can read Area'],
  ['POST /areas', 'can create Area'],
  ['PATCH /areas/:id', 'can update Area'],
  ['GET /trail', 'can read Trail'],
  ['GET /trail/verify', 'can verify Trail'],
  ['GET /evidence', 'can read Evidence'],
  ['POST /evidence', 'can create Evidence'],
  ['GET /evidence/:id/download', 'can read Evidence'],
  ['GET /evidence/:id/preview', 'can read Evidence'],
  ['POST /evidence/:id/supersede', 'can supersede Evidence'],
  ['GET /mailbox', 'can read Mailbox'],
  ['GET /mailbox/:id', 'can read Mailbox'],
  // Capability demonstrations: Level 3s record, analyse and accept; everyone reads.
  ['GET /pod-demonstrations', 'can read Demonstration'],
  ['GET /pod-demonstrations/:id', 'can read Demonstration'],
  ['POST /pod-demonstrations', 'can create Demonstration'],
  ['POST /pod-demonstrations/import/preview', 'can create Demonstration'],
  ['PATCH /pod-demonstrations/:id', 'can update Demonstration'],
  ['POST /pod-demonstrations/:id/analysis', 'can update Demonstration'],
  ['POST /pod-demonstrations/:id/acceptance', 'can approve Demonstration'],
  // The organisation's name and time zone, for dates in its own zone.
  ['GET /organisation', 'signed-in'],
  // Everyone reads their own messages (the service narrows to the reader's unless they are an administrator).
  ['GET /notifications', 'can read Notification'],
  ['GET /notifications/:id', 'can read Notification'],
  ['GET /me/delivery', 'signed-in'],
  ['PATCH /me/delivery', 'signed-in'],
  ['GET /certifications', 'can read Certification'],
  ['GET /certifications.csv', 'can read Certification'],
  ['GET /certifications/:id', 'can read Certification'],
  ['POST /certifications', 'can create Certification'],
  ['PATCH /certifications/:id', 'can update Certification'],
  ['GET /equipment', 'can read Equipment'],
  ['GET /equipment.csv', 'can read Equipment'],
  ['GET /equipment/:id', 'can read Equipment'],
  ['POST /equipment', 'can create Equipment'],
  ['PATCH /equipment/:id', 'can update Equipment'],
  ['GET /techniques/:techniqueId/register-links', 'can read Technique'],
  ['PUT /techniques/:techniqueId/register-links', 'signed-in'],
  ['GET /dashboard', 'can read Dashboard'],
  ['GET /audits/:id/report.pdf', 'can export Audit'],
  ['GET /findings/:id/record.pdf', 'can export Finding'],
  ['GET /audits/:id/export.json', 'can export Audit'],
  ['GET /findings/:id/export.json', 'can export Finding'],
  ['GET /actions/:id/export.json', 'can export CorrectiveAction'],
  ['GET /certifications/:id/export.json', 'can export Certification'],
  ['GET /equipment/:id/export.json', 'can export Equipment'],
  ['GET /techniques/:id/export.json', 'can export Technique'],
  ['GET /users.csv', 'can read User'],
  ['GET /techniques.csv', 'can read Technique'],
  ['GET /audits.csv', 'can read Audit'],
  ['GET /findings.csv', 'can read Finding'],
  ['GET /actions.csv', 'can read CorrectiveAction'],
  ['GET /techniques', 'can read Technique'],
  ['GET /techniques/:id', 'can read Technique'],
  ['POST /techniques', 'can create Technique'],
  ['PATCH /techniques/:id/revisions/:rev', 'can update Technique'],
  ['POST /techniques/:id/revisions/:rev/approve', 'can approve Technique'],
  ['POST /techniques/:id/revisions', 'can create Technique'],
  ['GET /techniques/:id/checklist', 'can read Technique'],
  ['POST /checklist/evaluate', 'can read Technique'],
  ['GET /policy', 'can read Policy'],
  ['PATCH /policy', 'can update Policy'],
  ['GET /materials', 'can read Material'],
  ['POST /materials', 'can create Material'],
  ['PATCH /materials/:id', 'can update Material'],
  ['GET /audits', 'can read Audit'],
  ['GET /audits/:id', 'can read Audit'],
  ['POST /audits', 'can create Audit'],
  ['POST /audits/:id/events', 'signed-in'],
  ['POST /audits/:id/checklist-runs', 'can create ChecklistRun'],
  ['PATCH /audits/:id/checklist-runs/:runId', 'can update ChecklistRun'],
  ['POST /audits/:id/findings', 'can create Finding'],
  ['GET /findings', 'can read Finding'],
  ['GET /findings/:id', 'can read Finding'],
  ['POST /findings', 'can create Finding'],
  ['POST /findings/:id/events', 'signed-in'],
  ['GET /actions', 'can read CorrectiveAction'],
  ['GET /actions/:id', 'can read CorrectiveAction'],
  ['POST /actions', 'can create CorrectiveAction'],
  ['POST /actions/:id/events', 'signed-in'],
  ['GET /home', 'signed-in'],
  ['GET /inspections', 'can read Inspection'],
  ['GET /inspections.csv', 'can read Inspection'],
  ['GET /inspections/options', 'can read Inspection'],
  ['GET /inspections/:id', 'can read Inspection'],
  ['POST /inspections', 'can create Inspection'],
  ['PATCH /inspections/:id', 'can update Inspection'],
  ['POST /inspections/import/preview', 'can create Inspection'],
  ['POST /inspections/import', 'can create Inspection'],
  ['GET /findings/:id/extent', 'can read Finding'],
  ['POST /findings/:id/extent-runs', 'can assess_extent Finding'],
  ['POST /findings/:id/extent-findings', 'can assess_extent Finding'],
  ['GET /findings/:id/impact', 'can read Finding'],
  ['GET /findings/:id/impact.csv', 'can read Finding'],
  ['PATCH /findings/:id/impact-scope', 'can decide_impact Finding'],
  ['POST /findings/:id/containment-decisions', 'can decide_impact Finding'],
  ['GET /equipment/:id/impact', 'can read Equipment'],
  ['GET /equipment/:id/impact.csv', 'can read Equipment'],
];

describe('each route’s guard is the one its resource needs', () => {
  it('then every route has exactly the guard in the table, and the table names no route that is gone', () => {
    const router = (context.app as unknown as { router: { stack: Layer[] } }).router;
    const actual = new Map(collectRoutes(router.stack).map((route) => [`${route.methods.join(',').toUpperCase()} ${route.path}`, route.guard]));
    const expected = new Map(EXPECTED_GUARDS);
    const wrong = [...actual].filter(([route, guard]) => expected.get(route) !== guard).map(([route, guard]) => `${route}: ${guard}, expected ${expected.get(route) ?? '(not in the table)'}`);
    const gone = [...expected.keys()].filter((route) => !actual.has(route));
    expect(wrong).toEqual([]);
    expect(gone).toEqual([]);
  });

  it('then no route that changes a record is public, except signing in', () => {
    const publicWrites = EXPECTED_GUARDS.filter(([route, guard]) => guard === 'public' && !route.startsWith('GET ')).map(([route]) => route);
    expect(publicWrites).toEqual(['POST /session']);
  });
});
