import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { createTestContext, makeUser, signedInAs, type TestContext } from '../helpers/test-app';
import { findingWithAction, makeCast } from '../helpers/workflow';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

const rowsOf = (text: string) => parse(text, { bom: true, columns: true }) as Record<string, string>[];

describe('CSV export of the record lists', () => {
  it('when signed out, then every list export is 401', async () => {
    for (const list of ['users', 'techniques', 'audits', 'findings', 'actions', 'certifications', 'equipment']) {
      expect((await request(context.app).get(`/api/${list}.csv`)).status, list).toBe(401);
    }
  });

  it('when people are exported with a search, then names with commas, quotes and non-ASCII letters round-trip', async () => {
    const tag = `csv${Date.now().toString(36)}`;
    await makeUser({ roles: ['technician'], displayName: `Þórdís "Tóta" Sigurðardóttir, ${tag}` });
    await makeUser({ roles: ['level3', 'auditor'], displayName: `Zoë Ångström ${tag}` });
    const session = await signedInAs(context, ['admin']);
    const response = await session.agent.get('/api/users.csv').query({ q: tag, sort: 'displayName' });
    expect(response.status).toBe(200);
    expect(response.text.charCodeAt(0)).toBe(0xfeff);
    const rows = rowsOf(response.text);
    expect(rows.map((row) => row.Name)).toEqual([`Zoë Ångström ${tag}`, `Þórdís "Tóta" Sigurðardóttir, ${tag}`]);
    expect(rows[0].Roles).toBe('Auditor; ET Level 3');
    expect((await session.agent.get('/api/users.csv').query({ role: 'nobody' })).status).toBe(400);
  });

  it('when findings, actions and audits are exported for an area, then the CSV holds exactly the filtered list', async () => {
    const cast = await makeCast(context);
    const { audit, finding, action } = await findingWithAction(cast);
    const findings = await cast.quality.agent.get('/api/findings.csv').query({ areaId: cast.areaId });
    expect(findings.status).toBe(200);
    const findingRows = rowsOf(findings.text);
    expect(findingRows).toHaveLength(1);
    expect(findingRows[0]).toMatchObject({ Number: finding.number, Class: 'Major', State: 'Action open', Technique: 'TAC-ET-023', Action: action.number });
    const actions = rowsOf((await cast.quality.agent.get('/api/actions.csv').query({ areaId: cast.areaId })).text);
    expect(actions.map((row) => [row.Number, row.Finding, row.State])).toEqual([[action.number, finding.number, 'Assigned']]);
    const audits = rowsOf((await cast.technician.agent.get('/api/audits.csv').query({ areaId: cast.areaId })).text);
    expect(audits.map((row) => [row.Audit, row.State, row.Techniques])).toEqual([[String(audit.id), 'Fieldwork', 'TAC-ET-023 rev A']]);
    const techniques = await cast.technician.agent.get('/api/techniques.csv');
    expect(techniques.status).toBe(200);
    // Every field quoted (CSV injection guard), the header row too.
    expect(techniques.text.split('\r\n')[0]).toBe('\ufeff"Code","Title","Area","Latest revision","State","Approved revision in force","Checklist verdict","Failed rules","Updated"');
  });
});
