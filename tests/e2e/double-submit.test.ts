// A double click on a creating button sends one request: the mutation hook
// refuses a second call while the first is in flight, and the button turns
// busy. Counted on the wire with page.on('request') and in the register.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshotPath } from '../helpers/browser';
import { browserSessions, isoDay } from '../helpers/record-pages';
import { listTotal } from '../helpers/lists';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

const { as } = browserSessions();

function countPosts(page: Page, pattern: RegExp) {
  const seen: string[] = [];
  page.on('request', (request) => {
    if (request.method() === 'POST' && pattern.test(new URL(request.url()).pathname)) seen.push(request.url());
  });
  return seen;
}

describe('double clicks in the browser', () => {
  it('when the auditor double-clicks "Raise the finding", then one request is sent and one finding is raised', async () => {
    const auditor = await as('auditor@tarnbrook.example');
    await auditor.goto(`${inject('baseUrl')}/audits?state=fieldwork`);
    await auditor.getByRole('link', { name: 'Structures Bay: second-layer lap-joint technique' }).click();
    await auditor.getByRole('button', { name: 'Raise a finding by hand' }).click();
    const dialog = auditor.getByRole('dialog');
    const title = `Double click ${Date.now().toString(36)}`;
    await dialog.getByLabel('Title').fill(title);
    await dialog.getByLabel('Rule or clause not met').fill('QP-ET-01 clause 6.3');
    await dialog.getByLabel('Requirement').fill('The technique names the calibration interval.');
    await dialog.getByLabel('Objective evidence').fill('No interval in section 4.');
    const posts = countPosts(auditor, /^\/api\/audits\/\d+\/findings$/);
    await dialog.getByRole('button', { name: 'Raise the finding' }).dblclick();
    await auditor.getByRole('heading', { name: new RegExp(`^F-\\d{4}-\\d{4}: ${title}$`) }).waitFor();
    expect(posts).toHaveLength(1);
    expect(await listTotal(auditor, 'findings', { q: title })).toBe(1);
  });

  it('when the auditor double-clicks "Raise a finding" on a failed check, then one request is sent', async () => {
    const auditor = await as('auditor@tarnbrook.example');
    await auditor.goto(`${inject('baseUrl')}/audits?state=fieldwork`);
    await auditor.getByRole('link', { name: 'Structures Bay: second-layer lap-joint technique' }).click();
    const raise = auditor.locator('li[data-status="fail"], li[data-status="warn"]').getByRole('button', { name: 'Raise a finding' }).first();
    await raise.waitFor();
    const posts = countPosts(auditor, /^\/api\/audits\/\d+\/findings$/);
    await raise.dblclick();
    // A new finding opens; or, when an open finding already names this check, the notice links to it.
    await Promise.race([
      auditor.waitForURL(/\/findings\/\d+$/).then(() => auditor.getByRole('heading', { level: 1 }).waitFor()),
      auditor.getByRole('alert').filter({ hasText: 'This check already has an open finding' }).waitFor(),
    ]);
    expect(posts).toHaveLength(1);
  });

  it('when the auditor double-clicks "Plan the audit", then one audit is planned', async () => {
    const auditor = await as('auditor@tarnbrook.example');
    await auditor.goto(`${inject('baseUrl')}/audits`);
    await auditor.getByRole('button', { name: 'Plan an audit' }).click();
    const plan = auditor.getByRole('dialog');
    const title = `Double plan ${Date.now().toString(36)}`;
    await plan.getByLabel('Title').fill(title);
    await plan.getByLabel('Criteria (what the audit checks against)').fill('Company ET procedure QP-ET-01');
    await plan.getByLabel('Audited area').selectOption({ label: 'Receiving Inspection' });
    await plan.getByLabel('Planned start').fill(isoDay(1));
    await plan.getByLabel('Planned end').fill(isoDay(8));
    await plan.getByLabel(/TAC-ET-023/).check();
    const posts = countPosts(auditor, /^\/api\/audits$/);
    await plan.getByRole('button', { name: 'Plan the audit' }).dblclick();
    await auditor.getByRole('heading', { name: title }).waitFor();
    expect(posts).toHaveLength(1);
    expect(await listTotal(auditor, 'audits', { q: title })).toBe(1);
  });

  it('when the quality manager double-clicks "Import N inspections", then one import is sent and its rows are written once', async () => {
    const technique = DEMO_TECHNIQUES.find((item) => item.code === 'TAC-ET-011')!;
    const tag = `DBL${Date.now().toString(36).toUpperCase()}`;
    const day = isoDay(-1);
    const rows = [1, 2, 3].map((n) =>
      [day, technique.code, technique.revision, 'TSP-7781-15', `${tag}-${n}`, `WO-${tag}`, 'Østerdal Aviation', 'technician@tarnbrook.example', 'accept'].join(','),
    );
    const csv = ['date,technique code,revision,part number,serial number,work order,customer,inspector e-mail,result', ...rows].join('\r\n');
    const quality = await as('quality@tarnbrook.example');
    await quality.goto(`${inject('baseUrl')}/registers/inspections`);
    await quality.getByRole('button', { name: 'Import CSV' }).click();
    const dialog = quality.getByRole('dialog', { name: 'Import inspections from CSV' });
    await dialog.getByLabel('CSV file').setInputFiles({ name: 'double.csv', mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
    await dialog.getByText('3 inspections read, all valid.').waitFor();
    await dialog.getByRole('button', { name: 'Import 3 inspections…' }).click();
    const posts = countPosts(quality, /^\/api\/inspections\/import$/);
    await dialog.getByRole('button', { name: 'Import 3 inspections', exact: true }).dblclick();
    await dialog.getByText('3 inspections imported into the register.').waitFor();
    expect(await dialog.getByText(/problems? found/).count()).toBe(0);
    await quality.screenshot({ path: screenshotPath('import-after-double-click') });
    expect(posts).toHaveLength(1);
    expect(await listTotal(quality, 'inspections', { q: `WO-${tag}` })).toBe(3);
  });
});
