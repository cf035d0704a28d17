// The next step in sight on record pages, errors at their fields, the leave
// guard of dialogs, and the approval dialog's verdict from the server.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshotPath } from '../helpers/browser';
import { browserSessions, isoDay } from '../helpers/record-pages';

const { as } = browserSessions();

async function firstOf(page: Page, path: string, query: Record<string, string>) {
  const response = await page.request.get(`${inject('baseUrl')}/api/${path}?${new URLSearchParams({ pageSize: '50', ...query })}`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as { items: { id: number; [key: string]: unknown }[] }).items;
}

describe('record guidance in the browser', () => {
  it('when the quality manager opens a major finding in containment, then its top says what still blocks containment and links to the worksheet', async () => {
    const quality = await as('quality@tarnbrook.example');
    const findings = await firstOf(quality, 'findings', { state: 'containment', class: 'major' });
    let shown = false;
    for (const finding of findings) {
      const detail = (await (await quality.request.get(`${inject('baseUrl')}/api/findings/${finding.id}`)).json()) as { undecidedInspectionCount: number };
      if (detail.undecidedInspectionCount === 0) continue;
      await quality.goto(`${inject('baseUrl')}/findings/${finding.id}`);
      const next = quality.getByTestId('next-step');
      await next.getByText(`Containment: ${detail.undecidedInspectionCount} past inspection`).waitFor();
      expect(await next.textContent()).toContain('Who: The quality manager');
      await quality.screenshot({ path: screenshotPath('finding-next-step-containment') });
      await next.getByRole('link', { name: 'Go there' }).click();
      expect(new URL(quality.url()).hash).toBe('#impact-worksheet');
      shown = true;
      break;
    }
    expect(shown).toBe(true);
  });

  it('when the auditor plans an audit ending before it starts, then the end date field says so and no generic message shows', async () => {
    const auditor = await as('auditor@tarnbrook.example');
    // Reached inside the app, so that browser Back stays in it (the guard asks before a page of the app replaces the dialog).
    await auditor.goto(`${inject('baseUrl')}/findings`);
    await auditor.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Audits' }).click();
    await auditor.getByRole('heading', { name: 'Audits', level: 1 }).waitFor();
    await auditor.getByRole('button', { name: 'Plan an audit' }).click();
    const plan = auditor.getByRole('dialog', { name: 'Plan an audit' });
    await plan.getByLabel('Title').fill('Dates the wrong way round');
    await plan.getByLabel('Criteria (what the audit checks against)').fill('QP-ET-01');
    await plan.getByLabel('Audited area').selectOption({ label: 'Receiving Inspection' });
    await plan.getByLabel('Planned start').fill(isoDay(10));
    await plan.getByLabel('Planned end').fill(isoDay(2));
    await plan.locator('input[type="checkbox"]').first().check();
    await plan.getByRole('button', { name: 'Plan the audit' }).click();
    await plan.getByText('the end is before the start').waitFor();
    expect(await plan.getByLabel('Planned end').getAttribute('aria-invalid')).toBe('true');
    expect(await plan.getByText(/fields are not valid/).count()).toBe(0);
    await auditor.screenshot({ path: screenshotPath('plan-audit-field-error') });

    // Browser Back with typed content asks first; staying keeps what was typed.
    await auditor.evaluate(() => history.back());
    const ask = auditor.getByRole('dialog', { name: 'Leave without sending?' });
    await ask.waitFor();
    await auditor.screenshot({ path: screenshotPath('dialog-leave-guard') });
    await ask.getByRole('button', { name: 'Stay and keep it' }).click();
    await ask.waitFor({ state: 'hidden' });
    expect(await plan.getByLabel('Title').inputValue()).toBe('Dates the wrong way round');
    expect(new URL(auditor.url()).pathname).toBe('/audits');
  });

  it('when a Level 3 opens the approval of a draft, then the dialog shows the server\'s verdict before it can be confirmed, and the editor says which checks wait for the registers', async () => {
    const level3 = await as('level3@tarnbrook.example');
    const drafts = await firstOf(level3, 'techniques', { state: 'draft' });
    expect(drafts.length).toBeGreaterThan(0);
    await level3.goto(`${inject('baseUrl')}/techniques/${drafts[0].id}/edit`);
    await level3.getByTestId('live-checklist').waitFor();
    const pending = level3.getByTestId('register-checks-pending');
    if (await pending.count()) expect(await pending.textContent()).toContain('People and equipment checks run once the technique is linked to the registers');
    const approve = level3.getByRole('button', { name: /^Approve revision/ });
    if ((await approve.count()) === 0 || (await approve.isDisabled())) return;
    await approve.click();
    const dialog = level3.getByRole('dialog');
    await dialog.getByTestId('approval-verdict').waitFor();
    expect(await dialog.getByTestId('approval-verdict').textContent()).toMatch(/as the server evaluates it now/);
    expect(await dialog.getByRole('button', { name: /^Approve revision/ }).isDisabled()).toBe(false);
    await level3.screenshot({ path: screenshotPath('approval-server-verdict') });
    await dialog.getByRole('button', { name: 'Cancel' }).click();
  });
});
