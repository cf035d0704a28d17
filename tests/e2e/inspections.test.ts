import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { inject } from 'vitest';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const HOLES = DEMO_TECHNIQUES.find((technique) => technique.code === 'TAC-ET-011')!;
const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
const tag = Date.now().toString(36).toUpperCase();
const HEADER = 'date,technique code,revision,part number,serial number,work order,customer,inspector e-mail,result,instrument serial,probe serial,reference standard serial,notes';
const row = (serial: string, extra: { customer?: string; result?: string; probe?: string; notes?: string } = {}) =>
  [
    yesterday,
    HOLES.code,
    HOLES.revision,
    'TSP-7781-15',
    serial,
    `WO-E2E-${tag}`,
    extra.customer ?? 'Kühlwerk Ærø Flugdienst',
    'technician@tarnbrook.example',
    extra.result ?? 'accept',
    'FK2-10482',
    extra.probe ?? 'RB48-0907',
    'TAC-RS-011',
    extra.notes ?? '',
  ].join(',');

describe('inspection register in the browser', () => {
  it('when the quality manager records an inspection and imports a CSV file, then the preview, the confirmation and the new rows show', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInAs(page, 'quality@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.goto(`${inject('baseUrl')}/registers`);
    await page.getByRole('link', { name: 'Inspections' }).click();
    await page.waitForURL(/\/registers\/inspections/);
    const table = page.getByRole('table', { name: 'Inspection register' });
    await table.locator('tbody tr').first().waitFor();
    // The demo register is seeded: more than one page of inspections.
    expect(await page.getByText(/\d+ records · page 1 of \d+/).textContent()).toMatch(/page 1 of ([2-9]|\d{2,})/);

    // Record one through the form, keyboard and labels only.
    await page.getByRole('button', { name: 'Record inspection' }).click();
    const form = page.getByRole('form', { name: 'Record inspection' });
    // Sent empty: the API's field errors show at their fields, and nothing is saved.
    await form.getByRole('button', { name: 'Record inspection' }).click();
    await form.getByText('choose the technique revision the work was done to').waitFor();
    await form.getByText('enter the part number').waitFor();
    expect(await form.getByLabel('Part number').getAttribute('aria-invalid')).toBe('true');
    const revisionSelect = form.getByLabel('Technique revision');
    const revisionValue = await revisionSelect.locator('option', { hasText: `${HOLES.code} rev ${HOLES.revision} —` }).getAttribute('value');
    await revisionSelect.selectOption(revisionValue!);
    await form.getByLabel('Date performed').fill('2020-01-01');
    await form.getByLabel('Inspector').selectOption({ label: 'Deniz Calloway' });
    await form.getByLabel('Part number').fill('TFR-7702-40');
    await form.getByLabel('Serial number').fill(`FR-${tag}`);
    await form.getByLabel('Work order').fill(`WO-FORM-${tag}`);
    await form.getByLabel('Customer').fill('Østerdal Aviation');
    await form.getByLabel('Result').selectOption('indication_recorded');
    await form.getByLabel('Instrument').selectOption({ label: 'FK2-10482 — Eddy current flaw detector, two-channel' });
    await form.getByLabel('Notes').fill('Non-relevant signal at the countersink');
    // A date before the revision's approval is refused at the date field.
    await form.getByRole('button', { name: 'Record inspection' }).click();
    await form.getByText(/the date is before the revision was approved/).waitFor();
    await form.getByLabel('Date performed').fill(yesterday);
    await page.screenshot({ path: screenshotPath('inspections-form'), fullPage: true });
    await form.getByRole('button', { name: 'Record inspection' }).click();
    await page.getByRole('status').filter({ hasText: `FR-${tag} recorded against ${HOLES.code} rev ${HOLES.revision}` }).waitFor();
    await page.getByRole('searchbox', { name: 'Search' }).fill(`WO-FORM-${tag}`);
    await table.getByText(`S/N FR-${tag}`).waitFor();
    await expect.poll(() => table.locator('tbody tr').count()).toBe(1);
    expect(await table.locator('tbody').textContent()).toContain('Indication recorded');

    // A file with one bad row: the row is highlighted with its field, and the import stays disabled.
    await page.getByRole('button', { name: 'Import CSV' }).click();
    const dialog = page.getByRole('dialog', { name: 'Import inspections from CSV' });
    const bad = [HEADER, row(`SP-${tag}-1`), row(`SP-${tag}-2`, { probe: 'TAC-RS-011' })].join('\r\n');
    await dialog.getByLabel('CSV file').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad, 'utf8') });
    await dialog.getByText('2 rows read; 1 problem to correct.').waitFor();
    await dialog.getByText(/Row 3, probe serial: .*registered as reference standard/).waitFor();
    expect(await dialog.locator('tr[data-invalid]').count()).toBe(1);
    expect(await dialog.locator('tr[data-invalid] td').first().textContent()).toBe('3');
    expect(await dialog.getByRole('button', { name: 'Import', exact: true }).isDisabled()).toBe(true);

    // The corrected file: quoted commas, a line break and non-ASCII text.
    const good = `\uFEFF${[
      HEADER,
      row(`SP-${tag}-1`),
      row(`SP-${tag}-2`, { result: 'Reject', customer: '"Brackwater Hydraulics, Hangar 4"', notes: '"Crack-like signal at 2 o’clock,\nconfirmed on rescan"' }),
    ].join('\r\n')}\r\n`;
    await dialog.getByLabel('CSV file').setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from(good, 'utf8') });
    await dialog.getByText('2 inspections read, all valid.').waitFor();
    expect(await dialog.locator('tr[data-invalid]').count()).toBe(0);
    expect(await dialog.getByRole('table', { name: 'Import preview' }).textContent()).toContain('Brackwater Hydraulics, Hangar 4');
    await page.screenshot({ path: screenshotPath('inspections-import'), fullPage: true });
    await dialog.getByRole('button', { name: 'Import 2 inspections…' }).click();
    await dialog.getByText('Write 2 inspections from “good.csv” to the register?').waitFor();
    await dialog.getByRole('button', { name: 'Import 2 inspections', exact: true }).click();
    await dialog.getByText('2 inspections imported into the register.').waitFor();
    await dialog.getByRole('button', { name: 'Close' }).click();

    await page.getByRole('searchbox', { name: 'Search' }).fill(`WO-E2E-${tag}`);
    await table.getByText(`S/N SP-${tag}-2`).waitFor();
    await expect.poll(() => table.locator('tbody tr').count()).toBe(2);
    const text = await table.locator('tbody').textContent();
    expect(text).toContain('Kühlwerk Ærø Flugdienst');
    expect(text).toContain('Brackwater Hydraulics, Hangar 4');
    expect(text).toContain('Reject');
    expect(new URL(page.url()).searchParams.get('q')).toBe(`WO-E2E-${tag}`);
    await page.screenshot({ path: screenshotPath('inspections-list'), fullPage: true });
    await context.close();
  });
});
