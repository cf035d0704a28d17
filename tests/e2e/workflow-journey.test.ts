// The audit → finding → corrective action journey clicked through in Chromium
// by the demo people, each in their own browser context.
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, screenshotPath } from '../helpers/browser';
import { listTotal, waitForListTotal } from '../helpers/lists';
import { DEFAULT_PAGE_SIZE } from '../../shared/schemas/common';
import { browserSessions, isoDay, sendEvent } from '../helpers/record-pages';

const { as } = browserSessions();

describe('the workflow journey in the browser', () => {
  it('when auditor, quality manager, Level 3 and accountable manager each do their step, then the finding closes with its signature shown', async () => {
    // The auditor plans an audit of Receiving Inspection with the bobbin technique and starts fieldwork.
    const auditor = await as('auditor@tarnbrook.example');
    await auditor.goto(`${inject('baseUrl')}/audits`);
    await auditor.getByRole('button', { name: 'Plan an audit' }).click();
    const plan = auditor.getByRole('dialog');
    await plan.getByLabel('Title').fill('Browser journey: heat-exchanger tubes');
    await plan.getByLabel('Criteria (what the audit checks against)').fill('Company ET procedure QP-ET-01');
    await plan.getByLabel('Audited area').selectOption({ label: 'Receiving Inspection' });
    await plan.getByLabel('Planned start').fill(isoDay(0));
    await plan.getByLabel('Planned end').fill(isoDay(7));
    await plan.getByLabel(/TAC-ET-023/).check();
    await plan.getByRole('button', { name: 'Plan the audit' }).click();
    await auditor.getByRole('heading', { name: 'Browser journey: heat-exchanger tubes' }).waitFor();
    await sendEvent(auditor, 'Start fieldwork');

    // Run the checklist and raise a finding from the orientation failure in one step.
    await auditor.getByRole('button', { name: 'Run the checklist' }).click();
    const failed = auditor.locator('li[data-status="fail"]', { hasText: 'Orientation coverage' });
    await failed.waitFor();
    expect(await failed.textContent()).toContain('circ-crack');
    await auditor.screenshot({ path: screenshotPath('audit-checklist-run'), fullPage: true });
    await failed.getByRole('button', { name: 'Raise a finding' }).click();
    await auditor.getByRole('heading', { name: /^F-\d{4}-\d{4}: TAC-ET-023: Orientation coverage/ }).waitFor();
    const findingUrl = auditor.url();
    await sendEvent(auditor, 'Submit');
    await auditor.getByText('In review', { exact: true }).first().waitFor();

    // The quality manager classifies it major, records containment and assigns the action to the Level 3.
    const quality = await as('quality@tarnbrook.example');
    await quality.goto(findingUrl);
    await sendEvent(quality, 'Classify', async (dialog) => {
      await dialog.getByLabel('Class').selectOption('major');
    });
    // The technique's past inspections are in doubt: each gets a decision before containment is recorded.
    const worksheet = quality.getByRole('region', { name: 'Impact on past inspections' });
    await worksheet.getByLabel('Choose every listed inspection').check();
    await worksheet.getByLabel('Decision', { exact: true }).selectOption({ label: 'Re-inspect' });
    await worksheet.getByLabel('Reason', { exact: true }).fill('Accepted with the bobbin coil alone: re-inspect with a rotating probe');
    await worksheet.getByRole('button', { name: 'Record decision' }).click();
    await worksheet.getByText('Decision recorded.').waitFor();
    await sendEvent(quality, 'Record containment', async (dialog) => {
      await dialog.getByLabel('What was done at once').fill('Technique suspended; bundle quarantined');
    });
    await quality.getByRole('button', { name: 'Assign corrective action' }).click();
    const assign = quality.getByRole('dialog');
    await assign.getByLabel('Owner').selectOption({ label: 'Sunniva Brack (Wheel and Brake Shop)' });
    await assign.getByRole('button', { name: 'Assign the corrective action' }).click();
    await assign.waitFor({ state: 'hidden' });
    await quality.getByRole('link', { name: /^CA-\d{4}-\d{4}$/ }).click();
    await quality.getByRole('heading', { name: /^CA-\d{4}-\d{4} for F-/ }).waitFor();
    const actionUrl = quality.url();

    // The Level 3 investigates and plans; the quality manager approves the plan.
    const owner = await as('level3@tarnbrook.example');
    await owner.goto(actionUrl);
    await sendEvent(owner, 'Start investigation');
    await sendEvent(owner, 'Submit root cause and plan', async (dialog) => {
      await dialog.getByLabel('Root-cause analysis').fill('The technique named a bobbin coil only; its current never crosses a circumferential crack');
      await dialog.getByLabel('Item 1', { exact: true }).fill('Add a rotating-probe pass');
      await dialog.getByLabel('Due', { exact: true }).fill(isoDay(14));
    });
    await quality.reload();
    await sendEvent(quality, 'Approve plan');

    // Evidence: the owner uploads a file on the action page's evidence panel.
    await owner.reload();
    const panel = owner.getByRole('region', { name: 'Evidence' });
    await panel.getByLabel('Evidence files to upload').setInputFiles([
      { name: 'demonstration.txt', mimeType: 'text/plain', buffer: Buffer.from(`Rev B demonstration: circumferential notch detected with the rotating probe. ${Date.now()}`) },
    ]);
    await panel.getByRole('list', { name: 'Uploads' }).getByText(/Stored · SHA-256/).waitFor();
    await owner.getByRole('group', { name: 'Actions' }).getByRole('button', { name: 'Submit' }).waitFor();
    await sendEvent(owner, 'Submit', async (dialog) => {
      await dialog.getByLabel('Summary of what was done').fill('Technique revised to rev B with a rotating-probe pass');
    });

    // The auditor verifies with their password (signed), then confirms effectiveness.
    await auditor.goto(actionUrl);
    await sendEvent(auditor, 'Verify', async (dialog) => {
      expect(await dialog.textContent()).toContain('corrective action verified');
      await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
    }, 'Sign: Verify');
    await auditor.getByText('Verified', { exact: true }).first().waitFor();
    await auditor.screenshot({ path: screenshotPath('action-verified'), fullPage: true });
    await auditor.goto(findingUrl);
    await sendEvent(auditor, 'Confirm effective', async (dialog) => {
      await dialog.getByLabel('How effectiveness was checked').fill('Reference tube notches in both orientations detected');
    });

    // The accountable manager closes it with their signature.
    const accountable = await as('accountable@tarnbrook.example');
    await accountable.goto(findingUrl);
    await sendEvent(accountable, 'Close', async (dialog) => {
      expect(await dialog.textContent()).toContain('closure approved');
      await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
    }, 'Sign: Close');
    const signature = accountable.getByTestId('signature');
    await signature.waitFor();
    const text = await signature.textContent();
    expect(text).toContain('Rafael Oduya');
    expect(text).toContain('closure approved');
    expect(text).toMatch(/SHA-256 [0-9a-f]{64}/);
    await accountable.getByText('Closed', { exact: true }).first().waitFor();
    await accountable.screenshot({ path: screenshotPath('finding-closed-with-signature'), fullPage: true });
  });

  it('when the quality manager opens the home page, then the findings waiting for review are listed with due dates', async () => {
    const quality = await as('quality@tarnbrook.example');
    const list = quality.getByRole('list', { name: 'Waiting on you' });
    await list.waitFor();
    expect(await list.getByText('Classify the finding').count()).toBeGreaterThanOrEqual(2);
    expect(await list.getByText(/Overdue since/).count()).toBeGreaterThan(0);
    await quality.screenshot({ path: screenshotPath('home-waiting-on-quality-manager'), fullPage: true });

    // The findings list filters on the server; the filters live in the address bar.
    const inReviewTotal = await listTotal(quality, 'findings', { state: 'in_review' });
    const allTotal = await listTotal(quality, 'findings');
    const overdueTotal = await listTotal(quality, 'findings', { overdue: 'true' });
    expect(inReviewTotal).toBeGreaterThanOrEqual(2);
    expect(overdueTotal).toBeGreaterThan(0);
    expect(overdueTotal).toBeLessThan(allTotal);

    await quality.getByRole('link', { name: 'Findings', exact: true }).click();
    const table = quality.getByRole('table', { name: 'Findings', exact: true });
    await quality.getByLabel('State').selectOption('in_review');
    await quality.waitForURL(/state=in_review/);
    await waitForListTotal(quality, 'Findings', inReviewTotal);
    const inReviewStates = await table.locator('tbody tr td:nth-child(4)').allTextContents();
    expect(inReviewStates.length).toBe(Math.min(inReviewTotal, DEFAULT_PAGE_SIZE));
    expect(inReviewStates.every((text) => text === 'In review')).toBe(true);

    await quality.getByLabel('State').selectOption('');
    await quality.waitForURL((url) => !url.search.includes('state='));
    await waitForListTotal(quality, 'Findings', allTotal);

    await quality.getByLabel('Overdue only').click();
    await quality.waitForURL(/overdue=true/);
    await waitForListTotal(quality, 'Findings', overdueTotal);
    const overdueRows = await table.locator('tbody tr').allTextContents();
    expect(overdueRows.length).toBeGreaterThan(0);
    expect(overdueRows.every((text) => text.includes('overdue'))).toBe(true);
    await quality.screenshot({ path: screenshotPath('findings-overdue'), fullPage: true });
  });

  it('when the auditor raises a finding by hand during fieldwork, then it opens raised with what they wrote', async () => {
    const auditor = await as('auditor@tarnbrook.example');
    await auditor.goto(`${inject('baseUrl')}/audits?state=fieldwork`);
    await auditor.getByRole('link', { name: 'Structures Bay: second-layer lap-joint technique' }).click();
    await auditor.getByRole('button', { name: 'Raise a finding by hand' }).click();
    const dialog = auditor.getByRole('dialog');
    await dialog.getByLabel('Title').fill('Lift-off compensation not described');
    await dialog.getByLabel('Rule or clause not met').fill('QP-ET-01 clause 6.2');
    await dialog.getByLabel('Requirement').fill('The technique states how lift-off is compensated over paint.');
    await dialog.getByLabel('Objective evidence').fill('Section 5 of TAC-ET-031 rev A names no paint-thickness correction.');
    await dialog.getByLabel('Technique (optional)').selectOption('TAC-ET-031');
    await dialog.getByRole('button', { name: 'Raise the finding' }).click();
    await auditor.getByRole('heading', { name: /^F-\d{4}-\d{4}: Lift-off compensation not described$/ }).waitFor();
    expect(await auditor.getByRole('region', { name: 'Nonconformity' }).getByText('QP-ET-01 clause 6.2').count()).toBe(1);
    await auditor.getByText('Raised', { exact: true }).first().waitFor();
  });
});
