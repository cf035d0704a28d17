import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { inject } from 'vitest';
import { launchBrowser, screenshotPath, signInAs } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('dashboard and registers in the browser', () => {
  it('when the quality manager opens the dashboard, then the charts draw from the demo data and a bar opens the filtered list', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInAs(page, 'quality@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.goto(`${inject('baseUrl')}/dashboard`);
    await page.getByRole('heading', { name: 'Dashboard', level: 1 }).waitFor();
    const openTile = page.locator('dt', { hasText: 'Open findings' }).locator('xpath=following-sibling::dd');
    await openTile.waitFor();
    const openFindings = Number(await openTile.textContent());
    expect(openFindings).toBeGreaterThan(0);

    const chart = page.locator('[data-chart="findings-by-area"]');
    await chart.locator('.recharts-bar-rectangle path').first().waitFor();
    expect(await chart.locator('.recharts-bar-rectangle path').count()).toBeGreaterThan(0);
    // The numbers behind the chart, as a table.
    await chart.getByText('The numbers behind this chart').click();
    const rows = chart.locator('tbody tr');
    expect(await rows.count()).toBe(3);
    expect(await chart.locator('tbody').textContent()).toContain('Wheel and Brake Shop');
    await page.screenshot({ path: screenshotPath('dashboard-quality-manager'), fullPage: true });

    await chart.locator('.recharts-bar-rectangle path').first().click();
    await page.waitForURL(/\/findings\?/);
    const url = new URL(page.url());
    expect(url.pathname).toBe('/findings');
    expect(url.searchParams.get('areaId')).toMatch(/^\d+$/);
    // The first bar is an area's open findings: every state but closed and withdrawn.
    expect(url.searchParams.get('state')).toBe('raised,in_review,containment,action_open,effectiveness_check,awaiting_signoff');
    await context.close();
  });

  it('when someone opens the registers, then certificate and calibration flags show in words', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await signInAs(page, 'quality@tarnbrook.example');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.goto(`${inject('baseUrl')}/registers`);
    await page.getByRole('table', { name: 'Personnel certifications' }).waitFor();
    await page.getByText('Deniz Calloway').first().waitFor();
    const table = page.getByRole('table', { name: 'Personnel certifications' });
    expect(await table.textContent()).toMatch(/Due by \d{4}-\d{2}-\d{2}/);
    expect(await table.textContent()).toMatch(/Expired \d+ days ago/);
    await page.screenshot({ path: screenshotPath('registers-certifications'), fullPage: true });
    await page.getByRole('link', { name: 'Equipment' }).click();
    await page.getByRole('table', { name: 'Equipment register' }).waitFor();
    await page.getByText('FM40-00731').waitFor();
    expect(await page.getByRole('table', { name: 'Equipment register' }).textContent()).toMatch(/Out of calibration: due date passed 12 days ago/);
    await page.screenshot({ path: screenshotPath('registers-equipment'), fullPage: true });
    // The bar-stock technique uses the portable instrument whose calibration lapsed.
    await page.getByRole('link', { name: 'Technique links' }).click();
    await page.getByLabel('Technique').selectOption({ label: (await page.locator('option', { hasText: 'TAC-ET-017' }).textContent())! });
    await page.getByText('FM40-00731', { exact: false }).waitFor();
    expect(await page.locator('main').textContent()).toContain('Deniz Calloway');
    await page.screenshot({ path: screenshotPath('registers-technique-links'), fullPage: true });
    await context.close();
  });
});
