// POST /api/checklist/evaluate: any technique JSON under the organisation's
// policy, and the same verdict as the command line for the shared examples.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, signedInAs, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const EXAMPLES_DIR = path.join(import.meta.dirname, '../shared/fixtures');
const EXAMPLES = ['wheel-bead-seat.json', 'heat-exchanger-bobbin.json'];
const ROOT = path.resolve(import.meta.dirname, '../..');

function runCli(file: string) {
  const result = spawnSync('npx', ['tsx', 'scripts/check-technique.ts', file], { cwd: ROOT, encoding: 'utf8' });
  return { status: result.status, output: JSON.parse(result.stdout) };
}

describe('evaluating any technique', () => {
  it('when signed out, then 401', async () => {
    const technique = JSON.parse(readFileSync(path.join(EXAMPLES_DIR, EXAMPLES[0]), 'utf8'));
    expect((await request(context.app).post('/api/checklist/evaluate').send(technique)).status).toBe(401);
  });

  it('when the technique is invalid, then 400 with the engine’s issues field by field', async () => {
    const auditor = await signedInAs(context, ['auditor']);
    const technique = JSON.parse(readFileSync(path.join(EXAMPLES_DIR, EXAMPLES[1]), 'utf8'));
    technique.coils[0].frequenciesHz = [];
    technique.flaws[0].orientation = 'sideways';
    technique.colour = 'blue';
    const response = await auditor.post('/api/checklist/evaluate').send(technique);
    expect(response.status).toBe(400);
    const byPath = Object.fromEntries(response.body.error.details.map((issue: { path: string; message: string }) => [issue.path, issue.message]));
    expect(byPath['coils[0].frequenciesHz']).toBe('frequenciesHz needs at least 1 entry');
    expect(byPath['flaws[0].orientation']).toContain('orientation must be one of axial, circumferential');
    expect(Object.values(byPath).join(' ')).toContain('Unknown field "colour" in technique');
  });

  for (const name of EXAMPLES) {
    it(`when ${name} is evaluated, then the verdict and every rule status match the command line`, async () => {
      const file = path.join(EXAMPLES_DIR, name);
      const cli = runCli(file);
      const technician = await signedInAs(context, ['technician']);
      const response = await technician.post('/api/checklist/evaluate').send(JSON.parse(readFileSync(file, 'utf8')));
      expect(response.status).toBe(200);
      expect(response.body.verdict).toBe(cli.output.verdict);
      expect(cli.status).toBe(cli.output.verdict === 'conforms' ? 0 : 1);
      const statuses = (output: { results: { rule: string; status: string; flaw?: string; coil?: number }[] }) =>
        output.results.map((result) => `${result.rule}/${result.flaw ?? ''}/${result.coil ?? ''}: ${result.status}`);
      expect(statuses(response.body)).toEqual(statuses(cli.output));
      expect(response.body.values).toEqual(cli.output.values);
    });
  }

  it('when the examples are evaluated, then the bead seat conforms and the bobbin tube does not (orientation gap)', async () => {
    const auditor = await signedInAs(context, ['auditor']);
    const bead = await auditor.post('/api/checklist/evaluate').send(JSON.parse(readFileSync(path.join(EXAMPLES_DIR, EXAMPLES[0]), 'utf8')));
    const tube = await auditor.post('/api/checklist/evaluate').send(JSON.parse(readFileSync(path.join(EXAMPLES_DIR, EXAMPLES[1]), 'utf8')));
    expect(bead.body.verdict).toBe('conforms');
    expect(tube.body.verdict).toBe('does-not-conform');
    const circ = tube.body.results.find((result: { rule: string; flaw?: string }) => result.rule === 'orientation-coverage' && result.flaw === 'circ-crack');
    expect(circ.status).toBe('fail');
    // δ = 660.9/√(40000 × 28) ≈ 0.62 mm (docs/domain.md engineering form; the examples README).
    expect(tube.body.values.standardDepthMm[0][0]).toBeCloseTo(0.6245, 3);
  });
});

describe('materials library', () => {
  it('when anyone signed in lists materials, then they come with %IACS, μr and source; only an admin adds or corrects one', async () => {
    expect((await request(context.app).get('/api/materials')).status).toBe(401);
    const technician = await signedInAs(context, ['technician']);
    const list = await technician.agent.get('/api/materials');
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual(expect.any(Array));

    const name = `Test alloy ${Date.now()}`;
    const body = { name, conductivityIacs: 35, relativePermeability: 1, source: 'measured on the test bar with a calibrated meter' };
    expect((await technician.post('/api/materials').send(body)).status).toBe(403);
    const level3 = await signedInAs(context, ['level3']);
    expect((await level3.post('/api/materials').send(body)).status).toBe(403);
    const admin = await signedInAs(context, ['admin']);
    expect((await admin.post('/api/materials').send({ ...body, conductivityIacs: 0 })).status).toBe(400);
    const created = await admin.post('/api/materials').send(body);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ ...body, libraryKey: null, version: 0 });
    expect((await admin.post('/api/materials').send(body)).status).toBe(409);

    expect((await admin.patch(`/api/materials/${created.body.id}`).send({ version: 7, conductivityIacs: 36 })).status).toBe(409);
    expect((await admin.patch('/api/materials/999999').send({ version: 0, conductivityIacs: 36 })).status).toBe(404);
    const updated = await admin.patch(`/api/materials/${created.body.id}`).send({ version: 0, conductivityIacs: 36 });
    expect(updated.status).toBe(200);
    expect(updated.body).toMatchObject({ conductivityIacs: 36, version: 1 });
    const found = await technician.agent.get(`/api/materials?q=${encodeURIComponent(name)}`);
    expect(found.body.items).toHaveLength(1);
    const trail = await admin.agent.get(`/api/trail?record=material:${created.body.id}`);
    expect(trail.body.items.map((entry: { event: string }) => entry.event)).toEqual(['MATERIAL_CREATED', 'MATERIAL_UPDATED']);
  });
});
