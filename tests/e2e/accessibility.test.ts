// WCAG 2.2 A/AA checks with axe-core on every screen for four roles, and the
// keyboard paths axe cannot judge: skip link, focus after a page change, the
// user menu, and a workflow dialog that traps focus and returns it on Escape.
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** A person signed in; the app's CSP forbids inline scripts, so this context bypasses it to inject axe-core. */
async function as(email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true });
  const page = await context.newPage();
  await signInAs(page, email);
  await page.getByRole('heading', { level: 1 }).waitFor();
  return page;
}

const focused = (page: Page) => page.evaluate(() => `${document.activeElement?.tagName} ${document.activeElement?.textContent?.trim().slice(0, 80) ?? ''}`);
const AXE_SOURCE = createRequire(import.meta.url).resolve('axe-core/axe.min.js');
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa'];

interface Violation {
  page: string;
  rule: string;
  impact: string | null;
  targets: string[];
}

async function firstId(page: Page, path: string): Promise<number> {
  const response = await page.request.get(`${inject('baseUrl')}/api/${path}?pageSize=1`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as { items: { id: number }[] }).items[0].id;
}

async function axeViolations(page: Page, path: string): Promise<Violation[]> {
  await page.goto(`${inject('baseUrl')}${path}`);
  await page.locator('main h1').first().waitFor({ timeout: 15_000 }).catch(() => undefined);
  // Nothing still loading: lists and panels show their content, not a placeholder.
  await expect.poll(() => page.locator('main [role="status"]', { hasText: /…$/ }).count(), { timeout: 10_000 }).toBe(0).catch(() => undefined);
  await page.addScriptTag({ path: AXE_SOURCE });
  const results = await page.evaluate(
    (tags) =>
      (window as unknown as { axe: { run(context: Document, options: unknown): Promise<{ violations: { id: string; impact: string | null; nodes: { target: string[] }[] }[] }> } }).axe.run(
        document,
        { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] },
      ),
    WCAG_TAGS,
  );
  return results.violations.map((violation) => ({
    page: path,
    rule: violation.id,
    impact: violation.impact,
    targets: violation.nodes.slice(0, 5).map((node) => node.target.join(' ')),
  }));
}

const SCREENS = ['/', '/dashboard', '/techniques', '/materials', '/audits', '/findings', '/actions', '/registers/certifications', '/registers/equipment', '/registers/technique-links', '/registers/inspections', '/admin/policy'];

describe('accessibility in the browser', () => {
  for (const email of ['auditor@tarnbrook.example', 'quality@tarnbrook.example', 'technician@tarnbrook.example', 'admin@tarnbrook.example']) {
    it(`when ${email} opens every screen, then axe-core finds no WCAG 2.2 A/AA violation`, { timeout: 420_000 }, async () => {
      const page = await as(email);
      const records = [
        `/techniques/${await firstId(page, 'techniques')}`,
        `/audits/${await firstId(page, 'audits')}`,
        `/findings/${await firstId(page, 'findings')}`,
        `/actions/${await firstId(page, 'actions')}`,
        `/registers/equipment/${await firstId(page, 'equipment')}/impact`,
      ];
      const extra = email.startsWith('admin') ? ['/admin/users', '/mailbox'] : email.startsWith('quality') ? ['/trail', '/techniques/new'] : [];
      const violations: Violation[] = [];
      for (const path of [...SCREENS, ...records, ...extra]) violations.push(...(await axeViolations(page, path)));
      expect(violations).toEqual([]);
    });
  }

  it('when a person uses the keyboard only, then the skip link, the heading focus, the user menu and a workflow dialog behave', { timeout: 180_000 }, async () => {
    const page = await as('auditor@tarnbrook.example');
    await page.goto(`${inject('baseUrl')}/audits`);
    await page.getByRole('heading', { name: 'Audits', level: 1 }).waitFor();

    // The first Tab reaches the skip link; following it puts focus in the main content.
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page.keyboard.press('Tab');
    expect(await focused(page)).toContain('Skip to the main content');
    await page.screenshot({ path: screenshotPath('a11y-skip-link') });
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.closest('main') !== null)).toBe(true);

    // A page change moves focus to the new page's heading.
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Findings' }).focus();
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Findings', level: 1 }).waitFor();
    await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('H1');

    // The user menu takes focus when opened and gives it back on Escape.
    const menuButton = page.locator('header button[aria-haspopup="menu"]');
    await menuButton.focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('role'))).toBe('menuitem');
    await page.screenshot({ path: screenshotPath('a11y-user-menu') });
    await page.keyboard.press('Escape');
    expect(await page.getByRole('menu').count()).toBe(0);
    expect(await menuButton.evaluate((element) => element === document.activeElement)).toBe(true);

    // A workflow dialog: opened with the keyboard, focus stays inside while tabbing, Escape closes it and returns focus.
    await page.goto(`${inject('baseUrl')}/audits`);
    const plan = page.getByRole('button', { name: 'Plan an audit' });
    await plan.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'Plan an audit' });
    await dialog.waitFor();
    for (let i = 0; i < 25; i += 1) {
      await page.keyboard.press('Tab');
      expect(await dialog.evaluate((element) => element.contains(document.activeElement))).toBe(true);
    }
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(await plan.evaluate((element) => element === document.activeElement)).toBe(true);
  });
});
