import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import canonicalize from 'canonicalize';
import { createHash } from 'node:crypto';
import { Signature } from '../../server/models';
import { createTestContext, TEST_PASSWORD, type TestContext } from '../helpers/test-app';
import { expectOk, findingAwaitingSignoff, makeCast, send } from '../helpers/workflow';
import { binary, pdfPages } from '../helpers/pdf';
import { formatUtcDateTime } from '../../shared/format/dates';
import { RULE_IDS } from '../../shared/domain/checklist';
import { AUDIT_STATES, CORRECTIVE_ACTION_STATES, FINDING_STATES, ROOT_CAUSE_METHODS } from '../../machines';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

// Kept for a look after the run (git-ignored).
const OUTPUT_DIR = path.resolve(import.meta.dirname, '../output');
mkdirSync(OUTPUT_DIR, { recursive: true });

const utcMinute = (iso: string) => formatUtcDateTime(iso);

// People read labels in a PDF, never codes: no rule id, basis tag, snake_case state, event code or JSON.
const SNAKE_CASE_STATES = [...AUDIT_STATES, ...FINDING_STATES, ...CORRECTIVE_ACTION_STATES, ...ROOT_CAUSE_METHODS].filter((code) => code.includes('_'));
function expectNoCodes(text: string) {
  // Hyphenated ids are codes; "ferromagnetic", "personnel" and "equipment" are also plain words, and so is
  // "lift-off" (the trade's word for the probe's distance from the part, which messages rightly use).
  for (const rule of RULE_IDS.filter((id) => id.includes('-') && id !== 'lift-off')) expect(text, `rule id ${rule}`).not.toMatch(new RegExp(`(^|[^A-Za-z-])${rule}([^A-Za-z-]|$)`, 'm'));
  expect(text).not.toMatch(/\[(pub|trade|mem)\]/i);
  for (const state of SNAKE_CASE_STATES) expect(text, `code ${state}`).not.toContain(state);
  expect(text).not.toMatch(/\b[A-Z]{3,}_[A-Z_]+\b/);
  expect(text).not.toMatch(/[{[]\s*"\w+"\s*:/);
  expect(text).not.toMatch(/\b[a-z]+[A-Z][A-Za-z]*(Mm|Hz|Id|Ids|Iacs)\b/);
}

describe('reports and exports', () => {
  it('when a finding is closed and its audit issued, then the PDFs carry the signatures, δ values, page numbers and the record hash on every page', async () => {
    const cast = await makeCast(context);
    const { audit, finding, action } = await findingAwaitingSignoff(cast);
    await expectOk(await send(cast.accountable, 'findings', finding.id, { type: 'CLOSE', password: TEST_PASSWORD }));
    await expectOk(await send(cast.auditor, 'audits', audit.id, { type: 'FINISH_FIELDWORK' }));
    await expectOk(await send(cast.quality, 'audits', audit.id, { type: 'ISSUE', password: TEST_PASSWORD }));

    // Role rule: a technician may not export; signed out is 401; an unknown record is 404.
    expect((await request(context.app).get(`/api/audits/${audit.id}/report.pdf`)).status).toBe(401);
    expect((await cast.technician.agent.get(`/api/audits/${audit.id}/report.pdf`)).status).toBe(403);
    expect((await cast.technician.agent.get(`/api/findings/${finding.id}/export.json`)).status).toBe(403);
    expect((await cast.quality.agent.get('/api/audits/99999999/report.pdf')).status).toBe(404);
    // Auditors, quality and accountable managers may export; the auditor's copy is the same record.
    expect((await cast.auditor.agent.get(`/api/findings/${finding.id}/record.pdf`)).status).toBe(200);
    expect((await cast.quality.agent.get('/api/audits/abc/report.pdf')).status).toBe(400);

    // The audit report.
    const auditPdf = await cast.quality.agent.get(`/api/audits/${audit.id}/report.pdf`).buffer(true).parse(binary);
    expect(auditPdf.status).toBe(200);
    expect(auditPdf.headers['content-type']).toBe('application/pdf');
    const auditJson = await cast.quality.agent.get(`/api/audits/${audit.id}/export.json`);
    expect(auditJson.status).toBe(200);
    const auditHash: string = auditJson.body.sha256;
    expect(auditHash).toBe(createHash('sha256').update(canonicalize(auditJson.body.content)!).digest('hex'));
    const issue = await Signature.findOne({ where: { recordType: 'audit', recordId: audit.id, event: 'ISSUE' } });
    expect(issue).not.toBeNull();
    writeFileSync(path.join(OUTPUT_DIR, 'audit-report.pdf'), auditPdf.body as Buffer);
    const auditPages = pdfPages(auditPdf.body as Buffer);
    expect(auditPages.length).toBeGreaterThan(1);
    auditPages.forEach((page, index) => {
      expect(page).toContain(`Page ${index + 1} of ${auditPages.length}`);
      expect(page).toContain(`Record SHA-256 ${auditHash}`);
      // The organisation's name on every page (ORG_NAME's default in tests).
      expect(page).toContain('Whorl');
    });
    const auditText = auditPages.join('\n');
    // The closing line: the trail's head when printed (a 64-hex hash, possibly wrapped by pdftotext's layout).
    expect(auditText).toMatch(/Trail head at print: sequence \d+, hash [0-9a-f]{16}/);
    // The caution once per document, on the first page under the title.
    expect(auditText.split('certified ET Level 3').length - 1).toBe(1);
    expect(auditPages[0]).toContain('certified ET Level 3');
    expectNoCodes(auditText);
    expect(auditText).toMatch(/Basis: (Published|Common practice|Recalled|Organisation default)/);
    expect(auditText).toContain(`Signed by ${issue!.printedName}`);
    expect(auditText).toContain(`Meaning: ${issue!.meaning}`);
    expect(auditText).toContain(`Date and time: ${utcMinute(issue!.signedAt.toISOString())}`);
    // The bobbin technique at 40 kHz and 160 kHz in 70/30 brass (28 %IACS): δ from 660.9/√(f·μr·%IACS) (docs/domain.md) = 0.624 mm and 0.312 mm.
    expect(auditText).toMatch(/at 40 kHz: δ = 0\.62\d* mm, 3δ = 1\.87\d* mm/);
    expect(auditText).toMatch(/at 160 kHz: δ = 0\.31\d* mm/);
    expect(auditText).toContain('σ = 16.24 MS/m');
    expect(auditText).toContain(finding.number);
    expect(auditText).toContain('TAC-ET-023');

    // The finding record.
    const findingPdf = await cast.quality.agent.get(`/api/findings/${finding.id}/record.pdf`).buffer(true).parse(binary);
    expect(findingPdf.status).toBe(200);
    const findingJson = await cast.quality.agent.get(`/api/findings/${finding.id}/export.json`);
    const findingHash: string = findingJson.body.sha256;
    writeFileSync(path.join(OUTPUT_DIR, 'finding-record.pdf'), findingPdf.body as Buffer);
    const findingPages = pdfPages(findingPdf.body as Buffer);
    findingPages.forEach((page, index) => {
      expect(page).toContain(`Page ${index + 1} of ${findingPages.length}`);
      expect(page).toContain(`Record SHA-256 ${findingHash}`);
    });
    const findingText = findingPages.join('\n');
    expectNoCodes(findingText);
    expect(findingText.split('certified ET Level 3').length - 1).toBe(1);
    const closure = await Signature.findOne({ where: { recordType: 'finding', recordId: finding.id, event: 'CLOSE' } });
    const verify = await Signature.findOne({ where: { recordType: 'action', recordId: action.id, event: 'VERIFY' } });
    expect(findingText).toContain(`Signed by ${closure!.printedName}`);
    expect(findingText).toContain(`Meaning: ${closure!.meaning}`);
    expect(findingText).toContain(`Date and time: ${utcMinute(closure!.signedAt.toISOString())}`);
    expect(findingText).toContain(`Signed by ${verify!.printedName}`);
    expect(findingText).toContain('The technique was written for axial cracks only');
    expect(findingText).toContain('Tubes re-inspected with a rotating probe');
    expect(findingText).toContain('Finding closed');
    expect(findingText).toContain('Corrective action verified');

    // The JSON export carries the trail of the finding and its action, and the hash covers the content.
    const events = findingJson.body.content.trail.map((entry: { event: string }) => entry.event);
    expect(events).toEqual(expect.arrayContaining(['SUBMIT', 'CLASSIFY', 'CLOSE', 'VERIFY']));
    expect(findingJson.body.content.record).not.toHaveProperty('allowedEvents');
    expect(findingJson.body.content.action.rootCause).toBe('The technique was written for axial cracks only');
    expect(findingJson.body.content.evidence.action.items.length).toBe(1);
    expect(findingHash).toBe(createHash('sha256').update(canonicalize(findingJson.body.content)!).digest('hex'));
    // The hash is the record's, not the viewer's: the accountable manager gets the same one.
    const again = await cast.accountable.agent.get(`/api/findings/${finding.id}/export.json`);
    expect(again.body.sha256).toBe(findingHash);

    // Actions export on their own too, trail included.
    const actionJson = await cast.quality.agent.get(`/api/actions/${action.id}/export.json`);
    expect(actionJson.status).toBe(200);
    expect(actionJson.body.content.trail.map((entry: { event: string }) => entry.event)).toContain('VERIFY');
  }, 90_000);
});

const HEADINGS = ['Scope and criteria', 'Checklist results', 'Findings', 'Signatures', 'Finding', 'Containment', 'Extent of condition', 'Impact on past inspections', 'Corrective action', 'Evidence', 'Verification', 'Closure', 'Trail'];

/** The last line of text on a page, above the footer: never a heading. */
function expectNoOrphanedHeadings(pages: string[]) {
  pages.forEach((page, index) => {
    const lines = page.split('\n').map((line) => line.trim()).filter((line) => line && !/Page \d+ of \d+|Record SHA-256/.test(line));
    expect(HEADINGS, `page ${index + 1} ends with a heading`).not.toContain(lines[lines.length - 1]);
  });
}

describe('audit report at issue', () => {
  it('when a finding moves on after its audit is issued, then the report prints the state it had at issue; an audit issued before snapshots were kept says so', async () => {
    const cast = await makeCast(context);
    const { audit, finding } = await findingAwaitingSignoff(cast);
    await expectOk(await send(cast.auditor, 'audits', audit.id, { type: 'FINISH_FIELDWORK' }));
    await expectOk(await send(cast.quality, 'audits', audit.id, { type: 'ISSUE', password: TEST_PASSWORD }));
    await expectOk(await send(cast.accountable, 'findings', finding.id, { type: 'CLOSE', password: TEST_PASSWORD }));

    const pdf = await cast.quality.agent.get(`/api/audits/${audit.id}/report.pdf`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    const pages = pdfPages(pdf.body as Buffer);
    const text = pages.join('\n');
    expect(text).toContain('As they stood when the report was issued');
    expect(text).toMatch(new RegExp(`${finding.number}[\\s\\S]*State: Awaiting signature`));
    expect(text).not.toContain('State: Closed');
    expectNoCodes(text);
    expectNoOrphanedHeadings(pages);

    await context.deps.sequelize.query('UPDATE audits SET issued_findings = NULL WHERE id = ?', { replacements: [audit.id] });
    const older = pdfPages((await cast.quality.agent.get(`/api/audits/${audit.id}/report.pdf`).buffer(true).parse(binary)).body as Buffer).join('\n');
    expect(older).toContain('issued before Whorl kept the findings as they stood at issue');
    expect(older).toContain('State: Closed');
  });

  it('when the organisation has a name on record, then every report page carries it', async () => {
    const { setOrganisationName } = await import('../../server/services/organisation.service');
    await setOrganisationName(context.deps.sequelize, 'Harrowgate Test Works', new Date());
    try {
      const cast = await makeCast(context);
      const { finding } = await findingAwaitingSignoff(cast);
      const pages = pdfPages((await cast.quality.agent.get(`/api/findings/${finding.id}/record.pdf`).buffer(true).parse(binary)).body as Buffer);
      for (const page of pages) expect(page).toContain('Harrowgate Test Works');
      expectNoCodes(pages.join('\n'));
      expectNoOrphanedHeadings(pages);
    } finally {
      await context.deps.sequelize.query('DELETE FROM organisation_profile');
    }
  });
});

describe('technique export', () => {
  it('when a technique is exported, then the JSON holds its revisions, register links and trail; a technician may not export', async () => {
    const { DEMO_TECHNIQUES } = await import('../../shared/domain/demo-techniques');
    const { signedInAs } = await import('../helpers/test-app');
    const level3 = await signedInAs(context, ['level3']);
    const code = `TX-${Date.now().toString(36).toUpperCase()}`;
    const created = await level3.post('/api/techniques').send({ technique: { ...DEMO_TECHNIQUES[0], code } });
    expect(created.status).toBe(201);
    const quality = await signedInAs(context, ['quality_manager']);
    const exported = await quality.agent.get(`/api/techniques/${created.body.id}/export.json`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-disposition']).toBe(`attachment; filename="technique-${code}.json"`);
    expect(exported.body.content.record.code).toBe(code);
    expect(exported.body.content.registerLinks).toEqual({ techniqueId: created.body.id, equipment: [], performers: [] });
    expect(exported.body.content.trail.length).toBeGreaterThan(0);
    expect(exported.body.sha256).toBe(createHash('sha256').update(canonicalize(exported.body.content)!).digest('hex'));
    const technician = await signedInAs(context, ['technician']);
    expect((await technician.agent.get(`/api/techniques/${created.body.id}/export.json`)).status).toBe(403);
  });
});
