// The technique editor in Chromium against the built client and the real server:
// the checklist changes live as the Level 3 edits, approval makes the revision
// read-only, and an auditor opens its checklist.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { inject } from 'vitest';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';
import { DEMO_TECHNIQUE_NOTES } from '../../shared/domain/demo-techniques';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const BOBBIN_FILE = JSON.parse(readFileSync(path.join(import.meta.dirname, '../shared/fixtures/heat-exchanger-bobbin.json'), 'utf8'));
// The shared bobbin example with reference notches where its far-side cracks are, no deeper than their
// 0.24 mm extent through the wall: its only gap is then the circumferential crack the bobbin coil cannot see.
const BOBBIN = {
  ...BOBBIN_FILE,
  reference: { ...BOBBIN_FILE.reference, notches: BOBBIN_FILE.reference.notches.map((notch: object) => ({ ...notch, location: 'far-side', depthMm: 0.2 })) },
};

async function signedInPage(email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  const page = await context.newPage();
  await signInAs(page, email);
  await page.getByRole('heading', { level: 1 }).waitFor();
  return page;
}

const verdictOf = (page: Page) => page.getByTestId('checklist-verdict').getAttribute('data-verdict');

describe('technique editor', () => {
  it('when a Level 3 edits a draft, then the checklist verdict changes live; approving makes it read-only; an auditor opens its checklist', async () => {
    const code = `E2E-ET-${Date.now().toString(36).toUpperCase()}`;
    const page = await signedInPage('level3@tarnbrook.example');
    await page.goto(`${inject('baseUrl')}/techniques/new`);
    await page.getByRole('heading', { name: 'New technique' }).waitFor();

    // Start from a technique file: the bobbin example, which misses the circumferential crack.
    await page.getByTestId('import-file').setInputFiles({
      name: 'bobbin.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify({ ...BOBBIN, code })),
    });
    await page.getByRole('status').filter({ hasText: 'Loaded bobbin.json' }).waitFor();
    await page.getByTestId('checklist-verdict').waitFor();
    expect(await verdictOf(page)).toBe('does-not-conform');
    expect(await page.locator('[data-rule="orientation-coverage"][data-status="fail"]').count()).toBe(1);

    await page.getByRole('button', { name: 'Create draft' }).click();
    await page.waitForURL(/\/techniques\/\d+\/edit$/);
    const techniqueUrl = page.url().replace(/\/edit$/, '');
    await page.getByRole('heading', { name: new RegExp(`Editing ${code} revision A`) }).waitFor();
    expect(await verdictOf(page)).toBe('does-not-conform');

    // A multi-directional assembly induces current along u and v: both cracks are crossed. No save yet.
    await page.getByLabel('Coil type').selectOption('multidirectional');
    await page.locator('[data-testid="checklist-verdict"][data-verdict="conforms"]').waitFor();
    expect(await page.getByRole('button', { name: 'Save draft' }).isEnabled()).toBe(true);
    // Its author never approves it (a second Level 3 does, below).
    expect(await page.getByRole('button', { name: 'Approve revision A' }).count()).toBe(0);

    // And a lower frequency changes the plot's legend at once.
    const frequencies = page.getByLabel('Test frequencies');
    await frequencies.fill('20 kHz, 160 kHz');
    await page.getByTestId('depth-plot').getByText('20 kHz (δ =').waitFor();
    await page.getByTestId('frame-coil-0').waitFor();
    await page.screenshot({ path: screenshotPath('technique-editor'), fullPage: true });
    await page.getByRole('figure', { name: 'Current density against depth' }).screenshot({ path: screenshotPath('technique-editor-depth-plot') });
    await page.getByRole('figure', { name: 'Induced current against flaw orientation' }).screenshot({ path: screenshotPath('technique-editor-frame-diagram') });
    // The coil's own field: the impedance plane and, on request, the density under the probe.
    const plane = page.getByRole('figure', { name: 'Impedance plane' });
    await plane.getByRole('img', { name: /Coil 1: .* impedance plane/ }).waitFor();
    expect(await plane.getByRole('row').count()).toBeGreaterThan(1);
    await plane.screenshot({ path: screenshotPath('technique-editor-impedance-plane') });
    const map = page.getByRole('figure', { name: 'Current density under the probe' });
    await map.getByRole('button', { name: 'Draw the density map' }).click();
    await map.getByRole('img', { name: /Current density under the coil at 20 kHz/ }).waitFor({ timeout: 30_000 });
    await map.screenshot({ path: screenshotPath('technique-editor-density-map') });

    // An invalid file changes nothing and says what is wrong.
    await page.getByTestId('import-file').setInputFiles({
      name: 'broken.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify({ ...BOBBIN, coils: [{ ...BOBBIN.coils[0], diameterMm: -1 }] })),
    });
    const alert = page.getByRole('alert').filter({ hasText: 'broken.json is not a valid technique' });
    await alert.waitFor();
    expect(await alert.textContent()).toContain('coils[0].diameterMm');
    expect(await page.getByLabel('Coil type').inputValue()).toBe('multidirectional');
    expect(await frequencies.inputValue()).toBe('20 kHz, 160 kHz');

    await page.getByRole('button', { name: 'Save draft' }).click();
    await page.getByRole('button', { name: 'Saved' }).waitFor();
    // Its author may not approve it: no Approve button for her.
    expect(await page.getByRole('button', { name: 'Approve revision A' }).count()).toBe(0);
    await page.context().close();

    const reviewer = await signedInPage('level3b@tarnbrook.example');
    await reviewer.goto(techniqueUrl);
    await reviewer.getByRole('button', { name: 'Approve revision A' }).click();
    const dialog = reviewer.getByRole('dialog');
    await dialog.getByText('read-only').waitFor();
    await dialog.getByRole('button', { name: 'Approve revision A' }).click();
    await reviewer.waitForURL(techniqueUrl);
    await reviewer.getByText('approved by Orla Dunmore').waitFor();
    expect(await reviewer.getByRole('link', { name: /Edit draft/ }).count()).toBe(0);
    expect(await reviewer.getByRole('button', { name: 'Start a new revision' }).count()).toBe(1);
    await reviewer.context().close();

    const auditor = await signedInPage('auditor@tarnbrook.example');
    await auditor.goto(techniqueUrl);
    await auditor.getByRole('heading', { name: 'Checklist, revision A' }).waitFor();
    expect(await verdictOf(auditor)).toBe('conforms');
    const timeline = auditor.getByRole('region', { name: 'Timeline' });
    await timeline.getByText('Draft edited').first().waitFor();
    expect(await timeline.textContent()).toMatch(/Created.*Draft edited.*Approved revision A/s);
    expect(await auditor.getByText('Caution:').count()).toBeGreaterThan(0);
    expect(await auditor.getByRole('button', { name: /Approve/ }).count()).toBe(0);
    expect(await auditor.getByRole('button', { name: 'Start a new revision' }).count()).toBe(0);
    await auditor.screenshot({ path: screenshotPath('technique-checklist-auditor'), fullPage: true });
    await auditor.context().close();
  });

  it('when anyone opens the register, then the demo techniques show with their state and verdict, filterable by state', async () => {
    const page = await signedInPage('technician@tarnbrook.example');
    await page.goto(`${inject('baseUrl')}/techniques?q=TAC-ET`);
    await page.getByRole('link', { name: 'TAC-ET-023' }).waitFor();
    const rowText = await page.getByRole('row').filter({ hasText: 'TAC-ET-023' }).textContent();
    expect(rowText).toContain('Approved');
    expect(rowText).toContain('Does not conform');
    await page.getByLabel('State of the latest revision').selectOption('draft');
    await page.waitForURL(/state=draft/);
    await page.getByRole('link', { name: 'TAC-ET-023' }).waitFor({ state: 'detached' });
    await page.getByRole('link', { name: 'TAC-ET-004' }).waitFor();
    expect(await page.getByRole('link', { name: 'New technique' }).count()).toBe(0);

    // The seeded register: each demo technique's revision in force carries the verdict its notes expect.
    const listed = await page.evaluate(async () => {
      const response = await fetch('/api/techniques?q=TAC-ET&pageSize=50');
      return (await response.json()) as { items: { code: string; state: string; verdict: string; approvedRevision: string | null }[] };
    });
    for (const [code, note] of Object.entries(DEMO_TECHNIQUE_NOTES)) {
      const item = listed.items.find((candidate) => candidate.code === code);
      expect(item, code).toBeDefined();
      if (item!.state === 'approved') expect(item!.verdict, code).toBe(note.expectedVerdict);
    }
    expect(listed.items.find((item) => item.code === 'TAC-ET-004')).toMatchObject({ state: 'draft', approvedRevision: 'C' });
    await page.context().close();
  });

  it('when the admin opens the policy page and the materials library, then each setting shows its default, basis and value, and each material its values', async () => {
    const page = await signedInPage('admin@tarnbrook.example');
    await page.getByRole('link', { name: 'Policy' }).click();
    await page.getByRole('heading', { name: 'Policy settings' }).waitFor();
    const setting = page.locator('[data-setting="fillFactorMinEncircling"]');
    expect(await setting.textContent()).toContain('Common practice, no single source');
    expect(await page.getByLabel('Minimum fill factor, encircling coil').inputValue()).toBe('0.7');
    await page.screenshot({ path: screenshotPath('policy-settings'), fullPage: true });

    await page.goto(`${inject('baseUrl')}/materials`);
    const row = page.getByRole('row').filter({ hasText: 'Aluminium 2024-T3' });
    await row.waitFor();
    expect(await row.textContent()).toContain('17.4');
    expect(await page.getByRole('button', { name: 'Edit Aluminium 2024-T3' }).count()).toBe(1);
    await page.context().close();
  });
});
