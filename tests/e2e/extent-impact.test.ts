// From one failed check to the similar techniques and the affected past
// inspections, clicked through in Chromium by the demo auditor and quality manager.
import { describe, expect, inject, it } from 'vitest';
import { screenshotPath } from '../helpers/browser';
import { browserSessions, isoDay, sendEvent } from '../helpers/record-pages';

const { as } = browserSessions();

describe('extent of condition and impact in the browser', () => {
  it('when a bar technique fails the center-effect check, then the quality manager finds its sister technique, raises a linked finding and decides every past inspection', async () => {
    // The auditor audits the sister bar technique and raises a finding from its failed center-effect check.
    // (The 25 mm bar technique, TAC-ET-017, already has an open finding for it in the demo: one per check.)
    const auditor = await as('auditor@tarnbrook.example');
    await auditor.goto(`${inject('baseUrl')}/audits`);
    await auditor.getByRole('button', { name: 'Plan an audit' }).click();
    const plan = auditor.getByRole('dialog');
    await plan.getByLabel('Title').fill('Browser extent: bar stock');
    await plan.getByLabel('Criteria (what the audit checks against)').fill('Company ET procedure QP-ET-01');
    await plan.getByLabel('Audited area').selectOption({ label: 'Receiving Inspection' });
    await plan.getByLabel('Planned start').fill(isoDay(0));
    await plan.getByLabel('Planned end').fill(isoDay(7));
    await plan.getByLabel(/TAC-ET-019/).check();
    await plan.getByRole('button', { name: 'Plan the audit' }).click();
    await auditor.getByRole('heading', { name: 'Browser extent: bar stock' }).waitFor();
    await sendEvent(auditor, 'Start fieldwork');
    await auditor.getByRole('button', { name: 'Run the checklist' }).click();
    const failed = auditor.locator('li[data-status="fail"]', { hasText: 'Center effect' });
    await failed.waitFor();
    await failed.getByRole('button', { name: 'Raise a finding' }).click();
    await auditor.getByRole('heading', { name: /^F-\d{4}-\d{4}: TAC-ET-019: Center effect/ }).waitFor();
    const findingUrl = auditor.url();
    const findingNumber = (await auditor.getByRole('heading', { level: 1 }).textContent())!.split(':')[0];
    await sendEvent(auditor, 'Submit');

    // The quality manager classifies it major, then looks for the same weakness elsewhere.
    const quality = await as('quality@tarnbrook.example');
    await quality.goto(findingUrl);
    await sendEvent(quality, 'Classify', async (dialog) => {
      await dialog.getByLabel('Class').selectOption('major');
    });
    const extent = quality.getByRole('region', { name: 'Extent of condition' });
    await extent.getByRole('button', { name: 'Look for the same weakness in other techniques' }).click();
    const sister = extent.getByRole('row', { name: /TAC-ET-017/ });
    await sister.waitFor();
    expect(await sister.textContent()).toMatch(/centre|center/i);
    expect(await extent.getByRole('row', { name: /TAC-ET-019/ }).textContent()).toContain('this finding');
    await extent.getByLabel('Raise a linked finding against TAC-ET-017').check();
    await extent.getByRole('button', { name: 'Raise 1 linked finding' }).click();
    const confirm = quality.getByRole('dialog');
    await confirm.getByRole('button', { name: 'Raise them' }).click();
    await confirm.waitFor({ state: 'hidden' });
    const raised = extent.getByRole('status');
    await raised.waitFor();
    const linkedNumber = (await raised.textContent())!.match(/F-\d{4}-\d{4}/)![0];
    await extent.getByRole('link', { name: linkedNumber }).first().waitFor();
    await extent.screenshot({ path: screenshotPath('extent-of-condition') });

    // The impact worksheet: TAC-ET-019 rev A's inspections since its approval, all undecided; containment is held.
    const worksheet = quality.getByRole('region', { name: 'Impact on past inspections' });
    await worksheet.getByText(/cannot leave containment while \d+ inspection/).waitFor();
    expect(await quality.getByRole('group', { name: 'Actions' }).getByRole('button', { name: 'Record containment' }).count()).toBe(0);
    await worksheet.getByLabel('Choose every listed inspection').check();
    await worksheet.getByLabel('Decision', { exact: true }).selectOption({ label: 'Re-inspect' });
    await worksheet.getByLabel('Reason', { exact: true }).fill('Accepted without a check of the bar centre: re-inspect ultrasonically');
    await worksheet.getByRole('button', { name: 'Record decision' }).click();
    await worksheet.getByText('Decision recorded.').waitFor();
    await worksheet.getByText(/cannot leave containment/).waitFor({ state: 'detached' });
    expect(await worksheet.locator('td', { hasText: /^Undecided$/ }).count()).toBe(0);
    await quality.getByRole('group', { name: 'Actions' }).getByRole('button', { name: 'Record containment' }).waitFor();
    await quality.screenshot({ path: screenshotPath('extent-impact-finding'), fullPage: true });
    await worksheet.screenshot({ path: screenshotPath('impact-worksheet') });

    // The linked finding waits for classification, with the class proposed, and points back.
    await extent.getByRole('link', { name: linkedNumber }).first().click();
    await quality.getByRole('heading', { name: new RegExp(`^${linkedNumber}: TAC-ET-017: Center effect \\(extent of ${findingNumber}\\)`) }).waitFor();
    await quality.getByRole('region', { name: 'Extent of condition' }).getByRole('link', { name: findingNumber }).waitFor();
    await quality.getByRole('group', { name: 'Actions' }).getByRole('button', { name: 'Classify' }).click();
    const classify = quality.getByRole('dialog');
    expect(await classify.getByLabel('Class').inputValue()).toBe('major');
    await classify.getByRole('button', { name: 'Cancel' }).click();
  });

  it('when a probe is found out of calibration, then its inspections since the last calibration are listed by customer and part', async () => {
    const quality = await as('quality@tarnbrook.example');
    await quality.goto(`${inject('baseUrl')}/registers/equipment`);
    await quality.getByRole('link', { name: /^Inspections made with / }).first().click();
    await quality.getByRole('heading', { name: /^Inspections made with / }).waitFor();
    const panel = quality.getByRole('region', { name: 'Inspections in doubt' });
    await panel.getByText(/inspection\(s\) (since its last calibration|no calibration)/).waitFor();
    await panel.getByRole('table', { name: 'Inspections by customer and part number' }).waitFor();
    await quality.screenshot({ path: screenshotPath('equipment-impact'), fullPage: true });
  });
});
